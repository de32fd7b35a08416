using System.Text.Json;
using System.Text.Json.Serialization;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>The JSON form of results: camelCase, SI units, enums as strings, non-finite numbers as null.</summary>
public static class ResultJson
{
    /// <summary>Serializer options used for every JSON output.</summary>
    public static JsonSerializerOptions Options { get; } = Create();

    /// <summary>Serializes a value to indented JSON text.</summary>
    public static string Serialize<T>(T value) => JsonSerializer.Serialize(value, Options);

    /// <summary>Writes JSON to <paramref name="path"/> (whole or not at all), or to <paramref name="standardOutput"/>
    /// when the path is <c>-</c> (Core writes to no console of its own: the caller passes its writer).</summary>
    /// <param name="path">Target file, or <c>-</c>.</param>
    /// <param name="value">What to write.</param>
    /// <param name="cancellationToken">As for <see cref="AtomicFile.Write"/>.</param>
    /// <param name="standardOutput">Where <c>-</c> goes; required when the path is <c>-</c>.</param>
    public static void Write<T>(string path, T value, CancellationToken cancellationToken = default, TextWriter? standardOutput = null)
    {
        if (path == "-")
        {
            ArgumentNullException.ThrowIfNull(standardOutput);
            standardOutput.WriteLine(Serialize(value));
            return;
        }

        AtomicFile.Write(path, s => JsonSerializer.Serialize(s, value, Options), cancellationToken);
    }

    private static JsonSerializerOptions Create()
    {
        var options = new JsonSerializerOptions
        {
            PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
            DictionaryKeyPolicy = null,
            WriteIndented = true,
            DefaultIgnoreCondition = JsonIgnoreCondition.Never,
            NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        };
        options.Converters.Add(new JsonStringEnumConverter(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new FiniteDoubleConverter());
        options.MakeReadOnly(populateMissingResolver: true);
        return options;
    }

    /// <summary>Writes NaN and infinities as null so the JSON stays portable; reads null back as NaN.</summary>
    private sealed class FiniteDoubleConverter : JsonConverter<double>
    {
        public override double Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
            reader.TokenType == JsonTokenType.Null ? double.NaN : reader.GetDouble();

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

        public override bool HandleNull => true;
    }
}
