using Monitor.Service.Audit;

namespace Monitor.Cli.Demo;

/// <summary>What a demo run produced: counts, every status change, the final view and the exposure log's verification.</summary>
internal sealed record DemoOutcome(
    string WorkDir,
    string ExposureLogFolder,
    int Quotes,
    int Trades,
    int Fits,
    int Rejections,
    int Outliers,
    IReadOnlyList<ObservedStatusChange> Changes,
    DemoSnapshot Final,
    ExposureLogVerification Verification,
    TimeSpan RealElapsed,
    bool Interrupted)
{
    /// <summary>The run's throw-away record key file (in the work folder).</summary>
    public string KeyFile { get; init; } = string.Empty;

    /// <summary>The checkpoint folder beside the exposure log.</summary>
    public string CheckpointFolder { get; init; } = string.Empty;

    public int Count(StatusChangeKind kind) => Changes.Count(c => c.Kind == kind);

    /// <summary>The story the demo promises: at least one warning, one breach and one clear, and an intact log.</summary>
    public bool Succeeded => Count(StatusChangeKind.Warning) > 0 && Count(StatusChangeKind.Breach) > 0 && Count(StatusChangeKind.Clear) > 0 && Verification.Intact;
}
