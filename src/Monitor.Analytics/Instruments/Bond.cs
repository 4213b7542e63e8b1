using System.Globalization;
using Monitor.Analytics.Dates;

namespace Monitor.Analytics.Instruments;

/// <summary>
/// Reference data of a fixed-coupon bond (or zero-coupon bill/bond when <see cref="Frequency"/> is 0), validated on
/// construction. Rates are decimals (0.05 = 5%). Cash flows and accrued interest are per 100 face; scale by
/// <see cref="Face"/>/100 for one unit. Coupon of a regular period = 100 x CouponRate / Frequency (a fixed
/// amount whatever the days, 31 CFR 356 App. B, I.A.1); an odd period pays 100 x CouponRate x its day-count
/// year fraction (ACT/ACT ICMA splits a long period into quasi-coupon periods).
/// </summary>
public sealed class Bond
{
    private const decimal MaxCouponRate = 1m;

    public Bond(
        string id,
        string issuer,
        string? spreadGroup,
        string currency,
        decimal couponRate,
        int frequency,
        DayCountConvention dayCount,
        DateOnly issueDate,
        DateOnly? firstCouponDate,
        DateOnly maturityDate,
        decimal face = 100m,
        int settlementLagDays = 1)
    {
        Id = RequireText(id, nameof(Id), id);
        Issuer = RequireText(issuer, nameof(Issuer), id);
        if (spreadGroup is not null && string.IsNullOrWhiteSpace(spreadGroup))
        {
            throw Invalid(id, nameof(SpreadGroup), $"'{spreadGroup}'", "must be null (government curve) or non-blank");
        }

        SpreadGroup = spreadGroup;
        Currency = RequireText(currency, nameof(Currency), id);
        if (!CouponFrequency.IsValid(frequency))
        {
            throw Invalid(id, nameof(Frequency), frequency.ToString(CultureInfo.InvariantCulture), "must be 0 (zero coupon), 1, 2, 4 or 12");
        }

        if (!Enum.IsDefined(dayCount))
        {
            throw Invalid(id, nameof(DayCount), dayCount.ToString(), "is not a known day-count convention");
        }

        if (couponRate < 0m || couponRate > MaxCouponRate)
        {
            throw Invalid(id, nameof(CouponRate), couponRate.ToString(CultureInfo.InvariantCulture), "must be a decimal rate between 0 and 1 (0.05 = 5%)");
        }

        if (frequency == CouponFrequency.ZeroCoupon && couponRate != 0m)
        {
            throw Invalid(id, nameof(CouponRate), couponRate.ToString(CultureInfo.InvariantCulture), "must be 0 for a zero-coupon bond (Frequency = 0)");
        }

        if (maturityDate <= issueDate)
        {
            throw Invalid(id, nameof(MaturityDate), Iso(maturityDate), $"must be after IssueDate {Iso(issueDate)}");
        }

        if (firstCouponDate is { } fc)
        {
            if (frequency == CouponFrequency.ZeroCoupon)
            {
                throw Invalid(id, nameof(FirstCouponDate), Iso(fc), "must be empty for a zero-coupon bond (Frequency = 0)");
            }

            if (fc <= issueDate || fc > maturityDate)
            {
                throw Invalid(id, nameof(FirstCouponDate), Iso(fc), $"must lie in (IssueDate {Iso(issueDate)}, MaturityDate {Iso(maturityDate)}]");
            }
        }

        if (face <= 0m)
        {
            throw Invalid(id, nameof(Face), face.ToString(CultureInfo.InvariantCulture), "must be positive (notional of one unit, e.g. 100 or 1000)");
        }

        if (settlementLagDays is < 0 or > 30)
        {
            throw Invalid(id, nameof(SettlementLagDays), settlementLagDays.ToString(CultureInfo.InvariantCulture), "must be between 0 and 30 business days");
        }

        CouponRate = couponRate;
        Frequency = frequency;
        DayCount = dayCount;
        IssueDate = issueDate;
        FirstCouponDate = firstCouponDate;
        MaturityDate = maturityDate;
        Face = face;
        SettlementLagDays = settlementLagDays;
        DayCounter = DayCounters.For(dayCount);
        Schedule = frequency == CouponFrequency.ZeroCoupon ? null : CouponSchedule.Generate(issueDate, firstCouponDate, maturityDate, frequency);
    }

    public string Id { get; }

    public string Issuer { get; }

    /// <summary>Spread group (sector / rating bucket); null = discounted on the government curve.</summary>
    public string? SpreadGroup { get; }

    public string Currency { get; }

    /// <summary>Annual coupon rate, decimal (0.05 = 5%).</summary>
    public decimal CouponRate { get; }

    /// <summary>Coupons per year: 0 (zero coupon), 1, 2, 4 or 12.</summary>
    public int Frequency { get; }

    public DayCountConvention DayCount { get; }

    public IDayCounter DayCounter { get; }

