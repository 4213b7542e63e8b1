namespace Monitor.Limits;

/// <summary>Thrown when limit definitions or the limits file are not usable; <see cref="Errors"/> lists every problem found.</summary>
public sealed class LimitConfigurationException : Exception
{
    public LimitConfigurationException(IReadOnlyList<string> errors)
        : base(BuildMessage(errors))
    {
        Errors = errors;
    }

    public LimitConfigurationException()
        : this(Array.Empty<string>())
    {
    }

    public LimitConfigurationException(string message)
        : this([message])
    {
    }

    public LimitConfigurationException(string message, Exception innerException)
        : base(message, innerException)
    {
        Errors = [message];
    }

    /// <summary>Each problem on its own, naming the field or JSON path, the value and the fix.</summary>
    public IReadOnlyList<string> Errors { get; }

    private static string BuildMessage(IReadOnlyList<string> errors) =>
        errors.Count == 0
            ? "Invalid limit configuration."
            : $"Invalid limit configuration ({errors.Count} problem(s)):{Environment.NewLine}  " + string.Join(Environment.NewLine + "  ", errors);
}
