namespace Monitor.Service.Tests.Fuzz;

/// <summary>One generated inbound message: its contract, the mutation applied (the category reported) and the raw JSON body.</summary>
internal sealed record FuzzCase(string Contract, string Category, string Json);
