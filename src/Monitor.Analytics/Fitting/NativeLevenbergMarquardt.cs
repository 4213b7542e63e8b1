namespace Monitor.Analytics.Fitting;

/// <summary>
/// Levenberg-Marquardt over preallocated arrays (Madsen, Nielsen and Tingleff, "Methods for Non-Linear
/// Least Squares Problems", 2nd ed. 2004, algorithm 3.16: gain ratio and Nielsen's damping update;
/// Marquardt's diagonal scaling). Normal equations (J'J + mu diag(J'J)) h = -J'r solved by Cholesky;
/// bounds by projecting the trial point onto the box, the gain ratio then uses the projected step; a parameter on its
/// bound that the gradient pushes outward is held for the iteration (see <see cref="HoldActiveBounds"/>).
/// Fixed parameters get a zero step. No allocation per iteration: buffers are sized once per problem size.
/// </summary>
internal sealed class NativeLevenbergMarquardt
{
    private double[] _r = [];
    private double[] _rTrial = [];
    private double[] _j = [];
    private double[] _jTrial = [];
    private readonly double[] _jtj = new double[36];
    private readonly double[] _a = new double[36];
    private readonly double[] _g = new double[6];
    private readonly double[] _h = new double[6];
    private readonly double[] _pTrial = new double[6];

    public SolverOutcome Solve(
        ILeastSquaresProblem problem,
        Span<double> p,
        ReadOnlySpan<double> lower,
        ReadOnlySpan<double> upper,
        ReadOnlySpan<bool> isFixed,
        int maxIterations,
        double relativeCostTolerance,
        double exactCost)
    {
        var n = problem.ParameterCount;
        var m = problem.ActiveCount;
        Ensure(m, n);
        for (var k = 0; k < n; k++)
        {
            p[k] = Math.Clamp(p[k], lower[k], upper[k]);
        }
        var r = _r.AsSpan(0, m);
        var jac = _j.AsSpan(0, m * n);
        problem.Evaluate(p, r, jac);
        var cost = Dot(r, r);
        if (!double.IsFinite(cost))
        {
            return new SolverOutcome(0, false, "non-finite residuals at the starting point", cost);
        }
        double mu = -1, nu = 2;
        var iterations = 0;
        while (iterations < maxIterations)
        {
            if (cost <= exactCost)
            {
                return new SolverOutcome(iterations, true, "exact fit (RMSE below tolerance)", cost);
            }
            iterations++;
            BuildNormalEquations(jac, r, m, n, isFixed);
            HoldActiveBounds(p, lower, upper, n);
            var maxDiag = 0.0;
            for (var k = 0; k < n; k++)
            {
                maxDiag = Math.Max(maxDiag, _jtj[k * n + k]);
            }
            if (mu < 0)
            {
                mu = 1e-3;
            }
            var gradNorm = 0.0;
            for (var k = 0; k < n; k++)
            {
                gradNorm = Math.Max(gradNorm, Math.Abs(_g[k]));
            }
            if (gradNorm <= 1e-16 * Math.Max(cost, 1e-300) || gradNorm == 0)
            {
                return new SolverOutcome(iterations, true, "gradient vanished", cost);
            }

            var accepted = false;
            for (var attempt = 0; attempt < 40 && !accepted; attempt++)
            {
                // (J'J + mu D) h = -g, D = diag(J'J) floored so flat directions still get damping.
                for (var i = 0; i < n * n; i++)
                {
                    _a[i] = _jtj[i];
                }
                for (var k = 0; k < n; k++)
                {
                    _a[k * n + k] += mu * Math.Max(_jtj[k * n + k], 1e-12 * maxDiag);
                    _h[k] = -_g[k];
                }
                if (!SmallCholesky.Solve(_a.AsSpan(0, n * n), _h.AsSpan(0, n), n))
                {
                    mu *= nu;
                    nu *= 2;
                    continue;
                }
                var stepNorm = 0.0;
                var pNorm = 0.0;
                for (var k = 0; k < n; k++)
                {
                    _pTrial[k] = isFixed[k] ? p[k] : Math.Clamp(p[k] + _h[k], lower[k], upper[k]);
                    _h[k] = _pTrial[k] - p[k];
                    stepNorm += _h[k] * _h[k];
                    pNorm += p[k] * p[k];
                }
                if (Math.Sqrt(stepNorm) <= 1e-12 * (Math.Sqrt(pNorm) + 1e-12))
                {
                    return new SolverOutcome(iterations, true, "step below tolerance", cost);
                }
                // Predicted reduction of the linear model: -(2 h'g + h'J'J h).
                var predicted = 0.0;
                for (var k = 0; k < n; k++)
                {
                    var jh = 0.0;
                    for (var l = 0; l < n; l++)
                    {
                        jh += _jtj[k * n + l] * _h[l];
                    }
                    predicted -= _h[k] * (2 * _g[k] + jh);
                }
                var rTrial = _rTrial.AsSpan(0, m);
                var jTrial = _jTrial.AsSpan(0, m * n);
                problem.Evaluate(_pTrial.AsSpan(0, n), rTrial, jTrial);
                var costTrial = Dot(rTrial, rTrial);
                var rho = predicted > 0 ? (cost - costTrial) / predicted : -1;
                if (double.IsFinite(costTrial) && costTrial < cost && rho > 0)
                {
                    accepted = true;
                    var reduction = cost - costTrial;
                    _pTrial.AsSpan(0, n).CopyTo(p);
                    (_r, _rTrial) = (_rTrial, _r);
                    (_j, _jTrial) = (_jTrial, _j);
                    r = _r.AsSpan(0, m);
                    jac = _j.AsSpan(0, m * n);
                    cost = costTrial;
                    var c = 2 * rho - 1;
                    mu *= Math.Max(1.0 / 3.0, 1 - c * c * c);
                    nu = 2;
                    if (reduction <= relativeCostTolerance * cost)
                    {
                        return new SolverOutcome(iterations, true, "relative reduction below tolerance", cost);
                    }
                }
                else
                {
                    mu *= nu;
                    nu *= 2;
                    if (mu > 1e20)
                    {
                        return new SolverOutcome(iterations, true, "no further decrease possible (damping exhausted)", cost);
                    }
                }
            }
            if (!accepted)
            {
                return new SolverOutcome(iterations, true, "no further decrease possible", cost);
            }
        }
        return new SolverOutcome(iterations, cost <= exactCost, cost <= exactCost ? "exact fit (RMSE below tolerance)" : "iteration limit reached", cost);
    }

