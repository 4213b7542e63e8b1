using System.Text.Json;
using System.Text.Json.Nodes;
using Monitor.Contracts.V1;

namespace Monitor.Contracts.Tests;

// Every README example deserialises into its contract with web defaults (camelCase), with no
// unknown field and no missing required field, and serialises back to the same JSON.
public class JsonRoundTripTests
{
    public static TheoryData<string> Messages() => new(JsonExamples.Messages);

    [Theory]
    [MemberData(nameof(Messages))]
    public void Example_round_trips_through_its_contract(string message)
    {
        var json = JsonExamples.Read(message);
        var value = JsonSerializer.Deserialize(json, JsonExamples.TypeOf(message), JsonExamples.Strict);
        Assert.NotNull(value);
        var back = JsonSerializer.Serialize(value, JsonExamples.TypeOf(message), JsonExamples.Strict);
        var expected = JsonNode.Parse(json);
        var actual = JsonNode.Parse(back);
        Assert.True(JsonNode.DeepEquals(expected, actual), $"{message}:\nexample  {expected!.ToJsonString()}\nround-trip {actual!.ToJsonString()}");
    }

    [Fact]
    public void Every_message_has_an_example_and_every_example_a_message()
    {
        var files = Directory.GetFiles(JsonExamples.DataPath(""), "*.json").Select(Path.GetFileNameWithoutExtension).Order();
        Assert.Equal(JsonExamples.Messages.Order(), files);
    }

    [Fact]
    public void Values_land_in_the_right_properties()
    {
        var trade = JsonSerializer.Deserialize<TradeBooked>(JsonExamples.Read("TradeBooked"), JsonExamples.Strict)!;
        Assert.Equal(("T-20261201-0042", 2, "amend", -5_000_000.0), (trade.TradeId, trade.Version, trade.Action, trade.FaceAmount));
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 10, 2, 17, TimeSpan.Zero), trade.TradeTime);

        var instrument = JsonSerializer.Deserialize<InstrumentDefined>(JsonExamples.Read("InstrumentDefined"), JsonExamples.Strict)!;
        Assert.Equal(new DateOnly(2036, 3, 15), instrument.MaturityDate);
        Assert.Null(instrument.SpreadGroup);

        var exposures = JsonSerializer.Deserialize<BookExposuresUpdated>(JsonExamples.Read("BookExposuresUpdated"), JsonExamples.Strict)!;
        Assert.Equal(318400, exposures.Measures["dv01"]);
        Assert.Equal(57, Assert.Single(exposures.Curves).Version);

        var batch = JsonSerializer.Deserialize<BookExposuresBatch>(JsonExamples.Read("BookExposuresBatch"), JsonExamples.Strict)!;
        Assert.Equal(["govt-long", "govt-short"], batch.Books.Select(b => b.Book));
        Assert.Equal(-6410, batch.Books[1].Measures["baseSlope"]);
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 9, 30, 1, 250, TimeSpan.Zero), batch.PublishedAt);
    }

    [Fact]
    public void A_missing_required_field_is_rejected_naming_it()
    {
        var json = JsonNode.Parse(JsonExamples.Read("TradeBooked"))!.AsObject();
        json.Remove("book");
        var e = Assert.Throws<JsonException>(() => JsonSerializer.Deserialize<TradeBooked>(json.ToJsonString(), JsonExamples.Strict));
        Assert.Contains("book", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Utc_written_as_z_is_accepted()
    {
        var json = JsonExamples.Read("BondQuoted").Replace("09:30:00.125+00:00", "09:30:00.125Z", StringComparison.Ordinal);
        var quote = JsonSerializer.Deserialize<BondQuoted>(json, JsonExamples.Strict)!;
        Assert.Equal(TimeSpan.Zero, quote.QuoteTime.Offset);
    }
}
