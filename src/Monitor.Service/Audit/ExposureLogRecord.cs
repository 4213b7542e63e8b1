using System.Text.Json;

namespace Monitor.Service.Audit;

/// <summary>One record of the exposure log, as written (format exposure-log/2, see Audit/README.md).</summary>
/// <param name="Seq">Sequence number, 1 for the first record of the log, +1 per record across days and restarts.</param>
/// <param name="Kind">Record kind (see <see cref="ExposureLogKinds"/>).</param>
/// <param name="EventTime">Time of the event, from the causing message (UTC).</param>
/// <param name="WrittenTime">Time the writer wrote the record, from its clock (UTC); decides the day file.</param>
/// <param name="Cause">The causing message.</param>
/// <param name="Payload">The figures: a JSON object supplied by the caller.</param>
/// <param name="PrevMac">MAC of the previous record (64 zeros for the first record of the log).</param>
/// <param name="Mac">HMAC-SHA256 under the record key, lowercase hex, of the record's canonical bytes without the mac member.</param>
/// <param name="Line">The exact line in the file (without the line feed).</param>
public sealed record ExposureLogRecord(
    long Seq,
    string Kind,
    DateTimeOffset EventTime,
    DateTimeOffset WrittenTime,
    ExposureLogCause Cause,
    JsonElement Payload,
    string PrevMac,
    string Mac,
    string Line);
