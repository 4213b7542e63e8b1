using System.Globalization;
using System.Text;
using Monitor.Analytics.Pricing;
using Monitor.Cli.Demo;

namespace Monitor.Cli.Load;

/// <summary>
/// The invented book set of <c>monitor load</c>: <see cref="BondCount"/> government bonds of the invented Republic of
/// Veloria (ids LGB-yyyy-mm, 1 to 30 years, semi-annual, ACT/ACT-ICMA, coupons near the demo curve), and
/// <see cref="Books"/> books (LB-0001...) in desks of 50 (LD-01...), each long <see cref="PositionsPerBook"/> seeded
/// bonds of 1-20 million face. Each book has a marketValue limit whose opening utilisation is spread over
/// [0.79, 0.83) around the 0.8 warning level (band 0.005): as the demo's rates sell-off lowers values by about 2-3%
/// through the run, many books step down from Warning to Within at different times, so status changes keep coming.
/// </summary>
internal sealed class LoadScenario
{
    public const int BondCount = 40;
    public const int PositionsPerBook = 10;
    public const double WarningFraction = 0.8;
    public const double HysteresisFraction = 0.005;
    public const int BooksPerDesk = 50;

    private LoadScenario(int books, string instrumentsCsv, string positionsCsv, string limitsJson, IReadOnlyList<(string Book, string InstrumentId, long Face)> positions)
    {
        Books = books;
        InstrumentsCsv = instrumentsCsv;
        PositionsCsv = positionsCsv;
        LimitsJson = limitsJson;
        Positions = positions;
    }

    public int Books { get; }

    public string InstrumentsCsv { get; }

    public string PositionsCsv { get; }

    public string LimitsJson { get; }

    public IReadOnlyList<(string Book, string InstrumentId, long Face)> Positions { get; }

    public static string BookId(int i) => string.Create(CultureInfo.InvariantCulture, $"LB-{i + 1:D4}");

    public static string DeskId(int i) => string.Create(CultureInfo.InvariantCulture, $"LD-{i / BooksPerDesk + 1:D2}");

    /// <summary>Generates <paramref name="books"/> books from <paramref name="seed"/>; the limits are set from each book's value on the demo's opening curve.</summary>
    public static LoadScenario Generate(int books, int seed)
    {
        if (books is < 1 or > 100_000)
        {
            throw new ArgumentOutOfRangeException(nameof(books), books, $"books {books} must be between 1 and 100000.");
        }
        var random = new Random(seed);
        var instruments = InstrumentsCsvText();
        var bonds = Monitor.Files.InstrumentFile.Read(new StringReader(instruments), "load-instruments.csv");
        var opening = new MarketPath(seed, 1).Government(0, 0);
        var dirty = bonds.ToDictionary(
            b => b.Id,
            b => CurvePricing.DirtyPrice(b, opening, DemoScenario.ValuationDate, QuoteFactory.SettlementOf(b)),
            StringComparer.Ordinal);
        var positions = new List<(string, string, long)>(books * PositionsPerBook);
        var value = new double[books];
        for (var i = 0; i < books; i++)
        {
            foreach (var bond in random.GetItems(bonds.ToArray(), PositionsPerBook).DistinctBy(b => b.Id))
            {
                var face = random.Next(1, 21) * 1_000_000L;
                positions.Add((BookId(i), bond.Id, face));
                value[i] += face * dirty[bond.Id] / 100.0;
            }
        }
        var positionsText = new StringBuilder("# Invented books of monitor load (generated).\nbook,instrument_id,face_amount\n");
        foreach (var (book, id, face) in positions)
        {
            positionsText.Append(CultureInfo.InvariantCulture, $"{book},{id},{face}\n");
        }
        return new LoadScenario(books, instruments, positionsText.ToString(), LimitsText(books, value, random), positions);
    }

    /// <summary>Writes instruments.csv, positions.csv and limits.json into <paramref name="folder"/>.</summary>
    public void Write(string folder)
    {
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "instruments.csv"), InstrumentsCsv);
        File.WriteAllText(Path.Combine(folder, "positions.csv"), PositionsCsv);
        File.WriteAllText(Path.Combine(folder, "limits.json"), LimitsJson);
    }

    private static string InstrumentsCsvText()
    {
        var text = new StringBuilder("# Invented government bonds of monitor load (generated).\n");
        text.Append("id,issuer,spread_group,currency,coupon_pct,frequency,day_count,issue_date,first_coupon_date,maturity_date,face,settlement_lag\n");
        for (var i = 0; i < BondCount; i++)
        {
            // Maturities spread from ~1 to ~30 years after the demo's trade date, on the 15th of May or November.
            var years = 1.0 + 29.0 * i / (BondCount - 1);
            var maturity = new DateOnly(DemoScenario.TradeDate.Year + (int)years, years % 1 < 0.5 ? 5 : 11, 15);
            var issue = maturity.AddYears(-Math.Max(2, (int)Math.Ceiling(years) + 1));
            // Coupon near the demo curve's level for the maturity (3% short to 4.5% long), in eighths.
            var coupon = Math.Round((3.0 + 1.5 * years / 30.0) * 8) / 8;
            text.Append(CultureInfo.InvariantCulture,
                $"LGB-{maturity:yyyy-MM},Republic of Veloria,,XTS,{coupon:F3},2,ACT/ACT-ICMA,{issue:yyyy-MM-dd},,{maturity:yyyy-MM-dd},100,1\n");
        }
        return text.ToString();
    }

    private static string LimitsText(int books, double[] value, Random random)
    {
        var text = new StringBuilder();
        text.Append("{\n  \"schemaVersion\": 1,\n  \"firm\": \"LOADFIRM\",\n");
        text.Append(CultureInfo.InvariantCulture, $"  \"defaults\": {{ \"warning\": {WarningFraction}, \"hysteresis\": {HysteresisFraction} }},\n");
        text.Append("  \"desks\": [\n");
        var desks = (books + BooksPerDesk - 1) / BooksPerDesk;
        for (var d = 0; d < desks; d++)
        {
            var members = Enumerable.Range(d * BooksPerDesk, Math.Min(BooksPerDesk, books - d * BooksPerDesk)).Select(i => $"\"{BookId(i)}\"");
            text.Append(CultureInfo.InvariantCulture, $"    {{ \"id\": \"{DeskId(d * BooksPerDesk)}\", \"books\": [{string.Join(", ", members)}] }}{(d < desks - 1 ? "," : "")}\n");
        }
        text.Append("  ],\n  \"limits\": [\n");
        for (var i = 0; i < books; i++)
        {
            // Opening utilisation u in [0.79, 0.83): upper = value / u.
            var utilisation = 0.79 + 0.04 * random.NextDouble();
            var upper = Math.Round(value[i] / utilisation);
            text.Append(CultureInfo.InvariantCulture,
                $"    {{ \"id\": \"{BookId(i)}-value\", \"scope\": \"book\", \"scopeId\": \"{BookId(i)}\", \"measure\": \"marketValue\", \"upper\": {upper} }}{(i < books - 1 ? "," : "")}\n");
        }
        text.Append("  ]\n}\n");
        return text.ToString();
    }
}
