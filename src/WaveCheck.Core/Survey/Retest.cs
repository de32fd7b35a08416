using System.Text.Json;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Survey;

/// <summary>A result file (or survey folder) as the comparison reads it: its circuits and the site's name.</summary>
/// <param name="Path">As the user named it.</param>
/// <param name="Site">Site name; null for an analysis file.</param>
/// <param name="Circuits">Its circuits.</param>
public sealed record RetestSide(string Path, string? Site, IReadOnlyList<CircuitFigures> Circuits);

/// <summary>
/// Compares two results of one site, for a retest after a remedy or a yearly inspection: two analysis JSON files
/// (<c>wavecheck.analysis/1</c>) or two surveys (a folder holding <c>survey.json</c>, or that file,
/// <c>wavecheck.survey/1</c>). Circuits are paired by name, then by a capture's file name; two analysis files are
/// one circuit each and are paired whatever their names.
/// </summary>
public static class Retest
{
    /// <summary>Largest result file read, bytes: 256 MiB (engineering choice: an analysis JSON of a long capture is a
    /// few MB; a larger file is no result of this tool, and refusing it bounds memory).</summary>
    public const long MaxFileBytes = 256L << 20;

    /// <summary>The analysis schema read.</summary>
    public const string AnalysisSchema = "wavecheck.analysis/1";

    /// <summary>The survey schema read.</summary>
    public const string SurveySchema = "wavecheck.survey/1";

    /// <summary>Reads one side.</summary>
    /// <param name="path">An analysis JSON file, a survey's <c>survey.json</c>, or a survey folder.</param>
    /// <exception cref="UserInputException">Not a result this version reads; the message names the file and what is wrong.</exception>
    public static RetestSide Load(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        var file = path;
        if (Directory.Exists(path))
        {
            file = System.IO.Path.Combine(path, "survey.json");
            if (!File.Exists(file))
            {
                throw new UserInputException($"{path}: no survey.json in this folder: expected a folder written by 'wavecheck survey', or an analysis JSON file");
            }
        }
        else if (!File.Exists(path))
        {
            throw new UserInputException($"{path}: no such file or folder: expected an analysis JSON file or a survey folder");
        }

        var info = new FileInfo(file);
        if (info.Length > MaxFileBytes)
        {
            throw new UserInputException($"{file}: {info.Length} bytes: at most {MaxFileBytes} bytes (256 MiB) are read; this is no WaveCheck result");
        }

        var bytes = File.ReadAllBytes(file);
        JsonDocument document;
        try
        {
            document = JsonDocument.Parse(bytes, new JsonDocumentOptions { MaxDepth = 64 });
        }
        catch (JsonException e)
        {
            throw new UserInputException($"{file}:{(e.LineNumber ?? 0) + 1}: not JSON ({Plain(e.Message)}): expected an analysis JSON file or a survey's survey.json");
        }

        using (document)
        {
            var root = document.RootElement;
            if (root.ValueKind != JsonValueKind.Object || !root.TryGetProperty("schema", out var schemaElement)
                || schemaElement.ValueKind != JsonValueKind.String)
            {
                throw new UserInputException($"{file}: not a WaveCheck result (no \"schema\"): expected an analysis JSON file or a survey's survey.json");
            }

            var schema = schemaElement.GetString()!;
            return schema switch
            {
                AnalysisSchema => new RetestSide(path, null, [FromAnalysis(file, root)]),
                SurveySchema => FromSurvey(path, file, root),
                _ => throw new UserInputException($"{file}: schema \"{ShownText.Of(schema)}\" is not one this version reads: expected \"{AnalysisSchema}\" or \"{SurveySchema}\""),
            };
        }
    }

