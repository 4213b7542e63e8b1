using System.Globalization;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// What the three fitters share: bounds (guard rails), cold start (decay grid, linear least squares on
/// rate proxies for the betas, then a few Gauss-Newton/LM steps with the decays fixed; the best grid point
/// seeds the full fit), warm start (few iterations from the previous parameters, cold start if that fails),
/// the outlier loop (drop |residual - median| &gt; max(k 1.4826 MAD, floor), worst first, refit) and the report.
/// Holds its solver workspace: one engine per thread.
/// </summary>
internal sealed class FitEngine
{
    private const int GridIterations = 6;
    private const int ColdStartSeeds = 3;
    private const int SeedIterations = 40;
    private readonly NativeLevenbergMarquardt _native = new();
    private double[] _proxyTimes = [];
    private double[] _proxyRates = [];

    public CurveFitResult Run(
        ILeastSquaresProblem problem,
        CurveFitOptions options,
        bool isSpread,
        double[]? warmStart,
        List<FitExclusion> exclusions,
        List<string> notes,
        string pointsName)
    {
        var model = problem.Model;
        var n = problem.ParameterCount;
        var minPoints = n;
        if (problem.ActiveCount < minPoints)
        {
            throw new ArgumentException(
                FormattableString.Invariant($"{pointsName}: a {model} fit needs at least {minPoints} usable points, got {problem.ActiveCount}."),
                pointsName);
        }
        Span<double> lower = stackalloc double[n];
        Span<double> upper = stackalloc double[n];
        for (var k = 0; k < n; k++)
        {
            if (FactorShape.IsDecay(model, k))
            {
                lower[k] = options.MinTau;
                upper[k] = options.MaxTau;
            }
            else
            {
                lower[k] = -options.MaxAbsBeta;
                upper[k] = options.MaxAbsBeta;
            }
        }
        lower[0] = isSpread ? options.MinSpreadLevel : options.MinLevel;
        if (isSpread)
        {
            SpreadDecays(problem, options, lower, upper);
        }

        var exactCost = Square(options.ExactFitRmseBp * 1e-4) * problem.ActiveCount;
        var p = new double[n];
        var iterations = 0;
        SolverOutcome outcome;
        var warmed = false;
        if (warmStart is not null)
        {
            if (warmStart.Length != n || warmStart.Any(v => !double.IsFinite(v)))
            {
                throw new ArgumentException(
                    FormattableString.Invariant($"warmStart: a {model} fit needs {n} finite parameters, got [{string.Join(", ", warmStart)}]."),
                    nameof(warmStart));
            }
            warmStart.CopyTo(p, 0);
            outcome = Solve(problem, options, p, lower, upper, options.WarmMaxIterations, exactCost);
            iterations += outcome.Iterations;
            warmed = outcome.Converged;
            if (!outcome.Converged)
            {
                notes.Add(FormattableString.Invariant($"warm start did not converge within {outcome.Iterations} iterations ({outcome.ExitReason}); fitted from a cold start"));
                var cold = new double[n];
                var coldOutcome = ColdStart(problem, options, cold, lower, upper, exactCost);
                iterations += coldOutcome.Iterations;
                if (!(coldOutcome.Cost > outcome.Cost))
                {
                    outcome = coldOutcome;
                    p = cold;
                }
            }
        }
        else
        {
            outcome = ColdStart(problem, options, p, lower, upper, exactCost);
            iterations += outcome.Iterations;
        }

        var residualsBp = new double[problem.PointCount];
        ComputeResiduals(problem, p, residualsBp);
        if (options.RejectOutliers)
        {
            for (var round = 1; round <= options.MaxOutlierRounds; round++)
            {
                if (!DropOutliers(problem, options, residualsBp, round, exclusions))
                {
                    break;
                }
                exactCost = Square(options.ExactFitRmseBp * 1e-4) * problem.ActiveCount;
                if (isSpread)
                {
                    SpreadDecays(problem, options, lower, upper); // the span may have narrowed
                }
                outcome = Solve(problem, options, p, lower, upper, options.MaxIterations, exactCost);
                iterations += outcome.Iterations;
                ComputeResiduals(problem, p, residualsBp);
            }
        }

        return new CurveFitResult(FactorShape.ToCurve(model, p), p, BuildReport(problem, options, residualsBp, outcome, iterations, warmed, exclusions, notes));
    }

