using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// The required type from the classes of residual current a capture shows, on waveforms synthesized from closed forms
/// and measured by the whole analysis: each finding of the verdict review, and the rules of IEC 60364-7-722 and
/// IEC 62423 that bear on it. Sources are named beside each check.
/// </summary>
public class RequiredTypeTests
{
    private static Evaluation Evaluate(IEnumerable<WaveformComponent> components, AssessmentOptions? assessment = null,
        SensorCoupling sensor = SensorCoupling.Dc, double? clipA = null, AnalysisOptions? analysis = null, double rateHz = 50_000)
    {
        // A little noise, as on any real recording: 20 µA rms, far below every threshold.
        List<WaveformComponent> parts = [.. components, new NoiseComponent(20e-6, 5)];
        using var source = new SynthCaptureSource(parts, rateHz, 1.0, sensor, clipA);
        return Evaluation.Run(source, analysis ?? new AnalysisOptions(), assessment ?? new AssessmentOptions());
    }

    private static Evaluation Evaluate(params string[] parts) =>
        Evaluate(parts.SelectMany(p => SynthesisSpec.Parse(p, 50)));

    [Theory]
    [InlineData(50, 3)]
    [InlineData(60, 3)]
    [InlineData(50, 6)]
    [InlineData(60, 6)]
    [InlineData(50, 2)]
    public void Rectified_current_from_several_phases_is_type_b_at_any_level(double mainsHz, int pulses)
    {
        // IEC 62423 (REFERENCE.md): rectified current from two or more phases is type B's; it never rests at zero
        // for 150° (IEC 61008-1 definition of pulsating DC, from memory). Levels 2 to 50 mA mean, alone and with a
        // mains sine on top: never A or F, and the smooth DC is the closed-form mean within 2 % + 0.1 mA.
        foreach (var meanA in new[] { 0.002, 0.005, 0.008, 0.020, 0.050 })
        {
            foreach (var sineA in new[] { 0.0, 0.005 })
            {
                List<WaveformComponent> parts = [new RectifiedComponent(meanA, mainsHz, pulses)];
                if (sineA > 0)
                {
                    parts.Add(new SineComponent(sineA, mainsHz, 30));
                }

                var r = Evaluate(parts, analysis: new AnalysisOptions { MainsHz = mainsHz });
                Assert.True(r.Assessment.RequiredType == DeviceType.B,
                    $"{pulses}-pulse {meanA * 1e3} mA + sine {sineA * 1e3} mA at {mainsHz} Hz: {r.Assessment.Headline}");
                Assert.Equal(meanA, Math.Abs(r.Analysis.Components.SmoothDcMaxA), (0.02 * meanA) + 0.0001);
                Assert.Contains(r.Assessment.Classes, c => c.Class == ResidualCurrentClass.SmoothDc && c.Presence == ClassPresence.Present);
            }
        }
    }

    [Fact]
    public void Smooth_dc_within_type_a_tolerance_still_requires_type_b_and_says_both()
    {
        // REFERENCE.md "tolerance is not fitness": 2.5 mA smooth DC is within the 6 mA type A tolerates (IEC 61008-1)
        // but the circuit produces DC, which only type B detects. The text says both.
        var r = Evaluate("sine:rms=5mA", "dc:level=2.5mA");
        Assert.Equal(DeviceType.B, r.Assessment.RequiredType);
        Assert.Contains("only type B detects", r.Assessment.Headline, StringComparison.Ordinal);
        Assert.Contains("would still work", r.Assessment.Headline, StringComparison.Ordinal);
        var withA = Evaluate(SynthesisSpec.Parse("sine:rms=5mA", 50).Concat(SynthesisSpec.Parse("dc:level=2.5mA", 50)),
            new AssessmentOptions { InstalledType = DeviceType.A });
        Assert.False(withA.Assessment.InstalledAdequate);
        Assert.False(withA.Assessment.Blinding.Blinded);
    }

