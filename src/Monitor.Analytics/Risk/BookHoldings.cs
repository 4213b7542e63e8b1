using System.Globalization;
using System.Runtime.InteropServices;

namespace Monitor.Analytics.Risk;

/// <summary>
/// A book as quantities of instruments of an <see cref="InstrumentCashFlowTable"/>: quantity = face / 100 (negative
/// for a short), so the book's flows are sum quantity x instrument flows per 100. Applying a trade is one hash update,
/// whatever the instrument's number of flows.
/// </summary>
/// <remarks>
/// A quantity is dropped when it nets to at most 1e-9 of the larger of the old quantity and the change (float
/// cancellation of an add then remove), like <see cref="BookCashFlowLedger"/>. The sorted arrays the risk pass reads
/// are rebuilt lazily, once after a batch of trades. Not thread-safe: one writer; readers only while nobody writes.
/// </remarks>
public sealed class BookHoldings
{
    private const double RelativeNettingTolerance = 1e-9;

    private readonly Dictionary<int, double> _quantities = [];
    private int[] _instruments = [];
    private double[] _compactQuantities = [];
    private int _count;
    private bool _dirty;

    /// <summary>Number of instruments held (nonzero quantity).</summary>
    public int Count => _quantities.Count;

    /// <summary>Adds <paramref name="quantity"/> (face / 100; negative sells) of instrument <paramref name="instrument"/>.</summary>
    public void Add(int instrument, double quantity)
    {
        if (instrument < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(instrument), instrument, "Instrument number cannot be negative.");
        }
        if (!double.IsFinite(quantity))
        {
            throw new ArgumentOutOfRangeException(nameof(quantity), quantity, "Quantity must be a finite number.");
        }
        if (quantity == 0)
        {
            return;
        }
        ref var slot = ref CollectionsMarshal.GetValueRefOrAddDefault(_quantities, instrument, out _);
        var old = slot;
        var updated = old + quantity;
        if (Math.Abs(updated) <= RelativeNettingTolerance * Math.Max(Math.Abs(old), Math.Abs(quantity)))
        {
            _quantities.Remove(instrument);
        }
        else
        {
            slot = updated;
        }
        _dirty = true;
    }

    /// <summary>Removes what <see cref="Add"/> with the same arguments added.</summary>
    public void Remove(int instrument, double quantity) => Add(instrument, -quantity);

    /// <summary>Quantity held of <paramref name="instrument"/> (0 if none).</summary>
    public double QuantityOf(int instrument) => _quantities.GetValueOrDefault(instrument);

    /// <summary>Builds the sorted arrays now (the risk pass does it itself; call before sharing between threads).</summary>
    public void Compact()
    {
        if (!_dirty)
        {
            return;
        }
        var n = _quantities.Count;
        if (_instruments.Length < n)
        {
            var capacity = Math.Max(n, _instruments.Length * 3 / 2);
            _instruments = new int[capacity];
            _compactQuantities = new double[capacity];
        }
        var i = 0;
        foreach (var (instrument, quantity) in _quantities)
        {
            _instruments[i] = instrument;
            _compactQuantities[i] = quantity;
            i++;
        }
        Array.Sort(_instruments, _compactQuantities, 0, n);
        _count = n;
        _dirty = false;
    }

    internal ReadOnlySpan<int> Instruments => _instruments.AsSpan(0, _count);

    internal ReadOnlySpan<double> Quantities => _compactQuantities.AsSpan(0, _count);

    internal void CheckAgainst(int instrumentCount)
    {
        if (_count > 0 && _instruments[_count - 1] >= instrumentCount)
        {
            throw new InvalidOperationException(
                string.Create(CultureInfo.InvariantCulture,
                    $"Book holds instrument {_instruments[_count - 1]} but the rows cover {instrumentCount} instruments: rebuild them after registering."));
        }
    }
}
