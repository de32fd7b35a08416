using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests;

/// <summary>
/// The whole job on the test currents of the standards: synthesized, measured and judged. Each waveform must get
/// the type its standard assigns it (IEC 60755 family as taken into IEC 60364-5-53:2015 §531.3.3; REFERENCE.md,
/// "Device types"): the least capable type whose test currents include it.
/// </summary>
public class EvaluationTests
{
    private static Evaluation Evaluate(string[] parts, double mainsHz = 50, double rateHz = 50_000,
        SensorCoupling sensor = SensorCoupling.Dc, AssessmentOptions? assessment = null, double? givenMainsHz = null)
    {
        var components = parts.SelectMany(p => SynthesisSpec.Parse(p, mainsHz)).ToList();
        // A little noise, as on any real recording: 20 µA rms, far below every significance threshold.
        components.Add(new NoiseComponent(20e-6, 3));
        using var source = new SynthCaptureSource(components, rateHz, 1.0, sensor);
        return Evaluation.Run(source, new AnalysisOptions { MainsHz = givenMainsHz }, assessment ?? new AssessmentOptions());
    }

    [Theory]
    // IEC 61008-1: type AC is tested with sinusoidal AC residual current.
    [InlineData(DeviceType.AC, new[] { "sine:rms=20mA" })]
    // IEC 61008-1 / 61009-1: type A adds pulsating DC at current-delay angles 0°, 90°, 135°.
    [InlineData(DeviceType.A, new[] { "halfwave:peak=30mA,angle=0" })]
    [InlineData(DeviceType.A, new[] { "halfwave:peak=30mA,angle=90" })]
    [InlineData(DeviceType.A, new[] { "halfwave:peak=30mA,angle=135" })]
    [InlineData(DeviceType.A, new[] { "halfwave:peak=30mA,polarity=neg" })]
    // Type A still trips with up to 6 mA smooth DC superimposed, type F with up to 10 mA (IEC 62423): tolerance, not
    // fitness. A circuit that itself produces smooth DC can produce a smooth DC fault, which only type B detects
    // (REFERENCE.md "tolerance is not fitness"; IEC 60364-5-53 §531.3.3).
    [InlineData(DeviceType.B, new[] { "halfwave:peak=30mA", "dc:level=4mA" })]
    [InlineData(DeviceType.B, new[] { "halfwave:peak=30mA", "dc:level=8mA" })]
    [InlineData(DeviceType.B, new[] { "halfwave:peak=30mA", "dc:level=14mA" })]
    // IEC 62423: type F's composite test current of 10 Hz, 50 Hz and 1 kHz components.
    [InlineData(DeviceType.F, new[] { "composite:rms=20mA,motor=10Hz,switch=1kHz" })]
    // IEC 62423: type B adds smooth DC and rectified current from two or more phases.
    [InlineData(DeviceType.B, new[] { "dc:level=20mA" })]
    [InlineData(DeviceType.B, new[] { "dc:level=-20mA" })]
    [InlineData(DeviceType.B, new[] { "sixpulse:mean=20mA" })]
    // Rectified current from two or more phases never rests at zero for 150° (IEC 61008-1 definition of pulsating
    // DC, from memory): type B at any level, below 6 mA too (IEC 62423).
    [InlineData(DeviceType.B, new[] { "rectified:mean=2mA,pulses=2" })]
    [InlineData(DeviceType.B, new[] { "rectified:mean=2mA,pulses=3" })]
    [InlineData(DeviceType.B, new[] { "rectified:mean=2mA,pulses=6" })]
    [InlineData(DeviceType.B, new[] { "rectified:mean=5mA,pulses=3" })]
    [InlineData(DeviceType.B, new[] { "rectified:mean=8mA,pulses=3" })]
    [InlineData(DeviceType.B, new[] { "rectified:mean=50mA,pulses=6" })]
    [InlineData(DeviceType.B, new[] { "rectified:mean=3mA,pulses=3", "sine:rms=10mA" })]
    [InlineData(DeviceType.B, new[] { "rectified:mean=3mA,pulses=6", "sine:rms=20mA" })]
    // Sinusoidal AC up to 1 kHz at a frequency other than mains is type B's (IEC 62423), with or without a motor
    // frequency beside it: adding a component never weakens the verdict.
    [InlineData(DeviceType.B, new[] { "sine:rms=10mA,freq=150Hz", "sine:rms=2mA" })]
    [InlineData(DeviceType.B, new[] { "sine:rms=10mA,freq=150Hz", "sine:rms=2mA", "sine:rms=3mA,freq=23Hz" })]
    // Extended-frequency type B (B+, DIN VDE 0664-400): tripping defined up to 20 kHz; switching leakage at 16 kHz.
    [InlineData(DeviceType.BPlus, new[] { "sine:rms=5mA", "switching:rms=10mA,freq=16kHz" })]
    public void Each_test_current_of_the_standards_gets_its_type(DeviceType expected, string[] parts)
    {
        var result = Evaluate(parts);
        Assert.True(expected == result.Assessment.RequiredType,
            $"{string.Join(" + ", parts)}: expected {expected.ToTradeName()}, got {result.Assessment.RequiredType?.ToTradeName() ?? "null"}: {result.Assessment.Headline}");
    }