    [Fact]
    public void A_motor_frequency_added_to_a_150_Hz_leakage_keeps_type_b()
    {
        // Finding: the 150 Hz-dominated leakage (AC up to 1 kHz: type B, IEC 62423) plus a small 23 Hz motor part
        // gave F. Adding a component must never weaken the verdict (REFERENCE.md "required type").
        var without = Evaluate("sine:rms=10mA,freq=150Hz", "sine:rms=2mA");
        var with = Evaluate("sine:rms=10mA,freq=150Hz", "sine:rms=2mA", "sine:rms=3mA,freq=23Hz");
        Assert.Equal(DeviceType.B, without.Assessment.RequiredType);
        Assert.Equal(DeviceType.B, with.Assessment.RequiredType);
        Assert.Contains(with.Assessment.Classes, c => c.Class == ResidualCurrentClass.Composite && c.Presence == ClassPresence.Present);
    }

    [Fact]
    public void A_larger_half_wave_added_to_a_dimmer_with_leakage_does_not_lower_the_verdict()
    {
        // Shrunk counterexample of the adding property (VerdictPropertyTests): a 10.2 mA half-wave at 45° with
        // 0.66 mA of mains leakage read B (a relative rest band was too narrow for the leakage's ripple), and adding
        // a 25.6 mA half-wave at 90° widened the band and read A. The rest band is now absolute (2 mA, engineering
        // choice), so ±0.93 mA of leakage on the rest is at rest either way: pulsating DC, type A, both times
        // (IEC 61008-1 definition, from memory).
        List<WaveformComponent> dimmer = [new SineComponent(0.000661, 50, 0), new HalfWaveComponent(0.010204, 50, 45)];
        var before = Evaluate(dimmer);
        var after = Evaluate([.. dimmer, new HalfWaveComponent(0.025641, 50, 90)]);
        Assert.Equal(DeviceType.A, before.Assessment.RequiredType);
        Assert.Equal(DeviceType.A, after.Assessment.RequiredType);
    }

    [Fact]
    public void Type_f_composite_test_current_is_type_f()
    {
        // IEC 62423: type F's composite test current, 10 Hz + 50 Hz + 1 kHz; its 1 kHz part is credited to F.
        var r = Evaluate("composite:rms=20mA,motor=10Hz,switch=1kHz");
        Assert.Equal(DeviceType.F, r.Assessment.RequiredType);
    }

    [Fact]
    public void Charging_point_with_plain_type_a_is_not_adequate_whatever_the_dc_today()
    {
        // IEC 60364-7-722 (REFERENCE.md): protection against DC fault current at every connection point: type B, or
        // type A with an RDC-DD (IEC 62955), unless the charging equipment provides the 6 mA detection itself.
        var parts = SynthesisSpec.Parse("sine:rms=3mA", 50).Concat(SynthesisSpec.Parse("dc:level=2.5mA", 50)).ToList();
        var plain = Evaluate(parts, new AssessmentOptions { EvChargingPoint = true, InstalledType = DeviceType.A });
        Assert.False(plain.Assessment.InstalledAdequate);
        Assert.Equal(DeviceType.B, plain.Assessment.RequiredType);
        var rdc = Evaluate(parts, new AssessmentOptions { EvChargingPoint = true, InstalledType = DeviceType.A, InstalledRdcDd = true });
        Assert.True(rdc.Assessment.InstalledAdequate);
        Assert.Equal("A+RDC-DD", rdc.Assessment.InstalledProtection?.ToTradeName());
        Assert.Contains("RDC-DD", rdc.Assessment.AcceptedProtection, StringComparison.Ordinal);

        // No DC today: still not adequate as plain A; with the charger's own detection declared, type A is.
        var ac = SynthesisSpec.Parse("sine:rms=3mA", 50);
        Assert.False(Evaluate(ac, new AssessmentOptions { EvChargingPoint = true, InstalledType = DeviceType.A }).Assessment.InstalledAdequate);
        var charger = Evaluate(ac, new AssessmentOptions { EvChargingPoint = true, ChargerDcDetection = true, InstalledType = DeviceType.A });
        Assert.True(charger.Assessment.InstalledAdequate);
        Assert.Equal(DeviceType.A, charger.Assessment.RequiredType);
        // Never type AC at a charging point (IEC 60364-7-722: at least type A).
        Assert.False(Evaluate(ac, new AssessmentOptions { EvChargingPoint = true, ChargerDcDetection = true, InstalledType = DeviceType.AC })
            .Assessment.InstalledAdequate);
    }

