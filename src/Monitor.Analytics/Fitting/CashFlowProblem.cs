namespace Monitor.Analytics.Fitting;

/// <summary>
/// Price residuals of instruments given as cash flows, r_i = (P_model - P_market) / (P_market D_i)
/// (close to market minus model yield), with P_model = sum_j c_j B_j exp(-z(t_j) t_j), where B_j is a
/// fixed base discount factor (1 for a base-curve fit; the base curve's DF for a spread fit, so that
/// the discount is exp(-(z_base + s) t)). dP/dp_k = -sum_j c_j t_j (dz/dp_k)(t_j) DF_j.
/// Cash flows are flattened once into contiguous arrays.
/// </summary>
internal sealed class CashFlowProblem : ILeastSquaresProblem
{
    private readonly string[] _ids;
    private readonly int[] _start; // flows of instrument i: [_start[i], _start[i+1])
    private readonly double[] _times;
    private readonly double[] _amounts;
    private readonly double[] _baseDiscount;
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
        _times = new double[flows];
        _amounts = new double[flows];
        _baseDiscount = new double[flows];
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
                _times[f] = ins.Times[j];
                _amounts[f] = ins.Amounts[j];
                _baseDiscount[f] = baseDiscount is null ? 1.0 : baseDiscount(ins.Times[j]);
            }
            _active[i] = true;
        }
        _start[n] = f;
        RebuildActive();
    }

    public CurveModel Model { get; }

    /// <summary>New quote for a point (cash flows unchanged): the refit hot path.</summary>
    public void UpdateQuote(int point, double dirtyPrice, double duration)
    {
        _price[point] = dirtyPrice;
        _weight[point] = 1.0 / (dirtyPrice * duration);
    }

    /// <summary>Recomputes the fixed base discount factors (spread fits, after the base curve moved): one pass over the flows.</summary>
    public void UpdateBaseDiscount(Func<double, double> baseDiscount)
    {
        for (var f = 0; f < _times.Length; f++)
        {
            _baseDiscount[f] = baseDiscount(_times[f]);
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
        Span<double> grad = stackalloc double[6];
        Span<double> dP = stackalloc double[6];
        for (var a = 0; a < _activeCount; a++)
        {
            var i = _activeIndex[a];
            var price = 0.0;
            dP.Clear();
            for (var f = _start[i]; f < _start[i + 1]; f++)
            {
                var t = _times[f];
                if (withJacobian)
                {
                    var z = FactorShape.ZeroAndGradient(Model, p, t, grad);
                    var pv = _amounts[f] * _baseDiscount[f] * Math.Exp(-z * t);
                    price += pv;
                    var tpv = -t * pv;
                    for (var k = 0; k < np; k++)
                    {
                        dP[k] += tpv * grad[k];
                    }
                }
                else
                {
                    price += _amounts[f] * _baseDiscount[f] * Math.Exp(-FactorShape.Zero(Model, p, t) * t);
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
            var t = _times[f];
            price += _amounts[f] * _baseDiscount[f] * Math.Exp(-FactorShape.Zero(Model, p, t) * t);
        }
        return (price - _price[point]) * _weight[point];
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
                    var v = _amounts[f] * _baseDiscount[f] * Math.Exp(-y * _times[f]);
                    pv += v;
                    tpv += _times[f] * v;
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