    private SolverOutcome Solve(ILeastSquaresProblem problem, CurveFitOptions options, Span<double> p, ReadOnlySpan<double> lower, ReadOnlySpan<double> upper, int maxIterations, double exactCost)
    {
        // A parameter whose box is a single point (a spread decay held fixed) is fixed, not merely clamped: its
        // gradient must not enter the step of the others.
        Span<bool> isFixed = stackalloc bool[problem.ParameterCount];
        for (var k = 0; k < isFixed.Length; k++)
        {
            isFixed[k] = lower[k] == upper[k];
        }
        if (options.Solver == FitSolver.MathNet)
        {
            return MathNetLevenbergMarquardt.Solve(problem, p, lower, upper, isFixed, maxIterations);
        }
        return _native.Solve(problem, p, lower, upper, isFixed, maxIterations, options.RelativeCostTolerance, exactCost);
    }

    private void SpreadDecays(ILeastSquaresProblem problem, CurveFitOptions options, Span<double> lower, Span<double> upper)
    {
        EnsureProxies(problem.ActiveCount);
        SpreadDecayRange.Apply(problem, options, _proxyTimes, _proxyRates, lower, upper);
    }

    private void EnsureProxies(int m)
    {
        if (_proxyTimes.Length < m)
        {
            _proxyTimes = new double[m];
            _proxyRates = new double[m];
        }
    }

