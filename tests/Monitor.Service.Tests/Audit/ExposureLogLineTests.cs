using Monitor.Service.Tests.Support;
using System.Security.Cryptography;
using Monitor.Service.Storage;
using System.Text;
using System.Text.Json;
using Monitor.Service.Audit;

namespace Monitor.Service.Tests.Audit;

/// <summary>The exposure-log/2 canonical form, checked against the spec in src/Monitor.Service/Audit/README.md.</summary>
public class ExposureLogLineTests
{
    private static readonly string Zeros = new('0', 64);

    [Fact]
    public void Line_is_the_canonical_record_with_its_hmac_sha256_appended_as_mac()
    {
        var payload = JsonSerializer.SerializeToElement(new { book = "RATES-1", dv01 = -1250.5 });
        var record = ExposureLogLine.Build(TestKey.Value, 
            1, "snapshot", new DateTimeOffset(2026, 12, 1, 9, 30, 0, TimeSpan.FromHours(1)),
            new DateTimeOffset(2026, 12, 1, 8, 30, 0, 500, TimeSpan.Zero), new ExposureLogCause("q-17", "BondQuote"), payload, Zeros);

        // The spec's canonical form, written by hand: fixed member order, no whitespace, times in UTC with 7 decimals.
        var canonical = "{\"format\":\"exposure-log/2\",\"seq\":1,\"kind\":\"snapshot\",\"eventTime\":\"2026-12-01T08:30:00.0000000Z\","
            + "\"writtenTime\":\"2026-12-01T08:30:00.5000000Z\",\"cause\":{\"id\":\"q-17\",\"type\":\"BondQuote\"},"
            + "\"payload\":{\"book\":\"RATES-1\",\"dv01\":-1250.5},\"prevMac\":\"" + Zeros + "\"}";
        // HMAC-SHA256 (RFC 2104) computed here with .NET's HMACSHA256 class over the hand-written canonical bytes.
        var hash = Convert.ToHexStringLower(HMACSHA256.HashData(Encoding.UTF8.GetBytes(TestKey.Text), Encoding.UTF8.GetBytes(canonical)));

        Assert.Equal(canonical[..^1] + ",\"mac\":\"" + hash + "\"}", record.Line);
        Assert.Equal(hash, record.Mac);
    }

    [Fact]
    public void Null_message_id_is_written_as_json_null_and_non_ascii_is_escaped()
    {
        var payload = JsonSerializer.SerializeToElement(new Dictionary<string, object?> { ["note"] = "d\u00e9j\u00e0 a+b<c" });
        var record = ExposureLogLine.Build(TestKey.Value, 2, "day-end", ExposureLogTestData.Day1Morning, ExposureLogTestData.Day1Morning, new ExposureLogCause(null, "timer"), payload, Zeros);

        Assert.Contains("\"cause\":{\"id\":null,\"type\":\"timer\"}", record.Line, StringComparison.Ordinal);
        Assert.All(record.Line, c => Assert.True(c < 128, $"non-ASCII character U+{(int)c:X4} in the line"));
        Assert.Contains("\"note\":\"d\\u00E9j\\u00E0 a\\u002Bb\\u003Cc\"", record.Line, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_reads_back_what_Build_wrote()
    {
        var record = ExposureLogLine.Build(TestKey.Value, 
            7, "status-change", ExposureLogTestData.Day1Morning, ExposureLogTestData.Day1Morning.AddSeconds(1), ExposureLogTestData.Cause(7), ExposureLogTestData.Figures(7), Zeros);

        var parsed = ExposureLogLine.Parse(TestKey.Value, Encoding.UTF8.GetBytes(record.Line));

        Assert.True(parsed.MacMatches);
        Assert.NotNull(parsed.Record);
        Assert.Equal(record.Seq, parsed.Record.Seq);
        Assert.Equal(record.Kind, parsed.Record.Kind);
        Assert.Equal(record.EventTime, parsed.Record.EventTime);
        Assert.Equal(record.WrittenTime, parsed.Record.WrittenTime);
        Assert.Equal(record.Cause, parsed.Record.Cause);
        Assert.Equal(record.Payload.GetRawText(), parsed.Record.Payload.GetRawText());
        Assert.Equal(record.Mac, parsed.Record.Mac);
    }

    [Theory]
    [InlineData("not json")]
    [InlineData("{\"seq\":1}")]
    public void Parse_reports_a_line_that_is_not_a_record(string line)
    {
        var parsed = ExposureLogLine.Parse(TestKey.Value, Encoding.UTF8.GetBytes(line));
        Assert.Null(parsed.Record);
        Assert.False(string.IsNullOrEmpty(parsed.Error));
    }

    [Fact]
    public void Parse_rejects_members_out_of_order()
    {
        var line = "{\"seq\":1,\"format\":\"exposure-log/2\",\"kind\":\"snapshot\",\"eventTime\":\"2026-12-01T08:30:00.0000000Z\","
            + "\"writtenTime\":\"2026-12-01T08:30:00.0000000Z\",\"cause\":{\"id\":null,\"type\":\"timer\"},"
            + "\"payload\":{},\"prevMac\":\"" + Zeros + "\",\"mac\":\"" + Zeros + "\"}";
        var parsed = ExposureLogLine.Parse(TestKey.Value, Encoding.UTF8.GetBytes(line));
        Assert.Null(parsed.Record);
        Assert.Contains("expected [format,seq,kind", parsed.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void The_example_line_of_the_format_spec_verifies()
    {
        // The example in src/Monitor.Service/Audit/README.md, under its example key; its mac was computed with Python's
        // hmac.new(key, canonical, hashlib.sha256), independently of this code.
        var readme = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "Data", "Audit.README.md"));
        var line = readme.Split('\n').Single(l => l.StartsWith("{\"format\":\"exposure-log/2\",\"seq\":42,", StringComparison.Ordinal));
        var key = RecordKey.FromText("example-record-key-for-the-readme-only-0001", "the README's example key");
        Assert.Contains("example-record-key-for-the-readme-only-0001", readme, StringComparison.Ordinal);

        var parsed = ExposureLogLine.Parse(key, Encoding.UTF8.GetBytes(line));

        Assert.True(parsed.MacMatches, parsed.Error);
        Assert.Equal(42, parsed.Record!.Seq);
        Assert.False(ExposureLogLine.Parse(TestKey.Value, Encoding.UTF8.GetBytes(line)).MacMatches); // another key: refused

        // Writing the same record gives the same line: our writer produces the spec's canonical form.
        var rebuilt = ExposureLogLine.Build(key,
            42, "status-change", parsed.Record.EventTime, parsed.Record.WrittenTime, parsed.Record.Cause, parsed.Record.Payload, parsed.Record.PrevMac);
        Assert.Equal(line, rebuilt.Line);
    }
}
