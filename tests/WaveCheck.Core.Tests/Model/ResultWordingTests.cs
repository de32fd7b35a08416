using System.Text.Json;
using System.Text.Json.Serialization;
using System.Text.Json.Serialization.Metadata;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests.Model;

/// <summary>
/// Core's texts mark the settings they name (<see cref="Setting.Ref"/>); <see cref="ResultWording"/> words a whole
/// result once for a front end, and Core's JSON words what no front end did by the property name.
/// </summary>
public class ResultWordingTests
{
    /// <summary>A capture whose result names settings in many places: sensor coupling not stated (warning and caution),
    /// a charging point (class finding, reasons, headline), thresholds (sources) and a trip replay (notes).</summary>
    private static AnalysisResult Marked()
    {
        using var source = new SynthCaptureSource([.. SynthesisSpec.Parse("sine:rms=20mA", 50)], 20_000, 1.0, SensorCoupling.Unknown);
        return Evaluation.Run(source, new AnalysisOptions(), new AssessmentOptions { EvChargingPoint = true, ChargerDcDetection = true }).Analysis;
    }

    /// <summary>Every text of a result's JSON written with no wording at all: the marks as they are in the model.</summary>
    private static string Unworded(AnalysisResult result)
    {
        var options = new JsonSerializerOptions(ResultJson.Options);
        options.Converters.Remove(options.Converters.Single(c => c is JsonConverter<string>));
        return Texts(JsonSerializer.Serialize(result, (JsonTypeInfo<AnalysisResult>)options.GetTypeInfo(typeof(AnalysisResult))));
    }

    /// <summary>The string values of a JSON document, unescaped, one a line (the writer escapes non-ASCII and '+').</summary>
    private static string Texts(string json)
    {
        using var document = JsonDocument.Parse(json);
        var texts = new List<string>();
        void Walk(JsonElement e)
        {
            switch (e.ValueKind)
            {
                case JsonValueKind.String:
                    texts.Add(e.GetString()!);
                    break;
                case JsonValueKind.Array:
                    foreach (var item in e.EnumerateArray())
                    {
                        Walk(item);
                    }

                    break;
                case JsonValueKind.Object:
                    foreach (var property in e.EnumerateObject())
                    {
                        Walk(property.Value);
                    }

                    break;
            }
        }

        Walk(document.RootElement);
        return string.Join("\n", texts);
    }

    [Fact]
    public void Every_marked_setting_of_a_result_is_worded_by_the_front_end()
    {
        var marked = Marked();
        var before = Unworded(marked);
        // The model carries the marks: without them this test could not fail.
        Assert.Contains("⟦Sensor⟧", before, StringComparison.Ordinal);
        Assert.Contains("⟦ChargerDcDetection⟧", before, StringComparison.Ordinal);
        Assert.Contains("⟦RatedResidualCurrentA⟧", before, StringComparison.Ordinal);
        Assert.Contains("⟦Accuracy⟧", before, StringComparison.Ordinal);

        var worded = Unworded(marked.InWords(p => $"<{p}>"));

        Assert.DoesNotContain("⟦", worded, StringComparison.Ordinal);
        Assert.Contains("state <Sensor> dc or ac", worded, StringComparison.Ordinal);
        Assert.Contains("as declared (<ChargerDcDetection>)", worded, StringComparison.Ordinal);
        Assert.Contains("IΔn of the device assessed (<RatedResidualCurrentA>; default 30 mA, practice)", worded, StringComparison.Ordinal);
        // The caution that repeats a capture warning is worded too, not only the warning.
        var result = marked.InWords(p => $"<{p}>");
        Assert.Contains(result.Assessment!.Cautions, c => c.StartsWith("Capture: sensor coupling not stated", StringComparison.Ordinal) && c.Contains("<Sensor>", StringComparison.Ordinal));
    }

    [Fact]
    public void Core_alone_writes_a_marked_setting_by_its_property_name()
    {
        var json = Texts(ResultJson.Serialize(Marked()));

        Assert.DoesNotContain("⟦", json, StringComparison.Ordinal);
        Assert.DoesNotMatch("--[A-Za-z]", json);
        Assert.Contains("state Sensor dc or ac", json, StringComparison.Ordinal);
        Assert.Contains("(engineering choice: 2 % + 0.1 mA default, Accuracy)", json, StringComparison.Ordinal);
    }

    [Fact]
    public void A_text_without_marks_is_kept_as_it_is()
    {
        var warning = new CaptureWarning("clipping", "12 samples at full scale", 1.5);
        var calls = 0;

        var worded = warning.InWords(p => { calls++; return p; });

        Assert.Equal(warning, worded);
        Assert.Same(warning.Message, worded.Message);
        Assert.Equal(0, calls);
    }

    [Fact]
    public void The_implausible_residual_warning_names_the_sum_setting()
    {
        var warning = Evaluation.ImplausibleResidual(2.0, "L1");

        Assert.Contains($"add every live conductor's channel with {Setting.Ref(nameof(ImportOptions.SumChannels))}, before",
            warning.Message, StringComparison.Ordinal);
        Assert.Contains("channel with SumChannels, before", warning.InWords(Setting.PropertyName).Message, StringComparison.Ordinal);
    }
}
