using Monitor.Analytics.Dates;
using static Monitor.Analytics.Tests.Support.D;

namespace Monitor.Analytics.Tests.Dates;

public class DayCounterTests
{
    private static readonly IDayCounter Icma = DayCounters.For(DayCountConvention.ActActIcma);
    private static readonly IDayCounter Isda = DayCounters.For(DayCountConvention.ActActIsda);

    // ISDA memo "The Actual/Actual Day Count Fraction" (1999), cases as tabulated in QuantLib's
    // test-suite/daycounters.cpp (testActualActual): calculation period, reference period, expected fraction.
    public static TheoryData<DateOnly, DateOnly, DateOnly, DateOnly, int, double, double> IsdaMemoCases() => new()
    {
        // regular semiannual period
        { Ymd(2003, 11, 1), Ymd(2004, 5, 1), Ymd(2003, 11, 1), Ymd(2004, 5, 1), 2, 0.5, 0.497724380567 },
        // short first calculation period (first period), annual
        { Ymd(1999, 2, 1), Ymd(1999, 7, 1), Ymd(1998, 7, 1), Ymd(1999, 7, 1), 1, 0.410958904110, 0.410958904110 },
        // short first calculation period (second period)
        { Ymd(1999, 7, 1), Ymd(2000, 7, 1), Ymd(1999, 7, 1), Ymd(2000, 7, 1), 1, 1.0, 1.001377348600 },
        // long first calculation period (first period), semiannual, split at the quasi-coupon date 15 Jan 2003
        { Ymd(2002, 8, 15), Ymd(2003, 7, 15), Ymd(2003, 1, 15), Ymd(2003, 7, 15), 2, 0.915760869565, 0.915068493151 },
        // long first calculation period (second period)
        { Ymd(2003, 7, 15), Ymd(2004, 1, 15), Ymd(2003, 7, 15), Ymd(2004, 1, 15), 2, 0.5, 0.504004790778 },
        // short final calculation period (penultimate period)
        { Ymd(1999, 7, 30), Ymd(2000, 1, 30), Ymd(1999, 7, 30), Ymd(2000, 1, 30), 2, 0.5, 0.503892506924 },
        // short final calculation period (final period), reference period 30 Jan - 30 Jul 2000
        { Ymd(2000, 1, 30), Ymd(2000, 6, 30), Ymd(2000, 1, 30), Ymd(2000, 7, 30), 2, 0.417582417582, 0.415300546448 },
    };

    [Theory]
    [MemberData(nameof(IsdaMemoCases))]
    public void ActualActual_matches_the_ISDA_1999_memo(DateOnly start, DateOnly end, DateOnly refStart, DateOnly refEnd, int frequency, double icma, double isda)
    {
        // Source: ISDA memo (1999), values printed to 12 decimals; tolerance 1e-11 because one printed value
        // (1.001377348600 = 184/365 + 182/366 = 1.0013773486039...) is truncated, not rounded. QuantLib checks 1e-10.
        Assert.Equal(icma, Icma.YearFraction(start, end, refStart, refEnd, frequency), 1e-11);
        Assert.Equal(isda, Isda.YearFraction(start, end, refStart, refEnd, frequency), 1e-11);
    }

    [Fact]
    public void Thirty360_bond_basis_and_eurobond_differ_on_a_February_month_end()
    {
        // ISDA 2006 Definitions, section 4.16(f) and (g): 28 Feb 2008 -> 31 Mar 2008 is 33 days under 30/360
        // (D2 = 31 stays because D1 = 28) and 32 days under 30E/360 (D2 31 -> 30).
        var start = Ymd(2008, 2, 28);
        var end = Ymd(2008, 3, 31);
        Assert.Equal(33, DayCounters.For(DayCountConvention.Thirty360BondBasis).DayCount(start, end));
        Assert.Equal(32, DayCounters.For(DayCountConvention.Thirty360European).DayCount(start, end));
        Assert.Equal(33 / 360.0, DayCounters.For(DayCountConvention.Thirty360BondBasis).YearFraction(start, end, start, end, 2), 15);
    }

