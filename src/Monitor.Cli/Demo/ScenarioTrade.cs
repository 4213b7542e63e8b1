namespace Monitor.Cli.Demo;

/// <summary>A trade the demo books at <paramref name="At"/> (time of the simulated day); face amount signed, + buys.</summary>
internal sealed record ScenarioTrade(TimeSpan At, string TradeId, string Book, string InstrumentId, double FaceAmount, string Story);
