using System.Globalization;

namespace Monitor.Analytics.Fitting;

/// <summary>
/// Checks fit instruments and splits them into usable ones and exclusions. Bad data throws an
/// <see cref="ArgumentException"/> naming the list position, the id, the field and the value;
/// instruments the caller pre-excluded are skipped; those with no flow after t = 0 are excluded as matured.
/// </summary>
internal static class InstrumentValidation
{
    public static List<ValidInstrument> Prepare(
        IReadOnlyList<FitInstrument> instruments,
        IReadOnlyList<FitExclusion>? preExcluded,
        List<FitExclusion> exclusions)
    {
        ArgumentNullException.ThrowIfNull(instruments);
        if (instruments.Count == 0)
        {
            throw new ArgumentException("instruments: the list is empty; a fit needs instruments.", nameof(instruments));
        }
        var skip = new HashSet<string>(StringComparer.Ordinal);
        if (preExcluded is not null)
        {
            foreach (var e in preExcluded)
            {
                exclusions.Add(e);
                skip.Add(e.Id);
            }
        }
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var valid = new List<ValidInstrument>(instruments.Count);
        for (var i = 0; i < instruments.Count; i++)
        {
            var ins = instruments[i] ?? throw new ArgumentException(Inv($"instruments[{i}] is null."), nameof(instruments));
            var where = Inv($"instruments[{i}] (Id '{ins.Id}')");
            if (string.IsNullOrWhiteSpace(ins.Id))
            {
                throw new ArgumentException(Inv($"instruments[{i}].Id must not be empty."), nameof(instruments));
            }
            if (!seen.Add(ins.Id))
            {
                throw new ArgumentException(Inv($"{where}.Id is a duplicate: every instrument needs its own id."), nameof(instruments));
            }
            if (skip.Contains(ins.Id))
            {
                continue;
            }
            if (ins.Times is null || ins.Amounts is null)
            {
                throw new ArgumentException(Inv($"{where}: Times and Amounts must not be null."), nameof(instruments));
            }
            if (ins.Times.Length != ins.Amounts.Length)
            {
                throw new ArgumentException(
                    Inv($"{where}: Times has {ins.Times.Length} entries but Amounts has {ins.Amounts.Length}; they must match."), nameof(instruments));
            }
            CheckQuote(ins, i);
            var times = new List<double>(ins.Times.Length);
            var amounts = new List<double>(ins.Times.Length);
            for (var j = 0; j < ins.Times.Length; j++)
            {
                if (!double.IsFinite(ins.Times[j]))
                {
                    throw new ArgumentException(Inv($"{where}.Times[{j}] must be finite, got {ins.Times[j]}."), nameof(instruments));
                }
                if (!double.IsFinite(ins.Amounts[j]))
                {
                    throw new ArgumentException(Inv($"{where}.Amounts[{j}] must be finite, got {ins.Amounts[j]}."), nameof(instruments));
                }
                if (ins.Times[j] > 0)
                {
                    times.Add(ins.Times[j]);
                    amounts.Add(ins.Amounts[j]);
                }
            }
            if (times.Count == 0)
            {
                exclusions.Add(new FitExclusion(ins.Id, FitExclusionReason.Matured, "no cash flow after the valuation date"));
                continue;
            }
            valid.Add(times.Count == ins.Times.Length
                ? new ValidInstrument(ins.Id, ins.Times, ins.Amounts, ins.DirtyPrice, ins.Duration)
                : new ValidInstrument(ins.Id, [.. times], [.. amounts], ins.DirtyPrice, ins.Duration));
        }
        return valid;
    }

    /// <summary>Checks the quote fields (price and duration) of instruments[index].</summary>
    public static void CheckQuote(FitInstrument ins, int index)
    {
        if (!double.IsFinite(ins.DirtyPrice) || ins.DirtyPrice <= 0)
        {
            throw new ArgumentException(
                Inv($"instruments[{index}] (Id '{ins.Id}').DirtyPrice must be a positive finite number (per 100 face), got {ins.DirtyPrice}."), "instruments");
        }
        if (!double.IsFinite(ins.Duration) || ins.Duration <= 0)
        {
            throw new ArgumentException(
                Inv($"instruments[{index}] (Id '{ins.Id}').Duration must be a positive finite number of years, got {ins.Duration}."), "instruments");
        }
    }

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
