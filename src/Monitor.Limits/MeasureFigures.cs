using System.Collections;
using System.Diagnostics.CodeAnalysis;
using System.Runtime.CompilerServices;

namespace Monitor.Limits;

/// <summary>
/// One value per <see cref="ExposureMeasure"/>, held inline in the object and never changed after construction: the
/// cheap, immutable form of a book's figures. A revaluation of a thousand books makes one of these per book (one
/// object each, instead of a hash dictionary or an object and an array), and <see cref="LimitSet"/> keeps it without
/// copying.
/// </summary>
public sealed class MeasureFigures : IReadOnlyDictionary<ExposureMeasure, double>
{
    private static readonly ExposureMeasure[] AllMeasures = CheckedMeasures();
    private readonly InlineValues _values;

    /// <param name="values">Called once per measure, in enum order, for its value.</param>
    public MeasureFigures(Func<ExposureMeasure, double> values)
    {
        ArgumentNullException.ThrowIfNull(values);
        foreach (var measure in AllMeasures)
        {
            _values[(int)measure] = values(measure);
        }
    }

    /// <param name="values">One value per measure, in enum order (index = (int)measure); copied.</param>
    /// <exception cref="ArgumentException">Not exactly one value per measure.</exception>
    public MeasureFigures(ReadOnlySpan<double> values)
    {
        if (values.Length != AllMeasures.Length)
        {
            throw new ArgumentException($"Expected {AllMeasures.Length} values, one per exposure measure in enum order, got {values.Length}.", nameof(values));
        }
        values.CopyTo(_values);
    }

    // The inline length is a constant: the enum's last member + 1, checked against the enum's values at type load.
    private const int Length = (int)ExposureMeasure.Convexity + 1;

    /// <summary>Number of measures: the length of the span the span constructor takes.</summary>
    public static int MeasureCount => AllMeasures.Length;

    public double this[ExposureMeasure key] => ContainsKey(key) ? _values[(int)key] : throw new KeyNotFoundException($"{key} is not an exposure measure.");

    public IEnumerable<ExposureMeasure> Keys => AllMeasures;

    public IEnumerable<double> Values => EnumerateValues();

    public int Count => Length;

    public bool ContainsKey(ExposureMeasure key) => (uint)key < Length;

    public bool TryGetValue(ExposureMeasure key, [MaybeNullWhen(false)] out double value)
    {
        if (ContainsKey(key))
        {
            value = _values[(int)key];
            return true;
        }
        value = 0;
        return false;
    }

    public IEnumerator<KeyValuePair<ExposureMeasure, double>> GetEnumerator()
    {
        foreach (var measure in AllMeasures)
        {
            yield return new KeyValuePair<ExposureMeasure, double>(measure, _values[(int)measure]);
        }
    }

    IEnumerator IEnumerable.GetEnumerator() => GetEnumerator();

    /// <summary>The value of <paramref name="measure"/>, 0 for a value outside the enum (as a missing key reads in <see cref="BookExposures.Get"/>).</summary>
    internal double ValueOrZero(ExposureMeasure measure) => (uint)measure < Length ? _values[(int)measure] : 0.0;

    /// <summary>The first non-finite value in enum order (the order the enumerator gives), without an enumerator.</summary>
    internal bool TryFindNonFinite(out ExposureMeasure measure, out double value)
    {
        for (var i = 0; i < Length; i++)
        {
            if (!double.IsFinite(_values[i]))
            {
                measure = (ExposureMeasure)i;
                value = _values[i];
                return true;
            }
        }
        measure = default;
        value = 0;
        return false;
    }

    private IEnumerable<double> EnumerateValues()
    {
        for (var i = 0; i < Length; i++)
        {
            yield return _values[i];
        }
    }

    private static ExposureMeasure[] CheckedMeasures()
    {
        var all = Enum.GetValues<ExposureMeasure>();
        if (all.Length != Length || all.Select((m, i) => (int)m == i).Contains(false))
        {
            throw new InvalidOperationException($"MeasureFigures holds {Length} values indexed 0..{Length - 1}: keep ExposureMeasure's values contiguous from 0 with {nameof(ExposureMeasure.Convexity)} last, or widen it.");
        }
        return all;
    }

    [InlineArray(Length)]
    private struct InlineValues
    {
        private double _element;
    }
}
