using System.Numerics;

namespace Monitor.Analytics.Risk;

/// <summary>
/// One moment layout for every curve key of a batch: n = base factors + the most spread factors of any key, so rows of
/// government and credit flows add up index by index (spread factors of all groups summed, the convention of
/// <see cref="FactorExposures.Plus"/>). <see cref="RiskDepth.Durations"/> keeps the prefix [value, first moments];
/// <see cref="RiskDepth.Full"/> keeps the whole <see cref="MomentLayout"/> row.
/// </summary>
internal sealed class CommonMomentLayout
{
    public CommonMomentLayout(int baseFactorCount, int spreadFactorCount, RiskDepth depth)
    {
        if (!Enum.IsDefined(depth))
        {
            throw new ArgumentOutOfRangeException(nameof(depth), depth, "Unknown risk depth.");
        }
        BaseFactorCount = baseFactorCount;
        SpreadFactorCount = spreadFactorCount;
        Depth = depth;
        FactorCount = baseFactorCount + spreadFactorCount;
        Width = depth == RiskDepth.Durations ? 1 + FactorCount : MomentLayout.Width(FactorCount);
        var lanes = Vector<double>.Count;
        Stride = (Width + lanes - 1) / lanes * lanes;
    }

    public int BaseFactorCount { get; }

    public int SpreadFactorCount { get; }

    public int FactorCount { get; }

    public RiskDepth Depth { get; }

    public int Width { get; }

    public int Stride { get; }

    /// <summary>Columns of a key's grid row that a pass must read: the first-moment prefix or the whole row.</summary>
    public int SourceColumns(int keyFactorCount) =>
        Depth == RiskDepth.Durations ? 1 + keyFactorCount : MomentLayout.Width(keyFactorCount);

    /// <summary>
    /// Target column of each source column of a key with <paramref name="keyFactorCount"/> factors (base first, then its
    /// spread factors: a factor keeps its index, only the triangle of second moments is laid out over the wider n).
    /// </summary>
    public int[] MapFrom(int keyFactorCount)
    {
        var map = new int[SourceColumns(keyFactorCount)];
        for (var k = 0; k <= keyFactorCount && k < map.Length; k++)
        {
            map[k] = k;
        }
        if (Depth == RiskDepth.Full)
        {
            var p = 1 + keyFactorCount;
            for (var j = 0; j < keyFactorCount; j++)
            {
                for (var k = j; k < keyFactorCount; k++)
                {
                    map[p++] = TrianglePosition(j, k);
                }
            }
        }
        return map;
    }

    // Position of (j, k), j <= k, in the upper triangle stored row by row after 1 + n first entries.
    private int TrianglePosition(int j, int k)
    {
        var n = FactorCount;
        return 1 + n + j * n - j * (j - 1) / 2 + (k - j);
    }
}
