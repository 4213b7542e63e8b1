namespace Monitor.Service.Journal;

/// <summary>What is wrong with a journal line found on replay.</summary>
public enum JournalProblemKind
{
    /// <summary>Bytes after the last line feed: a write cut short by a crash. Dropped (its append never completed, so its message was never acknowledged).</summary>
    TornTail,

    /// <summary>The line's SHA-256 does not match its bytes: the line was changed on disk. Not applied.</summary>
    HashMismatch,

    /// <summary>The line is not a journal record (bad JSON, missing members, unknown kind). Not applied.</summary>
    Unparsable,

    /// <summary>The line's <c>seq</c> does not follow the previous good line's: lines are missing or moved. The line is still applied.</summary>
    SequenceGap,
}
