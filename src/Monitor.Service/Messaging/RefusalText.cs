using System.Text.RegularExpressions;

namespace Monitor.Service.Messaging;

/// <summary>
/// The reason of a refusal in plain words from an analytics exception: .NET's additions to an argument exception's
/// message (" (Parameter 'mid')", "Actual value was -5.") are cut, and the library's member names (IssueDate,
/// Frequency) are replaced by their wire names.
/// </summary>
public static partial class RefusalText
{
    /// <param name="exception">The exception whose message is the reason.</param>
    /// <param name="wireNames">Library member name to wire field name, e.g. <c>IssueDate</c> to <c>issueDate</c>; may be empty.</param>
    public static string Plain(Exception exception, IReadOnlyDictionary<string, string> wireNames)
    {
        ArgumentNullException.ThrowIfNull(exception);
        ArgumentNullException.ThrowIfNull(wireNames);
        var text = exception.Message;
        var parameter = text.IndexOf(" (Parameter '", StringComparison.Ordinal);
        if (parameter >= 0)
        {
            text = text[..parameter];
        }
        var actual = text.IndexOf("Actual value was", StringComparison.Ordinal);
        if (actual >= 0)
        {
            text = text[..actual];
        }
        text = text.Trim();
        if (wireNames.Count > 0)
        {
            text = Word().Replace(text, m => wireNames.TryGetValue(m.Value, out var wire) ? wire : m.Value);
        }
        return text.Length == 0 ? "is not accepted." : text;
    }

    [GeneratedRegex(@"\b[A-Z][A-Za-z]+\b")]
    private static partial Regex Word();
}