    /// <summary>Pairs the circuits of two sides and says what changed.</summary>
    /// <param name="before">The earlier result.</param>
    /// <param name="after">The later result.</param>
    public static RetestComparison Compare(RetestSide before, RetestSide after)
    {
        ArgumentNullException.ThrowIfNull(before);
        ArgumentNullException.ThrowIfNull(after);
        var pairs = new List<(CircuitFigures? Before, CircuitFigures? After, RetestMatch Match)>();
        var unusedBefore = new List<CircuitFigures>(before.Circuits);
        if (before.Circuits.Count == 1 && after.Circuits.Count == 1 && before.Site is null && after.Site is null)
        {
            pairs.Add((before.Circuits[0], after.Circuits[0], RetestMatch.Single));
            unusedBefore.Clear();
        }
        else
        {
            foreach (var later in after.Circuits)
            {
                var match = RetestMatch.Circuit;
                var earlier = unusedBefore.FirstOrDefault(b => SameName(b.Circuit, later.Circuit));
                if (earlier is null)
                {
                    match = RetestMatch.File;
                    earlier = unusedBefore.FirstOrDefault(b => b.Files.Any(f => later.Files.Contains(f, StringComparer.OrdinalIgnoreCase)));
                }

                if (earlier is not null)
                {
                    unusedBefore.Remove(earlier);
                }

                pairs.Add((earlier, later, earlier is null ? RetestMatch.Unmatched : match));
            }
        }

        pairs.AddRange(unusedBefore.Select(b => ((CircuitFigures?)b, (CircuitFigures?)null, RetestMatch.Unmatched)));
        return new RetestComparison
        {
            BeforePath = before.Path,
            AfterPath = after.Path,
            Site = after.Site ?? before.Site,
            Circuits = [.. pairs.Select(p => Change(p.Before, p.After, p.Match))],
        };
    }

    /// <summary>What changed for one circuit.</summary>
    public static CircuitChange Change(CircuitFigures? before, CircuitFigures? after, RetestMatch match)
    {
        var name = after?.Circuit ?? before?.Circuit ?? throw new ArgumentException("a circuit needs a before or an after side");
        if (before is null || after is null)
        {
            return new CircuitChange(name, RetestMatch.Unmatched, before, after,
                before is null ? RetestOutcome.New : RetestOutcome.NotRetested,
                [before is null ? "only in the later result" : "only in the earlier result: not retested"]);
        }

        var changes = new List<string>();
        if (before.InstalledType != after.InstalledType)
        {
            changes.Add($"installed device {before.InstalledType?.ToTradeName() ?? "not given"} → {after.InstalledType?.ToTradeName() ?? "not given"}");
        }

        if (before.RatedResidualCurrentA != after.RatedResidualCurrentA)
        {
            changes.Add($"IΔn {Amps(before.RatedResidualCurrentA)} → {Amps(after.RatedResidualCurrentA)}");
        }

        var typeBefore = TypeText(before);
        var typeAfter = TypeText(after);
        if (typeBefore != typeAfter)
        {
            changes.Add($"required type {typeBefore} → {typeAfter}");
        }

        if (before.Verdict != after.Verdict)
        {
            changes.Add($"verdict {VerdictText.Of(before.Verdict)} → {VerdictText.Of(after.Verdict)}");
        }

        Figure(changes, "worst-window RMS", before.WorstWindowRmsA, after.WorstWindowRmsA);
        Figure(changes, "smooth DC", before.SmoothDcA, after.SmoothDcA);
        Figure(changes, "above 1 kHz", before.Above1kHzRmsA, after.Above1kHzRmsA);
        Figure(changes, "nuisance margin", before.NuisanceMarginA, after.NuisanceMarginA);
        if (before.NuisanceRisk != after.NuisanceRisk)
        {
            changes.Add($"nuisance risk {Risk(before.NuisanceRisk)} → {Risk(after.NuisanceRisk)}");
        }

        return new CircuitChange(name, match, before, after, Outcome(before, after), changes.Count == 0 ? ["no change"] : changes);
    }

    /// <summary>The outcome: the verdict decides first (ok better than cannot-tell better than upgrade; an error
    /// tells nothing and counts as cannot-tell), then the required type (a stronger one is worse, and so is one that
    /// was decided and no longer is).</summary>
    public static RetestOutcome Outcome(CircuitFigures before, CircuitFigures after)
    {
        ArgumentNullException.ThrowIfNull(before);
        ArgumentNullException.ThrowIfNull(after);
        if (before.Verdict == SurveyVerdict.Upgrade && after.Verdict == SurveyVerdict.Ok)
        {
            return RetestOutcome.Remedied;
        }

        var verdict = Rank(after.Verdict).CompareTo(Rank(before.Verdict));
        if (verdict != 0)
        {
            return verdict > 0 ? RetestOutcome.Worse : RetestOutcome.Better;
        }

        // A type that was decided and now is not: less is known, which is never better.
        if (after.RequiredType is null && before.RequiredType is not null)
        {
            return RetestOutcome.Worse;
        }

        var demand = Demand(after).CompareTo(Demand(before));
        return demand > 0 ? RetestOutcome.Worse : demand < 0 ? RetestOutcome.Better : RetestOutcome.Unchanged;
    }

