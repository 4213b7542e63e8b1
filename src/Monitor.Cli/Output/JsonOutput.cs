using System.Text.Json;
using System.Text.Json.Serialization;

namespace Monitor.Cli.Output;

/// <summary>Writes a verb's document as indented JSON: camelCase names, invariant numbers, non-finite numbers as null.</summary>
internal static class JsonOutput
{
    private static readonly JsonSerializerOptions Options = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        WriteIndented = true,
        Converters = { new FiniteDoubleConverter() },
    };

    public static void Write<T>(TextWriter writer, T document)
    {
        writer.WriteLine(JsonSerializer.Serialize(document, Options));
    }

    /// <summary>NaN and infinities (a unit duration of a book worth exactly 0) become null: JSON has no NaN.</summary>
    private sealed class FiniteDoubleConverter : JsonConverter<double>
    {
        public override bool HandleNull => false;

        public override double Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) => reader.GetDouble();

        public override void Write(Utf8JsonWriter writer, double value, JsonSerializerOptions options)
        {
            if (double.IsFinite(value))
            {
                writer.WriteNumberValue(value);
            }
            else
            {
                writer.WriteNullValue();
            }
        }
    }
}
