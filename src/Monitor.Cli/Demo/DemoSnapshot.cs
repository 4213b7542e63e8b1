using Monitor.Limits;
using Monitor.Service.Engine;
using Monitor.Service.Pipeline;

namespace Monitor.Cli.Demo;

/// <summary>What the view shows at one moment, read from the engine under the pipeline's lock.</summary>
internal sealed record DemoSnapshot(DateTimeOffset SimulatedTime, IReadOnlyList<BookRow> Books, IReadOnlyList<LimitRow> Limits, IReadOnlyList<CurveRow> Curves)
{
    public static Task<DemoSnapshot> CaptureAsync(RiskPipeline pipeline, TimeProvider clock, CancellationToken cancellationToken = default) =>
        pipeline.ReadAsync(engine => Capture(engine, clock.GetUtcNow()), cancellationToken);

    public static DemoSnapshot Capture(RiskEngine engine, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(engine);
        var uses = engine.Limits.CurrentUse(now);
        var limits = uses.Select(u => new LimitRow(
            u.Limit.Id,
            u.Limit.Scope.ToString(),
            LimitsFileParser.JsonName(u.Limit.Measure) + (u.Limit.SpreadGroup is { } g ? $" ({g})" : string.Empty),
            u.Exposure,
            u.Bound,
            u.Utilisation,
            EventMapper.StatusName(u.Status))).ToArray();
        var books = engine.Books.Values.OrderBy(b => b.Id, StringComparer.Ordinal).Select(b =>
        {
            var own = uses.Where(u => u.Limit.Scope.Level == LimitScopeLevel.Book && u.Limit.Scope.Id == b.Id).ToArray();
            var worst = own.Length == 0 ? LimitStatus.Within : own.Max(u => u.Status);
            double Get(ExposureMeasure m) => b.Exposures?.Totals.GetValueOrDefault(m) ?? double.NaN;
            return new BookRow(b.Id, b.Desk, Get(ExposureMeasure.MarketValue), Get(ExposureMeasure.Dv01), Get(ExposureMeasure.BaseLevel),
                Get(ExposureMeasure.BaseSlope), Get(ExposureMeasure.BaseCurvature), Get(ExposureMeasure.SpreadLevel),
                own.Length == 0 ? 0.0 : own.Max(u => u.Utilisation), EventMapper.StatusName(worst), b.ProvisionalReasons.Count > 0);
        }).ToArray();
        var curves = engine.Curves.Values.OrderBy(c => c.Key, StringComparer.Ordinal)
            .Select(c => new CurveRow(c.Label, c.Version, c.LastReport?.RmseBp, c.LastFitRejected)).ToArray();
        return new DemoSnapshot(now, books, limits, curves);
    }
}
