namespace Monitor.Service.Storage;

/// <summary>How durable writes are retried while storage fails (configuration section <c>Storage</c>).</summary>
public sealed class StorageOptions
{
    public const string SectionName = "Storage";

    /// <summary>Wait before the first retry of a failed write; doubled after each failure up to <see cref="RetryMaxDelay"/>. Default 1 s.</summary>
    public TimeSpan RetryFirstDelay { get; set; } = TimeSpan.FromSeconds(1);

    /// <summary>Longest wait between two retries. Default 5 s.</summary>
    public TimeSpan RetryMaxDelay { get; set; } = TimeSpan.FromSeconds(5);

    /// <summary>Problems with the values, each naming the key, the value and the fix; empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        if (RetryFirstDelay <= TimeSpan.Zero)
        {
            errors.Add($"Storage:RetryFirstDelay {RetryFirstDelay} must be positive, e.g. 00:00:01.");
        }
        if (RetryMaxDelay < RetryFirstDelay)
        {
            errors.Add($"Storage:RetryMaxDelay {RetryMaxDelay} must be at least Storage:RetryFirstDelay {RetryFirstDelay}, e.g. 00:00:05.");
        }
        return errors;
    }
}