    private SolverOutcome ColdStart(ILeastSquaresProblem problem, CurveFitOptions options, Span<double> p, ReadOnlySpan<double> lower, ReadOnlySpan<double> upper, double exactCost)
    {
        var model = problem.Model;
        var n = problem.ParameterCount;
        var m = problem.ActiveCount;
        EnsureProxies(m);
        problem.RateProxies(_proxyTimes, _proxyRates);

        // Decay grids over each decay's bounds (a spread fit narrows them, or fixes a decay: a one-point grid).
        var firstDecay = model == CurveModel.NelsonSiegel ? 3 : 4;
        var grid = DecayGrid(options, lower[firstDecay], upper[firstDecay]);
        var grid2 = model == CurveModel.Svensson ? DecayGrid(options, lower[5], upper[5]) : grid;
        Span<bool> decayFixed = stackalloc bool[n];
        for (var k = 0; k < n; k++)
        {
            decayFixed[k] = FactorShape.IsDecay(model, k);
        }
        Span<double> trial = stackalloc double[n];
        // Keep the best few grid points (by cost) and run the full fit from each: one seed can sit in a
        // neighbouring basin (seen on the GSW 2002-01-24 row, a short tau1 of 0.43 years).
        var seeds = new double[ColdStartSeeds * n];
        var seedCost = new double[ColdStartSeeds];
        Array.Fill(seedCost, double.PositiveInfinity);
        var secondCount = model == CurveModel.Svensson ? grid2.Length : 1;
        Span<double> rowBest = stackalloc double[n];
        Span<bool> firstDecayFixed = stackalloc bool[n];
        firstDecayFixed[n - 2] = model == CurveModel.Svensson;
        for (var g1 = 0; g1 < grid.Length; g1++)
        {
            var rowCost = double.PositiveInfinity;
            for (var g2 = 0; g2 < secondCount; g2++)
            {
                if (model == CurveModel.Svensson)
                {
                    if (!(grid2[g2] > grid[g1]))
                    {
                        continue; // tau2 > tau1: the second hump sits further out (as in the published GSW curves)
                    }
                    trial[4] = grid[g1];
                    trial[5] = grid2[g2];
                }
                else
                {
                    trial[3] = grid[g1];
                }
                LinearBetas(model, trial, m, lower, upper);
                var o = _native.Solve(problem, trial, lower, upper, decayFixed, GridIterations, options.RelativeCostTolerance, exactCost);
                if (o.Cost < rowCost)
                {
                    rowCost = o.Cost;
                    trial.CopyTo(rowBest);
                }
            }
            if (model == CurveModel.Svensson && double.IsFinite(rowCost))
            {
                // Profile over tau1: with tau1 held at the grid value, let tau2 and the betas move (the grid in tau2 is coarse).
                var profiled = _native.Solve(problem, rowBest, lower, upper, firstDecayFixed, 2 * GridIterations, options.RelativeCostTolerance, exactCost);
                rowCost = profiled.Cost;
            }
            // Seeds are the best point of each first-decay row, so they differ in tau1, where the basins differ.
            var worst = 0;
            for (var s = 1; s < ColdStartSeeds; s++)
            {
                if (seedCost[s] > seedCost[worst])
                {
                    worst = s;
                }
            }
            if (rowCost < seedCost[worst])
            {
                seedCost[worst] = rowCost;
                rowBest.CopyTo(seeds.AsSpan(worst * n, n));
            }
        }
        Span<double> candidate = stackalloc double[n];
        var best = new SolverOutcome(0, false, "no cold-start seed", double.PositiveInfinity);
        var iterations = 0;
        for (var s = 0; s < ColdStartSeeds; s++)
        {
            if (!double.IsFinite(seedCost[s]))
            {
                continue;
            }
            seeds.AsSpan(s * n, n).CopyTo(candidate);
            var o = Solve(problem, options, candidate, lower, upper, Math.Min(SeedIterations, options.MaxIterations), exactCost);
            iterations += o.Iterations;
            if (o.Cost < best.Cost || !double.IsFinite(best.Cost))
            {
                best = o;
                candidate.CopyTo(p);
            }
        }
        if (!best.Converged && options.MaxIterations > SeedIterations && double.IsFinite(best.Cost))
        {
            // Only the winning seed is followed to the end: slow valleys (poorly identified Svensson humps) cost iterations.
            best = Solve(problem, options, p, lower, upper, options.MaxIterations - SeedIterations, exactCost);
            iterations += best.Iterations;
        }
        return best with { Iterations = iterations };
    }

    private static double[] DecayGrid(CurveFitOptions options, double low, double high)
    {
        if (low == high)
        {
            return [low];
        }
        var grid = new double[options.TauGridPoints];
        for (var g = 0; g < grid.Length; g++)
        {
            grid[g] = low * Math.Pow(high / low, g / (grid.Length - 1.0));
        }
        return grid;
    }

    /// <summary>Betas by least squares of the rate proxies on the loadings at the given decays (a tiny ridge keeps it solvable).</summary>
    private void LinearBetas(CurveModel model, Span<double> p, int m, ReadOnlySpan<double> lower, ReadOnlySpan<double> upper)
    {
        var f = FactorShape.FactorCount(model);
        Span<double> xtx = stackalloc double[f * f];
        Span<double> xty = stackalloc double[f];
        Span<double> l = stackalloc double[f];
        xtx.Clear();
        xty.Clear();
        for (var i = 0; i < m; i++)
        {
            FactorShape.Loadings(model, p, _proxyTimes[i], l);
            for (var a = 0; a < f; a++)
            {
                xty[a] += l[a] * _proxyRates[i];
                for (var b = 0; b < f; b++)
                {
                    xtx[a * f + b] += l[a] * l[b];
                }
            }
        }
        for (var a = 0; a < f; a++)
        {
            xtx[a * f + a] += 1e-8 * m;
        }
        if (!SmallCholesky.Solve(xtx, xty, f))
        {
            xty.Clear();
            xty[0] = 0.03;
        }
        for (var a = 0; a < f; a++)
        {
            p[a] = Math.Clamp(xty[a], lower[a], upper[a]);
        }
    }

