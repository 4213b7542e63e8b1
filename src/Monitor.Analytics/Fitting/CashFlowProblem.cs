namespace Monitor.Analytics.Fitting;

/// <summary>
/// Price residuals of instruments given as cash flows, r_i = (P_model - P_market) / (P_market D_i)
/// (close to market minus model yield), with P_model = sum_j c_j B(t_j) exp(-z(t_j) t_j), where B is a
/// fixed base discount factor (1 for a base-curve fit; the base curve's DF for a spread fit, so that
/// the discount is exp(-(z_base + s) t)). dP/dp_k = -sum_j c_j t_j (dz/dp_k)(t_j) DF_j.
/// Cash flows are flattened once. Bonds share coupon dates, so the curve (exp and loadings) is evaluated once
/// per distinct time and the per-flow pass is multiply-adds only: the cost of an evaluation grows with the
/// number of distinct dates, not of flows. Times are compared exactly (equal dates give equal curve times).
/// </summary>
internal sealed class CashFlowProblem : ILeastSquaresProblem
{
    private readonly string[] _ids;
    private readonly int[] _start; // flows of instrument i: [_start[i], _start[i+1])
    private readonly int[] _timeOf; // flow -> distinct time index
    private readonly double[] _amounts;
    private readonly double[] _uniqueTimes;
    private readonly double[] _baseDiscount; // per distinct time
    private readonly double[] _discount; // per distinct time, B exp(-z t), last evaluation
    private readonly double[] _discountGradient; // per distinct time x parameter: -t dz/dp_k B exp(-z t)
    private readonly double[] _price;
    private readonly double[] _weight; // 1 / (P D)
    private readonly bool[] _active;
    private readonly int[] _activeIndex;
    private int _activeCount;

    public CashFlowProblem(CurveModel model, IReadOnlyList<ValidInstrument> instruments, Func<double, double>? baseDiscount)
    {
        Model = model;
        ParameterCount = FactorShape.ParameterCount(model);
        var n = instruments.Count;
        _ids = new string[n];
        _start = new int[n + 1];
        _price = new double[n];
        _weight = new double[n];
        _active = new bool[n];
        _activeIndex = new int[n];
        var flows = 0;
        foreach (var ins in instruments)
        {
            flows += ins.Times.Length;
        }
        _timeOf = new int[flows];
        _amounts = new double[flows];
        var unique = new Dictionary<double, int>();
        var times = new List<double>();
        var f = 0;
        for (var i = 0; i < n; i++)
        {
            var ins = instruments[i];
            _ids[i] = ins.Id;
            _start[i] = f;
            _price[i] = ins.DirtyPrice;
            _weight[i] = 1.0 / (ins.DirtyPrice * ins.Duration);
            for (var j = 0; j < ins.Times.Length; j++, f++)
            {
                if (!unique.TryGetValue(ins.Times[j], out var u))
                {
                    u = times.Count;
                    unique.Add(ins.Times[j], u);
                    times.Add(ins.Times[j]);
                }
                _timeOf[f] = u;
                _amounts[f] = ins.Amounts[j];
            }
            _active[i] = true;
        }
        _start[n] = f;
        _uniqueTimes = [.. times];
        _baseDiscount = new double[_uniqueTimes.Length];
        _discount = new double[_uniqueTimes.Length];
        _discountGradient = new double[_uniqueTimes.Length * ParameterCount];
        if (baseDiscount is null)
        {
            Array.Fill(_baseDiscount, 1.0);
        }
        else
        {
            UpdateBaseDiscount(baseDiscount);
        }
        RebuildActive();
    }

    public CurveModel Model { get; }

    /// <summary>Distinct cash-flow times (curve evaluations per pass).</summary>
    public int DistinctTimeCount => _uniqueTimes.Length;

    /// <summary>New quote for a point (cash flows unchanged): the refit hot path.</summary>
    public void UpdateQuote(int point, double dirtyPrice, double duration)
    {
        _price[point] = dirtyPrice;
        _weight[point] = 1.0 / (dirtyPrice * duration);
    }

    /// <summary>Recomputes the fixed base discount factors (spread fits, after the base curve moved): one pass over the distinct times.</summary>
    public void UpdateBaseDiscount(Func<double, double> baseDiscount)
    {
        for (var u = 0; u < _uniqueTimes.Length; u++)
        {
            _baseDiscount[u] = baseDiscount(_uniqueTimes[u]);
        }
    }

