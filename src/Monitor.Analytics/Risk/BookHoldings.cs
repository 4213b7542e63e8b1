using System.Globalization;

namespace Monitor.Analytics.Risk;

/// <summary>
/// A book as quantities of instruments of an <see cref="InstrumentCashFlowTable"/>: quantity = face / 100 (negative
/// for a short), so the book's flows are sum quantity x instrument flows per 100. Applying a trade is one binary search
/// (and, for an instrument new to the book, one array shift), whatever the instrument's number of flows.
/// </summary>
/// <remarks>
/// Storage: two parallel arrays sorted by instrument number, always ready for the risk pass (no rebuild after trades).
/// A quantity is dropped when it nets to at most 1e-9 of the larger of the old quantity and the change (float
/// cancellation of an add then remove), like <see cref="BookCashFlowLedger"/>. Not thread-safe: one writer; readers
/// only while nobody writes.
/// </remarks>
public sealed class BookHoldings
{
    private const double RelativeNettingTolerance = 1e-9;

    private int[] _instruments = [];
    private double[] _quantities = [];
    private int _count;

    /// <summary>Number of instruments held (nonzero quantity).</summary>
    public int Count => _count;

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
        var at = Array.BinarySearch(_instruments, 0, _count, instrument);
        if (at >= 0)
        {
            var old = _quantities[at];
            var updated = old + quantity;
            if (Math.Abs(updated) <= RelativeNettingTolerance * Math.Max(Math.Abs(old), Math.Abs(quantity)))
            {
                Array.Copy(_instruments, at + 1, _instruments, at, _count - at - 1);
                Array.Copy(_quantities, at + 1, _quantities, at, _count - at - 1);
                _count--;
            }
            else
            {
                _quantities[at] = updated;
            }
            return;
        }
        at = ~at;
        if (_count == _instruments.Length)
        {
            var capacity = Math.Max(8, _count * 2);
            Array.Resize(ref _instruments, capacity);
            Array.Resize(ref _quantities, capacity);
        }
        Array.Copy(_instruments, at, _instruments, at + 1, _count - at);
        Array.Copy(_quantities, at, _quantities, at + 1, _count - at);
        _instruments[at] = instrument;
        _quantities[at] = quantity;
        _count++;
    }

    /// <summary>Removes what <see cref="Add"/> with the same arguments added.</summary>
    public void Remove(int instrument, double quantity) => Add(instrument, -quantity);

    /// <summary>Quantity held of <paramref name="instrument"/> (0 if none).</summary>
    public double QuantityOf(int instrument)
    {
        var at = Array.BinarySearch(_instruments, 0, _count, instrument);
        return at >= 0 ? _quantities[at] : 0.0;
    }

    internal ReadOnlySpan<int> Instruments => _instruments.AsSpan(0, _count);

    internal ReadOnlySpan<double> Quantities => _quantities.AsSpan(0, _count);

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
