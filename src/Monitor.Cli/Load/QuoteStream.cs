using System.Globalization;
using Monitor.Analytics.Instruments;
using Monitor.Cli.Demo;
using Monitor.Contracts.V1;

namespace Monitor.Cli.Load;

/// <summary>
/// The quote tape of <c>monitor load</c>: the bonds in rounds (each round in a seeded shuffled order), priced by the
/// demo's <see cref="QuoteFactory"/> on the demo's moving market (<see cref="MarketPath"/>) at a day fraction that
/// runs from a start to an end fraction over a given number of quotes.
/// Each quote carries the real UTC time as its quote time, so the service takes the latest one as a refit's cause.
/// </summary>
internal sealed class QuoteStream
{
    private readonly IReadOnlyList<Bond> _bonds;
    private readonly long _total;
    private readonly double _from;
    private readonly double _to;
    private readonly QuoteFactory _factory;
    private Bond[] _round = [];

    public QuoteStream(IReadOnlyList<Bond> bonds, long total, double fromFraction, double toFraction, int seed)
    {
        ArgumentNullException.ThrowIfNull(bonds);
        _bonds = bonds;
        _total = Math.Max(1, total);
        _from = fromFraction;
        _to = toFraction;
        _factory = new QuoteFactory(bonds, new MarketPath(seed, (int)(_total / Math.Max(1, bonds.Count)) + 1), new Random(seed + 1));
    }

    public QuoteFactory Factory => _factory;

    /// <summary>Simulated time of quote <paramref name="index"/> on the demo day.</summary>
    public DateTimeOffset SimulatedTime(long index)
    {
        var f = _from + (_to - _from) * Math.Min(1.0, (double)index / _total);
        return DemoScenario.DayStart + f * (DemoScenario.DayEnd - DemoScenario.DayStart);
    }

    /// <summary>Quote number <paramref name="index"/>; call in increasing order.</summary>
    public BondQuoted Next(long index, DateTimeOffset now)
    {
        var position = (int)(index % _bonds.Count);
        if (position == 0 || _round.Length == 0)
        {
            _round = _factory.Shuffled();
        }
        var step = (int)(index / _bonds.Count);
        var quote = _factory.Quote(_round[position], SimulatedTime(index), step);
        return quote with
        {
            QuoteId = string.Create(CultureInfo.InvariantCulture, $"load-{index}"),
            QuoteTime = now,
            Source = "load-feed",
        };
    }

    /// <summary>A trade of 1-5 million face (either side) in <paramref name="book"/>, at the market's clean price.</summary>
    public TradeBooked Trade(long index, string book, Random random, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(random);
        var bond = _bonds[random.Next(_bonds.Count)];
        var step = (int)(index / _bonds.Count);
        return new TradeBooked
        {
            TradeId = string.Create(CultureInfo.InvariantCulture, $"LT-{index}"),
            Version = 1,
            Action = "new",
            Book = book,
            InstrumentId = bond.Id,
            FaceAmount = random.Next(1, 6) * 1_000_000 * (random.Next(2) == 0 ? -1 : 1),
            CleanPrice = Math.Round(_factory.CleanPrice(bond, SimulatedTime(index), step), 3),
            // On the scenario's trade date at the clock's time of day: the service values the books as of the
            // scenario's valuation date and refuses trade times more than a week from it.
            TradeTime = DemoScenario.At(now.UtcDateTime.TimeOfDay),
        };
    }
}
