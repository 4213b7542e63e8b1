using Monitor.Analytics.Risk;

namespace Monitor.Analytics.Tests.Risk;

/// <summary>Comparisons of exposures within 1e-9 of the gross scale (sums of the same terms in another order).</summary>
internal static class RiskAssert
{
    private const double Rel = 1e-9;

    public static void Close(FactorExposures expected, FactorExposures actual, FactorExposures gross)
    {
        Assert.Equal(expected.BaseFactorCount, actual.BaseFactorCount);
        Check(expected.Value, actual.Value, gross.Value, "value");
        var nb = expected.BaseFactorCount;
        var ns = Math.Max(expected.SpreadFactorCount, actual.SpreadFactorCount);
        for (var j = 0; j < nb; j++)
        {
            Check(expected.BaseMoneyDuration(j), actual.BaseMoneyDuration(j), gross.BaseMoneyDuration(j), $"base money duration {j}");
            for (var k = 0; k < nb; k++)
            {
                Check(expected.BaseMoneyConvexity(j, k), actual.BaseMoneyConvexity(j, k), gross.BaseMoneyConvexity(j, k), $"base convexity {j},{k}");
            }
            for (var k = 0; k < ns; k++)
            {
                Check(expected.BaseSpreadMoneyConvexity(j, k), actual.BaseSpreadMoneyConvexity(j, k), gross.BaseSpreadMoneyConvexity(j, k), $"mixed {j},{k}");
            }
        }
        for (var j = 0; j < ns; j++)
        {
            Check(expected.SpreadMoneyDuration(j), actual.SpreadMoneyDuration(j), gross.SpreadMoneyDuration(j), $"spread money duration {j}");
            for (var k = 0; k < ns; k++)
            {
                Check(expected.SpreadMoneyConvexity(j, k), actual.SpreadMoneyConvexity(j, k), gross.SpreadMoneyConvexity(j, k), $"spread convexity {j},{k}");
            }
        }
    }

    public static void FirstMomentsClose(FactorExposures expected, BookRiskMatrix actual, int book, FactorExposures gross)
    {
        Check(expected.Value, actual.Value(book), gross.Value, "value");
        Check(expected.Dv01, actual.Dv01(book), gross.Dv01, "dv01");
        for (var k = 0; k < actual.BaseFactorCount; k++)
        {
            Check(expected.BaseMoneyDuration(k), actual.BaseMoneyDuration(book, k), gross.BaseMoneyDuration(k), $"base money duration {k}");
        }
        for (var k = 0; k < actual.SpreadFactorCount; k++)
        {
            Check(expected.SpreadMoneyDuration(k), actual.SpreadMoneyDuration(book, k), gross.SpreadMoneyDuration(k), $"spread money duration {k}");
        }
    }

    private static void Check(double e, double a, double scale, string what) =>
        Assert.True(Math.Abs(e - a) <= Rel * Math.Max(Math.Abs(e), Math.Abs(scale)) + 1e-300, $"{what}: reference {e:R}, fast path {a:R}");
}
