namespace Monitor.Cli.Output;

/// <summary>
/// JSON: the fitted curve at a standard tenor. Base curve: zero rate (continuously compounded) and par yield
/// (semiannual), in percent. Spread curve: the spread in bp.
/// </summary>
internal sealed record CurvePointView(string Tenor, double Years, double? ZeroPct, double? ParPct, double? SpreadBp);
