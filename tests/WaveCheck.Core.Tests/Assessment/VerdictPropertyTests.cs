using CsCheck;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// Properties of the required type over generated mixtures of the standards' test currents (IEC 61008-1 half-waves,
/// IEC 62423 smooth DC, multi-pulse rectified and composite currents) and realistic leakage (mains capacitive
/// leakage, motor frequencies, harmonics, switching leakage). REFERENCE.md "required type": the least type that
/// detects every class of residual current the circuit can produce; adding a component can never lower it. Fixed
/// seeds and small budgets keep the suite fast; a failure prints its seed and the shrunk mixture, which then goes
/// into an ordinary regression test.
/// </summary>
public class VerdictPropertyTests
{
    private const double MainsHz = 50;
    private const double RateHz = 50_000;
    // 80 mixtures per property in CI (about 10 s on 2 cores); set WAVECHECK_PROPERTY_ITERATIONS=600 (and change the
    // seeds) for a wider search before a release: 600 each with three seed sets found the counterexamples now kept
    // in RequiredTypeTests and SubMainsDcRegressionTests.
    private static readonly int Iterations =
        int.TryParse(Environment.GetEnvironmentVariable("WAVECHECK_PROPERTY_ITERATIONS"), out var n) && n > 0 ? n : 80;

    /// <summary>A generated part: a description for the failure message and a factory at a scale and polarity.</summary>
    public enum PartKind
    {
        MainsSine,
        HalfWave,
        Rectified,
        SmoothDc,
        Motor,
        Harmonic,
        Switching,
    }

    public sealed record Part(PartKind Kind, string Name, Func<double, double, WaveformComponent> Make, double TwoPulsePeakA = 0)
    {
        public override string ToString() => Name;
    }

    // Polarity is shared by the DC-bearing parts of one mixture (sign), so DC terms add rather than cancel: two
    // opposite DC sources cancelling is a different circuit, not "content added".
    private static readonly Gen<Part> PartGen = Gen.OneOf(
        Gen.Select(Gen.Double[0.0005, 0.020], Gen.Double[0, 360]).Select(
            (a, ph) => new Part(PartKind.MainsSine, $"mains sine {a * 1e3:0.###} mA @{ph:0}°", (k, _) => new SineComponent(k * a, MainsHz, ph))),
        Gen.Select(Gen.Double[0.002, 0.040], Gen.OneOf(0.0, 45.0, 90.0, 135.0)).Select(
            (p, al) => new Part(PartKind.HalfWave, $"half-wave {p * 1e3:0.###} mA pk α={al}", (k, s) => new HalfWaveComponent(k * p, MainsHz, al, s < 0))),
        Gen.Select(Gen.Double[0.001, 0.030], Gen.OneOf(2, 3, 6)).Select(
            (m, n) => new Part(PartKind.Rectified, $"{n}-pulse {m * 1e3:0.###} mA", (k, s) => new RectifiedComponent(s * k * m, MainsHz, n),
                n == 2 ? m * Math.PI / 2 : 0)),
        Gen.Double[0.0015, 0.020].Select(
            d => new Part(PartKind.SmoothDc, $"smooth DC {d * 1e3:0.###} mA", (k, s) => new SmoothDcComponent(s * k * d))),
        Gen.Select(Gen.Double[0.001, 0.010], Gen.Double[5, 40]).Select(
            (a, f) => new Part(PartKind.Motor, $"motor {a * 1e3:0.###} mA @{f:0.#} Hz", (k, _) => new SineComponent(k * a, f, 17))),
        Gen.Select(Gen.Double[0.001, 0.010], Gen.Int[2, 19]).Select(
            (a, n) => new Part(PartKind.Harmonic, $"harmonic {n} {a * 1e3:0.###} mA", (k, _) => new SineComponent(k * a, n * MainsHz, 40))),
        Gen.Select(Gen.Double[0.001, 0.010], Gen.Double[2_000, 10_000]).Select(
            (a, f) => new Part(PartKind.Switching, $"switching {a * 1e3:0.###} mA @{f:0} Hz", (k, _) => new SwitchingComponent(k * a, f))));

    // One motor frequency per mixture: the sub-mains DC estimate fits one motor tone per window (SubMainsDc), so two
    // drives at once can read as a little DC: a stronger verdict, never a weaker one (docs/methods.md I.4).
    private static readonly Gen<(Part[] Parts, double Sign)> MixtureGen =
        Gen.Select(PartGen.Array[1, 3], Gen.OneOf(1.0, -1.0)).Where(m => m.Item1.Count(IsMotor) <= 1);

    private static bool IsMotor(Part p) => p.Kind == PartKind.Motor;

    private static DeviceType Level(IEnumerable<Part> parts, double sign, double scale = 1, int shiftSamples = 0,
        bool negate = false, double rateHz = RateHz)
    {
        return Assess(parts, sign, scale, shiftSamples, negate, rateHz).MinimumType;
    }

    private static WaveCheck.Core.Model.AssessmentResult Assess(IEnumerable<Part> parts, double sign, double scale = 1, int shiftSamples = 0,
        bool negate = false, double rateHz = RateHz)
    {
        var components = parts.Select(p => (WaveformComponent)new Shifted(p.Make(scale, negate ? -sign : sign), shiftSamples)).ToList();
        components.Add(new NoiseComponent(20e-6, 9));
        using var source = new SynthCaptureSource(components, rateHz, 1.0, WaveCheck.Core.Capture.SensorCoupling.Dc);
        return Evaluation.Run(source, new AnalysisOptions { MainsHz = MainsHz, WorkerCount = 1 }, new AssessmentOptions()).Assessment;
    }

