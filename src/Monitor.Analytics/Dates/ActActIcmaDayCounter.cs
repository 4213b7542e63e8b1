namespace Monitor.Analytics.Dates;

/// <summary>
/// ACT/ACT (ICMA) (ICMA Rule 251; ISDA 2006, 4.16(c)): days / (frequency x days in the reference coupon
/// period). When the accrual runs outside the reference period (a long odd period) it is split at quasi-coupon
/// dates, one regular period (12/frequency months) apart, and each piece counts against its own quasi period
/// (ISDA memo "The Actual/Actual Day Count Fraction", 1999, long first period example).
/// </summary>
public sealed class ActActIcmaDayCounter : IDayCounter
{
    public DayCountConvention Convention => DayCountConvention.ActActIcma;

    public int DayCount(DateOnly start, DateOnly end) => end.DayNumber - start.DayNumber;

    public double YearFraction(DateOnly start, DateOnly end, DateOnly referenceStart, DateOnly referenceEnd, int frequency)
    {
        if (frequency is not (1 or 2 or 3 or 4 or 6 or 12))
        {
            throw new ArgumentOutOfRangeException(nameof(frequency), frequency, $"ACT/ACT (ICMA) needs a coupon frequency of 1, 2, 3, 4, 6 or 12 a year; frequency = {frequency}.");
        }

        if (referenceEnd <= referenceStart)
        {
            throw new ArgumentException($"ACT/ACT (ICMA) needs a reference period with referenceStart < referenceEnd; referenceStart = {referenceStart:yyyy-MM-dd}, referenceEnd = {referenceEnd:yyyy-MM-dd}.", nameof(referenceEnd));
        }

        if (end < start)
        {
            return -YearFraction(end, start, referenceStart, referenceEnd, frequency);
        }

        var months = 12 / frequency;
        var endOfMonth = DateRules.IsEndOfMonth(referenceEnd);
        double sum = 0;

        // Piece before the reference period: walk back quasi-coupon periods.
        if (start < referenceStart)
        {
            var quasiEnd = referenceStart;
            var k = 1;
            while (quasiEnd > start)
            {
                var quasiStart = DateRules.AddMonths(referenceStart, -k * months, endOfMonth);
                var pieceStart = start > quasiStart ? start : quasiStart;
                var pieceEnd = end < quasiEnd ? end : quasiEnd;
                if (pieceEnd > pieceStart)
                {
                    sum += Fraction(pieceStart, pieceEnd, quasiStart, quasiEnd, frequency);
                }

                quasiEnd = quasiStart;
                k++;
            }
        }

        // Piece inside the reference period.
        {
            var pieceStart = start > referenceStart ? start : referenceStart;
            var pieceEnd = end < referenceEnd ? end : referenceEnd;
            if (pieceEnd > pieceStart)
            {
                sum += Fraction(pieceStart, pieceEnd, referenceStart, referenceEnd, frequency);
            }
        }

        // Piece after the reference period: walk forward quasi-coupon periods.
        if (end > referenceEnd)
        {
            var quasiStart = referenceEnd;
            var k = 1;
            while (quasiStart < end)
            {
                var quasiEnd = DateRules.AddMonths(referenceEnd, k * months, endOfMonth);
                var pieceStart = start > quasiStart ? start : quasiStart;
                var pieceEnd = end < quasiEnd ? end : quasiEnd;
                if (pieceEnd > pieceStart)
                {
                    sum += Fraction(pieceStart, pieceEnd, quasiStart, quasiEnd, frequency);
                }

                quasiStart = quasiEnd;
                k++;
            }
        }

        return sum;
    }

    private static double Fraction(DateOnly start, DateOnly end, DateOnly periodStart, DateOnly periodEnd, int frequency) =>
        (end.DayNumber - start.DayNumber) / (double)(frequency * (periodEnd.DayNumber - periodStart.DayNumber));
}