    [Fact]
    public void With_a_composite_current_the_dc_alternative_is_type_f_not_a()
    {
        // IEC 62423: type F adds the composite current, so beside 6 mA DC detection (IEC 62955) a circuit with a motor
        // frequency and 3 mA of smooth DC needs F; the headline and the accepted protection must say the same.
        var r = Evaluate("composite:rms=12mA,motor=12Hz,switch=1kHz", "dc:level=3mA");
        Assert.Equal(DeviceType.B, r.Assessment.RequiredType);
        Assert.Contains("or type F with 6 mA DC fault detection", r.Assessment.Headline, StringComparison.Ordinal);
        Assert.StartsWith("type B, or type F with 6 mA DC fault detection", r.Assessment.AcceptedProtection, StringComparison.Ordinal);
    }

    [Fact]
    public void Dc_detection_does_not_stand_in_for_type_b_once_the_dc_reaches_its_threshold()
    {
        // IEC 62955: an RDC-DD disconnects at 6 mA smooth DC; with 8 mA standing it cannot keep the circuit running,
        // and type A is beyond its 6 mA tolerance (IEC 61008-1): only type B.
        var parts = SynthesisSpec.Parse("sine:rms=3mA", 50).Concat(SynthesisSpec.Parse("dc:level=8mA", 50)).ToList();
        var r = Evaluate(parts, new AssessmentOptions { EvChargingPoint = true, InstalledType = DeviceType.A, InstalledRdcDd = true });
        Assert.False(r.Assessment.InstalledAdequate);
        Assert.Equal("type B", r.Assessment.AcceptedProtection);
    }

    [Fact]
    public void An_ac_coupled_half_wave_is_open_at_least_type_a()
    {
        // A current transformer removes the mean: a 30 mA half-wave rides on −Ipk/π = −9.55 mA (closed form). The
        // floor is not smooth DC: pulsating DC seen, DC unknown, so "open, at least A" (common practice, no source).
        List<WaveformComponent> parts = [new HalfWaveComponent(0.030, 50), new SmoothDcComponent(-0.030 / Math.PI)];
        var declared = Evaluate(parts, sensor: SensorCoupling.Ac);
        Assert.Null(declared.Assessment.RequiredType);
        Assert.Equal(DeviceType.A, declared.Assessment.MinimumType);
        Assert.Null(declared.Assessment.Blinding.Blinded);

        // Coupling not stated: mean zero with one-sided pulses is the signature of AC coupling; said and treated so.
        var unknown = Evaluate(parts, sensor: SensorCoupling.Unknown);
        Assert.Null(unknown.Assessment.RequiredType);
        Assert.Equal(DeviceType.A, unknown.Assessment.MinimumType);
        Assert.Contains(unknown.Assessment.Cautions, c => c.Contains("signature of an AC-coupled sensor", StringComparison.Ordinal));
        Assert.DoesNotContain(unknown.Assessment.Cautions, c => c.Contains("MAY NOT TRIP", StringComparison.Ordinal));
    }

    [Fact]
    public void Clipping_leaves_the_verdict_open_above_what_was_seen()
    {
        // Samples at full scale hide the waveform beyond it (common practice, no source): "at least A" for a
        // clipped half-wave, with the clipping named and a larger range asked for.
        var r = Evaluate([new HalfWaveComponent(0.030, 50)], clipA: 0.010);
        Assert.Null(r.Assessment.RequiredType);
        Assert.Equal(DeviceType.A, r.Assessment.MinimumType);
        Assert.Contains("full scale", r.Assessment.Headline, StringComparison.Ordinal);
        Assert.Contains("larger range", r.Assessment.Headline, StringComparison.Ordinal);
    }