    [Theory]
    [InlineData(DeviceType.AC, new[] { "sine:rms=20mA" })]
    [InlineData(DeviceType.A, new[] { "halfwave:peak=30mA,angle=90" })]
    // A mains sine on top of a two-pulse current stays below half its peak here: a two-pulse current less an in-phase
    // sine of its own peak is a half-wave, pulsating DC by definition (closed form |sin θ| − sin θ).
    [InlineData(DeviceType.B, new[] { "rectified:mean=4mA,pulses=3", "sine:rms=5mA" })]
    [InlineData(DeviceType.B, new[] { "rectified:mean=4mA,pulses=2", "sine:rms=2mA" })]
    [InlineData(DeviceType.B, new[] { "rectified:mean=4mA,pulses=6", "sine:rms=5mA" })]
    public void The_same_holds_at_60_Hz(DeviceType expected, string[] parts)
    {
        // IEC 61000-4-7: 12-cycle windows at 60 Hz; the verdict must not depend on the mains frequency.
        var result = Evaluate(parts, mainsHz: 60);
        Assert.Equal(60, result.Analysis.Mains.FrequencyHz, 0.01);
        Assert.Equal(12, result.Analysis.Windows.CyclesPerWindow);
        Assert.Equal(expected, result.Assessment.RequiredType);
    }

    [Fact]
    public void Six_pulse_current_at_60_Hz_has_no_mains_content_and_needs_the_mains_given()
    {
        // A six-pulse bridge's ripple is at 6 × mains with no fundamental (closed form of the bridge): auto detection
        // falls back to 50 Hz and says so; with --mains 60 the windows are 12 cycles and the verdict is the same.
        var auto = Evaluate(["sixpulse:mean=20mA"], mainsHz: 60);
        Assert.Equal("fallback", auto.Analysis.Mains.Source);
        Assert.Equal(DeviceType.B, auto.Assessment.RequiredType);
        var given = Evaluate(["sixpulse:mean=20mA"], mainsHz: 60, givenMainsHz: 60);
        Assert.Equal(12, given.Analysis.Windows.CyclesPerWindow);
        Assert.Equal(DeviceType.B, given.Assessment.RequiredType);
    }

    [Theory]
    [InlineData(12.0, 0.0)]
    [InlineData(17.0, 0.003)]
    [InlineData(37.0, 0.0)]
    public void A_motor_frequency_that_does_not_fit_the_window_is_not_smooth_dc(double motorHz, double dcA)
    {
        // Closed form: 2.4 cycles of a 12 Hz sine in a 200 ms window average to 12 % of its peak; that must not read
        // as smooth DC. The converter's composite current needs type F (IEC 62423), and the true DC is recovered
        // within 0.2 mA (a fifth of the 1 mA significance floor).
        List<string> parts = [$"composite:rms=12mA,motor={motorHz}Hz"];
        if (dcA != 0)
        {
            parts.Add($"dc:level={dcA * 1000}mA");
        }

        var result = Evaluate([.. parts]);
        // With real DC beside it, the circuit produces DC residual current: type B (REFERENCE.md, "tolerance is not
        // fitness").
        Assert.Equal(dcA == 0 ? DeviceType.F : DeviceType.B, result.Assessment.RequiredType);
        Assert.Equal(dcA, result.Analysis.Components.SmoothDcMaxA, 0.0002);

        // Nor may it drag the mains tracking: the synthesized mains is exactly 50 Hz; the windows must stay within
        // 0.05 Hz of it (0.1 % synchronisation, about the IEC 61000-4-7 window tolerance).
        Assert.InRange(result.Analysis.Mains.MinHz, 49.95, 50.05);
        Assert.InRange(result.Analysis.Mains.MaxHz, 49.95, 50.05);
    }

    [Fact]
    public void An_ac_coupled_sensor_leaves_the_dc_verdicts_open()
    {
        // An AC-coupled clamp cannot see smooth DC (common practice, no source): with it declared, the smooth-DC
        // test currents cannot decide between F and B, and the caution says what to measure instead.
        var result = Evaluate(["sine:rms=10mA"], sensor: SensorCoupling.Ac);
        Assert.Null(result.Assessment.RequiredType);
        Assert.Contains(result.Assessment.Types, t => t.Type == DeviceType.B && t.Suitable != false);
        Assert.Contains(result.Assessment.Cautions, c => c.Contains("DC", StringComparison.Ordinal));
    }

