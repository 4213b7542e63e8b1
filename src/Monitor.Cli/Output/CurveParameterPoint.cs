namespace Monitor.Cli.Output;

/// <summary>
/// JSON: a parameter curve at one tenor (years from the curve's date, the parameters' own time unit): zero yield
/// (continuously compounded), par yield (semiannual coupons, bond-equivalent), instantaneous forward (continuously
/// compounded), all in percent.
/// </summary>
internal sealed record CurveParameterPoint(string Tenor, double Years, double ZeroPct, double ParPct, double ForwardPct);
