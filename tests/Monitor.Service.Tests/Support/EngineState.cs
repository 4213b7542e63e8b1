using Monitor.Service.Engine;

namespace Monitor.Service.Tests.Support;

/// <summary>A comparable picture of an engine's state: curve versions and latest quotes, book positions and figures, trades.</summary>
public sealed record EngineState(string Curves, string Books, int Trades)
{
    public static EngineState Of(RiskEngine engine) => new(
        string.Join("; ", engine.Curves.Values.OrderBy(c => c.Key, StringComparer.Ordinal)
            .Select(c => $"{c.Label} v{c.Version} quotes {string.Join(",", c.LatestQuotes.Values.OrderBy(q => q.Bond.Id, StringComparer.Ordinal).Select(q => $"{q.Bond.Id}@{q.CleanPrice:R}"))}")),
        string.Join("; ", engine.Books.Values.OrderBy(b => b.Id, StringComparer.Ordinal)
            .Select(b => $"{b.Id} [{string.Join(",", b.Positions.OrderBy(p => p.Key, StringComparer.Ordinal).Select(p => $"{p.Key}={p.Value:R}"))}] "
                + string.Join(",", b.Exposures?.Totals.Select(p => $"{p.Key}={p.Value:R}") ?? []))),
        engine.Trades.Count);
}
