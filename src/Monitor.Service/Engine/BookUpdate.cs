using Monitor.Analytics.Risk;
using Monitor.Limits;

namespace Monitor.Service.Engine;

/// <summary>A book's recomputed figures: the limit measures and the full factor exposures behind them.</summary>
/// <remarks>
/// The engine hands <see cref="Risk"/> over as the revaluation's moment rows (<see cref="BookMoments"/>) and builds the
/// <see cref="BookRisk"/> objects only when read: a refit of a thousand books reads the measures, rarely the factors.
/// </remarks>
public sealed record BookUpdate
{
    private readonly BookMoments? _moments;
    private readonly BookRisk? _risk;

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

    public BookRisk Risk
    {
        get => _risk ?? _moments?.Risk!;
        init
        {
            _risk = value;
            _moments = null;
        }
    }

    public void Deconstruct(out string book, out BookExposures exposures, out BookRisk risk)
    {
        book = Book;
        exposures = Exposures;
        risk = Risk;
    }
}