    /// <summary>Residuals of every point (used or not) in bp, one pass.</summary>
    private static void ComputeResiduals(ILeastSquaresProblem problem, ReadOnlySpan<double> p, double[] residualsBp)
    {
        problem.AllResiduals(p, residualsBp);
        for (var i = 0; i < residualsBp.Length; i++)
        {
            residualsBp[i] *= 1e4;
        }
    }

    private static bool DropOutliers(ILeastSquaresProblem problem, CurveFitOptions options, double[] residualsBp, int round, List<FitExclusion> exclusions)
    {
        var allowed = problem.ActiveCount - (problem.ParameterCount + options.OutlierMinSurplus);
        if (allowed <= 0)
        {
            return false;
        }
        var ids = new List<int>(problem.ActiveCount);
        var bp = new List<double>(problem.ActiveCount);
        for (var i = 0; i < problem.PointCount; i++)
        {
            if (problem.IsActive(i))
            {
                ids.Add(i);
                bp.Add(residualsBp[i]);
            }
        }
        var median = Median(bp);
        var mad = Median(bp.Select(v => Math.Abs(v - median)));
        var threshold = Math.Max(options.OutlierMadMultiple * 1.4826 * mad, options.OutlierFloorBp);
        var worst = bp.Max(v => Math.Abs(v - median));
        if (!(worst > threshold))
        {
            return false;
        }
        // Worst first; only those at least half as far out as the worst, because one bad quote pulls its neighbours.
        var candidates = Enumerable.Range(0, ids.Count)
            .Where(a => Math.Abs(bp[a] - median) > threshold && Math.Abs(bp[a] - median) >= 0.5 * worst)
            .OrderByDescending(a => Math.Abs(bp[a] - median))
            .Take(allowed)
            .ToList();
        foreach (var a in candidates)
        {
            problem.SetActive(ids[a], false);
            exclusions.Add(new FitExclusion(problem.PointId(ids[a]), FitExclusionReason.Outlier,
                string.Create(CultureInfo.InvariantCulture,
                    $"residual {bp[a]:F2} bp, median {median:F2} bp, threshold {threshold:F2} bp (max of {options.OutlierMadMultiple:G3} x 1.4826 x MAD {mad:F2} bp and floor {options.OutlierFloorBp:G3} bp), round {round}")));
        }
        return candidates.Count > 0;
    }

    private static FitReport BuildReport(ILeastSquaresProblem problem, CurveFitOptions options, double[] residualsBp, SolverOutcome outcome, int iterations, bool warmed, List<FitExclusion> exclusions, List<string> notes)
    {
        var residuals = new List<FitResidual>(problem.PointCount);
        var used = new List<string>(problem.ActiveCount);
        double sumSq = 0, maxAbs = 0;
        string? maxId = null;
        for (var i = 0; i < problem.PointCount; i++)
        {
            var bp = residualsBp[i];
            var active = problem.IsActive(i);
            residuals.Add(new FitResidual(problem.PointId(i), bp, active));
            if (!active)
            {
                continue;
            }
            used.Add(problem.PointId(i));
            sumSq += bp * bp;
            if (Math.Abs(bp) >= maxAbs)
            {
                maxAbs = Math.Abs(bp);
                maxId = problem.PointId(i);
            }
        }
        var rmse = used.Count > 0 ? Math.Sqrt(sumSq / used.Count) : double.NaN;
        return new FitReport(problem.Model, options.Solver, rmse, maxAbs, maxId, iterations, outcome.Converged, outcome.ExitReason,
            warmed, used, exclusions, residuals, notes);
    }

    private static double Median(IEnumerable<double> values)
    {
        var sorted = values.ToArray(); // a copy: callers keep their order
        Array.Sort(sorted);
        var c = sorted.Length;
        return c % 2 == 1 ? sorted[c / 2] : 0.5 * (sorted[c / 2 - 1] + sorted[c / 2]);
    }

    private static double Square(double x) => x * x;
}
