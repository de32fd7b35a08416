using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// The classes of residual current read from a capture's figures (ClassDetector, through
/// <see cref="DeviceTypeAssessor"/>): each class's presence, the figure it was judged on, and the reason it gives.
/// Figures are built as an ideal analysis reports them (<see cref="AnalysisBuilder"/>); class rules from
/// docs/methods.md Part II §2 (IEC 60364-5-53 §531.3.3, IEC 61008-1, IEC 62423, IEC 60364-7-722).
/// </summary>
public class ClassDetectorTests
{
    private static string Ma(double a) => CurrentText.WithUnit(a);

    private static AssessmentResult Assess(AnalysisResult analysis, AssessmentOptions? options = null) =>
        DeviceTypeAssessor.Assess(analysis, options ?? new AssessmentOptions());

    private static AssessmentResult Assess(AnalysisBuilder b, AssessmentOptions? options = null) => Assess(b.Build(), options);

    private static ClassResult Class(AssessmentResult r, ResidualCurrentClass name) => r.Classes.Single(c => c.Class == name);

    private static AnalysisResult WithComponents(AnalysisBuilder b, Func<ComponentsResult, ComponentsResult> change)
    {
        var a = b.Build();
        return a with { Components = change(a.Components) };
    }

    [Fact]
    public void Mains_ac_is_present_absent_and_at_its_floor_counted_as_present()
    {
        // Every type detects mains-frequency AC (IEC 61008-1); its class is reported present from the 1 mA floor,
        // and "at limit" (1 mA ± 0.12 mA at 2 % + 0.1 mA) is reported present too: it demands nothing beyond type AC.
        var sine = Class(Assess(new AnalysisBuilder().Sine(0.010)), ResidualCurrentClass.MainsAc);
        Assert.Equal(ClassPresence.Present, sine.Presence);
        Assert.Equal(0.010, sine.FigureA!.Value, 12);
        Assert.Equal(Limits.SignificanceFloorA, sine.ThresholdA);
        Assert.Equal(DeviceType.AC, sine.LeastType);
        Assert.Equal($"mains-frequency component {Ma(0.010)} (worst window): every type detects it (IEC 61008-1)", sine.Text);
        Assert.Equal(ClassPresence.Absent, Class(Assess(new AnalysisBuilder().SmoothDc(0.005)), ResidualCurrentClass.MainsAc).Presence);
        Assert.Equal(ClassPresence.Present, Class(Assess(new AnalysisBuilder().Sine(0.001)), ResidualCurrentClass.MainsAc).Presence);
    }

