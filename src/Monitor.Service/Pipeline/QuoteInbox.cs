using Monitor.Service.Engine;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Quotes checked and priced by the consumers, waiting for the refit loop to hand them to the engine. Consumers add
/// under a short lock of their own, so a quote is acknowledged without waiting for a refit that holds the engine.
/// </summary>
public sealed class QuoteInbox
{
    private readonly Lock _sync = new();
    private List<(PricedQuote Quote, Cause Cause)> _waiting = [];
    private List<(PricedQuote Quote, Cause Cause)> _spare = [];

    public int Count
    {
        get
        {
            lock (_sync)
            {
                return _waiting.Count;
            }
        }
    }

    public void Add(PricedQuote quote, Cause cause)
    {
        lock (_sync)
        {
            _waiting.Add((quote, cause));
        }
    }

    /// <summary>
    /// Runs <paramref name="take"/> on every waiting quote in arrival order and empties the inbox. The two lists
    /// swap, so a drain allocates nothing once they have grown to a burst's size.
    /// </summary>
    public void Drain(Action<PricedQuote, Cause> take)
    {
        ArgumentNullException.ThrowIfNull(take);
        List<(PricedQuote Quote, Cause Cause)> taken;
        lock (_sync)
        {
            taken = _waiting;
            _waiting = _spare;
        }
        try
        {
            foreach (var (quote, cause) in taken)
            {
                take(quote, cause);
            }
        }
        finally
        {
            taken.Clear();
            lock (_sync)
            {
                _spare = taken;
            }
        }
    }
}
