namespace Monitor.Faults.Tests.Support;

/// <summary>One message of a generated stream: the inbound queue it goes to and its plain JSON body.</summary>
/// <param name="Queue">monitor-trades or monitor-quotes.</param>
/// <param name="Json">The message as a non-.NET producer would send it (camelCase, see src/Monitor.Contracts/README.md).</param>
/// <param name="TradeId">The trade's id for a trade message, null for a quote.</param>
/// <param name="Version">The trade's version for a trade message, 0 for a quote.</param>
public sealed record StreamMessage(string Queue, string Json, string? TradeId, int Version);
