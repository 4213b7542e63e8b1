namespace Monitor.Service.Audit;

/// <summary>What is wrong with a line of the exposure log.</summary>
public enum ExposureLogProblemKind
{
    /// <summary>Not a record: invalid JSON, a missing or mistyped member, members out of order.</summary>
    Unparsable,

    /// <summary>The last line of a file has no line feed: a write cut short (crash or full disk).</summary>
    TornLine,

    /// <summary>The stored hash is not the SHA-256 of the record: the line was changed after writing.</summary>
    HashMismatch,

    /// <summary>prevHash is not the hash of the record before it: a record was removed, inserted or moved.</summary>
    BrokenLink,

    /// <summary>seq is not one more than the record before it: a record was removed, duplicated or moved.</summary>
    SequenceGap,

    /// <summary>The day file asked for does not exist.</summary>
    MissingFile,
}