    [Fact]
    public void A_figure_within_the_uncertainty_is_at_limit_with_the_reason_and_a_clear_one_is_not()
    {
        // Smooth DC 1.0 mA against the 1 mA significance (engineering choice), ± (2 % + 0.1 mA) = ± 0.12 mA.
        var at = Class(Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.001)), ResidualCurrentClass.SmoothDc);
        Assert.Equal(ClassPresence.AtLimit, at.Presence);
        Assert.EndsWith($" [at the limit: within the measurement uncertainty ±{Ma(0.00012)} (2%+0.1mA); counted as present, the safe side (engineering choice)]", at.Text, StringComparison.Ordinal);
        var clear = Class(Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.003)), ResidualCurrentClass.SmoothDc);
        Assert.Equal(ClassPresence.Present, clear.Presence);
        Assert.DoesNotContain("[at the limit", clear.Text, StringComparison.Ordinal);
        Assert.EndsWith("(IEC 62423; IEC 60364-5-53 §531.3.3); an installed type A would still work with today's 3.00 mA (it tolerates 6.00 mA superimposed, IEC 61008-1) but cannot detect a DC fault", clear.Text, StringComparison.Ordinal);
        var absent = Class(Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.0005)), ResidualCurrentClass.SmoothDc);
        Assert.Equal(ClassPresence.Absent, absent.Presence);
        Assert.Equal($"smooth DC {Ma(0.0005)} below the {Ma(0.001)} significance (engineering choice)", absent.Text);
    }

    [Fact]
    public void Smooth_dc_says_what_kind_of_dc_it_is()
    {
        // Under pulses: the floor of a pulsating DC. Alone, beyond type A's 6 mA: no "type A would still work" clause.
        var floor = Class(Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.003)), ResidualCurrentClass.SmoothDc);
        Assert.StartsWith($"smooth DC {Ma(0.003)} under the pulses (their floor)", floor.Text, StringComparison.Ordinal);
        var big = Class(Assess(new AnalysisBuilder().Sine(0.002).SmoothDc(0.008)), ResidualCurrentClass.SmoothDc);
        Assert.StartsWith($"DC {Ma(0.008)} that does not rest at zero for 150° each cycle (not pulsating DC, IEC 61008-1)", big.Text, StringComparison.Ordinal);
        Assert.EndsWith("the circuit produces DC residual current, which only type B detects (IEC 62423; IEC 60364-5-53 §531.3.3)", big.Text, StringComparison.Ordinal);

        // Pulsating windows too few to count (--pulsating-share 0.5, 30 % pulsating): their floor is DC like any other.
        var few = WithComponents(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.003), c => c with { PulsatingDcShare = 0.3 });
        var fewText = Class(Assess(few, new AssessmentOptions { PulsatingShareThreshold = 0.5 }), ResidualCurrentClass.SmoothDc).Text;
        Assert.StartsWith($"DC {Ma(0.003)} that does not rest at zero", fewText, StringComparison.Ordinal);

        // A two-pulse rectifier: DC 2Ipk/π with a 100 Hz ripple of 4Ipk/(3π√2) rms and no mains component (Fourier
        // series of |sin θ|, closed form): rectified current from two or more phases.
        const double ipk = 0.010;
        var twoPulse = new AnalysisBuilder().SmoothDc(2 * ipk / Math.PI).Harmonic(2, 4 * ipk / (3 * Math.PI * Math.Sqrt(2)))
            .Harmonic(4, 4 * ipk / (15 * Math.PI * Math.Sqrt(2)));
        var text = Class(Assess(twoPulse), ResidualCurrentClass.SmoothDc).Text;
        Assert.StartsWith($"DC {Ma(2 * ipk / Math.PI)} that never rests at zero, with ripple at 100 Hz ({Ma(4 * ipk / (3 * Math.PI * Math.Sqrt(2)))}) above the mains component ({Ma(0)}): rectified current from two or more phases", text, StringComparison.Ordinal);
        // With a mains component above the ripple there is no ripple to speak of.
        var mainsOnTop = Class(Assess(twoPulse.Sine(0.005)), ResidualCurrentClass.SmoothDc).Text;
        Assert.DoesNotContain("ripple", mainsOnTop, StringComparison.Ordinal);
    }

    [Fact]
    public void Ripple_is_named_by_the_strongest_of_orders_2_3_and_6_only()
    {
        // A three-pulse rectifier's 150 Hz ripple above a 100 Hz one; order 4 (larger still) is no rectifier ripple.
        var b = new AnalysisBuilder().SmoothDc(0.008).Harmonic(2, 0.001).Harmonic(3, 0.002).Harmonic(4, 0.004);
        Assert.Contains($"with ripple at 150 Hz ({Ma(0.002)})", Class(Assess(b), ResidualCurrentClass.SmoothDc).Text, StringComparison.Ordinal);
        // Ripple below a tenth of the 1 mA floor is not named.
        var faint = new AnalysisBuilder().SmoothDc(0.008).Harmonic(6, 0.00009);
        Assert.DoesNotContain("ripple", Class(Assess(faint), ResidualCurrentClass.SmoothDc).Text, StringComparison.Ordinal);
        var justEnough = new AnalysisBuilder().SmoothDc(0.008).Harmonic(6, 0.0001);
        Assert.Contains("with ripple at 300 Hz", Class(Assess(justEnough), ResidualCurrentClass.SmoothDc).Text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(SensorCoupling.Ac, "the sensor is AC-coupled")]
    [InlineData(SensorCoupling.Unknown, "the sensor coupling is not stated and no DC was seen")]
    public void Smooth_dc_is_open_when_the_sensor_cannot_show_it(SensorCoupling coupling, string why)
    {
        var c = Class(Assess(new AnalysisBuilder().Coupling(coupling).Sine(0.005)), ResidualCurrentClass.SmoothDc);
        Assert.Equal(ClassPresence.Open, c.Presence);
        Assert.Equal($"smooth DC cannot be determined: {why}; any DC seen ({Ma(0)}) is not a measurement of it, and only type B detects smooth DC (IEC 62423)", c.Text);
    }

    [Fact]
    public void The_signature_of_an_ac_coupled_sensor_opens_smooth_dc()
    {
        // Closed form: a current transformer shows a half-wave riding on −Ipk/π, mean zero; pulses on a floor.
        var a = new AnalysisBuilder().Coupling(SensorCoupling.Unknown).HalfWave(0.020, 0).SmoothDc(-0.020 / Math.PI).Build();
        a = a with { Summary = a.Summary with { DcA = 0 } };
        var c = Class(Assess(a), ResidualCurrentClass.SmoothDc);
        Assert.Equal(ClassPresence.Open, c.Presence);
        Assert.Contains("the capture bears the signature of an AC-coupled sensor", c.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void Pulsating_dc_is_judged_on_its_pulse_mean_above_the_floor()
    {
        // A half-wave of 20 mA peak: mean Ipk/π = 6.37 mA (closed form), pulsating in every window.
        var halfWave = Assess(new AnalysisBuilder().HalfWave(0.020, 0));
        var p = Class(halfWave, ResidualCurrentClass.PulsatingDc);
        Assert.Equal(ClassPresence.Present, p.Presence);
        Assert.Equal(0.020 / Math.PI, p.FigureA!.Value, 1e-9);
        Assert.StartsWith($"pulsating DC: pulses with a mean of {Ma(0.020 / Math.PI)} above their floor in 100 % of windows, current-delay angle 0°, at rest for at least 150° of every cycle", p.Text, StringComparison.Ordinal);

        // The analysis's pulse mean is used where it has one; else the worst window's mean above the smooth DC.
        var own = Assess(WithComponents(new AnalysisBuilder().HalfWave(0.020, 0), c => c with { PulsatingMeanMaxA = 0.004 }));
        Assert.Equal(0.004, Class(own, ResidualCurrentClass.PulsatingDc).FigureA!.Value, 12);
        var none = Assess(WithComponents(new AnalysisBuilder().HalfWave(0.020, 0), c => c with { PulsatingMeanMaxA = 0 }));
        Assert.Equal(0.020 / Math.PI, Class(none, ResidualCurrentClass.PulsatingDc).FigureA!.Value, 1e-9);

        // No angle measured: no angle in the text.
        var noAngle = Assess(WithComponents(new AnalysisBuilder().HalfWave(0.020, 0), c => c with { CurrentDelayAngleDeg = null }));
        Assert.StartsWith($"pulsating DC: pulses with a mean of {Ma(0.020 / Math.PI)} above their floor in 100 % of windows, at rest for at least 150°", Class(noAngle, ResidualCurrentClass.PulsatingDc).Text, StringComparison.Ordinal);
    }

    [Fact]
    public void Pulsating_windows_below_the_share_threshold_are_no_class()
    {
        // --pulsating-share 0.5 with 30 % of windows pulsating: the class is absent whatever the pulse mean.
        var a = WithComponents(new AnalysisBuilder().HalfWave(0.020, 0), c => c with { PulsatingDcShare = 0.3 });
        var r = Assess(a, new AssessmentOptions { PulsatingShareThreshold = 0.5 });
        var p = Class(r, ResidualCurrentClass.PulsatingDc);
        Assert.Equal(ClassPresence.Absent, p.Presence);
        Assert.Equal("no window rests at a floor for 150° of every cycle: no pulsating DC (IEC 61008-1 definition, from memory)", p.Text);
        Assert.Equal(ClassPresence.Present, Class(Assess(a, new AssessmentOptions { PulsatingShareThreshold = 0.2 }), ResidualCurrentClass.PulsatingDc).Presence);
    }

    [Fact]
    public void Composite_current_is_the_largest_of_sub_mains_content_a_motor_tone_and_the_1khz_group()
    {
        // Threshold max(1 mA, 0.05 IΔn) = 1.5 mA on 30 mA (engineering choice); least type F (IEC 62423).
        var below = Class(Assess(new AnalysisBuilder().Sine(0.005).BelowMains(0.003)), ResidualCurrentClass.Composite);
        Assert.Equal(0.003, below.FigureA!.Value, 12);
        Assert.Equal(0.0015, below.ThresholdA!.Value, 12);
        Assert.StartsWith($"content below mains frequency {Ma(0.003)} (threshold {Ma(0.0015)}, engineering choice): a frequency converter's composite current", below.Text, StringComparison.Ordinal);

        var tone = Class(Assess(new AnalysisBuilder().Sine(0.005).BelowMains(0.002).Tone(12.5, 0.004)), ResidualCurrentClass.Composite);
        Assert.Equal(0.004, tone.FigureA!.Value, 12);
        Assert.StartsWith($"a motor-frequency tone at 12.5 Hz, {Ma(0.004)}", tone.Text, StringComparison.Ordinal);

        // Group 20 (1 kHz at 50 Hz) of a window that is not pulsating: the switching part of F's composite current.
        var group = Class(Assess(new AnalysisBuilder().Sine(0.005).BelowMains(0.002).Tone(12.5, 0.003).Harmonic(20, 0.005)), ResidualCurrentClass.Composite);
        Assert.Equal(0.005, group.FigureA!.Value, 12);
        Assert.StartsWith($"content in the harmonic group at 1 kHz {Ma(0.005)}", group.Text, StringComparison.Ordinal);

        // The group between the sub-mains content and a larger motor tone: the tone is named (the largest decides).
        var between = Class(Assess(new AnalysisBuilder().Sine(0.005).BelowMains(0.002).Tone(12.5, 0.004).Harmonic(20, 0.003)), ResidualCurrentClass.Composite);
        Assert.Equal(0.004, between.FigureA!.Value, 12);
        Assert.StartsWith("a motor-frequency tone at 12.5 Hz", between.Text, StringComparison.Ordinal);

        var quiet = Class(Assess(new AnalysisBuilder().Sine(0.005).BelowMains(0.0002)), ResidualCurrentClass.Composite);
        Assert.Equal(ClassPresence.Absent, quiet.Presence);
        Assert.Equal($"content below mains frequency {Ma(0.0002)} (threshold {Ma(0.0015)}, engineering choice)", quiet.Text);
    }

    [Fact]
    public void Non_mains_ac_adds_harmonics_and_a_tone_above_twice_mains_in_quadrature()
    {
        // Orthogonal components add in quadrature (Parseval): harmonics 3 mA and a 730 Hz tone 4 mA give 5 mA.
        // Threshold max(1 mA, 0.1 IΔn) = 3 mA on 30 mA (engineering choice); least type B (IEC 62423).
        var both = Class(Assess(new AnalysisBuilder().Sine(0.005).Harmonic(5, 0.003).Tone(730, 0.004)), ResidualCurrentClass.NonMainsAc);
        Assert.Equal(0.005, both.FigureA!.Value, 12);
        Assert.Equal(ClassPresence.Present, both.Presence);
        Assert.StartsWith($"AC at frequencies other than mains up to 1 kHz {Ma(0.005)}: a tone at 730 Hz, outside any pulsating DC's own harmonics (threshold {Ma(0.003)}, engineering choice); sinusoidal AC up to 1 kHz is specified for type B (IEC 62423)", both.Text, StringComparison.Ordinal);

        var harmonics = Class(Assess(new AnalysisBuilder().Sine(0.005).Harmonic(3, 0.002).Harmonic(5, 0.003).Harmonic(7, 0.001)), ResidualCurrentClass.NonMainsAc);
        Assert.Contains($": harmonics, strongest at 250 Hz ({Ma(0.003)}),", harmonics.Text, StringComparison.Ordinal);
        Assert.Equal(Math.Sqrt(0.000014), harmonics.FigureA!.Value, 12);

        // An analysis that reports no harmonic orders (only the fundamental) still names what it judged.
        var bare = new AnalysisBuilder().Sine(0.005).Build();
        bare = bare with { Harmonics = [bare.Harmonics[0]] };
        Assert.StartsWith($"AC at frequencies other than mains up to 1 kHz {Ma(0)}: harmonic content, outside", Class(Assess(bare), ResidualCurrentClass.NonMainsAc).Text, StringComparison.Ordinal);

        var small = Class(Assess(new AnalysisBuilder().Sine(0.005).Harmonic(3, 0.001)), ResidualCurrentClass.NonMainsAc);
        Assert.Equal(ClassPresence.Absent, small.Presence);
        Assert.EndsWith("(threshold 3.00 mA, engineering choice)", small.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void A_charging_point_has_its_dc_fault_class_unless_the_charger_detects_dc()
    {
        var ev = Class(Assess(new AnalysisBuilder().Sine(0.003), new AssessmentOptions { EvChargingPoint = true }), ResidualCurrentClass.ChargingPointDcFault);
        Assert.Equal(ClassPresence.Present, ev.Presence);
        Assert.StartsWith("charging point: IEC 60364-7-722 asks for protection against DC fault current whatever DC is measured today", ev.Text, StringComparison.Ordinal);
        var own = Class(Assess(new AnalysisBuilder().Sine(0.003), new AssessmentOptions { EvChargingPoint = true, ChargerDcDetection = true }), ResidualCurrentClass.ChargingPointDcFault);
        Assert.Equal(ClassPresence.Absent, own.Presence);
        Assert.Equal("charging point whose equipment provides 6 mA DC fault detection itself, as declared (⟦ChargerDcDetection⟧): check the maker's declaration (IEC 60364-7-722)", own.Text);
        Assert.DoesNotContain(Assess(new AnalysisBuilder().Sine(0.003)).Classes, c => c.Class == ResidualCurrentClass.ChargingPointDcFault);
    }

    [Fact]
    public void Clipped_windows_open_everything_above_what_the_rest_demands()
    {
        var clipped = Assess(WithComponents(new AnalysisBuilder().Sine(0.005), c => c with { ClippedWindowShare = 0.25 }));
        var c = Class(clipped, ResidualCurrentClass.Clipping);
        Assert.Equal(ClassPresence.Open, c.Presence);
        Assert.StartsWith("25 % of windows have samples at full scale", c.Text, StringComparison.Ordinal);
        Assert.Null(clipped.RequiredType);
        Assert.DoesNotContain(Assess(new AnalysisBuilder().Sine(0.005)).Classes, x => x.Class == ResidualCurrentClass.Clipping);
    }

    [Fact]
    public void A_firing_edge_is_removed_from_the_high_frequency_figure_from_10_degrees()
    {
        // The step of a phase-controlled half-wave puts content above 1 kHz (plain DFT of the ideal waveform in the
        // builder, to 20 kHz); the closed-form Fourier series of the same waveform (PhaseControlledSpectrum) accounts
        // for it. The two agree to 0.5 % (the DFT's sampling of the step), and what is left in quadrature,
        // √(hf² − edge²), is then under 10 % of the content.
        var at10 = Class(Assess(new AnalysisBuilder().HalfWave(0.020, 10)), ResidualCurrentClass.HighFrequency);
        var hf10 = new AnalysisBuilder().HalfWave(0.020, 10).Build().Components.Above1kHzRmsA;
        Assert.InRange(at10.FigureA!.Value, 0, 0.1 * hf10);
        Assert.Contains("firing edge accounts for", at10.Text, StringComparison.Ordinal);

        // Below 10° (Limits.MinimumDelayAngleDeg) the step is ignored: the figure is the content itself.
        var at9 = Class(Assess(new AnalysisBuilder().HalfWave(0.020, 9.9)), ResidualCurrentClass.HighFrequency);
        var hf9 = new AnalysisBuilder().HalfWave(0.020, 9.9).Build().Components.Above1kHzRmsA;
        Assert.Equal(hf9, at9.FigureA!.Value, 1e-12);
        Assert.Equal($"content 1-20 kHz {Ma(hf9)} below {Ma(0.003)} (engineering choice)", at9.Text);

        var at135 = Class(Assess(new AnalysisBuilder().HalfWave(0.020, 135)), ResidualCurrentClass.HighFrequency);
        var hf135 = new AnalysisBuilder().HalfWave(0.020, 135).Build().Components.Above1kHzRmsA;
        Assert.InRange(at135.FigureA!.Value, 0, 0.1 * hf135);
        Assert.Equal(ClassPresence.Absent, at135.Presence);
        Assert.Equal($"content 1-20 kHz {Ma(hf135)} ({Ma(at135.FigureA!.Value)} beyond the {Ma(Math.Sqrt((hf135 * hf135) - (at135.FigureA!.Value * at135.FigureA!.Value)))} a 135° firing edge accounts for) below {Ma(0.003)} (engineering choice)", at135.Text);
    }

    [Fact]
    public void The_firing_edge_is_counted_only_up_to_what_the_sample_rate_shows()
    {
        // At 30 kS/s the capture shows 1 to 15 kHz; the edge's share is taken over that range, so the content the
        // builder puts between 15 and 20 kHz (DFT orders 301..400 of the ideal 90° half-wave) is what remains.
        var b = new AnalysisBuilder().SampleRate(30_000).HalfWave(0.020, 90);
        var x = IdealHalfWave.Cycle(0.020, 90, 8000);
        double sq = 0;
        for (var k = 301; k <= 400; k++)
        {
            var h = IdealHalfWave.HarmonicRms(x, k);
            sq += h * h;
        }

        var hf = Class(Assess(b), ResidualCurrentClass.HighFrequency);
        Assert.Equal(Math.Sqrt(sq), hf.FigureA!.Value, 0.05 * Math.Sqrt(sq));
        Assert.Equal(ClassPresence.Open, hf.Presence); // below the threshold, and 15 to 20 kHz unseen
    }

    [Fact]
    public void Below_40_kS_per_s_with_nothing_seen_the_high_frequency_class_is_open()
    {
        var c = Class(Assess(new AnalysisBuilder().SampleRate(25_000).Sine(0.005)), ResidualCurrentClass.HighFrequency);
        Assert.Equal(ClassPresence.Open, c.Presence);
        Assert.Equal("whether content between 1 and 20 kHz needs B+ cannot be determined: the sample rate 25 kS/s shows content only up to 12.5 kHz (B+ is defined to 20 kHz, DIN VDE 0664-400)", c.Text);
        var seen = Class(Assess(new AnalysisBuilder().SampleRate(25_000).Sine(0.005).HighFrequency(8000, 0.004)), ResidualCurrentClass.HighFrequency);
        Assert.Equal(ClassPresence.Present, seen.Presence);
        Assert.StartsWith($"content 1-12.5 kHz {Ma(0.004)} (≥ {Ma(0.003)}, engineering choice): type B's tripping is defined only up to 1 kHz (IEC 62423)", seen.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void Presence_words_and_least_types_are_those_of_the_json()
    {
        var r = Assess(new AnalysisBuilder().Coupling(SensorCoupling.Ac).Sine(0.005).SmoothDc(0.001).BelowMains(0.0002));
        Assert.Equal([ResidualCurrentClass.MainsAc, ResidualCurrentClass.PulsatingDc, ResidualCurrentClass.SmoothDc, ResidualCurrentClass.Composite, ResidualCurrentClass.NonMainsAc, ResidualCurrentClass.HighFrequency], r.Classes.Select(c => c.Class));
        Assert.Equal([ClassPresence.Present, ClassPresence.Absent, ClassPresence.Open, ClassPresence.Absent, ClassPresence.Absent, ClassPresence.Absent], r.Classes.Select(c => c.Presence));
        Assert.Equal([DeviceType.AC, DeviceType.A, DeviceType.B, DeviceType.F, DeviceType.B, DeviceType.BPlus], r.Classes.Select(c => c.LeastType));
        Assert.Equal([false, false, true, false, false, false], r.Classes.Select(c => c.CoveredByDcDetection));
        Assert.Equal(ClassPresence.AtLimit, Class(Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.001)), ResidualCurrentClass.SmoothDc).Presence);
    }
}
