namespace Monitor.Analytics.Dates;

/// <summary>
/// Day-count conventions (ISDA 2006 Definitions, section 4.16; ICMA Rule 251 for ACT/ACT ICMA).
/// Text names: see <see cref="DayCounters.Parse"/>.
/// </summary>
public enum DayCountConvention
{
    /// <summary>ACT/ACT (ICMA): days / (frequency x days in the reference coupon period). Most government bonds.</summary>
    ActActIcma,

    /// <summary>ACT/ACT (ISDA): days in a leap year / 366 + days in a non-leap year / 365.</summary>
    ActActIsda,

    /// <summary>30/360 Bond Basis (ISDA 4.16(f)): D1 31 -> 30; D2 31 -> 30 only when D1 is 30 or 31. US corporates.</summary>
    Thirty360BondBasis,

    /// <summary>30E/360 Eurobond Basis (ISDA 4.16(g)): any 31st becomes 30.</summary>
    Thirty360European,

    /// <summary>ACT/360: actual days / 360.</summary>
    Act360,

    /// <summary>ACT/365 (Fixed): actual days / 365.</summary>
    Act365Fixed,
}
