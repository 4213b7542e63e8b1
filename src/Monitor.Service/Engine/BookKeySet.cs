using Monitor.Analytics.Risk;

namespace Monitor.Service.Engine;

/// <summary>
/// The curve keys a book holds in one revaluation (ordinal order) with each key's moment layout (base factors, spread
/// factors, row width) and the offset of its row in the book's <see cref="BookMoments"/>. Books holding the same keys
/// share one instance: with one curve key, a thousand books share a single one.
/// </summary>
internal sealed class BookKeySet
{
    private readonly string[] _keys;
    private readonly int[] _spreadFactors;
    private readonly int[] _offsets;

    /// <param name="baseFactorCount">Base curve factors.</param>
    /// <param name="keys">The keys, ordinal order.</param>
    /// <param name="spreadFactors">Each key's spread factors (0 for the government key).</param>
    /// <param name="widths">Each key's row width (<see cref="BookRiskMatrix.MomentWidth"/> of its pass).</param>
    public BookKeySet(int baseFactorCount, string[] keys, int[] spreadFactors, int[] widths)
    {
        BaseFactorCount = baseFactorCount;
        _keys = keys;
        _spreadFactors = spreadFactors;
        _offsets = new int[keys.Length + 1];
        for (var k = 0; k < keys.Length; k++)
        {
            _offsets[k + 1] = _offsets[k] + widths[k];
            MaxSpreadFactorCount = Math.Max(MaxSpreadFactorCount, spreadFactors[k]);
        }
    }

    public int BaseFactorCount { get; }

    /// <summary>The most spread factors of any key: the spread factors of the book's total.</summary>
    public int MaxSpreadFactorCount { get; }

    public int Count => _keys.Length;

    /// <summary>Doubles of all rows together.</summary>
    public int TotalWidth => _offsets[^1];

    public string Key(int k) => _keys[k];

    public int SpreadFactorCount(int k) => _spreadFactors[k];

    public int Offset(int k) => _offsets[k];

    public int Width(int k) => _offsets[k + 1] - _offsets[k];
}