    private static int Rank(SurveyVerdict verdict) => verdict switch
    {
        SurveyVerdict.Ok => 0,
        SurveyVerdict.Upgrade => 2,
        _ => 1,
    };

    private static int Demand(CircuitFigures c) => (int?)(c.RequiredType ?? c.MinimumType) ?? -1;

    private static bool SameName(string a, string b) => string.Equals(a.Trim(), b.Trim(), StringComparison.OrdinalIgnoreCase);

    private static string TypeText(CircuitFigures c) =>
        c.RequiredType?.ToTradeName() ?? (c.MinimumType is { } m ? $"at least {m.ToTradeName()}" : "unknown");

    private static string Risk(RiskLevel? risk) => risk is { } r ? VerdictText.Of(r) : "unknown";

    private static string Amps(double? amperes) => amperes is { } a ? CurrentText.WithUnit(a) : "unknown";

    private static void Figure(List<string> changes, string label, double? before, double? after)
    {
        if (before is { } b && after is { } a)
        {
            // Equal as written on screen: no change worth a line.
            if (CurrentText.WithUnit(a) != CurrentText.WithUnit(b))
            {
                var delta = a - b;
                changes.Add($"{label} {CurrentText.WithUnit(b)} → {CurrentText.WithUnit(a)} ({(delta > 0 ? "+" : "−")}{CurrentText.WithUnit(Math.Abs(delta))})");
            }
        }
        else if (before is not null || after is not null)
        {
            changes.Add($"{label} {Amps(before)} → {Amps(after)}");
        }
    }

    private static CircuitFigures FromAnalysis(string file, JsonElement root)
    {
        var capture = Required(file, root, "capture");
        var captureFile = RequiredString(file, capture, "capture.filePath", "filePath");
        var summary = Required(file, root, "summary");
        var components = Required(file, root, "components");
        var worst = root.TryGetProperty("windows", out var windows) && windows.ValueKind == JsonValueKind.Object
            && windows.TryGetProperty("statistics", out var statistics) && statistics.ValueKind == JsonValueKind.Object
            && statistics.TryGetProperty("rmsA", out var rms) && rms.ValueKind == JsonValueKind.Object
            ? Number(file, rms, "windows.statistics.rmsA.max", "max")
            : null;
        InstalledProtection? installed = null;
        double? rated = null;
        DeviceType? required = null, minimum = null;
        bool? adequate = null;
        RiskLevel? risk = null;
        double? margin = null;
        if (root.TryGetProperty("assessment", out var assessment) && assessment.ValueKind == JsonValueKind.Object)
        {
            installed = Protection(file, assessment);
            rated = Number(file, assessment, "assessment.ratedResidualCurrentA", "ratedResidualCurrentA");
            required = Type(file, assessment, "requiredType");
            minimum = Type(file, assessment, "minimumType");
            adequate = assessment.TryGetProperty("installedAdequate", out var a) && a.ValueKind is JsonValueKind.True or JsonValueKind.False
                ? a.GetBoolean() : null;
            if (assessment.TryGetProperty("nuisanceTrip", out var nuisance) && nuisance.ValueKind == JsonValueKind.Object)
            {
                margin = Number(file, nuisance, "assessment.nuisanceTrip.marginA", "marginA");
                risk = Text(nuisance, "risk") is { } r ? Enum.TryParse<RiskLevel>(r, ignoreCase: true, out var parsed) ? parsed
                    : throw new UserInputException($"{file}: assessment.nuisanceTrip.risk \"{ShownText.Of(r)}\" is not low, possible or likely") : null;
            }
        }

        var name = System.IO.Path.GetFileName(captureFile);
        return new CircuitFigures
        {
            Circuit = name,
            Files = [name],
            InstalledType = installed,
            RatedResidualCurrentA = rated,
            RequiredType = required,
            MinimumType = minimum,
            Verdict = SurveyRow.VerdictOf(installed, adequate),
            WorstWindowRmsA = worst ?? Number(file, summary, "summary.rmsA", "rmsA"),
            SmoothDcA = Number(file, components, "components.smoothDcMaxA", "smoothDcMaxA"),
            Above1kHzRmsA = Number(file, components, "components.above1kHzRmsA", "above1kHzRmsA"),
            NuisanceRisk = risk,
            NuisanceMarginA = margin,
        };
    }

