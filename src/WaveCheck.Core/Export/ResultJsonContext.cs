using System.Text.Json.Serialization;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// Source-generated JSON metadata of the result model: serialisation without reflection, so the trimmed,
/// ahead-of-time compiled <c>wavecheck</c> writes the same bytes as the JIT build (bench/json-identity.sh). The
/// options themselves (naming, enums as strings, non-finite numbers as null) are set once in
/// <see cref="ResultJson.Options"/>; a type written through <see cref="ResultJson"/> must be listed here or come with
/// its own context (<see cref="ResultJson.Write{T}(string, T, System.Text.Json.Serialization.Metadata.JsonTypeInfo{T}, CancellationToken, TextWriter?)"/>).
/// </summary>
[JsonSerializable(typeof(AnalysisResult))]
[JsonSerializable(typeof(AssessmentResult))]
[JsonSerializable(typeof(SurveyDocument))]
[JsonSerializable(typeof(RetestComparison))]
[JsonSerializable(typeof(double))]
public sealed partial class ResultJsonContext : JsonSerializerContext;
