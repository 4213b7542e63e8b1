using System.CommandLine;
using System.Globalization;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Analytics.Pricing;
using Monitor.Cli.Output;
using Monitor.Files;

namespace Monitor.Cli.Verbs;

/// <summary>
/// <c>monitor bond</c>: price from a yield (--from-yield) or a yield from a clean price (--from-price) for one bond,
/// in a yield convention (<see cref="YieldConvention"/>), with the yield measures (<see cref="BondYield.Measures"/>).
/// The bond comes from an instruments file (--instruments, --id) or from options (--coupon-pct, --maturity-date, ...).
/// Exit 0 done, 1 bad option, 2 bad file or a price/yield the bond cannot have.
/// </summary>
internal static class BondVerb
{
    public const string Street = "street";
    public const string TreasuryAuction = "treasury-auction";
    public const string Compounded = "compounded";

    public static Command Create()
    {
        var fromYield = new Option<double?>("--from-yield") { Description = "(one of --from-yield, --from-price) Yield to maturity in percent, compounded at the coupon frequency: print the price." };
        var fromPrice = new Option<double?>("--from-price") { Description = "(one of --from-yield, --from-price) Clean price per 100 face: print the yield." };
        var settlement = CommonOptions.Date("--settlement-date", CommonOptions.RequiredMark + "Settlement date YYYY-MM-DD.");
        var convention = CommonOptions.OneOf(
            new Option<string>("--convention")
            {
                Description = "Yield convention: street (simple interest in the final coupon period), treasury-auction (31 CFR 356 App. B: simple interest up to the next coupon) or compounded (every flow compounded).",
                DefaultValueFactory = _ => Street,
            },
            Street, TreasuryAuction, Compounded);
        var instruments = CommonOptions.File("--instruments", "Instruments file holding the bond (with --id); or give the bond by the options below.", required: false);
        var id = new Option<string?>("--id") { Description = "With --instruments: the bond's id. Otherwise a label for the bond (default 'bond')." };
        var coupon = new Option<double?>("--coupon-pct") { Description = "(required without --instruments) Annual coupon in percent (0 with --frequency 0 for a zero-coupon bond)." };
        var maturity = CommonOptions.Date("--maturity-date", "(required without --instruments) Maturity date YYYY-MM-DD.");
        var frequency = new Option<int>("--frequency") { Description = "Coupons a year: 1, 2, 4, 12, or 0 for a zero-coupon bond.", DefaultValueFactory = _ => 2 };
        var dayCount = new Option<string>("--day-count") { Description = "Accrual day count: ACT/ACT-ICMA, ACT/ACT-ISDA, 30/360, 30E/360, ACT/360 or ACT/365F.", DefaultValueFactory = _ => "ACT/ACT-ICMA" };
        var issue = CommonOptions.Date("--issue-date", "Issue (accrual start) date YYYY-MM-DD (default: the last regular coupon date on or before settlement, counted back from maturity).");
        var firstCoupon = CommonOptions.Date("--first-coupon-date", "First coupon date YYYY-MM-DD of an odd first period (default: regular periods back from maturity).");
        var json = CommonOptions.Json();
        var command = new Command("bond", "Price a bond from a yield, or find its yield from a clean price, in a yield convention; print clean and dirty price, accrued, yield, Macaulay and modified duration, convexity and DV01 per 100 face.");
        foreach (var option in new Option[] { fromYield, fromPrice, settlement, convention, instruments, id, coupon, maturity, frequency, dayCount, issue, firstCoupon, json })
        {
            command.Options.Add(option);
        }
        CommonOptions.CheckRequired(command);
        command.SetAction(parse => VerbRunner.Run(parse, output =>
        {
            var settle = CommonOptions.ParseDate("--settlement-date", parse.GetValue(settlement))!.Value;
            var bond = parse.GetValue(instruments) is { } path
                ? FromFile(path, parse.GetValue(id) ?? throw CliInputException.Missing("--id", "the id of the bond in " + path + "."))
                : FromOptions(
                    parse.GetValue(id) ?? "bond",
                    parse.GetValue(coupon) ?? throw CliInputException.Missing("--coupon-pct", "the annual coupon in percent (or give --instruments and --id)."),
                    CommonOptions.ParseDate("--maturity-date", parse.GetValue(maturity)) ?? throw CliInputException.Missing("--maturity-date", "the maturity date YYYY-MM-DD (or give --instruments and --id)."),
                    parse.GetValue(frequency),
                    parse.GetValue(dayCount)!,
                    CommonOptions.ParseDate("--issue-date", parse.GetValue(issue)),
                    CommonOptions.ParseDate("--first-coupon-date", parse.GetValue(firstCoupon)),
                    settle);
            var view = Compute(bond, settle, Convention(CommonOptions.Word(parse, convention)!), parse.GetValue(fromYield), parse.GetValue(fromPrice));
            if (parse.GetValue(json))
            {
                JsonOutput.Write(output, view);
            }
            else
            {
                BondTables.Write(TableConsole.Create(output), view);
            }
            return 0;
        }));
        return command;
    }

