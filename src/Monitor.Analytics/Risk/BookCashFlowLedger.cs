using System.Globalization;
using System.Runtime.InteropServices;
using Monitor.Analytics.Instruments;

namespace Monitor.Analytics.Risk;

/// <summary>
/// A book's cash flows in money, merged by date, per discount curve key (<see cref="CurveKey"/>).
/// Factor exposures are linear in the cash flows (see <see cref="FactorExposures"/>), so the book's exposures
/// are those of this merged ledger, and a curve change costs one pass over its distinct dates.
/// </summary>
/// <remarks>
/// <para>Storage: per curve key a dictionary from date index to net amount, so <see cref="Add"/> and
/// <see cref="Remove"/> cost O(number of the bond's flows) whatever the book's size (a sorted array would
/// need an O(book dates) shift for each new date). The compact sorted arrays the risk loop reads
/// (<see cref="GetSegment"/>) are updated in place when a trade only changes amounts on dates the book already has
/// (binary search per flow), and otherwise rebuilt lazily, once after a batch of trades; ascending date order keeps
/// the sums independent of dictionary history.</para>
/// <para>Netting: a date is dropped when its net amount is at most 1e-9 of the larger of the old amount and
/// the change (float cancellation of an add then remove), or below 1e-6 money in absolute terms.</para>
/// <para>Not thread-safe: one writer; readers (risk) only while nobody writes.</para>
/// </remarks>
public sealed class BookCashFlowLedger
{
    private const double RelativeNettingTolerance = 1e-9;
    private const double AbsoluteNettingTolerance = 1e-6;

    private readonly Dictionary<string, Bucket> _buckets = new(StringComparer.Ordinal);

    /// <summary>A ledger whose dates are numbered in <paramref name="dates"/> (shared by all books priced together).</summary>
    public BookCashFlowLedger(CashFlowDateIndex dates)
    {
        Dates = dates ?? throw new ArgumentNullException(nameof(dates));
    }

    /// <summary>The shared date index.</summary>
    public CashFlowDateIndex Dates { get; }

    /// <summary>Curve keys that hold at least one date, in ordinal order.</summary>
    public IReadOnlyList<string> CurveKeys =>
        _buckets.Where(b => b.Value.Amounts.Count > 0).Select(b => b.Key).Order(StringComparer.Ordinal).ToArray();

    // Keys with a bucket (possibly empty), without sorting or allocating: for the batch pass.
    internal IReadOnlyCollection<string> RawCurveKeys => _buckets.Keys;

    /// <summary>Total number of (curve key, date) entries.</summary>
    public int EntryCount => _buckets.Values.Sum(b => b.Amounts.Count);

    /// <summary>
    /// Adds <paramref name="scale"/> times <paramref name="flows"/> under <paramref name="curveKey"/>
    /// (null or empty = government). For a bond's flows per 100 face, scale = face / 100; a short has scale &lt; 0.
    /// </summary>
    public void Add(string? curveKey, IReadOnlyList<CashFlow> flows, double scale)
    {
        ArgumentNullException.ThrowIfNull(flows);
        if (!double.IsFinite(scale))
        {
            throw new ArgumentOutOfRangeException(nameof(scale), scale, "Scale must be a finite number.");
        }
        for (var i = 0; i < flows.Count; i++)
        {
            if (!double.IsFinite(flows[i].Amount))
            {
                throw new ArgumentException(
                    string.Create(CultureInfo.InvariantCulture, $"Cash flow {i} on {flows[i].Date:yyyy-MM-dd} has a non-finite amount {flows[i].Amount}."),
                    nameof(flows));
            }
        }
        var key = CurveKey.Normalize(curveKey);
        if (!_buckets.TryGetValue(key, out var bucket))
        {
            bucket = new Bucket();
            _buckets.Add(key, bucket);
        }
        foreach (var flow in flows)
        {
            var delta = flow.Amount * scale;
            if (delta == 0)
            {
                continue;
            }
            var index = Dates.GetOrAdd(flow.Date);
            // One hash lookup per flow: a reference to the slot, added as 0 if new (removed again if it nets out).
            ref var slot = ref CollectionsMarshal.GetValueRefOrAddDefault(bucket.Amounts, index, out _);
            var old = slot;
            var updated = old + delta;
            var netsToZero = Math.Abs(updated) <= RelativeNettingTolerance * Math.Max(Math.Abs(old), Math.Abs(delta))
                || Math.Abs(updated) < AbsoluteNettingTolerance;
            if (netsToZero)
            {
                bucket.Amounts.Remove(index);
                bucket.Dirty = true;
            }
            else
            {
                slot = updated;
                bucket.UpdateCompact(index, updated);
            }
        }
    }