    /// <summary>Same level, or every class whose presence differs lies within 25 % of its threshold in both runs.</summary>
    private static bool SameAwayFromLimits(WaveCheck.Core.Model.AssessmentResult a, WaveCheck.Core.Model.AssessmentResult b)
    {
        if (a.MinimumType == b.MinimumType)
        {
            return true;
        }

        foreach (var ca in a.Classes)
        {
            var cb = b.Classes.FirstOrDefault(c => c.Class == ca.Class);
            if (cb is null || Present(ca) == Present(cb))
            {
                continue;
            }

            if (!(NearLimit(ca) && NearLimit(cb)))
            {
                return false;
            }
        }

        return true;

        static bool Present(WaveCheck.Core.Model.ClassResult c) => c.Presence is ClassPresence.Present or ClassPresence.AtLimit;
        static bool NearLimit(WaveCheck.Core.Model.ClassResult c) =>
            c is { FigureA: { } f, ThresholdA: { } t } && Math.Abs(f) >= 0.75 * t && Math.Abs(f) <= 1.25 * t;
    }

    [Fact]
    public void Adding_a_component_never_lowers_the_required_type()
    {
        // REFERENCE.md "required type" (derived). Exception by definition, kept out of the generator's reach: a
        // two-pulse current less an in-phase mains sine of its own peak is a half-wave (|sin θ| − sin θ), pulsating DC,
        // so a mains sine added to a two-pulse current stays below half its peak (docs/methods.md II.2).
        Gen.Select(MixtureGen, PartGen).Where(t => Admissible(t.Item1.Parts, t.Item2)).Sample(
            (mixture, added) =>
            {
                var before = Level(mixture.Parts, mixture.Sign);
                var after = Level([.. mixture.Parts, added], mixture.Sign);
                Assert.True(after >= before, $"adding {added.Name} lowered the required type from {before.ToTradeName()} to {after.ToTradeName()}");
            },
            iter: Iterations, threads: 1, seed: "0000000000711",
            print: t => $"{string.Join(" + ", t.Item1.Parts.Select(p => p.Name))} (sign {t.Item1.Sign}) then + {t.Item2.Name}");
    }

    [Fact]
    public void Scaling_the_current_up_never_lowers_the_required_type()
    {
        // Thresholds depend only on IΔn, so k ≥ 1 can only lift figures over them (docs/methods.md II.2).
        Gen.Select(MixtureGen, Gen.Double[1, 5]).Sample(
            (mixture, k) =>
            {
                var before = Level(mixture.Parts, mixture.Sign);
                var after = Level(mixture.Parts, mixture.Sign, k);
                Assert.True(after >= before, $"scaling by {k:0.###} lowered the required type from {before.ToTradeName()} to {after.ToTradeName()}");
            },
            iter: Iterations, threads: 1, seed: "0000000000712",
            print: t => $"{string.Join(" + ", t.Item1.Parts.Select(p => p.Name))} × {t.Item2:0.###}");
    }

    [Fact]
    public void Time_shift_polarity_and_a_higher_sample_rate_change_nothing()
    {
        // The standards treat both polarities of DC alike (IEC 62423: "smooth DC of either polarity"; half-waves of
        // either polarity, IEC 61008-1); a recording that starts later or samples faster but sees nothing new must
        // give the same verdict (nothing generated lies above 20 kHz). Within 25 % of a threshold a class may come
        // out either way: where windows fall on a slow motor cycle moves a per-window figure by a little (engineering
        // tolerance of this property, not of the verdict, which resolves figures at the limit to the safe side).
        Gen.Select(MixtureGen, Gen.Int[1, 999]).Sample(
            (mixture, shift) =>
            {
                var reference = Assess(mixture.Parts, mixture.Sign);
                Assert.True(SameAwayFromLimits(reference, Assess(mixture.Parts, mixture.Sign, shiftSamples: shift * 7)), "time shift");
                Assert.True(SameAwayFromLimits(reference, Assess(mixture.Parts, mixture.Sign, negate: true)), "polarity flip");
                Assert.True(SameAwayFromLimits(reference, Assess(mixture.Parts, mixture.Sign, rateHz: 2 * RateHz)), "double sample rate");
            },
            iter: Iterations / 3, threads: 1, seed: "0000000000713",
            print: t => $"{string.Join(" + ", t.Item1.Parts.Select(p => p.Name))} shift {t.Item2 * 7}");
    }

    private static bool Admissible(Part[] parts, Part added)
    {
        if (IsMotor(added) && parts.Any(IsMotor))
        {
            return false;
        }

        // One mains-frequency leakage per circuit: two mains sines of opposite phase cancel, a smaller current rather
        // than content added.
        if (added.Kind == PartKind.MainsSine && parts.Any(p => p.Kind == PartKind.MainsSine))
        {
            return false;
        }

        var twoPulsePeak = parts.Sum(p => p.TwoPulsePeakA);
        return !(twoPulsePeak > 0 && added.Kind == PartKind.MainsSine
            && SinePeak(added) > 0.5 * twoPulsePeak);
    }

    private static double SinePeak(Part sine)
    {
        // The peak of the generated sine, measured over one mains cycle (1000 samples at 50 kS/s).
        var component = sine.Make(1, 1);
        var peak = 0.0;
        Span<double> buffer = new double[1000];
        component.AddTo(0, 50_000, buffer);
        foreach (var x in buffer)
        {
            peak = Math.Max(peak, Math.Abs(x));
        }

        return peak;
    }

    /// <summary>A component started <c>offset</c> samples into its own waveform: the same current recorded later.</summary>
    private sealed class Shifted(WaveformComponent inner, int offset) : WaveformComponent
    {
        public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA) =>
            inner.AddTo(startSample + offset, sampleRateHz, destinationA);

        public override string Describe() => inner.Describe();
    }
}
