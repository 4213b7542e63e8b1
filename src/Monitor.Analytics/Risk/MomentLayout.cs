namespace Monitor.Analytics.Risk;

/// <summary>
/// Layout of the discounted moments of a set of cash flows against n factors, in one row of doubles:
/// [0] = sum c DF (value); [1 + k] = sum c t L_k DF (money duration of factor k);
/// then the upper triangle j &lt;= k, row by row, of sum c t^2 L_j L_k DF (money convexity).
/// All entries are linear in the cash flows, so rows of positions add up to the row of a book.
/// </summary>
internal static class MomentLayout
{
    /// <summary>Number of doubles in a row for <paramref name="factorCount"/> factors: 1 + n + n(n+1)/2.</summary>
    public static int Width(int factorCount) => 1 + factorCount + factorCount * (factorCount + 1) / 2;

    /// <summary>Writes the moments of one unit cash flow at time t with discount factor df and loadings l.</summary>
    public static void FillUnitRow(double t, double df, ReadOnlySpan<double> loadings, Span<double> row)
    {
        var n = loadings.Length;
        row[0] = df;
        var tdf = t * df;
        var t2df = t * tdf;
        for (var k = 0; k < n; k++)
        {
            row[1 + k] = tdf * loadings[k];
        }
        var p = 1 + n;
        for (var j = 0; j < n; j++)
        {
            var lj = t2df * loadings[j];
            for (var k = j; k < n; k++)
            {
                row[p++] = lj * loadings[k];
            }
        }
    }

    /// <summary>Writes only [DF, t L_k DF] of a unit cash flow (the first 1 + n entries of the row).</summary>
    public static void FillUnitFirstMoments(double t, double df, ReadOnlySpan<double> loadings, Span<double> row)
    {
        row[0] = df;
        var tdf = t * df;
        for (var k = 0; k < loadings.Length; k++)
        {
            row[1 + k] = tdf * loadings[k];
        }
    }

    /// <summary>Adds amount times the unit row of a cash flow to <paramref name="row"/>.</summary>
    public static void AddCashFlow(double amount, double t, double df, ReadOnlySpan<double> loadings, Span<double> row)
    {
        var n = loadings.Length;
        var w = amount * df;
        row[0] += w;
        var tw = t * w;
        var t2w = t * tw;
        for (var k = 0; k < n; k++)
        {
            row[1 + k] += tw * loadings[k];
        }
        var p = 1 + n;
        for (var j = 0; j < n; j++)
        {
            var lj = t2w * loadings[j];
            for (var k = j; k < n; k++)
            {
                row[p++] += lj * loadings[k];
            }
        }
    }

    /// <summary>Expands the upper triangle of a moment row into a full symmetric n x n matrix (row-major).</summary>
    public static double[] ExpandSecondMoments(ReadOnlySpan<double> row, int n)
    {
        var full = new double[n * n];
        var p = 1 + n;
        for (var j = 0; j < n; j++)
        {
            for (var k = j; k < n; k++)
            {
                full[j * n + k] = row[p];
                full[k * n + j] = row[p];
                p++;
            }
        }
        return full;
    }
}
