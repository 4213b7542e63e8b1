using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace Monitor.Analytics.Risk;

/// <summary>
/// The one hot loop of the risk paths: acc[m] += weight_i * row(index_i)[m] for m below
/// <c>vectors * Vector&lt;double&gt;.Count</c>, rows of <c>stride</c> doubles in one flat array.
/// </summary>
/// <remarks>
/// Columns go in chunks of up to four SIMD vectors held in registers (one pass over the entries per chunk): keeping
/// the accumulators out of memory is what makes this loop fast. Callers check the indices against the row count
/// (the loads skip bounds checks) and pad rows and <c>acc</c> to whole vectors. No allocation.
/// </remarks>
internal static class RowAccumulator
{
    public static void Accumulate(
        ReadOnlySpan<int> indices, ReadOnlySpan<double> weights, double[] data, int stride, int vectors, Span<double> acc)
    {
        var lanes = Vector<double>.Count;
        if (vectors * lanes > stride || acc.Length < vectors * lanes || weights.Length < indices.Length)
        {
            throw new ArgumentException("Row accumulator: columns beyond the stride, accumulator too short or weights missing.");
        }
        ref var rows = ref MemoryMarshal.GetArrayDataReference(data);
        ref var index0 = ref MemoryMarshal.GetReference(indices);
        ref var weight0 = ref MemoryMarshal.GetReference(weights);
        var count = indices.Length;
        for (var first = 0; first < vectors; first += 4)
        {
            var width = Math.Min(4, vectors - first);
            var column = (nuint)(first * lanes);
            var n = (nuint)lanes;
            Vector<double> a0 = default, a1 = default, a2 = default, a3 = default;
            switch (width)
            {
                case 1:
                    for (var i = 0; i < count; i++)
                    {
                        var w = new Vector<double>(Unsafe.Add(ref weight0, i));
                        var offset = (nuint)Unsafe.Add(ref index0, i) * (nuint)stride + column;
                        a0 += w * Vector.LoadUnsafe(ref rows, offset);
                    }
                    break;
                case 2:
                    for (var i = 0; i < count; i++)
                    {
                        var w = new Vector<double>(Unsafe.Add(ref weight0, i));
                        var offset = (nuint)Unsafe.Add(ref index0, i) * (nuint)stride + column;
                        a0 += w * Vector.LoadUnsafe(ref rows, offset);
                        a1 += w * Vector.LoadUnsafe(ref rows, offset + n);
                    }
                    break;
                default:
                    for (var i = 0; i < count; i++)
                    {
                        var w = new Vector<double>(Unsafe.Add(ref weight0, i));
                        var offset = (nuint)Unsafe.Add(ref index0, i) * (nuint)stride + column;
                        a0 += w * Vector.LoadUnsafe(ref rows, offset);
                        a1 += w * Vector.LoadUnsafe(ref rows, offset + n);
                        a2 += w * Vector.LoadUnsafe(ref rows, offset + 2 * n);
                        if (width > 3)
                        {
                            a3 += w * Vector.LoadUnsafe(ref rows, offset + 3 * n);
                        }
                    }
                    break;
            }
            var target = acc[(first * lanes)..];
            a0.CopyTo(target);
            if (width > 1)
            {
                a1.CopyTo(target[lanes..]);
            }
            if (width > 2)
            {
                a2.CopyTo(target[(2 * lanes)..]);
            }
            if (width > 3)
            {
                a3.CopyTo(target[(3 * lanes)..]);
            }
        }
    }
}
