using System.Text.Json;
using System.Text.Json.Serialization.Metadata;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Export;

public class ResultJsonContextTests
{
    /// <summary>Every type the source-generated context reaches from the result model, walked through properties,
    /// elements and dictionary values.</summary>
    private static HashSet<Type> Reachable()
    {
        var seen = new HashSet<Type>();
        var pending = new Stack<Type>([typeof(AnalysisResult), typeof(AssessmentResult), typeof(SurveyDocument)]);
        while (pending.TryPop(out var type))
        {
            var underlying = Nullable.GetUnderlyingType(type) ?? type;
            if (!seen.Add(underlying))
            {
                continue;
            }

            var info = ResultJson.Options.GetTypeInfo(underlying);
            foreach (var property in info.Properties)
            {
                pending.Push(property.PropertyType);
            }

            if (info.ElementType is { } element)
            {
                pending.Push(element);
            }

            if (info.KeyType is { } key)
            {
                pending.Push(key);
            }
        }

        return seen;
    }

    [Fact]
    public void EveryEnumOfTheModelIsWrittenAsItsCamelCaseOrDeclaredName()
    {
        // The JSON form's rule (docs/formats.md): enums as strings, camelCase unless a member names itself. The
        // ahead-of-time build cannot use the reflection-based enum converter, so each enum has its own in
        // ResultJson.Options; an enum added to the model without one would be written as a number.
        var enums = Reachable().Where(t => t.IsEnum).ToList();
        Assert.Contains(typeof(DeviceType), enums);
        Assert.True(enums.Count >= 5, $"only {enums.Count} enums reached: the walk is broken");
        foreach (var type in enums)
        {
            foreach (var value in Enum.GetValues(type))
            {
                var json = JsonSerializer.Serialize(value, ResultJson.Options.GetTypeInfo(type));
                using var written = JsonDocument.Parse(json);
                Assert.True(written.RootElement.ValueKind == JsonValueKind.String, $"{type.Name}.{value} is written as {json}, not as a string");
                var name = value.ToString()!;
                var declared = type.GetField(name)!
                    .GetCustomAttributes(typeof(System.Text.Json.Serialization.JsonStringEnumMemberNameAttribute), false)
                    .Cast<System.Text.Json.Serialization.JsonStringEnumMemberNameAttribute>().SingleOrDefault()?.Name;
                Assert.Equal(declared ?? JsonNamingPolicy.CamelCase.ConvertName(name), written.RootElement.GetString());
            }
        }
    }

    [Fact]
    public void TheModelIsServedBySourceGeneratedMetadataNotReflection()
    {
        // The resolver is the generated context alone (no reflection fallback): a type outside it fails loudly in
        // every build rather than only in the trimmed one.
        Assert.Same(ResultJsonContext.Default, ResultJson.Options.TypeInfoResolver);
        Assert.Throws<NotSupportedException>(() => ResultJson.Serialize(new Uri("https://example.invalid/")));
    }

    [Fact]
    public void NonFiniteNumbersAreWrittenAsNull()
    {
        // Portable JSON (RFC 8259 §6 has no NaN or infinity): the writer's documented rule.
        Assert.Equal("null", ResultJson.Serialize(double.NaN));
        Assert.Equal("null", ResultJson.Serialize(double.PositiveInfinity));
        Assert.Equal("1.5", ResultJson.Serialize(1.5));
    }
}