    /// <summary>Puts every point back into the fit.</summary>
    public void ActivateAll()
    {
        Array.Fill(_active, true);
        RebuildActive();
    }

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
        EvaluateCurve(p, withJacobian);
        Span<double> dP = stackalloc double[6];
        for (var a = 0; a < _activeCount; a++)
        {
            var i = _activeIndex[a];
            var price = 0.0;
            dP.Clear();
            for (var f = _start[i]; f < _start[i + 1]; f++)
            {
                var u = _timeOf[f];
                var c = _amounts[f];
                price += c * _discount[u];
                if (withJacobian)
                {
                    var g = _discountGradient.AsSpan(u * np, np);
                    for (var k = 0; k < np; k++)
                    {
                        dP[k] += c * g[k];
                    }
                }
            }
            var w = _weight[i];
            r[a] = (price - _price[i]) * w;
            if (withJacobian)
            {
                var row = jacobian.Slice(a * np, np);
                for (var k = 0; k < np; k++)
                {
                    row[k] = dP[k] * w;
                }
            }
        }
    }

    public double Residual(ReadOnlySpan<double> p, int point)
    {
        var price = 0.0;
        for (var f = _start[point]; f < _start[point + 1]; f++)
        {
            var u = _timeOf[f];
            var t = _uniqueTimes[u];
            price += _amounts[f] * _baseDiscount[u] * Math.Exp(-FactorShape.Zero(Model, p, t) * t);
        }
        return (price - _price[point]) * _weight[point];
    }

    public void AllResiduals(ReadOnlySpan<double> p, Span<double> residuals)
    {
        EvaluateCurve(p, withGradient: false);
        for (var i = 0; i < _ids.Length; i++)
        {
            var price = 0.0;
            for (var f = _start[i]; f < _start[i + 1]; f++)
            {
                price += _amounts[f] * _discount[_timeOf[f]];
            }
            residuals[i] = (price - _price[i]) * _weight[i];
        }
    }

    /// <summary>
    /// Flat continuously compounded rate y over the base discount (for a base fit: the bond's yield;
    /// for a spread fit: its z-spread), solved by Newton on sum c B e^{-y t} = P, pinned at the
    /// Fisher-Weil duration at y. Cold-start only.
    /// </summary>
    public void RateProxies(Span<double> times, Span<double> rates)
    {
        for (var a = 0; a < _activeCount; a++)
        {
            var i = _activeIndex[a];
            var y = 0.03;
            double pv = 0, tpv = 0;
            for (var iter = 0; iter < 30; iter++)
            {
                pv = 0;
                tpv = 0;
                for (var f = _start[i]; f < _start[i + 1]; f++)
                {
                    var t = _uniqueTimes[_timeOf[f]];
                    var v = _amounts[f] * _baseDiscount[_timeOf[f]] * Math.Exp(-y * t);
                    pv += v;
                    tpv += t * v;
                }
                if (!(tpv > 0))
                {
                    break;
                }
                var step = (pv - _price[i]) / tpv; // dPV/dy = -tpv
                y = Math.Clamp(y + step, -0.5, 1.0);
                if (Math.Abs(step) < 1e-12)
                {
                    break;
                }
            }
            times[a] = pv > 0 ? Math.Max(tpv / pv, 1e-3) : 1.0;
            rates[a] = y;
        }
    }

    // Discount factor (and its parameter gradient) at every distinct time: the only place with exp and loadings.
    private void EvaluateCurve(ReadOnlySpan<double> p, bool withGradient)
    {
        var np = ParameterCount;
        Span<double> grad = stackalloc double[6];
        for (var u = 0; u < _uniqueTimes.Length; u++)
        {
            var t = _uniqueTimes[u];
            if (withGradient)
            {
                var z = FactorShape.ZeroAndGradient(Model, p, t, grad);
                var df = _baseDiscount[u] * Math.Exp(-z * t);
                _discount[u] = df;
                var g = _discountGradient.AsSpan(u * np, np);
                var scale = -t * df;
                for (var k = 0; k < np; k++)
                {
                    g[k] = scale * grad[k];
                }
            }
            else
            {
                _discount[u] = _baseDiscount[u] * Math.Exp(-FactorShape.Zero(Model, p, t) * t);
            }
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
