using Monitor.Contracts.V1;

namespace Monitor.Cli.Demo;

/// <summary>A <see cref="LimitStatusChanged"/> the demo received, with its kind.</summary>
internal sealed record ObservedStatusChange(LimitStatusChanged Message, StatusChangeKind Kind)
{
    public static ObservedStatusChange From(LimitStatusChanged message)
    {
        var up = Rank(message.Status) > Rank(message.PreviousStatus);
        var kind = !up ? StatusChangeKind.Clear : Rank(message.Status) == 2 ? StatusChangeKind.Breach : StatusChangeKind.Warning;
        return new ObservedStatusChange(message, kind);
    }

    /// <summary>within 0, warning 1, breach 2 (the service's status names).</summary>
    public static int Rank(string status) => status switch
    {
        "breach" => 2,
        "warning" => 1,
        _ => 0,
    };
}
