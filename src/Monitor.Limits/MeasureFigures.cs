using System.Collections;
using System.Diagnostics.CodeAnalysis;

namespace Monitor.Limits;

/// <summary>
/// One value per <see cref="ExposureMeasure"/>, held in an array and never changed after construction: the cheap,
/// immutable form of a book's figures. A revaluation of a thousand books makes one of these per book (instead of a
/// hash dictionary), and <see cref="LimitSet"/> keeps it without copying.
/// </summary>
public sealed class MeasureFigures : IReadOnlyDictionary<ExposureMeasure, double>
{
    private static readonly ExposureMeasure[] AllMeasures = Enum.GetValues<ExposureMeasure>();
    private readonly double[] _values = new double[AllMeasures.Length];

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

    /// <summary>Number of measures: the length of the span the span constructor takes.</summary>
    public static int MeasureCount => AllMeasures.Length;

    public double this[ExposureMeasure key] => ContainsKey(key) ? _values[(int)key] : throw new KeyNotFoundException($"{key} is not an exposure measure.");

    public IEnumerable<ExposureMeasure> Keys => AllMeasures;

    public IEnumerable<double> Values => _values;

    public int Count => _values.Length;

    public bool ContainsKey(ExposureMeasure key) => (uint)key < (uint)_values.Length;

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
    internal double ValueOrZero(ExposureMeasure measure) => (uint)measure < (uint)_values.Length ? _values[(int)measure] : 0.0;

    /// <summary>The first non-finite value in enum order (the order the enumerator gives), without an enumerator.</summary>
    internal bool TryFindNonFinite(out ExposureMeasure measure, out double value)
    {
        for (var i = 0; i < _values.Length; i++)
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
}
