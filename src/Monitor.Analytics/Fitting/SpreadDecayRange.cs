namespace Monitor.Analytics.Fitting;

/// <summary>
/// Where a spread fit may put its decay(s), from the Fisher-Weil durations of the group's active instruments.
/// <para>Why: a spread group is a handful of bonds over a narrow span (the demo's: five bonds, 2.5 to 10 years). When the
/// hump of the curvature loading (at x = t/tau = 1.7933) lies outside that span, the slope and curvature loadings are
/// nearly collinear over the data (both about tau/t for a short decay, both about linear in t for a long one): huge
/// offsetting betas then buy a fraction of a basis point against the quote noise, the least-squares minimum runs down a
/// flat valley to the |beta| bound (b1 = +0.97, b2 = -1, tau = 0.2 years was seen) and Levenberg-Marquardt crawls along
/// it until its iteration limit; the gate refuses the fit. So the decay is kept where the hump lies inside the span:
/// tau in [d_min, d_max] / 1.7933 (clamped to [MinTau, MaxTau]).</para>
/// <para>With fewer than ParameterCount + <see cref="CurveFitOptions.FreeSpreadDecayMinSurplus"/> instruments the decay
/// is not estimated at all: with five bonds and four parameters one residual degree of freedom is left, and the quote
/// noise alone moves the decay from one end of its range to the other between refits (so do the spread slope and
/// curvature exposures). It is held where the curvature hump sits mid-span, tau = (d_min + d_max) / 2 / 1.7933, the
/// rule Diebold and Li (2006, "Forecasting the term structure of government bond yields", J. Econometrics 130) use to
/// fix their decay (hump at a medium maturity) applied to the group's own span; the fit is then linear in the betas
/// but for the exponential discounting, and warm and cold starts meet at the same minimum.
/// A Svensson spread holds its two decays at the humps of the span's ends (d_min and d_max / 1.7933), so they stay apart.</para>
/// </summary>
internal static class SpreadDecayRange
{
    /// <summary>x at which the curvature loading C(x) = (1 - e^-x)/x - e^-x peaks (C'(x) = 0; computed, common practice).</summary>
    public const double CurvaturePeak = 1.7933;

    /// <summary>Writes the decay bounds into <paramref name="lower"/>/<paramref name="upper"/>; a fixed decay gets lower == upper.</summary>
    public static void Apply(ILeastSquaresProblem problem, CurveFitOptions options, Span<double> durations, Span<double> rates, Span<double> lower, Span<double> upper)
    {
        var m = problem.ActiveCount;
        problem.RateProxies(durations, rates);
        double shortest = double.PositiveInfinity, longest = 0;
        for (var i = 0; i < m; i++)
        {
            shortest = Math.Min(shortest, durations[i]);
            longest = Math.Max(longest, durations[i]);
        }
        var low = Math.Clamp(shortest / CurvaturePeak, options.MinTau, options.MaxTau);
        var high = Math.Clamp(longest / CurvaturePeak, low, options.MaxTau);
        var fixedDecay = m < problem.ParameterCount + options.FreeSpreadDecayMinSurplus;
        var decay = 0;
        for (var k = 0; k < problem.ParameterCount; k++)
        {
            if (!FactorShape.IsDecay(problem.Model, k))
            {
                continue;
            }
            if (!fixedDecay)
            {
                lower[k] = low;
                upper[k] = high;
            }
            else if (problem.Model == CurveModel.NelsonSiegel)
            {
                lower[k] = upper[k] = Math.Clamp(0.5 * (shortest + longest) / CurvaturePeak, options.MinTau, options.MaxTau);
            }
            else
            {
                lower[k] = upper[k] = decay == 0 ? low : high;
            }
            decay++;
        }
    }
}
