namespace Monitor.Cli.Output;

/// <summary>
/// JSON of <c>monitor curve</c>: the model ("nelson-siegel" or "svensson"), the parameters as given (betas in percent,
/// decays in years) and the curve at each tenor.
/// </summary>
internal sealed record CurveParameterView(string Model, IReadOnlyDictionary<string, double> Parameters, IReadOnlyList<CurveParameterPoint> Points);
