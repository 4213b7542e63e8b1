using Monitor.Contracts.V1;

namespace Monitor.Cli.Demo;

/// <summary>A <see cref="LimitStatusChanged"/> the demo received, with its kind and its cause in words ("after trade T-1").</summary>
internal sealed record ObservedStatusChange(LimitStatusChanged Message, StatusChangeKind Kind, string Cause)
{
    /// <param name="message">The event as received.</param>
    /// <param name="tradeOf">The trade id the demo sent under a message id, if it sent one.</param>
    public static ObservedStatusChange From(LimitStatusChanged message, Func<Guid, string?> tradeOf)
    {
        ArgumentNullException.ThrowIfNull(message);
        ArgumentNullException.ThrowIfNull(tradeOf);
        var up = Rank(message.Status) > Rank(message.PreviousStatus);
        var kind = !up ? StatusChangeKind.Clear : Rank(message.Status) == 2 ? StatusChangeKind.Breach : StatusChangeKind.Warning;
        return new ObservedStatusChange(message, kind, CauseInWords(message, tradeOf));
    }

    /// <summary>The cause as an officer reads it, never an internal type name.</summary>
    public static string CauseInWords(LimitStatusChanged message, Func<Guid, string?> tradeOf)
    {
        ArgumentNullException.ThrowIfNull(message);
        ArgumentNullException.ThrowIfNull(tradeOf);
        return message.CauseMessageType switch
        {
            "TradeBooked" => message.CauseMessageId is { } id && tradeOf(id) is { } trade ? $"after trade {trade}" : "after a trade",
            "BondQuoted" or "refit" => "after a curve refit",
            "ParYieldsPublished" => "after new par yields",
            "opening-quotes" => "on the opening quotes",
            "limits-file" => "after a limits reload",
            "journal-replay" => "on restart (journal replayed)",
            _ => "after " + message.CauseMessageType.Replace('-', ' '),
        };
    }

    /// <summary>within 0, warning 1, breach 2 (the service's status names).</summary>
    public static int Rank(string status) => status switch
    {
        "breach" => 2,
        "warning" => 1,
        _ => 0,
    };
}
