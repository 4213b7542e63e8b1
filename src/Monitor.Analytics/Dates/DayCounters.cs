namespace Monitor.Analytics.Dates;

/// <summary>Day counter lookup by convention and by text name.</summary>
public static class DayCounters
{
    private static readonly IDayCounter IcmaCounter = new ActActIcmaDayCounter();
    private static readonly IDayCounter IsdaCounter = new ActActIsdaDayCounter();
    private static readonly IDayCounter BondBasisCounter = new Thirty360BondBasisDayCounter();
    private static readonly IDayCounter EuropeanCounter = new Thirty360EuropeanDayCounter();
    private static readonly IDayCounter Act360Counter = new Act360DayCounter();
    private static readonly IDayCounter Act365FixedCounter = new Act365FixedDayCounter();

    /// <summary>The (stateless, shared) day counter for <paramref name="convention"/>.</summary>
    public static IDayCounter For(DayCountConvention convention) => convention switch
    {
        DayCountConvention.ActActIcma => IcmaCounter,
        DayCountConvention.ActActIsda => IsdaCounter,
        DayCountConvention.Thirty360BondBasis => BondBasisCounter,
        DayCountConvention.Thirty360European => EuropeanCounter,
        DayCountConvention.Act360 => Act360Counter,
        DayCountConvention.Act365Fixed => Act365FixedCounter,
        _ => throw new ArgumentOutOfRangeException(nameof(convention), convention, $"Unknown day-count convention: {convention}."),
    };

    /// <summary>The canonical text name: ACT/ACT-ICMA, ACT/ACT-ISDA, 30/360, 30E/360, ACT/360, ACT/365F.</summary>
    public static string Name(DayCountConvention convention) => convention switch
    {
        DayCountConvention.ActActIcma => "ACT/ACT-ICMA",
        DayCountConvention.ActActIsda => "ACT/ACT-ISDA",
        DayCountConvention.Thirty360BondBasis => "30/360",
        DayCountConvention.Thirty360European => "30E/360",
        DayCountConvention.Act360 => "ACT/360",
        DayCountConvention.Act365Fixed => "ACT/365F",
        _ => throw new ArgumentOutOfRangeException(nameof(convention), convention, $"Unknown day-count convention: {convention}."),
    };

    /// <summary>Parses a text name (case-insensitive, surrounding blanks ignored); throws naming the value otherwise.</summary>
    public static DayCountConvention Parse(string text)
    {
        if (TryParse(text, out var convention))
        {
            return convention;
        }

        throw new FormatException(
            $"Unknown day count '{text}'; expected one of ACT/ACT-ICMA, ACT/ACT-ISDA, 30/360, 30E/360, ACT/360, ACT/365F.");
    }

    /// <summary>Parses a text name; false when it is not one of the known names.</summary>
    public static bool TryParse(string? text, out DayCountConvention convention)
    {
        convention = default;
        switch (text?.Trim().ToUpperInvariant())
        {
            case "ACT/ACT-ICMA":
                convention = DayCountConvention.ActActIcma;
                return true;
            case "ACT/ACT-ISDA":
                convention = DayCountConvention.ActActIsda;
                return true;
            case "30/360":
                convention = DayCountConvention.Thirty360BondBasis;
                return true;
            case "30E/360":
                convention = DayCountConvention.Thirty360European;
                return true;
            case "ACT/360":
                convention = DayCountConvention.Act360;
                return true;
            case "ACT/365F":
                convention = DayCountConvention.Act365Fixed;
                return true;
            default:
                return false;
        }
    }
}
