namespace Monitor.Contracts.V1;

/// <summary>
/// Outbound: the newest figures of the books that changed since the last batch, one <see cref="BookExposuresUpdated"/>
/// per book (each with its own cause and curves), in book id order. One message carries many books: a refit of the
/// government curve moves every book, and a thousand separate messages a second cost the broker and every consumer
/// more than the figures are worth. Wire identity: <c>Monitor.Contracts.V1.BookExposuresBatch</c>.
/// </summary>
public sealed record BookExposuresBatch
{
    /// <summary>One entry per book, at most one per book in a batch, ordered by book id (ordinal).</summary>
    public required IReadOnlyList<BookExposuresUpdated> Books { get; init; }

    /// <summary>When the service published the batch; each entry's <c>ComputedAt</c> is when its figures were computed.</summary>
    public required DateTimeOffset PublishedAt { get; init; }
}
