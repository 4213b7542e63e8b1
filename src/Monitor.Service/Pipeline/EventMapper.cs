using Monitor.Analytics.Curves;
using Monitor.Analytics.Fitting;
using Monitor.Contracts.V1;
using Monitor.Limits;
using Monitor.Service.Engine;

namespace Monitor.Service.Pipeline;

/// <summary>Turns engine outcomes into the outbound contract messages (one place, so the wire shape is easy to audit).</summary>
public static class EventMapper
{
    public static CurveFitted CurveFitted(CurveFitOutcome outcome, string? baseCurveId, Cause cause, DateTimeOffset now) => new()
    {
        CurveId = CurveKeyLabel.Of(outcome.CurveKey),
        Version = outcome.Version,
        AsOf = cause.EventTime,
        Model = outcome.Result!.Report.Model.ToString(),
        BaseCurveId = baseCurveId,
        Parameters = Parameters(outcome.Result.Curve),
        Fit = Summary(outcome.Result.Report),
        CauseMessageId = MessageId(cause),
        FittedAt = now,
    };

    public static CurveRejected CurveRejected(CurveFitOutcome outcome, Cause cause, DateTimeOffset now) => new()
    {
        CurveId = CurveKeyLabel.Of(outcome.CurveKey),
        AsOf = cause.EventTime,
        Reasons = outcome.Verdict.Reasons,
        Fit = outcome.Result is { } result ? Summary(result.Report) : null,
        KeptCurveVersion = outcome.Version > 0 ? outcome.Version : null,
        KeptCurveAsOf = outcome.KeptCurveFittedAt,
        CauseMessageId = MessageId(cause),
        RejectedAt = now,
    };

    public static BookExposuresUpdated BookUpdated(BookUpdate update, IReadOnlyList<CurveVersion> curves, Cause cause, DateTimeOffset now) => new()
    {
        Book = update.Book,
        Measures = update.Exposures.Totals.ToDictionary(p => LimitsFileParser.JsonName(p.Key), p => p.Value, StringComparer.Ordinal),
        Curves = curves,
        CauseMessageId = MessageId(cause),
        CauseMessageType = cause.MessageType,
        ComputedAt = now,
        Provisional = update.Provisional,
        ProvisionalReasons = update.Provisional ? update.ProvisionalReasons : null,
    };

    /// <summary>A limit's status change; <paramref name="provisionalReasons"/> say why figures in the limit's scope are provisional (<see cref="RiskEngine.ProvisionalReasons"/>), empty when none is.</summary>
    public static LimitStatusChanged StatusChanged(LimitStatusChange change, IReadOnlyList<CurveVersion> curves, Cause cause, DateTimeOffset now, IReadOnlyList<string> provisionalReasons) => new()
    {
        LimitId = change.LimitId,
        Scope = change.Scope.Level.ToString().ToLowerInvariant(),
        ScopeId = change.Scope.Id,
        Measure = LimitsFileParser.JsonName(change.Measure),
        Status = StatusName(change.Current),
        PreviousStatus = StatusName(change.Previous),
        Exposure = change.Exposure,
        Limit = change.LimitValue,
        Utilisation = change.Utilisation,
        Curves = curves,
        CauseMessageId = MessageId(cause),
        CauseMessageType = cause.MessageType,
        EventTime = cause.EventTime,
        ProcessedAt = now,
        Provisional = provisionalReasons.Count > 0,
        ProvisionalReasons = provisionalReasons.Count > 0 ? provisionalReasons : null,
    };

    /// <summary>Status names on the wire and in the log: within, warning, breach; retired (removed by a reload), expired (a temporary limit past its expiry).</summary>
    public static string StatusName(LimitStatus status) => status.ToString().ToLowerInvariant();

    public static IReadOnlyList<CurveVersion> CurveVersions(RiskEngine engine) =>
        engine.Curves.Values
            .Where(c => c.Curve is not null)
            .OrderBy(c => c.Key, StringComparer.Ordinal)
            .Select(c => new CurveVersion { CurveId = c.Label, Version = c.Version, AsOf = c.FittedAt ?? DateTimeOffset.MinValue })
            .ToArray();

    public static CurveParameters Parameters(IFactorCurve curve) => curve switch
    {
        NelsonSiegelCurve ns => new CurveParameters { Beta0 = ns.Beta0, Beta1 = ns.Beta1, Beta2 = ns.Beta2, Tau = ns.Tau },
        SvenssonCurve sv => new CurveParameters { Beta0 = sv.Beta0, Beta1 = sv.Beta1, Beta2 = sv.Beta2, Tau = sv.Tau1, Beta3 = sv.Beta3, Tau2 = sv.Tau2 },
        _ => throw new ArgumentException($"Curve type {curve.GetType().Name} has no wire form.", nameof(curve)),
    };

    public static FitSummary Summary(FitReport report) => new()
    {
        RmseBp = report.RmseBp,
        MaxErrorBp = report.MaxAbsErrorBp,
        Iterations = report.Iterations,
        UsedQuoteIds = report.UsedIds,
        Excluded = report.Exclusions.Select(e => new ExcludedQuote { QuoteId = e.Id, Reason = $"{e.Reason.ToString().ToLowerInvariant()}: {e.Detail}" }).ToArray(),
    };

    private static Guid? MessageId(Cause cause) => Guid.TryParse(cause.MessageId, out var id) ? id : null;
}
