namespace Monitor.Service.Audit;

/// <summary>Result of verifying one or more day files of the exposure log.</summary>
/// <param name="Intact">True when no problem was found.</param>
/// <param name="Records">Number of lines read as records (including ones with problems).</param>
/// <param name="FirstSeq">seq of the first readable record, null when there is none.</param>
/// <param name="LastSeq">seq of the last readable record, null when there is none.</param>
/// <param name="LastHash">hash of the last readable record, null when there is none.</param>
/// <param name="Files">File names verified, in chain order.</param>
/// <param name="Problems">Problems in file and line order.</param>
public sealed record ExposureLogVerification(
    bool Intact,
    int Records,
    long? FirstSeq,
    long? LastSeq,
    string? LastHash,
    IReadOnlyList<string> Files,
    IReadOnlyList<ExposureLogProblem> Problems);
