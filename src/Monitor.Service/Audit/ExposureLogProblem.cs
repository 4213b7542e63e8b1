namespace Monitor.Service.Audit;

/// <summary>One problem found by <see cref="ExposureLogVerifier"/>.</summary>
/// <param name="File">File name of the day file.</param>
/// <param name="LineNumber">1-based line number in that file (0 when the whole file is at fault).</param>
/// <param name="Seq">The record's seq when it could be read, else null.</param>
/// <param name="Kind">What is wrong.</param>
/// <param name="Detail">Expected and found values.</param>
public sealed record ExposureLogProblem(string File, int LineNumber, long? Seq, ExposureLogProblemKind Kind, string Detail);
