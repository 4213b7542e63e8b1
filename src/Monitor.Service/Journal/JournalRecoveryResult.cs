using Monitor.Service.Engine;

namespace Monitor.Service.Journal;

/// <summary>
/// What a rebuild did: trades applied, seen before (duplicates: e.g. a redelivery journalled twice) or superseded
/// (an older version), trades and quotes refused (with their reasons), quotes kept, and the refit's result
/// (curves fitted, books revalued, limit status changes) for the caller to log and publish.
/// </summary>
public sealed record JournalRecoveryResult(
    int Applied,
    int Duplicates,
    int Superseded,
    IReadOnlyList<string> RejectedTrades,
    int QuotesAccepted,
    IReadOnlyList<string> RejectedQuotes,
    EngineResult Refit);
