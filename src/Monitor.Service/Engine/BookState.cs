using Monitor.Analytics.Risk;
using Monitor.Limits;

namespace Monitor.Service.Engine;

/// <summary>One book: its positions by instrument, its cash flows merged by date, and its last figures.</summary>
public sealed class BookState
{
    public BookState(string id, string desk, CashFlowDateIndex dates)
    {
        Id = id;
        Desk = desk;
        Ledger = new BookCashFlowLedger(dates);
    }

    public string Id { get; }

    public string Desk { get; }

    /// <summary>Signed face amount by instrument id.</summary>
    public Dictionary<string, double> Positions { get; } = new(StringComparer.Ordinal);

    public BookCashFlowLedger Ledger { get; }

    public BookExposures? Exposures { get; set; }

    public BookRisk? Risk { get; set; }

    public DateTimeOffset? UpdatedAt { get; set; }
}
