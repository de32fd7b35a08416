using WaveCheck.Core.Assessment;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// The leakage split through the whole streaming analysis: a synthesized supply voltage carried beside the residual
/// current of known R ∥ C paths, each checked within 1 % of the closed form I = V(1/R + jωC) (Ohm's law and the
/// capacitor's admittance, REFERENCE.md "Insulation").
/// </summary>
public class LeakageAnalysisTests
{
    private static AnalysisResult Run(SupplyVoltage supply, IReadOnlyList<WaveformComponent> current, double durationS = 3,
        double rateHz = 20_000, AssessmentOptions? assessment = null)
    {
        using var source = new SynthCaptureSource(current, rateHz, durationS, supply: supply);
        return Evaluation.Run(source, new AnalysisOptions(), assessment ?? new AssessmentOptions()).Analysis;
    }

    private static void Within1Percent(double expected, double actual, string what) =>
        Assert.True(Math.Abs(actual - expected) <= 0.01 * Math.Abs(expected), $"{what}: expected {expected:G6}, got {actual:G6}");

    [Theory]
    [InlineData(50.0)]
    [InlineData(60.0)]
    public void SinglePhaseSineVoltageAcrossRAndCGivesRAndC(double mainsHz)
    {
        const double r = 330e3, c = 47e-9;
        var supply = new SupplyVoltage(230, mainsHz, []);
        var split = Run(supply, [new RcLeakageComponent(supply, 0, r, c), new NoiseComponent(0.00002, 3)]).LeakageSplit!;

        Assert.Equal("single-phase", split.Kind);
        Assert.Equal(0, split.WindowsWithoutVoltage);
        Within1Percent(230 / r, split.ResistiveA.Mean, "I_R");
        Within1Percent(230 * 2 * Math.PI * mainsHz * c, split.CapacitiveA.Mean, "I_C");
        Within1Percent(r, split.ResistanceOhm!.Value, "R");
        Within1Percent(c, split.CapacitanceF.Mean, "C");
        Within1Percent(mainsHz, split.FrequencyHz, "f");
        // A sine voltage: only the fundamental carries the fit, which therefore tests nothing.
        Assert.Equal([1], split.Fit!.Orders);
        Assert.Null(split.Fit.SimpleRc);
    }

    [Theory]
    [InlineData(50.0)]
    [InlineData(60.0)]
    public void VoltageHarmonicsAreFittedAndTheRcModelHolds(double mainsHz)
    {
        const double r = 150e3, c = 100e-9;
        var supply = new SupplyVoltage(230, mainsHz, [(3, 0.03, 20), (5, 0.04, -60), (7, 0.02, 110)]);
        var split = Run(supply, [new RcLeakageComponent(supply, 0, r, c)]).LeakageSplit!;

        // The fundamental split is unchanged by the harmonics (each lies in its own bin of the synchronised window).
        Within1Percent(230 / r, split.ResistiveA.Mean, "I_R");
        Within1Percent(230 * 2 * Math.PI * mainsHz * c, split.CapacitiveA.Mean, "I_C");
        var fit = split.Fit!;
        Assert.Equal([1, 3, 5, 7], fit.Orders);
        Within1Percent(r, fit.ResistanceOhm!.Value, "fitted R");
        Within1Percent(c, fit.CapacitanceF, "fitted C");
        Assert.True(fit.Residual.Max < 0.01, $"residual {fit.Residual.Max}");
        Assert.True(fit.SimpleRc);
        Assert.Equal(Limits.LeakageFitResidualLimit, fit.ResidualLimit);
    }

