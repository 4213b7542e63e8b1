namespace Monitor.Cli.Demo;

/// <summary>How the demo names a limit status change: up to warning, up to breach, or down (a clear).</summary>
internal enum StatusChangeKind
{
    Warning,
    Breach,
    Clear,
}