    public DateOnly IssueDate { get; }

    /// <summary>First coupon date when the first period is odd (short or long); null = generated backward from maturity.</summary>
    public DateOnly? FirstCouponDate { get; }

    public DateOnly MaturityDate { get; }

    /// <summary>Notional of one unit (e.g. 100 or 1000). Prices and cash flows here are per 100 face.</summary>
    public decimal Face { get; }

    /// <summary>Settlement lag in business days (T+n).</summary>
    public int SettlementLagDays { get; }

    public bool IsZeroCoupon => Frequency == CouponFrequency.ZeroCoupon;

    /// <summary>Coupon periods; null for a zero-coupon bond.</summary>
    public CouponSchedule? Schedule { get; }

    /// <summary>Coupon paid at the end of <paramref name="period"/>, per 100 face.</summary>
    public double CouponAmount(CouponPeriod period)
    {
        var rate = (double)CouponRate;
        return period.IsRegular
            ? 100.0 * rate / Frequency
            : 100.0 * rate * DayCounter.YearFraction(period.Start, period.End, period.ReferenceStart, period.ReferenceEnd, Frequency);
    }

    /// <summary>
    /// Coupons and redemption (100) paid strictly after <paramref name="settlement"/>, per 100 face, in date order.
    /// Any date is accepted (before issue: every flow; on or after maturity: none).
    /// </summary>
    public IReadOnlyList<CashFlow> CashFlowsAfter(DateOnly settlement)
    {
        var flows = new List<CashFlow>();
        if (Schedule is null)
        {
            if (MaturityDate > settlement)
            {
                flows.Add(new CashFlow(MaturityDate, 100.0));
            }

            return flows;
        }

        foreach (var period in Schedule.Periods)
        {
            if (period.End <= settlement)
            {
                continue;
            }

            var amount = CouponAmount(period);
            if (period.End == MaturityDate)
            {
                amount += 100.0;
            }

            flows.Add(new CashFlow(period.End, amount));
        }

        return flows;
    }

    /// <summary>
    /// Accrued interest per 100 face at <paramref name="settlement"/>: 100 x CouponRate x year fraction from the start
    /// of the current period (issue date in the first period), by the bond's day count. ACT/ACT (ICMA) counts a long
    /// first period by quasi-coupon periods. Zero on a regular coupon date; settlement before issue or on/after maturity is rejected.
    /// </summary>
    public double AccruedInterest(DateOnly settlement)
    {
        RequireSettlement(settlement);
        if (Schedule is null)
        {
            return 0.0;
        }

        var period = CurrentPeriod(settlement);
        if (period.IsRegular && settlement == period.Start)
        {
            return 0.0;
        }

        return 100.0 * (double)CouponRate * DayCounter.YearFraction(period.Start, settlement, period.ReferenceStart, period.ReferenceEnd, Frequency);
    }

    /// <summary>The coupon period in which <paramref name="settlement"/> falls (Start &lt;= settlement &lt; End).</summary>
    public CouponPeriod CurrentPeriod(DateOnly settlement)
    {
        RequireSettlement(settlement);
        if (Schedule is null)
        {
            throw new InvalidOperationException($"Bond {Id} is zero-coupon (Frequency = 0) and has no coupon periods.");
        }

        return Schedule.Periods[Schedule.PeriodIndexContaining(settlement)];
    }

    /// <summary>Last coupon date on or before <paramref name="settlement"/> (the issue date in the first period).</summary>
    public DateOnly PreviousCouponDate(DateOnly settlement) => CurrentPeriod(settlement).Start;

    /// <summary>First coupon date strictly after <paramref name="settlement"/>.</summary>
    public DateOnly NextCouponDate(DateOnly settlement) => CurrentPeriod(settlement).End;

    /// <summary>Throws unless IssueDate &lt;= settlement &lt; MaturityDate.</summary>
    public void RequireSettlement(DateOnly settlement)
    {
        if (settlement < IssueDate || settlement >= MaturityDate)
        {
            throw new ArgumentOutOfRangeException(
                nameof(settlement),
                settlement,
                $"Bond {Id}: settlement {Iso(settlement)} must lie in [IssueDate {Iso(IssueDate)}, MaturityDate {Iso(MaturityDate)}).");
        }
    }

    public override string ToString() =>
        string.Create(CultureInfo.InvariantCulture, $"{Id} {CouponRate:P3} {Iso(MaturityDate)} f={Frequency} {DayCounters.Name(DayCount)}");

    private static string Iso(DateOnly d) => d.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    private static string RequireText(string? value, string field, string? id)
    {
        if (string.IsNullOrWhiteSpace(value))
        {
            throw Invalid(id, field, $"'{value}'", "must not be blank");
        }

        return value;
    }

    private static ArgumentException Invalid(string? id, string field, string value, string rule) =>
        new($"Bond '{id}': {field} = {value} {rule}.", field);
}
