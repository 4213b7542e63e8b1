namespace Monitor.Cli.Demo;

/// <summary>
/// One book in the demo view: value in XTS, the per-bp figures in XTS per bp, the highest use of its own limits (1 = 100%),
/// and whether its figures are provisional (a spread group without a fitted curve, valued on a stand-in spread).
/// </summary>
internal sealed record BookRow(string Book, string Desk, double Value, double Dv01, double BaseLevel, double BaseSlope, double BaseCurvature, double SpreadLevel, double MaxUse, string Status, bool Provisional = false)
{
    /// <summary>The mark shown beside a provisional book's figures, explained by <see cref="ProvisionalLegend"/>.</summary>
    public const string ProvisionalMark = "*";

    public const string ProvisionalLegend = "* provisional: a spread group of the book has no fitted curve yet; its bonds are valued on the government curve plus a flat spread from their own quote or last trade price";

    /// <summary>The mark, or nothing when the figures are final.</summary>
    public string Mark => Provisional ? ProvisionalMark : string.Empty;
}
