using Monitor.Contracts.V1;
using Monitor.Service.Engine;

namespace Monitor.Service.Pipeline;

/// <summary>
/// A book's new figures waiting in the <see cref="EventOutbox"/>. Turned into a <see cref="BookExposuresUpdated"/>
/// (an entry of a <see cref="BookExposuresBatch"/>) only when sent: most are replaced by newer figures first, and
/// mapping them all would cost more than the refit.
/// </summary>
public sealed record BookFigures(BookUpdate Update, IReadOnlyList<CurveVersion> Curves, Cause Cause, DateTimeOffset ComputedAt)
{
    public string Book => Update.Book;

    public BookExposuresUpdated ToMessage() => EventMapper.BookUpdated(Update, Curves, Cause, ComputedAt);
}
