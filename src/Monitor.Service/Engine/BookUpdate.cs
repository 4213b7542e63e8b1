using Monitor.Analytics.Risk;
using Monitor.Limits;

namespace Monitor.Service.Engine;

/// <summary>A book's recomputed figures: the limit measures and the full factor exposures behind them.</summary>
/// <remarks>
/// The engine hands <see cref="Risk"/> over as the revaluation's moment rows (<see cref="BookMoments"/>) and builds the
/// <see cref="BookRisk"/> only when it is read, once: a refit of a thousand books is read for its measures, rarely for
/// its factors.
/// </remarks>
public sealed record BookUpdate
{
    private readonly BookMoments _moments;
    private BookRisk? _risk;

    public BookUpdate(string book, BookExposures exposures, BookRisk risk)
    {
        Book = book;
        Exposures = exposures;
        _risk = risk;
    }

    internal BookUpdate(string book, BookExposures exposures, BookMoments moments)
    {
        Book = book;
        Exposures = exposures;
        _moments = moments;
    }

    public string Book { get; init; }

    public BookExposures Exposures { get; init; }

    /// <summary>
    /// Why the figures are provisional (a spread group without a fitted curve, valued on the government curve plus a
    /// flat spread from the bond's own price), one reason per bond so valued; empty when every curve was fitted.
    /// </summary>
    public IReadOnlyList<string> ProvisionalReasons { get; init; } = [];

    /// <summary>Whether any figure was built on a stand-in spread (<see cref="ProvisionalReasons"/>).</summary>
    public bool Provisional => ProvisionalReasons.Count > 0;

    public BookRisk Risk
    {
        get => _risk ??= _moments.BuildRisk();
        init
        {
            _risk = value;
            _moments = default;
        }
    }

    // As the positional record compared: book, figures and exposures (not the lazily filled cache behind Risk).
    public bool Equals(BookUpdate? other) =>
        other is not null && (ReferenceEquals(this, other)
            || (Book == other.Book && EqualityComparer<BookExposures>.Default.Equals(Exposures, other.Exposures) && EqualityComparer<BookRisk>.Default.Equals(Risk, other.Risk)
                && ProvisionalReasons.SequenceEqual(other.ProvisionalReasons)));

    public override int GetHashCode() => HashCode.Combine(Book, Exposures, Risk);

    public void Deconstruct(out string book, out BookExposures exposures, out BookRisk risk)
    {
        book = Book;
        exposures = Exposures;
        risk = Risk;
    }
}
