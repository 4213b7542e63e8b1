namespace Monitor.Contracts.Tests;

// Pins the wire API: every public type, property name, property type, nullability and "required".
// A failure here means a contract changed. Published contracts must not change shape: add a new
// type in a new version namespace instead (see src/Monitor.Contracts/README.md), then approve
// the new lines here in the same commit.
public class ContractSurfaceTests
{
    private const string Approved = """
        record Monitor.Contracts.V1.BondQuoted
          Double? AskCleanPrice
          Double? BidCleanPrice
          required String InstrumentId
          Double? MidCleanPrice
          required String QuoteId
          required DateTimeOffset QuoteTime
          required String Source
          Double? Yield
        record Monitor.Contracts.V1.BookExposuresBatch
          required IReadOnlyList<BookExposuresUpdated> Books
          required DateTimeOffset PublishedAt
        record Monitor.Contracts.V1.BookExposuresUpdated
          required String Book
          Guid? CauseMessageId
          String? CauseMessageType
          required DateTimeOffset ComputedAt
          required IReadOnlyList<CurveVersion> Curves
          required IReadOnlyDictionary<String, Double> Measures
          Boolean Provisional
          IReadOnlyList<String>? ProvisionalReasons
        record Monitor.Contracts.V1.CurveFitted
          required DateTimeOffset AsOf
          String? BaseCurveId
          Guid? CauseMessageId
          required String CurveId
          required FitSummary Fit
          required DateTimeOffset FittedAt
          required String Model
          required CurveParameters Parameters
          required Int64 Version
        record Monitor.Contracts.V1.CurveParameters
          required Double Beta0
          required Double Beta1
          required Double Beta2
          Double? Beta3
          required Double Tau
          Double? Tau2
        record Monitor.Contracts.V1.CurveRejected
          required DateTimeOffset AsOf
          Guid? CauseMessageId
          required String CurveId
          FitSummary? Fit
          DateTimeOffset? KeptCurveAsOf
          Int64? KeptCurveVersion
          required IReadOnlyList<String> Reasons
          required DateTimeOffset RejectedAt
        record Monitor.Contracts.V1.CurveVersion
          required DateTimeOffset AsOf
          required String CurveId
          required Int64 Version
        record Monitor.Contracts.V1.ExcludedQuote
          required String QuoteId
          required String Reason
        record Monitor.Contracts.V1.ExposureLogCheckpointed
          required String CheckpointMac
          required DateTimeOffset CheckpointedAt
          required DateOnly Day
          required Int64 DayRecords
          required String Mac
          required String Reason
          required Int64 Seq
        record Monitor.Contracts.V1.FitSummary
          required IReadOnlyList<ExcludedQuote> Excluded
          required Int32 Iterations
          required Double MaxErrorBp
          required Double RmseBp
          required IReadOnlyList<String> UsedQuoteIds
        record Monitor.Contracts.V1.InstrumentDefined
          required Double CouponRate
          required String Currency
          required String DayCount
          required Double Face
          DateOnly? FirstCouponDate
          required Int32 Frequency
          required String InstrumentId
          required DateOnly IssueDate
          required String Issuer
          required DateOnly MaturityDate
          required Int32 SettlementLagDays
          String? SpreadGroup
        record Monitor.Contracts.V1.LimitStatusChanged
          Guid? CauseMessageId
          required String CauseMessageType
          required IReadOnlyList<CurveVersion> Curves
          required DateTimeOffset EventTime
          required Double Exposure
          required Double Limit
          required String LimitId
          required String Measure
          required String PreviousStatus
          required DateTimeOffset ProcessedAt
          Boolean Provisional
          IReadOnlyList<String>? ProvisionalReasons
          required String Scope
          required String ScopeId
          required String Status
          required Double Utilisation
        record Monitor.Contracts.V1.LimitsReloadFlagged
          required Int32 LimitCount
          required DateTimeOffset ProcessedAt
          required IReadOnlyList<String> Reasons
          required IReadOnlyList<String> RemovedLimitIds
          required String Sha256
          required String Source
        record Monitor.Contracts.V1.ParYieldPoint
          required Double ParYield
          required String Tenor
        record Monitor.Contracts.V1.ParYieldsPublished
          required DateTimeOffset AsOf
          required String CurveId
          required IReadOnlyList<ParYieldPoint> Points
          required String Source
        record Monitor.Contracts.V1.TradeBooked
          required String Action
          required String Book
          required Double CleanPrice
          required Double FaceAmount
          required String InstrumentId
          required String TradeId
          required DateTimeOffset TradeTime
          required Int32 Version
        """;

    [Fact]
    public void Public_surface_matches_the_approved_list()
    {
        var actual = string.Join("\n", ContractSurface.Describe());
        var approved = string.Join("\n", Approved.Split('\n').Select(l => l.TrimEnd()).Where(l => l.Length > 0));
        Assert.Equal(approved, actual);
    }
}
