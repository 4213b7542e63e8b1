using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>
/// What a rebuild did: trades applied, seen before (duplicates: e.g. a redelivery journalled twice) or superseded
/// (an older version), instrument definitions applied, quotes refused (with their reasons; a refused trade or
/// definition stops the start instead), quotes kept, and the refit's result
/// (curves fitted, books revalued, limit status changes) for the caller to log and publish.
/// </summary>
public sealed record JournalRecoveryResult(
    int Applied,
    int Duplicates,
    int Superseded,
    int Definitions,
    int QuotesAccepted,
    IReadOnlyList<string> RejectedQuotes,
    EngineResult Refit);
