using System.Globalization;
using System.Text.Json;

namespace Monitor.Faults.Tests.Support;

/// <summary>
/// A seeded, reproducible stream of trades (new, then 0-2 amendments, then a cancellation one time in five, each
/// with the next version) and quotes, interleaved at random while every trade's versions stay in order. It knows
/// the final face per (book, instrument) it implies: start-of-day positions plus the last version of every trade
/// that is not cancelled.
/// </summary>
public sealed class TradeStream
{
    // Government bonds in the rates books only: the test market's spread group UTIL-A has 3 bonds, too few for a
    // spread curve (a fit needs 4), so a book holding a credit bond is never valued and writes no stop-snapshot.
    private static readonly string[] Books = ["RATES-CORE", "RATES-CURVE"];

    private readonly Dictionary<string, (int Version, string Book, string Instrument, double Face, bool Cancelled)> _last = new(StringComparer.Ordinal);

    private TradeStream(IReadOnlyList<StreamMessage> messages, IReadOnlyDictionary<(string Book, string Instrument), double> startOfDay)
    {
        Messages = messages;
        StartOfDay = startOfDay;
    }

    public IReadOnlyList<StreamMessage> Messages { get; }

    public IReadOnlyDictionary<(string Book, string Instrument), double> StartOfDay { get; }

    public int TradeMessages => Messages.Count(m => m.TradeId is not null);

    public int QuoteMessages => Messages.Count(m => m.TradeId is null);

    /// <summary>The last version of every trade id in the stream.</summary>
    public IReadOnlyDictionary<string, int> LastVersions => _last.ToDictionary(p => p.Key, p => p.Value.Version, StringComparer.Ordinal);

    /// <summary>Final face per (book, instrument) implied by the stream, computed here without the service.</summary>
    public Dictionary<(string Book, string Instrument), double> ExpectedPositions()
    {
        var positions = new Dictionary<(string, string), double>(StartOfDay);
        foreach (var trade in _last.Values.Where(t => !t.Cancelled))
        {
            positions[(trade.Book, trade.Instrument)] = positions.GetValueOrDefault((trade.Book, trade.Instrument)) + trade.Face;
        }
        return positions;
    }

    /// <summary>Generates a stream of <paramref name="trades"/> trades (about 2 messages each) and quotes on the instruments of quotes-open.csv.</summary>
    public static TradeStream Generate(int seed, int trades, string dataFolder, DateTimeOffset now)
    {
        var random = new Random(seed);
        var quotes = ReadMids(Path.Combine(dataFolder, "quotes-open.csv"));
        var instruments = quotes.Keys.Where(id => id.StartsWith("VGB-", StringComparison.Ordinal)).Order(StringComparer.Ordinal).ToArray();
        var runPrefix = "F" + seed.ToString(CultureInfo.InvariantCulture) + "-";

        // Each trade's events in version order; the interleaving below keeps that order.
        var pending = new List<Queue<(string Id, int Version, string Action, string Book, string Instrument, double Face, double Price)>>();
        for (var i = 0; i < trades; i++)
        {
            var id = runPrefix + i.ToString("D5", CultureInfo.InvariantCulture);
            var book = Books[random.Next(Books.Length)];
            var instrument = instruments[random.Next(instruments.Length)];
            var events = new Queue<(string, int, string, string, string, double, double)>();
            var face = Face(random);
            events.Enqueue((id, 1, "new", book, instrument, face, Price(random, quotes[instrument])));
            var amends = random.Next(3);
            for (var a = 0; a < amends; a++)
            {
                face = Face(random);
                events.Enqueue((id, events.Count + 1, "amend", book, instrument, face, Price(random, quotes[instrument])));
            }
            if (random.Next(5) == 0)
            {
                events.Enqueue((id, events.Count + 1, "cancel", book, instrument, face, Price(random, quotes[instrument])));
            }
            pending.Add(events);
        }

        var stream = new List<StreamMessage>();
        var result = new TradeStream(stream, ReadPositions(Path.Combine(dataFolder, "positions.csv")));
        var quoteCount = 0;
        while (pending.Count > 0)
        {
            // Mostly the oldest open trades, so versions of one trade arrive close together as from a booking system.
            var index = random.Next(Math.Min(pending.Count, 50));
            var e = pending[index].Dequeue();
            if (pending[index].Count == 0)
            {
                pending.RemoveAt(index);
            }
            stream.Add(new StreamMessage("monitor-trades", JsonSerializer.Serialize(new
            {
                tradeId = e.Id,
                version = e.Version,
                action = e.Action,
                book = e.Book,
                instrumentId = e.Instrument,
                faceAmount = e.Face,
                cleanPrice = e.Price,
                tradeTime = now.ToString("o", CultureInfo.InvariantCulture),
            }), e.Id, e.Version));
            result._last[e.Id] = (e.Version, e.Book, e.Instrument, e.Face, e.Action == "cancel");
            if (random.Next(10) < 3)
            {
                var instrument = instruments[random.Next(instruments.Length)];
                var mid = Price(random, quotes[instrument]);
                stream.Add(new StreamMessage("monitor-quotes", JsonSerializer.Serialize(new
                {
                    quoteId = runPrefix + "q" + (++quoteCount).ToString("D6", CultureInfo.InvariantCulture),
                    instrumentId = instrument,
                    bidCleanPrice = Math.Round(mid - 0.02, 3),
                    askCleanPrice = Math.Round(mid + 0.02, 3),
                    quoteTime = now.AddMilliseconds(quoteCount).ToString("o", CultureInfo.InvariantCulture),
                    source = "fault-test",
                }), null, 0));
            }
        }
        return result;
    }

    // Whole lots of 100,000 face between -5m and +5m, never zero.
    private static double Face(Random random)
    {
        var lots = random.Next(1, 51) * 100_000.0;
        return random.Next(2) == 0 ? lots : -lots;
    }

    // Within 5 cents of the reference mid, rounded to 0.001 as quoted.
    private static double Price(Random random, double mid) => Math.Round(mid + ((random.NextDouble() - 0.5) * 0.1), 3);

    private static Dictionary<string, double> ReadMids(string path)
    {
        var mids = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var line in DataLines(path))
        {
            var f = line.Split(',');
            mids[f[0]] = (double.Parse(f[2], CultureInfo.InvariantCulture) + double.Parse(f[3], CultureInfo.InvariantCulture)) / 2;
        }
        return mids;
    }

    private static Dictionary<(string, string), double> ReadPositions(string path)
    {
        var positions = new Dictionary<(string, string), double>();
        foreach (var line in DataLines(path))
        {
            var f = line.Split(',');
            positions[(f[0], f[1])] = positions.GetValueOrDefault((f[0], f[1])) + double.Parse(f[2], CultureInfo.InvariantCulture);
        }
        return positions;
    }

    // Skips comments (#) and the header line.
    private static IEnumerable<string> DataLines(string path) =>
        File.ReadLines(path).Where(l => l.Length > 0 && !l.StartsWith('#')).Skip(1);
}
