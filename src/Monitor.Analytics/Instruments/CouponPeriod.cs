namespace Monitor.Analytics.Instruments;

/// <summary>
/// One accrual period of a coupon schedule, unadjusted dates. Interest accrues from <see cref="Start"/> to
/// <see cref="End"/> (paid on End). The reference period is the regular coupon period that ACT/ACT (ICMA) counts
/// days against: equal to [Start, End] for a regular period; for an odd period it is the regular period that ends
/// (first period) or starts (last period) at the coupon date.
/// </summary>
public readonly record struct CouponPeriod(DateOnly Start, DateOnly End, DateOnly ReferenceStart, DateOnly ReferenceEnd, bool IsRegular);