    /// <summary>Removes what <see cref="Add"/> with the same arguments added (= Add with -scale).</summary>
    public void Remove(string? curveKey, IReadOnlyList<CashFlow> flows, double scale) => Add(curveKey, flows, -scale);

    /// <summary>Net amount in money on <paramref name="date"/> under <paramref name="curveKey"/> (0 if none).</summary>
    public double AmountOn(string? curveKey, DateOnly date) =>
        _buckets.TryGetValue(CurveKey.Normalize(curveKey), out var bucket)
        && Dates.TryGetIndex(date, out var index)
        && bucket.Amounts.TryGetValue(index, out var amount) ? amount : 0.0;

    /// <summary>The merged flows of one curve key as dated cash flows in money, ascending by date.</summary>
    public IReadOnlyList<CashFlow> CashFlows(string? curveKey)
    {
        var segment = GetSegment(curveKey);
        var result = new CashFlow[segment.Count];
        for (var i = 0; i < result.Length; i++)
        {
            result[i] = new CashFlow(Dates[segment.DateIndices[i]], segment.Amounts[i]);
        }
        Array.Sort(result, (a, b) => a.Date.CompareTo(b.Date));
        return result;
    }

    /// <summary>Compact, date-index-ascending view of one curve key (empty if the key holds nothing).</summary>
    public LedgerSegment GetSegment(string? curveKey)
    {
        var key = CurveKey.Normalize(curveKey);
        if (!_buckets.TryGetValue(key, out var bucket))
        {
            return new LedgerSegment(key, [], [], 0);
        }
        if (bucket.Dirty)
        {
            bucket.Compact();
        }
        return new LedgerSegment(key, bucket.DateIndices, bucket.CompactAmounts, bucket.Count);
    }

    private sealed class Bucket
    {
        public Dictionary<int, double> Amounts { get; } = [];

        public int[] DateIndices { get; private set; } = [];

        public double[] CompactAmounts { get; private set; } = [];

        public int Count { get; private set; }

        public bool Dirty { get; set; }

        // Keeps the compact view valid when the date is already in it (the usual trade: a bond the book holds, or one
        // sharing its coupon dates): a binary search instead of a re-sort of the whole bucket at the next risk pass.
        public void UpdateCompact(int index, double amount)
        {
            if (Dirty)
            {
                return;
            }
            var at = Array.BinarySearch(DateIndices, 0, Count, index);
            if (at >= 0)
            {
                CompactAmounts[at] = amount;
            }
            else
            {
                Dirty = true;
            }
        }

        public void Compact()
        {
            var n = Amounts.Count;
            if (DateIndices.Length < n)
            {
                // Grow with headroom so a trading day of small changes does not reallocate every time.
                var capacity = Math.Max(n, DateIndices.Length * 3 / 2);
                DateIndices = new int[capacity];
                CompactAmounts = new double[capacity];
            }
            var i = 0;
            foreach (var (index, amount) in Amounts)
            {
                DateIndices[i] = index;
                CompactAmounts[i] = amount;
                i++;
            }
            Array.Sort(DateIndices, CompactAmounts, 0, n);
            Count = n;
            Dirty = false;
        }
    }
}
