namespace Monitor.Service.Audit;

/// <summary>
/// The record a verifier expects the next one to follow: its seq and hash, and where it was read.
/// Seq and Mac are null when that record was unreadable (the next link cannot be checked).
/// </summary>
internal sealed record ChainLink(long? Seq, string? Mac, string Where)
{
    /// <summary>Before the first record of the log: the next one must be seq 1 with prevMac of 64 zeros.</summary>
    public static readonly ChainLink Start = new(0, ExposureLogMac.Genesis, "the start of the log");
}
