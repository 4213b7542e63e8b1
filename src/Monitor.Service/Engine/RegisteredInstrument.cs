namespace Monitor.Service.Engine;

/// <summary>
/// Where a bond's cash flows are registered: its curve key, its number in that key's
/// <see cref="CurveKeyInstruments"/> table and how many flows it has left (0 once matured: nothing to value).
/// </summary>
internal readonly record struct RegisteredInstrument(string CurveKey, int Number, int FlowCount);