    [Theory]
    // ISDA 2006, 4.16(f) 30/360: D1 = 31 -> 30, then D2 = 31 -> 30 because D1 is 30.
    [InlineData(2007, 1, 31, 2007, 3, 31, 60, 60)]
    // D1 = 30 and D2 = 31: both conventions give 30 days from 30 Apr to 31 May.
    [InlineData(2007, 4, 30, 2007, 5, 31, 30, 30)]
    // D1 = 15, D2 = 31: Bond Basis keeps 31 (16 days), 30E/360 caps at 30 (15 days).
    [InlineData(2007, 5, 15, 2007, 5, 31, 16, 15)]
    // Across a leap-year February end: 29 Feb 2008 -> 31 Aug 2008 (no February adjustment in either).
    [InlineData(2008, 2, 29, 2008, 8, 31, 182, 181)]
    public void Thirty360_rules(int y1, int m1, int d1, int y2, int m2, int d2, int bondBasis, int european)
    {
        // Formula of ISDA 2006 section 4.16(f)/(g) applied by hand (values worked out from the rule, no table).
        var s = Ymd(y1, m1, d1);
        var e = Ymd(y2, m2, d2);
        Assert.Equal(bondBasis, DayCounters.For(DayCountConvention.Thirty360BondBasis).DayCount(s, e));
        Assert.Equal(european, DayCounters.For(DayCountConvention.Thirty360European).DayCount(s, e));
    }

    [Fact]
    public void Act360_and_Act365F_count_actual_days()
    {
        // ISDA 2006, 4.16(d)/(e): 1 Jan 2008 -> 1 Jan 2009 has 366 actual days.
        var s = Ymd(2008, 1, 1);
        var e = Ymd(2009, 1, 1);
        Assert.Equal(366 / 360.0, DayCounters.For(DayCountConvention.Act360).YearFraction(s, e, s, e, 1), 15);
        Assert.Equal(366 / 365.0, DayCounters.For(DayCountConvention.Act365Fixed).YearFraction(s, e, s, e, 1), 15);
        Assert.Equal(1.0, Isda.YearFraction(s, e, s, e, 1), 15);
    }

    [Theory]
    [InlineData("ACT/ACT-ICMA", DayCountConvention.ActActIcma)]
    [InlineData("act/act-isda", DayCountConvention.ActActIsda)]
    [InlineData(" 30/360 ", DayCountConvention.Thirty360BondBasis)]
    [InlineData("30E/360", DayCountConvention.Thirty360European)]
    [InlineData("ACT/360", DayCountConvention.Act360)]
    [InlineData("ACT/365F", DayCountConvention.Act365Fixed)]
    public void Names_parse_and_round_trip(string text, DayCountConvention expected)
    {
        Assert.Equal(expected, DayCounters.Parse(text));
        Assert.Equal(expected, DayCounters.Parse(DayCounters.Name(expected)));
        Assert.Equal(expected, DayCounters.For(expected).Convention);
    }

    [Fact]
    public void Unknown_name_is_rejected_naming_the_value()
    {
        var ex = Assert.Throws<FormatException>(() => DayCounters.Parse("ACT/366"));
        Assert.Contains("'ACT/366'", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Icma_is_antisymmetric_and_additive_across_quasi_periods()
    {
        // Property of the definition (ICMA Rule 251): fractions of adjacent periods add up.
        var refStart = Ymd(2020, 2, 15);
        var refEnd = Ymd(2020, 8, 15);
        var whole = Icma.YearFraction(Ymd(2019, 6, 1), Ymd(2021, 1, 10), refStart, refEnd, 2);
        var split = Icma.YearFraction(Ymd(2019, 6, 1), Ymd(2020, 5, 5), refStart, refEnd, 2)
                    + Icma.YearFraction(Ymd(2020, 5, 5), Ymd(2021, 1, 10), refStart, refEnd, 2);
        Assert.Equal(whole, split, 14);
        Assert.Equal(-whole, Icma.YearFraction(Ymd(2021, 1, 10), Ymd(2019, 6, 1), refStart, refEnd, 2), 14);
    }
}