    [Fact]
    public void A_declared_mains_frequency_the_capture_contradicts_stops_the_analysis()
    {
        // A 60 Hz capture declared 50 Hz would turn the mains current into a non-harmonic tone (IEC 61000-4-7 windows
        // of the wrong length): refused with the frequency seen; kept only when asked.
        var parts = new[] { new SineComponent(0.010, 60) };
        var ex = Assert.Throws<UserInputException>(() => Evaluate(parts, analysis: new AnalysisOptions { MainsHz = 50 }));
        Assert.Contains("60 Hz", ex.Message, StringComparison.Ordinal);
        Assert.Contains("KeepGivenMains", ex.Message, StringComparison.Ordinal);
        var kept = Evaluate(parts, analysis: new AnalysisOptions { MainsHz = 50, KeepGivenMains = true });
        Assert.Equal(50, kept.Analysis.Mains.NominalHz);
        // The declared frequency that agrees is accepted as before.
        Assert.Equal(DeviceType.AC, Evaluate(parts, analysis: new AnalysisOptions { MainsHz = 60 }).Assessment.RequiredType);
    }

    [Theory]
    [InlineData(0.00600, true)]
    [InlineData(0.00590, true)]
    [InlineData(0.00570, false)]
    public void At_six_milliamps_the_blinding_of_type_a_is_at_the_limit_and_resolved_to_the_safe_side(double dcA, bool blinded)
    {
        // IEC 61008-1: type A works with 6 mA smooth DC. With the default accuracy 2 % + 0.1 mA (engineering choice),
        // 5.90 mA ± 0.218 mA reaches 6 mA: at the limit, counted as blinded; 5.70 mA ± 0.214 mA does not.
        var parts = new WaveformComponent[] { new SineComponent(0.003, 50), new SmoothDcComponent(dcA) };
        var r = Evaluate(parts, new AssessmentOptions { InstalledType = DeviceType.A });
        Assert.Equal(blinded, r.Assessment.Blinding.Blinded);
    }

    [Fact]
    public void A_figure_within_the_uncertainty_of_a_threshold_is_at_the_limit_and_counted()
    {
        // DC significance 1 mA (engineering choice): 0.95 mA ± (2 % + 0.1 mA) reaches it, "at limit", counted as
        // present with the reason; with a tighter stated accuracy of 0.5 % + 0.01 mA it is absent.
        var parts = new WaveformComponent[] { new SineComponent(0.005, 50), new SmoothDcComponent(0.00095) };
        var r = Evaluate(parts);
        var dc = r.Assessment.Classes.Single(c => c.Class == ResidualCurrentClass.SmoothDc);
        Assert.Equal(ClassPresence.AtLimit, dc.Presence);
        Assert.Contains("safe side", dc.Text, StringComparison.Ordinal);
        Assert.Equal(DeviceType.B, r.Assessment.RequiredType);
        var tight = Evaluate(parts, new AssessmentOptions { Accuracy = new MeasurementAccuracy(0.005, 0.00001) });
        Assert.Equal(ClassPresence.Absent, tight.Assessment.Classes.Single(c => c.Class == ResidualCurrentClass.SmoothDc).Presence);
        Assert.Equal(DeviceType.AC, tight.Assessment.RequiredType);
    }

    [Fact]
    public void Nuisance_margin_of_type_b_on_smooth_dc_is_against_half_its_rating()
    {
        // IEC 62423: a compliant type B may trip on smooth DC from 0.5 IΔn (15 mA for 30 mA); 20 mA standing DC
        // leaves a guaranteed margin of −5 mA, risk likely, whatever the 2 IΔn upper limit.
        var r = Evaluate([new SmoothDcComponent(0.020)], new AssessmentOptions { InstalledType = DeviceType.B });
        Assert.Equal(RiskLevel.Likely, r.Assessment.NuisanceTrip.Risk);
        Assert.Equal(-0.005, r.Assessment.NuisanceTrip.MarginA, 0.0002);
        Assert.True(r.Assessment.NuisanceTrip.TypicalStandingA < r.Assessment.NuisanceTrip.StandingA);
    }

    [Theory]
    [InlineData("A+RDC-DD", DeviceType.A, true)]
    [InlineData("f + rdc-dd", DeviceType.F, true)]
    [InlineData("B+", DeviceType.BPlus, false)]
    [InlineData("A", DeviceType.A, false)]
    public void Installed_protection_parses_type_and_dc_detection(string text, DeviceType type, bool rdcDd)
    {
        Assert.True(DeviceTypeNames.TryParseProtection(text, out var t, out var r));
        Assert.Equal(type, t);
        Assert.Equal(rdcDd, r);
    }
}
