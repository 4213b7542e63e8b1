namespace Monitor.Service.Journal;

/// <summary>A problem found on replay: the 1-based line number (0 for a torn tail), the byte offset of the line in the file and what is wrong.</summary>
public sealed record JournalProblem(JournalProblemKind Kind, string File, int LineNumber, long ByteOffset, string Detail)
{
    /// <summary>The trade id on the line when it could be read (even from a line failing its check), else null.</summary>
    public string? TradeId { get; init; }

    public override string ToString() =>
        $"{Kind} in {File} line {LineNumber} (byte {ByteOffset}){(TradeId is null ? string.Empty : $", trade {TradeId}")}: {Detail}";
}
