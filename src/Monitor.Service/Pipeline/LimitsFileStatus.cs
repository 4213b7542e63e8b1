namespace Monitor.Service.Pipeline;

/// <summary>
/// Whether the limits in force are those of the limits file as it stands: set by <see cref="LimitsFileWatcher"/>, read by
/// the <c>limits</c> health check. A file that cannot be read or is refused leaves the last good limits in force and
/// keeps the reason here until a later version of the file is accepted.
/// </summary>
public sealed class LimitsFileStatus
{
    private volatile string? _problem;

    /// <summary>Why the file as it stands is not in force; null while it is.</summary>
    public string? Problem => _problem;

    public void Refused(string problem) => _problem = problem;

    public void Accepted() => _problem = null;
}