    [Fact]
    public void A_low_sample_rate_leaves_the_verdict_open_below_b_plus()
    {
        // Nyquist: at 10 kS/s nothing above 5 kHz is seen, so whether content up to 20 kHz asks for B+ cannot be
        // judged (REFERENCE.md B+): the verdict is "at least AC", every type below B+ open, B+ (defined to 20 kHz)
        // suitable.
        var result = Evaluate(["sine:rms=10mA"], rateHz: 10_000);
        Assert.Null(result.Assessment.RequiredType);
        Assert.Equal(DeviceType.AC, result.Assessment.MinimumType);
        Assert.Null(result.Assessment.Types.Single(t => t.Type == DeviceType.B).Suitable);
        Assert.True(result.Assessment.Types.Single(t => t.Type == DeviceType.BPlus).Suitable);
        Assert.Contains("at least type AC", result.Assessment.Headline, StringComparison.Ordinal);
    }

    [Fact]
    public void A_flat_capture_says_so_in_its_cautions()
    {
        // A dead channel must not pass silently as "type AC sufficient" (common practice, no source: check the chain).
        using var source = new SynthCaptureSource([new SmoothDcComponent(0)], 50_000, 1.0);
        var result = Evaluation.Run(source, new AnalysisOptions(), new AssessmentOptions());
        Assert.Contains(result.Analysis.Warnings, w => w.Code == "flat");
        Assert.Contains(result.Assessment.Cautions, c => c.Contains("flat", StringComparison.Ordinal));
    }

    [Fact]
    public void Touch_current_rides_on_the_same_pass()
    {
        // IEC 60990 unweighted network under current drive reads the injected current: a 1 mA rms 50 Hz sine reads
        // 1 mA rms (closed form; see TouchCurrentNetworks), within 1 %.
        var result = Evaluate(["sine:rms=1mA"]);
        Assert.NotNull(result.Analysis.TouchCurrent);
        Assert.Equal(0.001, result.Analysis.TouchCurrent!.UnweightedRmsA, 0.001 * 0.01);
        Assert.NotNull(result.Assessment.TouchCurrent);
    }

    [Fact]
    public void A_blinded_type_a_device_is_said_so()
    {
        // REFERENCE.md "blinding": smooth DC above 6 mA pre-magnetises a type A core (IEC 62955 Note 2).
        var result = Evaluate(["sine:rms=5mA", "dc:level=9mA"], assessment: new AssessmentOptions { InstalledType = DeviceType.A });
        Assert.True(result.Assessment.Blinding.Blinded);
        Assert.False(result.Assessment.InstalledAdequate);
    }

    [Fact]
    public void A_load_current_taken_for_the_residual_current_is_warned_about_first()
    {
        // Engineering choice (Limits.ImplausibleResidualMainsRmsA, 1 A): 10 A rms at 50 Hz is a phase conductor's
        // load current, not a residual current any RCD in use would hold (REFERENCE.md: ratings to 1 A, practice).
        var load = Evaluate(["sine:rms=10A", "dc:level=2mA"]);
        var first = load.Analysis.Warnings[0];
        Assert.Equal(Evaluation.ImplausibleResidualCode, first.Code);
        Assert.Contains("10000 mA at mains frequency", first.Message, StringComparison.Ordinal);
        Assert.Contains(load.Assessment.Cautions, c => c.Contains("not a residual current", StringComparison.Ordinal));

        // Just below the threshold (0.9 A rms): a large residual current, but no such warning.
        var large = Evaluate(["sine:rms=0.9A"]);
        Assert.DoesNotContain(large.Analysis.Warnings, w => w.Code == Evaluation.ImplausibleResidualCode);
    }

    [Theory]
    // REFERENCE.md "rated IΔn values in use": 10, 30, 100, 300, 500 mA (1 A for some), practice; 6 mA from memory.
    [InlineData(0.030, false)]
    [InlineData(0.3, false)]
    [InlineData(1.0, false)]
    [InlineData(0.006, false)]
    [InlineData(0.025, true)]
    [InlineData(0.00003, true)]   // "30" read as µA-scale slip: 0.03 mA
    [InlineData(30.0, true)]      // "30" read as amperes
    public void A_rating_off_the_ones_in_use_is_cautioned_about(double ratedA, bool cautioned)
    {
        var result = Evaluate(["sine:rms=2mA"], assessment: new AssessmentOptions { RatedResidualCurrentA = ratedA });
        Assert.Equal(cautioned, !Limits.IsRatingInUse(ratedA));
        Assert.Equal(cautioned, result.Assessment.Cautions.Any(c => c.StartsWith("IΔn ", StringComparison.Ordinal) && c.Contains("not a rating in use", StringComparison.Ordinal)));
    }
}
