namespace Monitor.Service.Audit;

/// <summary>Result of verifying one or more day files of the exposure log.</summary>
/// <param name="Intact">True when no problem was found (records after the last checkpoint may still be unanchored).</param>
/// <param name="Records">Number of lines read as records (including ones with problems).</param>
/// <param name="FirstSeq">seq of the first readable record, null when there is none.</param>
/// <param name="LastSeq">seq of the last readable record, null when there is none.</param>
/// <param name="LastMac">mac of the last readable record, null when there is none.</param>
/// <param name="Files">File names verified, in chain order.</param>
/// <param name="Problems">Problems in file and line order (checkpoint problems after the log's).</param>
public sealed record ExposureLogVerification(
    bool Intact,
    int Records,
    long? FirstSeq,
    long? LastSeq,
    string? LastMac,
    IReadOnlyList<string> Files,
    IReadOnlyList<ExposureLogProblem> Problems)
{
    /// <summary>Checkpoints read and verified under the key (0 when none were given).</summary>
    public int Checkpoints { get; init; }

    /// <summary>The highest seq a verified checkpoint anchors and the log agrees with; null when none.</summary>
    public long? AnchoredSeq { get; init; }

    /// <summary>
    /// Records after <see cref="AnchoredSeq"/> (all records when no checkpoint anchors any): their chain holds, but
    /// nothing outside the folder vouches for them, so a cut or rewrite of them by a key holder cannot be shown.
    /// </summary>
    public long Unanchored { get; init; }
}
