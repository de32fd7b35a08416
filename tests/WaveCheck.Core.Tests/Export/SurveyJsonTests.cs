using System.Text.Json;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Results;

public class SurveyJsonTests
{
    [Fact]
    public void Survey_json_has_schema_rows_upstream_and_cautions()
    {
        var rows = new[] { new ResultBuilder { WorstWindowRmsA = 0.009 }.Row("c1.wav", "C1"), SurveyRows.Failed("c2.wav", new CaptureSettings(), "c2.wav: broken") };
        var upstream = UpstreamCheck.EvaluateAll([new UpstreamGroup("Q2", DeviceType.A, 0.1, ["c1.wav", "c2.wav"])], rows);
        var document = new SurveyDocument
        {
            Site = "Fernbrook Joinery, Unit 4",
            GeneratedAt = new DateTimeOffset(2026, 3, 4, 10, 0, 0, TimeSpan.Zero),
            Rows = rows,
            Upstream = upstream,
            Cautions = SurveyCautions.All,
        };
        var folder = Directory.CreateTempSubdirectory("wavecheck-json-").FullName;
        try
        {
            var path = Path.Combine(folder, "survey.json");
            SurveyJson.Write(path, document);
            using var json = JsonDocument.Parse(File.ReadAllText(path));
            var root = json.RootElement;
            Assert.Equal("wavecheck.survey/1", root.GetProperty("schema").GetString());
            Assert.Equal("Fernbrook Joinery, Unit 4", root.GetProperty("site").GetString());
            Assert.Equal("2026-03-04T10:00:00+00:00", root.GetProperty("generatedAt").GetString());
            Assert.Equal(2, root.GetProperty("rows").GetArrayLength());
            Assert.Equal(0.009, root.GetProperty("rows")[0].GetProperty("worstWindowRmsA").GetDouble());
            Assert.Equal(JsonValueKind.Null, root.GetProperty("rows")[1].GetProperty("rmsA").ValueKind);
            var q2 = root.GetProperty("upstream")[0];
            Assert.Equal("incomplete", q2.GetProperty("leakageRisk").GetString());
            Assert.False(q2.GetProperty("complete").GetBoolean());
            Assert.Equal(3, root.GetProperty("cautions").GetArrayLength());
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }
}
