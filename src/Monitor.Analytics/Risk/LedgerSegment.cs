namespace Monitor.Analytics.Risk;

/// <summary>
/// Compact view of the cash flows of one book on one curve key: parallel arrays of date indices
/// (into the book's <see cref="CashFlowDateIndex"/>, ascending) and net amounts in money.
/// Valid until the ledger next changes.
/// </summary>
public readonly struct LedgerSegment
{
    private readonly int[]? _dateIndices;
    private readonly double[]? _amounts;
    private readonly int _count;

    internal LedgerSegment(string curveKey, int[] dateIndices, double[] amounts, int count)
    {
        CurveKey = curveKey;
        _dateIndices = dateIndices;
        _amounts = amounts;
        _count = count;
    }

    /// <summary>Curve key of the segment (<see cref="Risk.CurveKey.Government"/> for the base curve).</summary>
    public string CurveKey { get; }

    /// <summary>Number of distinct dates.</summary>
    public int Count => _count;

    /// <summary>Date indices, ascending.</summary>
    public ReadOnlySpan<int> DateIndices => _dateIndices.AsSpan(0, _count);

    /// <summary>Net amounts in money, aligned with <see cref="DateIndices"/>.</summary>
    public ReadOnlySpan<double> Amounts => _amounts.AsSpan(0, _count);
}
