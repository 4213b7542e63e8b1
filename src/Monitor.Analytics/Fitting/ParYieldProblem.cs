namespace Monitor.Analytics.Fitting;

/// <summary>
/// Par-yield residuals r_i = par_published(T_i) - par_model(T_i) (market minus model, like the bond residuals), with the schedule of
/// <see cref="Curves.ParYield.Compute"/>: par(T) = (1 - DF(T)) / A(T), A = sum_k w_k DF(t_k), coupon times
/// stepping back from T by 1/f and a short stub weighted by its length. Flattened once.
/// d par/dp = (-dDF(T)/dp A - (1 - DF(T)) dA/dp) / A^2 = -(dDF(T)/dp + par dA/dp) / A, dDF(t)/dp = -t DF(t) dz/dp.
/// </summary>
internal sealed class ParYieldProblem : ILeastSquaresProblem
{
    private readonly string[] _ids;
    private readonly double[] _tenor;
    private readonly double[] _target;
    private readonly int[] _start;
    private readonly double[] _times;
    private readonly double[] _weights;
    private readonly bool[] _active;
    private readonly int[] _activeIndex;
    private int _activeCount;

    public ParYieldProblem(CurveModel model, IReadOnlyList<(string Id, double Tenor, double ParYield)> points, int frequency)
    {
        Model = model;
        ParameterCount = FactorShape.ParameterCount(model);
        var n = points.Count;
        _ids = new string[n];
        _tenor = new double[n];
        _target = new double[n];
        _start = new int[n + 1];
        _active = new bool[n];
        _activeIndex = new int[n];
        var times = new List<double>();
        var weights = new List<double>();
        var period = 1.0 / frequency;
        for (var i = 0; i < n; i++)
        {
            _ids[i] = points[i].Id;
            _tenor[i] = points[i].Tenor;
            _target[i] = points[i].ParYield;
            _start[i] = times.Count;
            var t = points[i].Tenor;
            // Same stepping and tolerances as ParYield.Compute.
            while (t > period * (1 - 1e-9))
            {
                times.Add(t);
                weights.Add(period);
                t -= period;
            }
            if (t > 1e-9)
            {
                times.Add(t);
                weights.Add(t);
            }
            _active[i] = true;
        }
        _start[n] = times.Count;
        _times = [.. times];
        _weights = [.. weights];
        RebuildActive();
    }

    public CurveModel Model { get; }

    public int ParameterCount { get; }

    public int PointCount => _ids.Length;

    public int ActiveCount => _activeCount;

    public string PointId(int point) => _ids[point];

    public bool IsActive(int point) => _active[point];

    public void SetActive(int point, bool active)
    {
        _active[point] = active;
        RebuildActive();
    }

    public void Evaluate(ReadOnlySpan<double> p, Span<double> r, Span<double> jacobian)
    {
        var np = ParameterCount;
        var withJacobian = !jacobian.IsEmpty;
        Span<double> grad = stackalloc double[6];
        Span<double> dA = stackalloc double[6];
        Span<double> dDfT = stackalloc double[6];
        for (var a = 0; a < _activeCount; a++)
        {
            var i = _activeIndex[a];
            var annuity = 0.0;
            var dfT = 0.0;
            dA.Clear();
            // The first flow of each schedule is at the tenor itself.
            for (var f = _start[i]; f < _start[i + 1]; f++)
            {
                var t = _times[f];
                var z = withJacobian ? FactorShape.ZeroAndGradient(Model, p, t, grad) : FactorShape.Zero(Model, p, t);
                var df = Math.Exp(-z * t);
                annuity += _weights[f] * df;
                if (f == _start[i])
                {
                    dfT = df;
                }
                if (withJacobian)
                {
                    var scale = -t * df;
                    for (var k = 0; k < np; k++)
                    {
                        var d = scale * grad[k];
                        dA[k] += _weights[f] * d;
                        if (f == _start[i])
                        {
                            dDfT[k] = d;
                        }
                    }
                }
            }
            var par = (1.0 - dfT) / annuity;
            r[a] = _target[i] - par;
            if (withJacobian)
            {
                var row = jacobian.Slice(a * np, np);
                for (var k = 0; k < np; k++)
                {
                    row[k] = (dDfT[k] + par * dA[k]) / annuity;
                }
            }
        }
    }

    public double Residual(ReadOnlySpan<double> p, int point)
    {
        var annuity = 0.0;
        var dfT = Math.Exp(-FactorShape.Zero(Model, p, _tenor[point]) * _tenor[point]);
        for (var f = _start[point]; f < _start[point + 1]; f++)
        {
            annuity += _weights[f] * Math.Exp(-FactorShape.Zero(Model, p, _times[f]) * _times[f]);
        }
        return _target[point] - (1.0 - dfT) / annuity;
    }

    public void AllResiduals(ReadOnlySpan<double> p, Span<double> residuals)
    {
        for (var i = 0; i < _ids.Length; i++)
        {
            residuals[i] = Residual(p, i);
        }
    }

    /// <summary>The published par yield as a zero-rate proxy: continuous equivalent 2 ln(1 + y/2) at the tenor.</summary>
    public void RateProxies(Span<double> times, Span<double> rates)
    {
        for (var a = 0; a < _activeCount; a++)
        {
            var i = _activeIndex[a];
            times[a] = _tenor[i];
            rates[a] = 2.0 * Math.Log(1.0 + _target[i] / 2.0);
        }
    }

    private void RebuildActive()
    {
        _activeCount = 0;
        for (var i = 0; i < _active.Length; i++)
        {
            if (_active[i])
            {
                _activeIndex[_activeCount++] = i;
            }
        }
    }
}