    /// <summary>
    /// A parameter on its bound whose descent direction points out of the box is held for this iteration (its row and
    /// column taken out as for a fixed one): the step of the others then solves the reduced system instead of being the
    /// full step with that component clipped, and the gradient test sees the projected gradient. Without this, with a
    /// decay sitting on its bound, every clipped step was a poor step for the betas too, and the relative-reduction test
    /// stopped the fit short of the minimum (0.6 bp apart in the level on a ten-bond spread group).
    /// Projected (active-set) Levenberg-Marquardt, Kanzow, Yamashita and Fukushima, J. Comput. Appl. Math. 172 (2004).
    /// </summary>
    private void HoldActiveBounds(ReadOnlySpan<double> p, ReadOnlySpan<double> lower, ReadOnlySpan<double> upper, int n)
    {
        for (var k = 0; k < n; k++)
        {
            // _g = J'r: the descent direction is -_g.
            var blocked = (p[k] <= lower[k] && _g[k] > 0) || (p[k] >= upper[k] && _g[k] < 0);
            if (!blocked)
            {
                continue;
            }
            for (var l = 0; l < n; l++)
            {
                _jtj[k * n + l] = 0;
                _jtj[l * n + k] = 0;
            }
            _jtj[k * n + k] = 1;
            _g[k] = 0;
        }
    }

    private void BuildNormalEquations(ReadOnlySpan<double> jac, ReadOnlySpan<double> r, int m, int n, ReadOnlySpan<bool> isFixed)
    {
        Array.Clear(_jtj);
        Array.Clear(_g);
        for (var i = 0; i < m; i++)
        {
            var row = jac.Slice(i * n, n);
            var ri = r[i];
            for (var k = 0; k < n; k++)
            {
                var jk = row[k];
                _g[k] += jk * ri;
                for (var l = 0; l <= k; l++)
                {
                    _jtj[k * n + l] += jk * row[l];
                }
            }
        }
        for (var k = 0; k < n; k++)
        {
            for (var l = 0; l < k; l++)
            {
                _jtj[l * n + k] = _jtj[k * n + l];
            }
        }
        for (var k = 0; k < n; k++)
        {
            if (!isFixed[k])
            {
                continue;
            }
            for (var l = 0; l < n; l++)
            {
                _jtj[k * n + l] = 0;
                _jtj[l * n + k] = 0;
            }
            _jtj[k * n + k] = 1;
            _g[k] = 0;
        }
    }

    private void Ensure(int m, int n)
    {
        if (_r.Length < m)
        {
            _r = new double[m];
            _rTrial = new double[m];
        }
        if (_j.Length < m * n)
        {
            _j = new double[m * n];
            _jTrial = new double[m * n];
        }
    }

    private static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        var s = 0.0;
        for (var i = 0; i < a.Length; i++)
        {
            s += a[i] * b[i];
        }
        return s;
    }
}
