using System.Globalization;
using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using Monitor.Files.Csv;

namespace Monitor.Files;

/// <summary>
/// Instruments file (our format, see config/examples/README.md):
/// <c>id,issuer,spread_group,currency,coupon_pct,frequency,day_count,issue_date,first_coupon_date,maturity_date,face,settlement_lag</c>.
/// Each row becomes a validated <see cref="Bond"/>; a rule the bond breaks is reported against the column that holds it.
/// </summary>
public static class InstrumentFile
{
    private static readonly string[] Required =
        ["id", "issuer", "spread_group", "currency", "coupon_pct", "frequency", "day_count", "issue_date", "maturity_date", "settlement_lag"];

    private static readonly string[] Optional = ["first_coupon_date", "face"];

    /// <summary>Bond field names (as validation errors give them) mapped to file columns.</summary>
    private static readonly Dictionary<string, string> ColumnOf = new(StringComparer.Ordinal)
    {
        ["Id"] = "id",
        ["Issuer"] = "issuer",
        ["SpreadGroup"] = "spread_group",
        ["Currency"] = "currency",
        ["CouponRate"] = "coupon_pct",
        ["Frequency"] = "frequency",
        ["DayCount"] = "day_count",
        ["IssueDate"] = "issue_date",
        ["FirstCouponDate"] = "first_coupon_date",
        ["MaturityDate"] = "maturity_date",
        ["Face"] = "face",
        ["SettlementLagDays"] = "settlement_lag",
    };

    public static IReadOnlyList<Bond> Read(TextReader reader, string fileName) => Read(reader, fileName, null);

    /// <param name="reader">The file's text.</param>
    /// <param name="fileName">For error messages.</param>
    /// <param name="reportingCurrency">When set, a row in another currency is refused with its line and value.</param>
    public static IReadOnlyList<Bond> Read(TextReader reader, string fileName, string? reportingCurrency)
    {
        var bonds = new List<Bond>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var row in CsvTable.Read(reader, fileName, Required, Optional))
        {
            var id = row.RequiredText("id");
            if (!seen.Add(id))
            {
                throw row.Error("id", id, "appears twice: instrument ids must be unique.");
            }
            var currency = row.RequiredText("currency");
            if (reportingCurrency is not null && !string.Equals(currency, reportingCurrency, StringComparison.Ordinal))
            {
                throw row.Error("currency", currency, $"is not the reporting currency {reportingCurrency} (Monitor:ReportingCurrency); bonds in other currencies are refused until several currencies are supported.");
            }
            var dayCountText = row.RequiredText("day_count");
            if (!DayCounters.TryParse(dayCountText, out var dayCount))
            {
                throw row.Error("day_count", dayCountText, "is not a day count; use ACT/ACT-ICMA, ACT/ACT-ISDA, 30/360, 30E/360, ACT/360 or ACT/365F.");
            }
            var couponText = row.RequiredText("coupon_pct");
            if (!decimal.TryParse(couponText, NumberStyles.Float, CultureInfo.InvariantCulture, out var couponPct))
            {
                throw row.Error("coupon_pct", couponText, "is not a number (annual coupon in percent, e.g. 4.25).");
            }
            var faceText = row.OptionalText("face");
            var face = 100m;
            if (faceText is not null && !decimal.TryParse(faceText, NumberStyles.Float, CultureInfo.InvariantCulture, out face))
            {
                throw row.Error("face", faceText, "is not a number (face amount of one unit, normally 100).");
            }
            try
            {
                bonds.Add(new Bond(
                    id,
                    row.RequiredText("issuer"),
                    row.OptionalText("spread_group"),
                    row.RequiredText("currency"),
                    couponPct / 100m,
                    row.RequiredInteger("frequency"),
                    dayCount,
                    row.RequiredDate("issue_date"),
                    row.OptionalDate("first_coupon_date"),
                    row.RequiredDate("maturity_date"),
                    face,
                    row.RequiredInteger("settlement_lag")));
            }
            catch (ArgumentException ex)
            {
                var column = ex.ParamName is { } field && ColumnOf.TryGetValue(field, out var c) ? c : "id";
                throw row.Error(column, row.Raw(column), ex.Message);
            }
        }
        return bonds;
    }

    public static IReadOnlyList<Bond> Read(string path) => FileReading.Read(path, Read);

    /// <summary>The file's bonds, every one in <paramref name="reportingCurrency"/> or the read stops at the first that is not.</summary>
    public static IReadOnlyList<Bond> Read(string path, string reportingCurrency) => FileReading.Read(path, (reader, name) => Read(reader, name, reportingCurrency));
}
