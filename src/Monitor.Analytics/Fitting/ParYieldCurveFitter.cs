using System.Globalization;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// Fits a Nelson-Siegel or Svensson zero curve to par yields at tenors (for example the US Treasury daily
/// par yield curve, 1M..30Y), minimising par-yield errors: par(T) = (1 - DF(T)) / A(T) with semiannual
/// coupons, the convention of <see cref="Curves.ParYield.Compute"/> with frequency 2 (a flattened internal
/// equivalent is used). Residuals are in bp of par yield. Blank tenors (null or NaN) are skipped with a note.
/// Not thread-safe: one instance per thread.
/// </summary>
public sealed class ParYieldCurveFitter
{
    /// <summary>Coupon frequency of the par yields: semiannual, bond-equivalent.</summary>
    public const int Frequency = 2;

    private readonly FitEngine _engine = new();

    public CurveFitResult Fit(IReadOnlyList<ParYieldPoint> points, CurveFitOptions options, double[]? warmStart = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        if (points.Count == 0)
        {
            throw new ArgumentException("points: the list is empty; a par-yield fit needs points.", nameof(points));
        }
        var notes = new List<string>();
        var used = new List<(string Id, double Tenor, double ParYield)>();
        for (var i = 0; i < points.Count; i++)
        {
            var pt = points[i];
            var label = TenorLabel(pt.TenorYears);
            if (!double.IsFinite(pt.TenorYears) || pt.TenorYears <= 0)
            {
                throw new ArgumentException(Inv($"points[{i}].TenorYears must be a positive number of years, got {pt.TenorYears}."), nameof(points));
            }
            if (pt.ParYield is not { } y || double.IsNaN(y))
            {
                notes.Add(Inv($"tenor {label} has no par yield; skipped"));
                continue;
            }
            if (!double.IsFinite(y) || Math.Abs(y) > 1)
            {
                throw new ArgumentException(Inv($"points[{i}].ParYield (tenor {label}) must be a decimal yield (0.05 = 5%), got {y}."), nameof(points));
            }
            used.Add((label, pt.TenorYears, y));
        }
        var problem = new ParYieldProblem(options.Model, used, Frequency);
        return _engine.Run(problem, options, isSpread: false, warmStart, [], notes, nameof(points));
    }

    /// <summary>"1M".."11M" below a year (rounded to whole months), otherwise years ("2Y", "2.5Y").</summary>
    public static string TenorLabel(double years) =>
        years < 1 - 1e-9
            ? Inv($"{Math.Round(years * 12)}M")
            : Inv($"{years:0.##}Y");

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