    private static RetestSide FromSurvey(string path, string file, JsonElement root)
    {
        SurveyDocument survey;
        try
        {
            survey = root.Deserialize(ResultJson.TypeInfo<SurveyDocument>())
                ?? throw new UserInputException($"{file}: the survey is null");
        }
        catch (JsonException e)
        {
            var where = string.IsNullOrEmpty(e.Path) ? string.Empty : $" at {e.Path}";
            var missing = e.Message.IndexOf("including:", StringComparison.Ordinal);
            var what = missing > 0 ? $"missing {e.Message[(missing + "including:".Length)..].Trim().TrimEnd('.')}"
                : "a value of the wrong kind";
            throw new UserInputException($"{file}: not a survey this version reads{where}: {what}");
        }

        var circuits = survey.Circuits.Count > 0 ? survey.Circuits : CircuitVerdicts.From(survey.Rows ?? []);
        return new RetestSide(path, survey.Site, [.. circuits.Select(c => new CircuitFigures
        {
            Circuit = c.Circuit,
            Files = [.. c.Captures.Select(k => System.IO.Path.GetFileName(k.File))],
            InstalledType = c.InstalledType,
            RatedResidualCurrentA = c.RatedResidualCurrentA,
            RequiredType = c.RequiredType,
            MinimumType = c.MinimumType,
            Verdict = c.Verdict,
            WorstWindowRmsA = c.WorstWindowRmsA,
            SmoothDcA = c.SmoothDcA,
            Above1kHzRmsA = c.Above1kHzRmsA,
            NuisanceRisk = c.NuisanceRisk,
            NuisanceMarginA = c.NuisanceMarginA,
        })]);
    }

    private static JsonElement Required(string file, JsonElement parent, string name) =>
        parent.TryGetProperty(name, out var value) && value.ValueKind == JsonValueKind.Object
            ? value
            : throw new UserInputException($"{file}: no \"{name}\" object: not an analysis this version reads");

    private static string RequiredString(string file, JsonElement parent, string where, string name) =>
        Text(parent, name) ?? throw new UserInputException($"{file}: no {where}: not an analysis this version reads");

    private static string? Text(JsonElement parent, string name) =>
        parent.TryGetProperty(name, out var value) && value.ValueKind == JsonValueKind.String ? value.GetString() : null;

    private static double? Number(string file, JsonElement parent, string where, string name)
    {
        if (!parent.TryGetProperty(name, out var value) || value.ValueKind == JsonValueKind.Null)
        {
            return null;
        }

        return value.ValueKind == JsonValueKind.Number && value.TryGetDouble(out var number) && double.IsFinite(number)
            ? number
            : throw new UserInputException($"{file}: {where} is not a number");
    }

    /// <summary>The installed protection as the analysis wrote it: in full (<c>installedProtection</c>), or as a type
    /// alone where an older file has only <c>installedType</c>.</summary>
    private static InstalledProtection? Protection(string file, JsonElement assessment)
    {
        var (name, text) = Text(assessment, "installedProtection") is { } full
            ? ("installedProtection", full)
            : ("installedType", Text(assessment, "installedType"));
        if (text is null)
        {
            return null;
        }

        return InstalledProtection.TryParse(text, out var protection)
            ? protection
            : throw new UserInputException($"{file}: assessment.{name} \"{ShownText.Of(text)}\" is not an installed protection (AC, A, F, B or B+, optionally with +RDC-DD or + charger DC detection)");
    }

    private static DeviceType? Type(string file, JsonElement parent, string name)
    {
        if (Text(parent, name) is not { } text)
        {
            return null;
        }

        return DeviceTypeNames.TryParse(text, out var type)
            ? type
            : throw new UserInputException($"{file}: assessment.{name} \"{ShownText.Of(text)}\" is not a device type (AC, A, F, B or B+)");
    }

    private static string Plain(string message)
    {
        var at = message.IndexOf(" Path:", StringComparison.Ordinal);
        var cut = message.IndexOf(" LineNumber:", StringComparison.Ordinal);
        var end = new[] { at, cut }.Where(i => i > 0).DefaultIfEmpty(message.Length).Min();
        return message[..end].TrimEnd('.', ' ');
    }
}
