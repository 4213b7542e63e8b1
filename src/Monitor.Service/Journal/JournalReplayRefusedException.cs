namespace Monitor.Service.Journal;

/// <summary>
/// A trade or instrument definition the journal holds (accepted when it was written) that the engine refuses on
/// replay. It stops the start: going on would leave the books without a trade the broker was told was taken.
/// </summary>
public sealed class JournalReplayRefusedException : Exception
{
    public JournalReplayRefusedException(string file, long seq, string what, string reason, Exception inner)
        : base($"Journal replay refused {what} ({file}, seq {seq}): {reason} The start stops rather than leave it out of the books. " +
            "Restore the start-of-day files the journal was written against, or write a new start-of-day positions file that " +
            "includes it (a changed positions file starts a new start-of-day state and older journal days are not replayed).", inner)
    {
        File = file;
        Seq = seq;
    }

    public string File { get; }

    public long Seq { get; }
}
