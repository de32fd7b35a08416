using System.Text.Json;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Export;

/// <summary>The typed verdicts keep the words the analysis JSON has always carried.</summary>
public class ResultJsonTests
{
    private static JsonElement Json<T>(T value) => JsonDocument.Parse(ResultJson.Serialize(value)).RootElement;

    [Theory]
    // The trade's designations of the types (IEC 60755 family; B+ is DIN VDE 0664-400's national designation).
    [InlineData(DeviceType.AC, "AC")]
    [InlineData(DeviceType.A, "A")]
    [InlineData(DeviceType.F, "F")]
    [InlineData(DeviceType.B, "B")]
    [InlineData(DeviceType.BPlus, "B+")]
    public void A_device_type_is_written_with_its_trade_name(DeviceType type, string name)
    {
        var verdict = Json(new TypeVerdict(type, true, []));
        Assert.Equal(name, verdict.GetProperty("type").GetString());
        var blinding = Json(new BlindingResult(type, 0, null, false, "x"));
        Assert.Equal(name, blinding.GetProperty("deviceType").GetString());
        var trip = Json(new NuisanceTripResult(RiskLevel.Low, type, 0, 0.015, 0.015, 100, 0.009, true, [], "x"));
        Assert.Equal(name, trip.GetProperty("deviceType").GetString());
        Assert.Equal(name, type.ToTradeName());
    }

    [Theory]
    // The trade's ways of writing an installed protection (common practice, no source): a type; a type with an RDC-DD
    // (IEC 62955) beside it; a type at a charging point whose equipment detects 6 mA DC itself (IEC 60364-7-722).
    [InlineData(DeviceType.A, DcDetection.None, "A")]
    [InlineData(DeviceType.A, DcDetection.RdcDd, "A+RDC-DD")]
    [InlineData(DeviceType.BPlus, DcDetection.None, "B+")]
    [InlineData(DeviceType.F, DcDetection.Charger, "F + charger DC detection")]
    public void An_installed_protection_is_written_in_the_trade_words_and_read_back(DeviceType type, DcDetection dc, string words)
    {
        var row = new SurveyRow { File = "c.wav", RatedResidualCurrentA = 0.03, Verdict = SurveyVerdict.Ok, InstalledType = new InstalledProtection(type, dc) };
        var text = ResultJson.Serialize(row);

        Assert.Equal(words, JsonDocument.Parse(text).RootElement.GetProperty("installedType").GetString());
        // The bytes the text-typed field wrote before: the writer's default encoder escapes '+' as \u002B.
        Assert.Contains($"\"installedType\": \"{words.Replace("+", "\\u002B", StringComparison.Ordinal)}\"", text, StringComparison.Ordinal);
        var back = JsonSerializer.Deserialize(text, (System.Text.Json.Serialization.Metadata.JsonTypeInfo<SurveyRow>)ResultJson.Options.GetTypeInfo(typeof(SurveyRow)));
        Assert.Equal(row.InstalledType, back!.InstalledType);
        Assert.Equal(words, row.InstalledType.ToString());
        // Read as people type it too: case and spaces do not matter.
        Assert.True(InstalledProtection.TryParse(words.ToLowerInvariant().Replace(" ", string.Empty, StringComparison.Ordinal), out var loose));
        Assert.Equal(row.InstalledType, loose);
    }

    [Theory]
    [InlineData("G")]
    [InlineData("A+")]
    [InlineData("+RDC-DD")]
    [InlineData(" + charger DC detection")]
    [InlineData("A+RCBO")]
    public void A_protection_in_other_words_is_not_read(string words)
    {
        Assert.False(InstalledProtection.TryParse(words, out _));
        var json = $$"""{ "file": "c.wav", "ratedResidualCurrentA": 0.03, "verdict": "ok", "installedType": "{{words}}" }""";
        Assert.Throws<JsonException>(() => JsonSerializer.Deserialize(json, (System.Text.Json.Serialization.Metadata.JsonTypeInfo<SurveyRow>)ResultJson.Options.GetTypeInfo(typeof(SurveyRow))));
    }

    [Theory]
    // The words of docs/methods.md II.2: absent, at limit, present, open.
    [InlineData(ClassPresence.Absent, "absent")]
    [InlineData(ClassPresence.AtLimit, "at limit")]
    [InlineData(ClassPresence.Present, "present")]
    [InlineData(ClassPresence.Open, "open")]
    public void A_class_presence_is_written_in_words(ClassPresence presence, string word)
    {
        var c = Json(new ClassResult(ResidualCurrentClass.SmoothDc, "smooth DC", presence, null, null, DeviceType.B, true, "x"));
        Assert.Equal(word, c.GetProperty("presence").GetString());
        Assert.Equal(word, VerdictText.Of(presence));
    }

    [Theory]
    // The identifiers the JSON has carried since the classes were introduced: the enum's name in camelCase.
    [InlineData(ResidualCurrentClass.MainsAc, "mainsAc", "AC")]
    [InlineData(ResidualCurrentClass.PulsatingDc, "pulsatingDc", "A")]
    [InlineData(ResidualCurrentClass.Composite, "composite", "F")]
    [InlineData(ResidualCurrentClass.NonMainsAc, "nonMainsAc", "B")]
    [InlineData(ResidualCurrentClass.SmoothDc, "smoothDc", "B")]
    [InlineData(ResidualCurrentClass.HighFrequency, "highFrequency", "B+")]
    [InlineData(ResidualCurrentClass.ChargingPointDcFault, "chargingPointDcFault", "B")]
    [InlineData(ResidualCurrentClass.Clipping, "clipping", "B+")]
    public void A_class_is_written_with_its_identifier_and_least_type(ResidualCurrentClass cls, string id, string leastType)
    {
        var c = Json(new ClassResult(cls, cls.Describe(), ClassPresence.Present, 0.001, 0.001, cls.LeastType(), false, "x"));
        Assert.Equal(id, c.GetProperty("class").GetString());
        Assert.Equal(leastType, c.GetProperty("leastType").GetString());
    }
}
