namespace Monitor.Analytics.Fitting;

/// <summary>In-place Cholesky factorisation and solve of a small symmetric positive-definite system (row-major n x n).</summary>
internal static class SmallCholesky
{
    /// <summary>Solves A x = b, overwriting A with its factor and b with x. False if A is not positive definite.</summary>
    public static bool Solve(Span<double> a, Span<double> b, int n)
    {
        for (var j = 0; j < n; j++)
        {
            var d = a[j * n + j];
            for (var k = 0; k < j; k++)
            {
                d -= a[j * n + k] * a[j * n + k];
            }
            if (!(d > 0) || !double.IsFinite(d))
            {
                return false;
            }
            d = Math.Sqrt(d);
            a[j * n + j] = d;
            for (var i = j + 1; i < n; i++)
            {
                var s = a[i * n + j];
                for (var k = 0; k < j; k++)
                {
                    s -= a[i * n + k] * a[j * n + k];
                }
                a[i * n + j] = s / d;
            }
        }
        for (var i = 0; i < n; i++)
        {
            var s = b[i];
            for (var k = 0; k < i; k++)
            {
                s -= a[i * n + k] * b[k];
            }
            b[i] = s / a[i * n + i];
        }
        for (var i = n - 1; i >= 0; i--)
        {
            var s = b[i];
            for (var k = i + 1; k < n; k++)
            {
                s -= a[k * n + i] * b[k];
            }
            b[i] = s / a[i * n + i];
        }
        return true;
    }
}