    [Fact]
    public void AHarmonicCurrentOfTheLoadsOwnIsNotASimpleRcLeakage()
    {
        // A rectifier's own 150 Hz leakage beside an R ∥ C path: the 3rd order no longer follows V_3 (G + 3jωC).
        var supply = new SupplyVoltage(230, 50, [(3, 0.03, 0), (5, 0.03, 0)]);
        var split = Run(supply, [new RcLeakageComponent(supply, 0, 400e3, 50e-9), new SineComponent(0.002, 150, 40)]).LeakageSplit!;

        Assert.False(split.Fit!.SimpleRc);
        Assert.True(split.Fit.Residual.P95 > Limits.LeakageFitResidualLimit);
        Assert.Contains(split.Notes, n => n.StartsWith("Not a simple R-C leakage", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData(50.0, 1, 180e3, 0.0)]
    [InlineData(60.0, 2, null, 60e-9)]
    [InlineData(50.0, 0, 250e3, 20e-9)]
    public void ThreePhaseAsymmetryIsLocatedOnItsPhase(double mainsHz, int phase, double? r, double extraC)
    {
        // Balanced 150 nF to earth on every phase (cancels), plus the asymmetry on one phase.
        var supply = new SupplyVoltage(230, mainsHz, [], Phases: 3);
        List<WaveformComponent> parts = [.. Enumerable.Range(0, 3).Select(p => new RcLeakageComponent(supply, p, null, 150e-9))];
        parts.Add(new RcLeakageComponent(supply, phase, r, extraC));
        var split = Run(supply, parts).LeakageSplit!;

        Assert.Equal("three-phase", split.Kind);
        Assert.Equal(["L1", "L2", "L3"], split.VoltageChannels);
        var location = split.Location!;
        var expectedIr = r is { } ohms ? 230 / ohms : 0;
        var expectedIc = 230 * 2 * Math.PI * mainsHz * extraC;
        Assert.Equal($"L{phase + 1}", location.DominantPhase);
        Assert.Equal(expectedIc > expectedIr ? "capacitive" : "resistive", location.DominantKind);
        Assert.Equal(1.0, location.DominantShare);
        var resistive = location.Directions.Single(d => d.Phase == $"L{phase + 1}" && d.Kind == "resistive");
        var capacitive = location.Directions.Single(d => d.Phase == $"L{phase + 1}" && d.Kind == "capacitive");
        if (r is { } rr)
        {
            Within1Percent(rr, resistive.ResistanceOhm!.Value, "R on the phase");
        }

        if (extraC > 0)
        {
            Within1Percent(extraC, capacitive.CapacitanceF!.Value, "C on the phase");
        }

        // The other phases carry nothing (within 1 % of the asymmetry's current).
        var asymmetry = Math.Max(expectedIr, expectedIc);
        foreach (var d in location.Directions.Where(d => d.Phase != $"L{phase + 1}"))
        {
            Assert.True(d.MeanA < 0.01 * asymmetry, $"{d.Phase} {d.Kind}: {d.MeanA}");
        }

        Assert.Contains("balanced capacitances", location.Assumption, StringComparison.Ordinal);
    }

    [Fact]
    public void AResistanceBelowTheMinimumIsFlaggedAsAPossibleInsulationFault()
    {
        // 230 V over 120 kΩ draws 1.9 mA in phase: far below the 1 MΩ (0.23 mA) of IEC 60364-6 (from memory).
        var supply = new SupplyVoltage(230, 50, []);
        var split = Run(supply, [new RcLeakageComponent(supply, 0, 120e3, 30e-9)]).LeakageSplit!;
        Assert.Equal(InsulationState.BelowMinimum, split.Insulation!.State);
        Assert.Contains("insulation resistance tester", split.Insulation.Message, StringComparison.Ordinal);
        Assert.Contains("qualified person", split.Insulation.Message, StringComparison.Ordinal);
        // The short form keeps the finding, its figure against the minimum and what to do; only the reasoning goes.
        Assert.StartsWith("POSSIBLE INSULATION FAULT: leakage resistance 12", split.Insulation.Summary, StringComparison.Ordinal);
        Assert.Contains("1 MΩ minimum of IEC 60364-6", split.Insulation.Summary, StringComparison.Ordinal);
        Assert.Contains("insulation resistance tester", split.Insulation.Summary, StringComparison.Ordinal);
        Assert.True(split.Insulation.Summary.Length < split.Insulation.Message.Length);
    }

    [Fact]
    public void AFilterCapacitanceAloneIsNoInsulationFinding()
    {
        // 22 nF alone: 1.6 mA capacitive, no resistive part; within 0.1 mA + 2 % + 2° of phase it stays below 0.23 mA.
        var supply = new SupplyVoltage(230, 50, []);
        var split = Run(supply, [new RcLeakageComponent(supply, 0, null, 22e-9)]).LeakageSplit!;
        Assert.Equal(InsulationState.AboveMinimum, split.Insulation!.State);
        Assert.True(Math.Abs(split.ResistiveA.Mean) < 1e-6);
    }

    [Fact]
    public void AResistanceNearTheMinimumIsResolvedToTheSafeSide()
    {
        // 1.1 MΩ: 0.21 mA in phase, within the 0.1 mA offset of the default accuracy of the 0.23 mA limit.
        var supply = new SupplyVoltage(230, 50, []);
        var split = Run(supply, [new RcLeakageComponent(supply, 0, 1.1e6, 10e-9)]).LeakageSplit!;
        Assert.Equal(InsulationState.AtLimit, split.Insulation!.State);
        Assert.Contains("possible insulation fault", split.Insulation.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void AReversedClampIsPointedOut()
    {
        // A negative resistance is no leakage: the current is the negative of a real R ∥ C path's.
        var supply = new SupplyVoltage(230, 50, []);
        var split = Run(supply, [new RcLeakageComponent(supply, 0, -200e3, -30e-9)]).LeakageSplit!;
        Assert.True(split.ResistiveA.Mean < 0);
        Assert.Contains(split.Notes, n => n.Contains("clamp's orientation", StringComparison.Ordinal));
    }

    [Fact]
    public void AVoltageChannelWithoutVoltageSplitsNothingAndSaysSo()
    {
        var supply = new SupplyVoltage(5, 50, []);
        var split = Run(supply, [new SineComponent(0.003, 50)]).LeakageSplit!;
        Assert.Equal(0, split.Windows);
        Assert.True(split.WindowsWithoutVoltage > 0);
        Assert.Equal(InsulationState.NotResolved, split.Insulation!.State);
        Assert.Contains(split.Notes, n => n.Contains("check that the voltage channel is connected", StringComparison.Ordinal));
    }

    [Fact]
    public void ACaptureWithoutAVoltageChannelHasNoSplitInItsJson()
    {
        using var source = new SynthCaptureSource([new SineComponent(0.003, 50)], 20_000, 3);
        var result = Evaluation.Run(source, new AnalysisOptions(), new AssessmentOptions()).Analysis;
        Assert.Null(result.LeakageSplit);
        var json = ResultJson.Serialize(result);
        Assert.DoesNotContain("leakageSplit", json, StringComparison.Ordinal);
        Assert.DoesNotContain("\"voltage\"", json, StringComparison.Ordinal);
    }

    [Fact]
    public void TheSplitIsTheSameWhateverTheBlockSizeAndWorkerCount()
    {
        // Streaming: the voltage travels in the same windows as the current, whatever the cut of the blocks.
        var supply = new SupplyVoltage(230, 50, [(5, 0.03, 0)]);
        LeakageSplitResult Split(int workers, int block)
        {
            using var source = new SynthCaptureSource([new RcLeakageComponent(supply, 0, 200e3, 80e-9), new NoiseComponent(0.0001, 9)], 20_000, 5, supply: supply);
            var analysis = new CaptureAnalysis(source.Info, new AnalysisOptions { WorkerCount = workers });
            var b = source.CreateBlock(block);
            while (source.Read(b))
            {
                analysis.Push(b);
            }

            return analysis.Complete(source.Info).LeakageSplit!;
        }

        var one = Split(1, 65536);
        var other = Split(3, 997);
        Assert.Equal(one.ResistiveA, other.ResistiveA);
        Assert.Equal(one.CapacitiveA, other.CapacitiveA);
        Assert.Equal(one.Fit!.Residual, other.Fit!.Residual);
        Assert.Equal(one.Windows, other.Windows);
        Assert.True(one.Trend.Count == one.Windows, $"{one.Trend.Count} trend points for {one.Windows} windows");
    }

    [Fact]
    public void PushingBareCurrentIntoACaptureWithVoltageIsRefused()
    {
        var supply = new SupplyVoltage(230, 50, []);
        using var source = new SynthCaptureSource([new SineComponent(0.003, 50)], 20_000, 3, supply: supply);
        var analysis = new CaptureAnalysis(source.Info, new AnalysisOptions());
        Assert.Throws<InvalidOperationException>(() => analysis.Push(new double[10]));
    }
}
