using Monitor.Analytics.Curves;

namespace Monitor.Benchmarks;

/// <summary>
/// The baseline the issue describes: a plain per-position loop in C#, pricing each position's flows on the curve
/// (base + its spread curve) with value and 3 base + 3 spread factor money durations, summed per book.
/// Curve times are precomputed per bond (as any loop would cache them); loadings and discount factors are per flow.
/// </summary>
internal static class PlainPositionLoop
{
    public const int Width = 7;

    public static void Run(SyntheticMarket market, Position[] positions, IFactorCurve baseCurve, Dictionary<string, IFactorCurve> spreads, double[] books)
    {
        Array.Clear(books);
        Span<double> lb = stackalloc double[3];
        Span<double> ls = stackalloc double[3];
        foreach (var p in positions)
        {
            var bond = market.Bonds[p.Bond];
            var spread = bond.SpreadGroup is null ? null : spreads[bond.SpreadGroup];
            double value = 0, b0 = 0, b1 = 0, b2 = 0, s0 = 0, s1 = 0, s2 = 0;
            for (var j = 0; j < bond.Times.Length; j++)
            {
                var t = bond.Times[j];
                baseCurve.Loadings(t, lb);
                var z = baseCurve.ZeroRate(t);
                if (spread is not null)
                {
                    spread.Loadings(t, ls);
                    z += spread.ZeroRate(t);
                }
                var pv = bond.Amounts[j] * Math.Exp(-z * t);
                value += pv;
                var tpv = t * pv;
                b0 += tpv * lb[0];
                b1 += tpv * lb[1];
                b2 += tpv * lb[2];
                if (spread is not null)
                {
                    s0 += tpv * ls[0];
                    s1 += tpv * ls[1];
                    s2 += tpv * ls[2];
                }
            }
            var row = books.AsSpan(p.Book * Width, Width);
            row[0] += p.Quantity * value;
            row[1] += p.Quantity * b0;
            row[2] += p.Quantity * b1;
            row[3] += p.Quantity * b2;
            row[4] += p.Quantity * s0;
            row[5] += p.Quantity * s1;
            row[6] += p.Quantity * s2;
        }
    }
}
