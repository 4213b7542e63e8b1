namespace Monitor.Analytics.Fitting;

/// <summary>
/// Keeps the flattened cash flows of the last fit. When the next call passes the same instruments (same ids in the same
/// order, the very same Times and Amounts arrays, the same pre-excluded ids), only prices and durations are re-read and
/// validated: the intraday refit does no per-flow copying. Trap: callers must not change a Times or Amounts array in
/// place after passing it; pass new arrays when cash flows change (then the cache rebuilds).
/// </summary>
internal sealed class CashFlowProblemCache
{
    private FitInstrument[] _source = [];
    private int[] _pointOf = [];
    private string[] _preExcludedIds = [];
    private FitExclusion[] _ownExclusions = [];
    private CashFlowProblem? _problem;

    public CashFlowProblem Get(
        CurveModel model,
        IReadOnlyList<FitInstrument> instruments,
        IReadOnlyList<FitExclusion>? preExcluded,
        Func<double, double>? baseDiscount,
        List<FitExclusion> exclusions)
    {
        ArgumentNullException.ThrowIfNull(instruments);
        if (_problem is not null && _problem.Model == model && SameStructure(instruments, preExcluded))
        {
            if (preExcluded is not null)
            {
                exclusions.AddRange(preExcluded);
            }
            exclusions.AddRange(_ownExclusions);
            for (var i = 0; i < instruments.Count; i++)
            {
                var k = _pointOf[i];
                if (k >= 0)
                {
                    var ins = instruments[i];
                    InstrumentValidation.CheckQuote(ins, i);
                    _problem.UpdateQuote(k, ins.DirtyPrice, ins.Duration);
                }
            }
            if (baseDiscount is not null)
            {
                _problem.UpdateBaseDiscount(baseDiscount);
            }
            _problem.ActivateAll();
            return _problem;
        }

        var before = exclusions.Count;
        var valid = InstrumentValidation.Prepare(instruments, preExcluded, exclusions);
        var problem = new CashFlowProblem(model, valid, baseDiscount);
        var index = new Dictionary<string, int>(valid.Count, StringComparer.Ordinal);
        for (var k = 0; k < valid.Count; k++)
        {
            index[valid[k].Id] = k;
        }
        _source = [.. instruments];
        _pointOf = [.. instruments.Select(ins => index.TryGetValue(ins.Id, out var k) ? k : -1)];
        _preExcludedIds = preExcluded is null ? [] : [.. preExcluded.Select(e => e.Id)];
        _ownExclusions = [.. exclusions.Skip(before + (preExcluded?.Count ?? 0))];
        _problem = problem;
        return problem;
    }

    private bool SameStructure(IReadOnlyList<FitInstrument> instruments, IReadOnlyList<FitExclusion>? preExcluded)
    {
        if (instruments.Count != _source.Length || (preExcluded?.Count ?? 0) != _preExcludedIds.Length)
        {
            return false;
        }
        for (var i = 0; i < _preExcludedIds.Length; i++)
        {
            if (!string.Equals(preExcluded![i].Id, _preExcludedIds[i], StringComparison.Ordinal))
            {
                return false;
            }
        }
        for (var i = 0; i < instruments.Count; i++)
        {
            var a = instruments[i];
            var b = _source[i];
            if (a is null || !ReferenceEquals(a.Times, b.Times) || !ReferenceEquals(a.Amounts, b.Amounts) || !string.Equals(a.Id, b.Id, StringComparison.Ordinal))
            {
                return false;
            }
        }
        return true;
    }
}