    public static BondView Compute(Bond bond, DateOnly settlement, YieldConvention convention, double? yieldPct, double? cleanPrice)
    {
        if (yieldPct.HasValue == cleanPrice.HasValue)
        {
            throw yieldPct.HasValue
                ? CliInputException.Option("--from-price", Inv(cleanPrice!.Value), "cannot be given with --from-yield: give one of them.")
                : CliInputException.Missing("--from-yield", "the yield in percent (or give --from-price, the clean price per 100).");
        }
        if (settlement < bond.IssueDate || settlement >= bond.MaturityDate)
        {
            throw CliInputException.Option("--settlement-date", Num.Date(settlement), $"must lie in [issue date {Num.Date(bond.IssueDate)}, maturity date {Num.Date(bond.MaturityDate)}).");
        }
        double yield;
        try
        {
            yield = yieldPct is { } y ? y / 100 : BondYield.FromCleanPrice(bond, settlement, cleanPrice!.Value, convention);
        }
        catch (ArgumentOutOfRangeException ex)
        {
            throw CliInputException.Option("--from-price", Inv(cleanPrice!.Value), ex.Message.Split(" (Parameter", 2)[0]);
        }
        catch (ArithmeticException ex)
        {
            throw new CliInputException(ex.Message, ex);
        }
        YieldMeasures m;
        try
        {
            m = BondYield.Measures(bond, settlement, yield, convention);
        }
        catch (ArgumentOutOfRangeException ex)
        {
            throw CliInputException.Option("--from-yield", Inv(yieldPct ?? 100 * yield), ex.Message.Split(" (Parameter", 2)[0]);
        }
        return new BondView(
            bond.Id, (double)(bond.CouponRate * 100), Num.Date(bond.MaturityDate), bond.Frequency, DayCounters.Name(bond.DayCount),
            Num.Date(bond.IssueDate), Num.Date(settlement), Name(convention), yieldPct.HasValue ? "yield" : "price",
            100 * m.Yield, m.CleanPrice, m.AccruedInterest, m.DirtyPrice, m.MacaulayDuration, m.ModifiedDuration, m.Convexity, m.Dv01);
    }

    public static YieldConvention Convention(string word) => word switch
    {
        TreasuryAuction => YieldConvention.TreasuryAuction,
        Compounded => YieldConvention.Compounded,
        _ => YieldConvention.Street,
    };

    private static string Name(YieldConvention convention) => convention switch
    {
        YieldConvention.TreasuryAuction => TreasuryAuction,
        YieldConvention.Compounded => Compounded,
        _ => Street,
    };

    private static Bond FromFile(string path, string id) =>
        InstrumentFile.Read(path).FirstOrDefault(b => b.Id == id)
            ?? throw CliInputException.Option("--id", id, $"is not an instrument in {path}.");

    private static Bond FromOptions(
        string id, double couponPct, DateOnly maturity, int frequency, string dayCountText, DateOnly? issue, DateOnly? firstCoupon, DateOnly settlement)
    {
        if (!DayCounters.TryParse(dayCountText, out var dayCount))
        {
            throw CliInputException.Option("--day-count", dayCountText, "is not a day count; use ACT/ACT-ICMA, ACT/ACT-ISDA, 30/360, 30E/360, ACT/360 or ACT/365F.");
        }
        if (!double.IsFinite(couponPct))
        {
            throw CliInputException.Option("--coupon-pct", Inv(couponPct), "is not a number (annual coupon in percent, e.g. 4.25).");
        }
        var start = issue ?? DefaultIssue(maturity, frequency, firstCoupon, settlement);
        try
        {
            return new Bond(id, "(command line)", null, "XTS", (decimal)couponPct / 100m, frequency, dayCount, start, firstCoupon, maturity);
        }
        catch (ArgumentException ex)
        {
            var option = ex.ParamName switch
            {
                "CouponRate" => "--coupon-pct",
                "Frequency" => "--frequency",
                "MaturityDate" => "--maturity-date",
                "FirstCouponDate" => "--first-coupon-date",
                "IssueDate" => "--issue-date",
                _ => "--id",
            };
            throw CliInputException.Option(option, null, ex.Message.Split(" (Parameter", 2)[0]);
        }
    }

    /// <summary>
    /// The last regular coupon date on or before settlement, stepping back whole periods from maturity (or from the
    /// first coupon date); a zero-coupon bond accrues nothing, so settlement itself.
    /// </summary>
    private static DateOnly DefaultIssue(DateOnly maturity, int frequency, DateOnly? firstCoupon, DateOnly settlement)
    {
        if (frequency <= 0 || 12 % frequency != 0)
        {
            return settlement;
        }
        var anchor = firstCoupon ?? maturity;
        var months = 12 / frequency;
        for (var k = firstCoupon.HasValue ? 1 : 0; k < 12 * 200; k++)
        {
            var date = anchor.AddMonths(-k * months);
            if (date <= settlement)
            {
                return date;
            }
        }
        return settlement;
    }

    private static string Inv(double x) => x.ToString("G", CultureInfo.InvariantCulture);
}
