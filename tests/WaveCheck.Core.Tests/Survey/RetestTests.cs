using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Survey;

/// <summary>Comparing two results of one site (docs/methods.md Part III, "retest"): pairing by circuit name, then by
/// file name, and the outcome rule (the verdict first, then the required type; a stronger type is worse). Common
/// practice, no source: a retest reads what was found before against what is found now.</summary>
public class RetestTests
{
    private static CircuitFigures Figures(string circuit, SurveyVerdict verdict, DeviceType? required, string file,
        double worstA = 0.009, double? dcA = 0.009, double? marginA = 0.006, DeviceType installed = DeviceType.A) => new()
        {
            Circuit = circuit,
            Files = [file],
            InstalledType = new InstalledProtection(installed),
            RatedResidualCurrentA = 0.030,
            RequiredType = required,
            MinimumType = required ?? DeviceType.A,
            Verdict = verdict,
            WorstWindowRmsA = worstA,
            SmoothDcA = dcA,
            NuisanceMarginA = marginA,
            NuisanceRisk = RiskLevel.Low,
        };

    private static RetestSide Side(string path, params CircuitFigures[] circuits) => new(path, "Invented clinic", circuits);

    [Fact]
    public void Circuits_pair_by_name_then_by_file_and_unpaired_ones_are_said()
    {
        var before = Side("2025",
            Figures("C1 bay", SurveyVerdict.Upgrade, DeviceType.B, "bay1.wav"),
            Figures("C2 old name", SurveyVerdict.Ok, DeviceType.A, "lights.csv"),
            Figures("C3 removed", SurveyVerdict.Ok, DeviceType.A, "gone.wav"));
        var after = Side("2026",
            Figures("c1 BAY", SurveyVerdict.Ok, DeviceType.B, "bay1-2026.wav", installed: DeviceType.B),
            Figures("C2 lighting", SurveyVerdict.Ok, DeviceType.A, "lights.csv"),
            Figures("C4 new", SurveyVerdict.Ok, DeviceType.A, "new.wav"));
        var comparison = Retest.Compare(before, after);

        Assert.Equal(["c1 BAY", "C2 lighting", "C4 new", "C3 removed"], comparison.Circuits.Select(c => c.Circuit));
        Assert.Equal([RetestMatch.Circuit, RetestMatch.File, RetestMatch.Unmatched, RetestMatch.Unmatched],
            comparison.Circuits.Select(c => c.Match));
        Assert.Equal([RetestOutcome.Remedied, RetestOutcome.Unchanged, RetestOutcome.New, RetestOutcome.NotRetested],
            comparison.Circuits.Select(c => c.Outcome));
        Assert.Contains("installed device A → B", comparison.Circuits[0].Changes);
        Assert.Contains("verdict upgrade → ok", comparison.Circuits[0].Changes);
        Assert.Equal(["no change"], comparison.Circuits[1].Changes);
    }

    [Fact]
    public void Two_analysis_files_pair_whatever_their_names()
    {
        var comparison = Retest.Compare(
            new RetestSide("a.json", null, [Figures("bay3-before.wav", SurveyVerdict.Upgrade, DeviceType.B, "bay3-before.wav")]),
            new RetestSide("b.json", null, [Figures("bay3-after.wav", SurveyVerdict.Upgrade, DeviceType.B, "bay3-after.wav", worstA: 0.004)]));
        var change = Assert.Single(comparison.Circuits);
        Assert.Equal(RetestMatch.Single, change.Match);
        // 9.00 mA → 4.00 mA: a fall of 5.00 mA (subtraction, shown through CurrentText at 3 significant figures).
        Assert.Contains("worst-window RMS 9.00 mA → 4.00 mA (−5.00 mA)", change.Changes);
    }

    [Theory]
    [InlineData(SurveyVerdict.Upgrade, DeviceType.B, SurveyVerdict.Ok, DeviceType.B, RetestOutcome.Remedied)]
    [InlineData(SurveyVerdict.Ok, DeviceType.A, SurveyVerdict.Upgrade, DeviceType.B, RetestOutcome.Worse)]
    [InlineData(SurveyVerdict.Ok, DeviceType.A, SurveyVerdict.Ok, DeviceType.F, RetestOutcome.Worse)]
    [InlineData(SurveyVerdict.Ok, DeviceType.F, SurveyVerdict.Ok, DeviceType.A, RetestOutcome.Better)]
    [InlineData(SurveyVerdict.CannotTell, null, SurveyVerdict.Ok, DeviceType.A, RetestOutcome.Better)]
    [InlineData(SurveyVerdict.Ok, DeviceType.A, SurveyVerdict.Error, null, RetestOutcome.Worse)]
    [InlineData(SurveyVerdict.Ok, DeviceType.B, SurveyVerdict.Ok, null, RetestOutcome.Worse)]
    [InlineData(SurveyVerdict.Upgrade, DeviceType.B, SurveyVerdict.Upgrade, DeviceType.B, RetestOutcome.Unchanged)]
    public void The_verdict_decides_first_then_the_required_type(SurveyVerdict verdictBefore, DeviceType? before,
        SurveyVerdict verdictAfter, DeviceType? after, RetestOutcome expected)
    {
        // A required type that became undecided (the last case: minimum A after B before) is worse: less is known.
        var outcome = Retest.Outcome(Figures("C1", verdictBefore, before, "a.wav"), Figures("C1", verdictAfter, after, "a.wav"));
        Assert.Equal(expected, outcome);
    }

    [Theory]
    // An analysis file states the protection in full (installedProtection) and the type alone (installedType); an
    // older file has only the type. Both are read into the protection, once, where the file is read.
    [InlineData("\"installedType\": \"A\", \"installedProtection\": \"A+RDC-DD\"", DeviceType.A, DcDetection.RdcDd)]
    [InlineData("\"installedType\": \"F\", \"installedProtection\": \"F + charger DC detection\"", DeviceType.F, DcDetection.Charger)]
    [InlineData("\"installedType\": \"B+\"", DeviceType.BPlus, DcDetection.None)]
    public void An_analysis_file_states_its_protection_in_full(string installed, DeviceType type, DcDetection dc)
    {
        var side = Retest.Load(AnalysisFile(installed));
        Assert.Equal(new InstalledProtection(type, dc), Assert.Single(side.Circuits).InstalledType);
    }

    [Fact]
    public void A_protection_no_tool_writes_is_refused_with_the_file_and_the_key()
    {
        var file = AnalysisFile("\"installedType\": \"A\", \"installedProtection\": \"A+RCBO\"");
        var e = Assert.Throws<UserInputException>(() => Retest.Load(file));
        Assert.Equal($"{file}: assessment.installedProtection \"A+RCBO\" is not an installed protection (AC, A, F, B or B+, optionally with +RDC-DD or + charger DC detection)", e.Message);
    }

    /// <summary>The least analysis JSON the comparison reads, with <paramref name="installed"/> in its assessment.</summary>
    private static string AnalysisFile(string installed)
    {
        var path = Path.Combine(Directory.CreateTempSubdirectory("wavecheck-retest-").FullName, "bay.json");
        File.WriteAllText(path, $$"""
            { "schema": "wavecheck.analysis/1", "capture": { "filePath": "bay.wav" }, "summary": { "rmsA": 0.004 },
              "components": { "smoothDcMaxA": 0.001, "above1kHzRmsA": 0.0 },
              "assessment": { {{installed}}, "ratedResidualCurrentA": 0.03, "requiredType": "A", "installedAdequate": true } }
            """);
        return path;
    }
}
