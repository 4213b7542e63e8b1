namespace Monitor.Contracts.V1;

/// <summary>
/// Inbound: reference data of one bond (new or replaced). Rates are decimals (0.045 = 4.5%).
/// Wire identity: the full type name, <c>Monitor.Contracts.V1.InstrumentDefined</c>.
/// </summary>
public sealed record InstrumentDefined
{
    public required string InstrumentId { get; init; }

    public required string Issuer { get; init; }

    /// <summary>Sector / rating bucket whose spread curve prices the bond; null for the government curve.</summary>
    public string? SpreadGroup { get; init; }

    /// <summary>ISO 4217 code, e.g. "EUR".</summary>
    public required string Currency { get; init; }

    /// <summary>Annual coupon rate as a decimal; 0 for a zero-coupon bill.</summary>
    public required double CouponRate { get; init; }

    /// <summary>Coupons per year: 1, 2, 4 or 12; 0 for zero-coupon.</summary>
    public required int Frequency { get; init; }

    /// <summary>One of "ACT/ACT-ICMA", "30/360", "30E/360", "ACT/360", "ACT/365F" (ISDA 2006, section 4.16).</summary>
    public required string DayCount { get; init; }

    public required DateOnly IssueDate { get; init; }

    /// <summary>First coupon date when the first period is odd; null for a regular first period.</summary>
    public DateOnly? FirstCouponDate { get; init; }

    public required DateOnly MaturityDate { get; init; }

    /// <summary>Face amount of one unit (denomination), in <see cref="Currency"/>; prices are per 100 of it.</summary>
    public required double Face { get; init; }

    /// <summary>Settlement lag in business days (1 for T+1).</summary>
    public required int SettlementLagDays { get; init; }
}
