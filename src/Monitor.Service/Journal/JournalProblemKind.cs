namespace Monitor.Service.Journal;

/// <summary>What is wrong with a journal line found on replay.</summary>
public enum JournalProblemKind
{
    /// <summary>Bytes after the last line feed: a write cut short by a crash. Cut off (its append never completed, so its message was never acknowledged); the only problem that does not stop the start.</summary>
    TornTail,

    /// <summary>The line's mac is not the HMAC-SHA256 of its bytes under the record key: written or changed without the key. Stops the start.</summary>
    MacMismatch,

    /// <summary>The line is not a journal record (bad JSON, missing members, unknown kind). Stops the start.</summary>
    Unparsable,

    /// <summary>The line's <c>seq</c> does not follow the previous good line's: lines are missing or moved. Stops the start.</summary>
    SequenceGap,

    /// <summary>The line's <c>prevMac</c> is not the mac of the line before: lines were removed, inserted or moved. Stops the start.</summary>
    BrokenLink,
}
