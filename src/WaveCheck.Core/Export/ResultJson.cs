using System.Text.Json;
using System.Text.Json.Serialization;
using System.Text.Json.Serialization.Metadata;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Capture.Comtrade;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>The JSON form of results: camelCase, SI units, enums as strings, non-finite numbers as null.</summary>
public static class ResultJson
{
    /// <summary>Serializer options used for every JSON output.</summary>
    public static JsonSerializerOptions Options { get; } = Create();

    /// <summary>Serializes a value to indented JSON text (its type must be known to <see cref="ResultJsonContext"/>).</summary>
    public static string Serialize<T>(T value) => JsonSerializer.Serialize(value, TypeInfo<T>());

    /// <summary>The metadata of <typeparamref name="T"/> under <see cref="Options"/>, for a caller with a JSON context of
    /// its own: <paramref name="context"/> resolves the types <see cref="ResultJsonContext"/> does not know.</summary>
    public static JsonTypeInfo<T> TypeInfo<T>(IJsonTypeInfoResolver context)
    {
        var options = new JsonSerializerOptions(Options)
        {
            TypeInfoResolver = JsonTypeInfoResolver.Combine(ResultJsonContext.Default, context),
        };
        options.MakeReadOnly();
        return (JsonTypeInfo<T>)options.GetTypeInfo(typeof(T));
    }

    /// <summary>Writes JSON to <paramref name="path"/> (whole or not at all), or to <paramref name="standardOutput"/>
    /// when the path is <c>-</c> (Core writes to no console of its own: the caller passes its writer).</summary>
    /// <param name="path">Target file, or <c>-</c>.</param>
    /// <param name="value">What to write.</param>
    /// <param name="cancellationToken">As for <see cref="AtomicFile.Write"/>.</param>
    /// <param name="standardOutput">Where <c>-</c> goes; required when the path is <c>-</c>.</param>
    public static void Write<T>(string path, T value, CancellationToken cancellationToken = default, TextWriter? standardOutput = null) =>
        Write(path, value, TypeInfo<T>(), cancellationToken, standardOutput);

    /// <summary>As <see cref="Write{T}(string, T, CancellationToken, TextWriter?)"/>, with the metadata of a type
    /// <see cref="ResultJsonContext"/> does not know (from <see cref="TypeInfo{T}(IJsonTypeInfoResolver)"/>).</summary>
    /// <param name="path">Target file, or <c>-</c>.</param>
    /// <param name="value">What to write.</param>
    /// <param name="typeInfo">The metadata of <typeparamref name="T"/> under <see cref="Options"/>.</param>
    /// <param name="cancellationToken">As for <see cref="AtomicFile.Write"/>.</param>
    /// <param name="standardOutput">Where <c>-</c> goes; required when the path is <c>-</c>.</param>
    public static void Write<T>(string path, T value, JsonTypeInfo<T> typeInfo, CancellationToken cancellationToken = default,
        TextWriter? standardOutput = null)
    {
        if (path == "-")
        {
            ArgumentNullException.ThrowIfNull(standardOutput);
            standardOutput.WriteLine(JsonSerializer.Serialize(value, typeInfo));
            return;
        }

        AtomicFile.Write(path, s => JsonSerializer.Serialize(s, value, typeInfo), cancellationToken);
    }

    /// <summary>The source-generated metadata of <typeparamref name="T"/> under <see cref="Options"/> (a type
    /// <see cref="ResultJsonContext"/> lists): reading or writing through it needs no reflection, so it works trimmed.</summary>
    internal static JsonTypeInfo<T> TypeInfo<T>() => (JsonTypeInfo<T>)Options.GetTypeInfo(typeof(T));

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
        // One converter per enum of the model rather than the reflection-based factory, which the ahead-of-time build
        // cannot use; ResultJsonTests checks that every enum the context reaches is written as a string.
        options.Converters.Add(new JsonStringEnumConverter<DeviceType>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<RiskLevel>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<SurveyVerdict>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<DcCheck>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<TypeCheck>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<Finding>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<LimitState>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<ResidualCurrentClass>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<ClassPresence>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<DcDetection>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<Regime>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<ChannelQuantity>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<SensorCoupling>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<ComtradeDataFileType>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<WavSampleFormat>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<ActionPriority>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<DeviceTiming>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<RetestMatch>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<RetestOutcome>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new JsonStringEnumConverter<TripFinding>(JsonNamingPolicy.CamelCase));
        options.Converters.Add(new FiniteDoubleConverter());
        options.Converters.Add(new WordedStringConverter());
        options.TypeInfoResolver = ResultJsonContext.Default;
        options.MakeReadOnly();
        return options;
    }

    /// <summary>Writes a text whose settings are still marked (<see cref="Setting.Ref"/>: a result no front end
    /// worded, <see cref="ResultWording"/>) with the settings' property names, so no mark reaches a file; any other
    /// text as it is.</summary>
    private sealed class WordedStringConverter : JsonConverter<string>
    {
        public override string? Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
            reader.GetString();

        public override void Write(Utf8JsonWriter writer, string value, JsonSerializerOptions options) =>
            writer.WriteStringValue(Setting.Render(value, Setting.PropertyName));

        public override string ReadAsPropertyName(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
            reader.GetString()!;

        public override void WriteAsPropertyName(Utf8JsonWriter writer, string value, JsonSerializerOptions options) =>
            writer.WritePropertyName(value);
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
