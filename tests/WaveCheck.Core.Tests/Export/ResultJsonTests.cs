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
