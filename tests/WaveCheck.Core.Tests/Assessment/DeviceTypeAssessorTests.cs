using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// Required type and per-type verdicts for the standard waveforms of IEC 60364-5-53 §531.3.3 / IEC 62423, built as
/// the figures an ideal analysis reports (<see cref="AnalysisBuilder"/>).
/// </summary>
public class DeviceTypeAssessorTests
{
    private static readonly AssessmentOptions Defaults = new();

    private static AssessmentResult Assess(AnalysisBuilder b, AssessmentOptions? o = null) =>
        DeviceTypeAssessor.Assess(b.Build(), o ?? Defaults);

    private static bool? Suitable(AssessmentResult r, DeviceType type) => r.Types.Single(t => t.Type == type).Suitable;

    private static void AssertVerdicts(AssessmentResult r, bool? ac, bool? a, bool? f, bool? b, bool? bPlus)
    {
        Assert.Equal([DeviceType.AC, DeviceType.A, DeviceType.F, DeviceType.B, DeviceType.BPlus], r.Types.Select(t => t.Type));
        Assert.Equal(ac, Suitable(r, DeviceType.AC));
        Assert.Equal(a, Suitable(r, DeviceType.A));
        Assert.Equal(f, Suitable(r, DeviceType.F));
        Assert.Equal(b, Suitable(r, DeviceType.B));
        Assert.Equal(bPlus, Suitable(r, DeviceType.BPlus));
        Assert.All(r.Types, t => Assert.NotEmpty(t.Reasons));
    }

    [Fact]
    public void Each_type_verdict_names_the_classes_it_rests_on()
    {
        // IEC 61008-1: pulsating DC is type A's (AC not specified for it); IEC 62423: smooth DC is type B's.
        var r = Assess(new AnalysisBuilder().HalfWave(0.030, 0).SmoothDc(0.012), new AssessmentOptions { EvChargingPoint = true });
        TypeVerdict Of(DeviceType t) => r.Types.Single(v => v.Type == t);

        Assert.Equal([ResidualCurrentClass.PulsatingDc, ResidualCurrentClass.SmoothDc, ResidualCurrentClass.ChargingPointDcFault], Of(DeviceType.AC).Classes);
        Assert.Equal([ResidualCurrentClass.SmoothDc, ResidualCurrentClass.ChargingPointDcFault], Of(DeviceType.A).Classes);
        Assert.Equal([ResidualCurrentClass.PulsatingDc, ResidualCurrentClass.SmoothDc, ResidualCurrentClass.ChargingPointDcFault], Of(DeviceType.B).Classes);
        // Not suitable: the rule of a charging point's own RCD first (type AC only), then each class's finding in order.
        Assert.Equal(Of(DeviceType.AC).Classes.Count + 1, Of(DeviceType.AC).Reasons.Count);
        Assert.StartsWith("charging point: IEC 60364-7-722 asks for its own RCD", Of(DeviceType.AC).Reasons[0], StringComparison.Ordinal);
        Assert.Equal(Of(DeviceType.A).Classes.Select(c => r.Classes.Single(k => k.Class == c).Text), Of(DeviceType.A).Reasons);

        // Open: an AC-coupled sensor cannot show smooth DC, which types AC, A and F may not detect.
        var open = Assess(new AnalysisBuilder().Sine(0.010).Coupling(SensorCoupling.Ac));
        var ac = open.Types.Single(v => v.Type == DeviceType.AC);
        Assert.Null(ac.Suitable);
        Assert.Contains(ResidualCurrentClass.SmoothDc, ac.Classes);
        Assert.Equal(ac.Classes.Select(c => open.Classes.Single(k => k.Class == c).Text), ac.Reasons);

        // The JSON names them as the class list does (ResultJson, camelCase).
        Assert.Matches("\"classes\": \\[\\s*\"pulsatingDc\",\\s*\"smoothDc\",", ResultJson.Serialize(r));
    }

    [Fact]
    public void MainsSineNeedsOnlyTypeAC()
    {
        // IEC 61008-1: type AC detects sinusoidal AC residual current.
        var r = Assess(new AnalysisBuilder().Sine(0.010));
        Assert.Equal(DeviceType.AC, r.RequiredType);
        Assert.Equal(DeviceType.AC, r.MinimumType);
        AssertVerdicts(r, true, true, true, true, true);
        Assert.StartsWith("Type AC sufficient", r.Headline);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(90.0)]
    [InlineData(135.0)]
    public void HalfWavePulsatingDcAtAnyDelayAngleNeedsTypeA(double angleDeg)
    {
        // IEC 61008-1: type A detects pulsating DC (half-wave at 0°, 90°, 135°); AC does not.
        var b = new AnalysisBuilder().HalfWave(0.020, angleDeg);
        var r = Assess(b);
        Assert.Equal(DeviceType.A, r.RequiredType);
        AssertVerdicts(r, false, true, true, true, true);
        Assert.Contains("pulsating DC", r.Types[0].Reasons[0]);
        Assert.Contains("pulsating DC", r.Headline);
    }

    [Fact]
    public void FiringEdgeHighFrequencyContentDoesNotReadAsSwitchingConverter()
    {
        // A 135° half-wave's step puts > 10 % of its RMS above 1 kHz (plain DFT in the builder); the closed-form
        // Fourier series accounts for it, so the verdict stays type A rather than B+.
        var analysis = new AnalysisBuilder().HalfWave(0.020, 135).Build();
        Assert.True(analysis.Components.Above1kHzRmsA > 0.10 * analysis.Summary.RmsA, "premise: edge content is above the 10 % significance");
        var r = DeviceTypeAssessor.Assess(analysis, Defaults);
        Assert.Equal(DeviceType.A, r.RequiredType);

        // Real switching content on top of the same dimmer is still seen.
        var withSwitching = DeviceTypeAssessor.Assess(new AnalysisBuilder().HalfWave(0.020, 135).HighFrequency(16_000, 0.004).Build(), Defaults);
        Assert.Equal(DeviceType.BPlus, withSwitching.RequiredType);
    }

    [Theory]
    // IEC 61008-1: A works with 6 mA smooth DC; IEC 62423: F with 10 mA. That is tolerance, not fitness: a circuit
    // producing smooth DC needs type B at any significant level (REFERENCE.md; IEC 60364-5-53 §531.3.3).
    [InlineData(0.004, DeviceType.B)]
    [InlineData(0.008, DeviceType.B)]
    [InlineData(0.014, DeviceType.B)]
    [InlineData(-0.014, DeviceType.B)] // type B: smooth DC of either polarity
    [InlineData(0.0005, DeviceType.A)] // below the 1 mA significance (engineering choice): pulsating DC alone
    public void HalfWaveOnSmoothDcNeedsTypeBAtAnySignificantLevel(double smoothDcA, DeviceType expected)
    {
        var r = Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(smoothDcA));
        Assert.Equal(expected, r.RequiredType);
    }

    [Fact]
    public void SmoothDcWithinTypeAToleranceRulesOutAAndFAndSaysWhy()
    {
        var r = Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.004));
        AssertVerdicts(r, false, false, false, true, true);
        Assert.Contains(r.Types[1].Reasons, t => t.Contains("only type B detects", StringComparison.Ordinal)
            && t.Contains("would still work with today's 4.00 mA (it tolerates 6.00 mA", StringComparison.Ordinal));
    }

    [Fact]
    public void HeadlineQuotesTheDecidingFigureTheLimitAndItsSource()
    {
        var r = Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.0142));
        Assert.StartsWith("Type B required: smooth DC 14.2 mA under the pulses (their floor) (≥ 1.00 mA significance, engineering choice)", r.Headline);
        Assert.Contains("only type B detects (IEC 62423", r.Headline);
    }

    [Fact]
    public void CompositeConverterCurrentNeedsTypeF()
    {
        // IEC 62423 composite test current: 10 Hz (motor) + 50 Hz (rated) + 1 kHz (switching) components.
        var b = new AnalysisBuilder().Sine(0.010).BelowMains(0.003).Harmonic(20, 0.003);
        var r = Assess(b);
        Assert.Equal(DeviceType.F, r.RequiredType);
        AssertVerdicts(r, false, false, true, true, true);
        Assert.Contains(r.Types[1].Reasons, t => t.Contains("composite current", StringComparison.Ordinal));
        // Sub-mains content alone (no 1 kHz part) is the same class.
        Assert.Equal(DeviceType.F, Assess(new AnalysisBuilder().Sine(0.010).BelowMains(0.003)).RequiredType);
    }

    [Fact]
    public void NonHarmonicMotorToneMarksCompositeCurrent()
    {
        // A 70 Hz motor frequency is not a 50 Hz harmonic: a converter's signature (IEC 62423 composite current).
        var r = Assess(new AnalysisBuilder().Sine(0.010).Tone(70, 0.004));
        Assert.Equal(DeviceType.F, r.RequiredType);
    }

    [Fact]
    public void SmoothDcWithSixPulseRippleNeedsTypeB()
    {
        // Three-phase bridge: smooth DC with 300 Hz ripple (harmonic 6 at 50 Hz), no fundamental (IEC 60364-5-53
        // guidance). The DC alone (5 mA) is within type F's 10 mA: the ripple signature decides.
        var r = Assess(new AnalysisBuilder().SmoothDc(0.005).Harmonic(6, 0.002).Sine(0.0002));
        Assert.Equal(DeviceType.B, r.RequiredType);
        Assert.Contains("rectified current from", r.Headline);

        var large = Assess(new AnalysisBuilder().SmoothDc(0.020).Harmonic(6, 0.002));
        Assert.Equal(DeviceType.B, large.RequiredType);
    }

    [Fact]
    public void SixPulseRippleBesideALargerMainsLeakageStillReadsAsThreePhaseBridge()
    {
        // Closed form of the six-pulse bridge: 6th-harmonic ripple RMS is 4.0 % of the mean, so 9 mA of bridge output
        // carries 0.36 mA at 300 Hz. A filter's 2 mA mains leakage beside it must not hide the signature, and 9 mA is
        // within type F's 10 mA tolerance (IEC 62423): only the ripple says type B.
        var r = Assess(new AnalysisBuilder().SmoothDc(0.009).Harmonic(6, 0.009 * 0.0404).Sine(0.002));
        Assert.Equal(DeviceType.B, r.RequiredType);

        // Without the ripple the same DC is still the circuit's own smooth DC: type B, not type F's tolerance.
        Assert.Equal(DeviceType.B, Assess(new AnalysisBuilder().SmoothDc(0.009).Sine(0.002)).RequiredType);
    }

    [Fact]
    public void ChargingPointWithSixMilliampsDcNeedsTypeBNotF()
    {
        // IEC 60364-7-722 (REFERENCE.md, installation rules): DC ≥ 6 mA at a charging point: type B, or type A with an
        // RDC-DD; type F is not a choice there even though it tolerates 10 mA (IEC 62423).
        var builder = new AnalysisBuilder().SmoothDc(0.008).Sine(0.002);
        Assert.Equal(DeviceType.B, Assess(builder).RequiredType);
        var ev = DeviceTypeAssessor.Assess(builder.Build(), new AssessmentOptions { EvChargingPoint = true });
        Assert.Equal(DeviceType.B, ev.RequiredType);
        // At 8 mA an RDC-DD would disconnect (IEC 62955): type B only.
        Assert.Equal("type B", ev.AcceptedProtection);
        Assert.Contains("fit type B", ev.EvCharging.Recommendation);
    }

    [Fact]
    public void SinusoidalCurrentAtAnotherFrequencyNeedsTypeB()
    {
        // IEC 62423: type B adds sinusoidal AC up to 1 kHz; 400 Hz (order 8) dominates, no sub-mains part.
        var r = Assess(new AnalysisBuilder().Sine(0.001).Harmonic(8, 0.008));
        Assert.Equal(DeviceType.B, r.RequiredType);
    }

    [Fact]
    public void ModestHarmonicsOnCapacitiveLeakageStayTypeAC()
    {
        // 20 % third harmonic of a 10 mA leakage, 2 mA: below max(1 mA, 0.1 IΔn) = 3 mA (engineering choice, Limits).
        var r = Assess(new AnalysisBuilder().Sine(0.010).Harmonic(3, 0.002));
        Assert.Equal(DeviceType.AC, r.RequiredType);
    }

    [Fact]
    public void SwitchingLeakageAt16kHzNeedsBPlus()
    {
        // DIN VDE 0664-400: B+ tripping defined up to 20 kHz; type B only to 1 kHz (IEC 62423).
        var b = new AnalysisBuilder().Sine(0.005).BelowMains(0.002).HighFrequency(16_000, 0.003);
        var r = Assess(b);
        Assert.Equal(DeviceType.BPlus, r.RequiredType);
        AssertVerdicts(r, false, false, false, false, true);
        Assert.Contains("type B's tripping is defined only up to 1 kHz", r.Headline);
    }

    [Fact]
    public void AcCoupledSensorLeavesDcVerdictsOpen()
    {
        var r = Assess(new AnalysisBuilder().Sine(0.010).Coupling(SensorCoupling.Ac));
        AssertVerdicts(r, null, null, null, true, true);
        Assert.Null(r.RequiredType);
        Assert.Equal(DeviceType.AC, r.MinimumType);
        Assert.Contains(r.Cautions, c => c.Contains("DC-coupled clamp"));
        Assert.Null(r.Blinding.Blinded);
        Assert.Null(r.EvCharging.DcAboveRdcDdThreshold);
        Assert.StartsWith("Required type cannot be determined", r.Headline);
    }

    [Fact]
    public void AcCoupledSensorStillRulesOutWhatTheSeenFiguresRuleOut()
    {
        // Composite current is seen through any sensor: AC and A are out, F stays open on DC.
        var r = Assess(new AnalysisBuilder().Sine(0.010).BelowMains(0.003).Coupling(SensorCoupling.Ac));
        AssertVerdicts(r, false, false, null, true, true);
        Assert.Equal(DeviceType.F, r.MinimumType);
        Assert.Null(r.RequiredType);
    }

    [Fact]
    public void UnknownCouplingThatShowsDcIsJudgedOnIt()
    {
        var r = Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.014).Coupling(SensorCoupling.Unknown));
        Assert.Equal(DeviceType.B, r.RequiredType);

        var open = Assess(new AnalysisBuilder().Sine(0.010).Coupling(SensorCoupling.Unknown));
        Assert.Null(open.RequiredType);
        Assert.Contains(open.Cautions, c => c.Contains("coupling is not stated"));
    }

    [Fact]
    public void LowSampleRateLeavesBPlusOpen()
    {
        // Nyquist: 20 kS/s shows only 10 kHz, not the 20 kHz B+ is defined to.
        var r = Assess(new AnalysisBuilder().Sine(0.010).SampleRate(20_000));
        Assert.Null(r.RequiredType);
        Assert.Equal(DeviceType.AC, r.MinimumType);
        Assert.Null(Suitable(r, DeviceType.B));
        Assert.True(Suitable(r, DeviceType.BPlus));
        Assert.Contains("at least type AC", r.Headline);
        Assert.Contains("shows content only up to 10 kHz", r.Headline);
        Assert.Contains(r.NuisanceTrip.Contributions, p => p.Label == "1-10 kHz" && p.HighHz == 10_000);
        Assert.Contains(r.Cautions, c => c.Contains("50 kS/s"));

        var dc = Assess(new AnalysisBuilder().SmoothDc(0.014).Sine(0.005).SampleRate(20_000));
        Assert.Null(dc.RequiredType);
        Assert.Equal(DeviceType.B, dc.MinimumType);
        Assert.Null(Suitable(dc, DeviceType.B));

        var all = Assess(new AnalysisBuilder().Sine(0.005).HighFrequency(5_000, 0.003).SampleRate(20_000));
        Assert.Equal(DeviceType.BPlus, all.RequiredType);
    }

    [Fact]
    public void DcThresholdOverrideDecidesTypeACorB()
    {
        // 1.5 mA smooth DC on a 10 mA sine: default significance 1 mA (engineering choice) -> present, type B.
        var b = new AnalysisBuilder().Sine(0.010).SmoothDc(0.0015);
        Assert.Equal(DeviceType.B, Assess(b).RequiredType);
        var r = Assess(b, new AssessmentOptions { DcThresholdA = 0.002 });
        Assert.Equal(DeviceType.AC, r.RequiredType);
        Assert.Contains(r.Thresholds, t => t.Name == "dcSignificanceA" && t.Value == 0.002 && t.Source.EndsWith("(overridden)"));
    }

    [Fact]
    public void DcSignificanceIsFixedSoAddedContentNeverHidesIt()
    {
        // Finding: a threshold scaled by the RMS let a larger sine hide 3 mA of DC. The threshold is now fixed
        // (engineering choice, Limits.DcSignificanceA): 3 mA of DC is type B on a 10 mA or a 100 mA sine alike.
        Assert.Equal(DeviceType.B, Assess(new AnalysisBuilder().Sine(0.100).SmoothDc(0.003)).RequiredType);
        Assert.Equal(DeviceType.B, Assess(new AnalysisBuilder().Sine(0.010).SmoothDc(0.003)).RequiredType);
    }

    [Fact]
    public void AssessmentSerialisesWithNonFiniteFactorsAsNull()
    {
        // ResultJson writes non-finite numbers as null; type A's smooth-DC factor is infinite (does not respond).
        var r = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.004), new AssessmentOptions { InstalledType = DeviceType.A });
        var json = ResultJson.Serialize(r);
        Assert.Contains("\"tripFactor\": null", json);
        Assert.Contains("\"requiredType\": \"B\"", json);
        Assert.Contains("\"classes\": [", json);
    }

    [Fact]
    public void ToleranceAndHighFrequencyOverridesMoveTheVerdict()
    {
        // Tolerances move the blinding of an installed device, not the required type (tolerance is not fitness).
        var nearA = new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.0055);
        Assert.Equal(DeviceType.B, Assess(nearA).RequiredType);
        // 5.5 mA ± (2 % + 0.1 mA) = ± 0.21 mA stays below type A's 6 mA (IEC 61008-1): not blinded; below a 5 mA
        // tolerance it is; with a tolerance of 6.5 mA it is not.
        Assert.False(Assess(nearA, new AssessmentOptions { InstalledType = DeviceType.A }).Blinding.Blinded);
        Assert.True(Assess(nearA, new AssessmentOptions { InstalledType = DeviceType.A, TypeASmoothDcToleranceA = 0.005 }).Blinding.Blinded);
        Assert.False(Assess(nearA, new AssessmentOptions { InstalledType = DeviceType.A, TypeASmoothDcToleranceA = 0.0065 }).Blinding.Blinded);

        var hf = new AnalysisBuilder().Sine(0.005).BelowMains(0.002).HighFrequency(16_000, 0.003);
        Assert.Equal(DeviceType.BPlus, Assess(hf).RequiredType);
        Assert.Equal(DeviceType.F, Assess(hf, new AssessmentOptions { HighFrequencyThresholdA = 0.005 }).RequiredType);

        var composite = new AnalysisBuilder().Sine(0.010).BelowMains(0.003);
        Assert.Equal(DeviceType.AC, Assess(composite, new AssessmentOptions { BelowMainsThresholdA = 0.004 }).RequiredType);

        var harmonic = new AnalysisBuilder().Sine(0.010).Harmonic(3, 0.002);
        Assert.Equal(DeviceType.B, Assess(harmonic, new AssessmentOptions { HarmonicThresholdA = 0.0015 }).RequiredType);
    }

    [Fact]
    public void InstalledTypeABlindedByDcIsStatedFirst()
    {
        var r = Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.014), new AssessmentOptions { InstalledType = DeviceType.A });
        Assert.Equal(DeviceType.A, r.InstalledType);
        Assert.False(r.InstalledAdequate);
        Assert.True(r.Blinding.Blinded);
        Assert.Equal(0.006, r.Blinding.ToleranceA);
        Assert.Contains("MAY NOT TRIP ON A REAL FAULT", r.Blinding.Explanation);
        Assert.StartsWith("WARNING", r.Cautions[0]);
        Assert.Equal(DeviceType.A, r.NuisanceTrip.DeviceType);
    }

    [Fact]
    public void BlindingToleranceOfTypeBScalesWithRating()
    {
        // IEC 62423: max(0.4 IΔn, 10 mA): 12 mA at 30 mA, 40 mA at 100 mA.
        var b = new AnalysisBuilder().SmoothDc(0.020).Sine(0.005);
        var r30 = Assess(b, new AssessmentOptions { InstalledType = DeviceType.B });
        Assert.Equal(0.012, r30.Blinding.ToleranceA!.Value, 12);
        Assert.True(r30.Blinding.Blinded);
        var r100 = Assess(b, new AssessmentOptions { InstalledType = DeviceType.B, RatedResidualCurrentA = 0.1 });
        Assert.Equal(0.040, r100.Blinding.ToleranceA!.Value, 12);
        Assert.False(r100.Blinding.Blinded);
    }

    [Fact]
    public void TypeACBlindedByAnySignificantDc()
    {
        var r = Assess(new AnalysisBuilder().Sine(0.010).SmoothDc(0.002), new AssessmentOptions { InstalledType = DeviceType.AC });
        Assert.Null(r.Blinding.ToleranceA);
        Assert.True(r.Blinding.Blinded);
        Assert.False(r.InstalledAdequate);
    }

    [Fact]
    public void EveryVerdictCarriesTheStandingCautions()
    {
        var r = Assess(new AnalysisBuilder().Sine(0.010));
        Assert.Contains(r.Cautions, c => c.Contains("Verify on site"));
        Assert.Contains(r.Cautions, c => c.Contains("local codes") && c.Contains("maker's data"));
        Assert.Contains(r.Cautions, c => c.Contains("licensed or otherwise qualified"));
        Assert.Contains(r.Cautions, c => c.Contains("Type AC is not permitted in some countries"));
        Assert.Contains(r.Thresholds, t => t.Name == "frequencyFactor1kHz" && t.Source.Contains("from memory"));
    }

    [Fact]
    public void CaptureWarningsTravelIntoCautions()
    {
        var a = new AnalysisBuilder().Sine(0.010).Build() with { Warnings = [new CaptureWarning("clipping", "12 samples clipped at 1.2 s", 1.2)] };
        var r = DeviceTypeAssessor.Assess(a, Defaults);
        Assert.Contains("Capture: 12 samples clipped at 1.2 s", r.Cautions);
    }

    [Fact]
    public void EvChargingPointFollowsTheSixMilliampDcCriterion()
    {
        // IEC 62955: RDC-DD disconnects at 6 mA smooth DC; IEC 60364-7-722: type B, or type A + RDC-DD.
        var high = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.008), new AssessmentOptions { EvChargingPoint = true });
        Assert.True(high.EvCharging.DcAboveRdcDdThreshold);
        Assert.Contains("fit type B", high.EvCharging.Recommendation);
        var low = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.004), new AssessmentOptions { EvChargingPoint = true });
        Assert.False(low.EvCharging.DcAboveRdcDdThreshold);
        Assert.Contains("type A with a 6.00 mA DC detection device (RDC-DD, IEC 62955)", low.EvCharging.Recommendation);
        Assert.Equal(0.006, low.EvCharging.RdcDdThresholdA);
    }

    [Fact]
    public void EvChargingPointNeverGetsTypeAc()
    {
        // IEC 60364-7-722 (REFERENCE.md, std): a charging point has its own RCD of at least type A, even when the
        // capture is a clean sine; and type A is enough only with an RDC-DD, which the cautions must say beside the
        // headline.
        var sine = Assess(new AnalysisBuilder().Sine(0.005), new AssessmentOptions { EvChargingPoint = true });
        Assert.Equal(DeviceType.B, sine.RequiredType);
        Assert.Contains("IEC 60364-7-722", sine.Headline);
        Assert.Contains("or type A with 6 mA DC fault detection", sine.Headline);
        Assert.Equal(false, sine.Types[0].Suitable);
        Assert.Contains(sine.Cautions, c => c.Contains("type B, or type A with a 6.00 mA DC detection device"));
        var declared = Assess(new AnalysisBuilder().Sine(0.005), new AssessmentOptions { EvChargingPoint = true, ChargerDcDetection = true });
        Assert.Equal(DeviceType.A, declared.RequiredType);
        Assert.Equal(false, declared.Types[0].Suitable);
        Assert.Equal(DeviceType.AC, Assess(new AnalysisBuilder().Sine(0.005)).RequiredType);
    }

    [Fact]
    public void TypeBBeyondItsDcRangeIsNotDescribedAsPreMagnetised()
    {
        // REFERENCE.md: pre-magnetisation blinds types A and F (IEC 62955 Note 2); type B detects smooth DC and is
        // specified with superimposed DC up to max(0.4 IΔn, 10 mA) (IEC 62423, std). 14 mA > 12 mA at 30 mA.
        var r = Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.014), new AssessmentOptions { InstalledType = DeviceType.B });
        Assert.True(r.Blinding.Blinded);
        Assert.Contains("not specified", r.Blinding.Explanation);
        Assert.DoesNotContain("pre-magnetises", r.Blinding.Explanation);
        var a = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.008), new AssessmentOptions { InstalledType = DeviceType.A });
        Assert.Contains("pre-magnetises", a.Blinding.Explanation);
    }

    [Fact]
    public void UnstatedCouplingTakenAsDcSaysSo()
    {
        // Common practice, no source: a DC reading makes the sensor DC-capable, but the user should confirm it.
        var r = Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.014).Coupling(SensorCoupling.Unknown));
        Assert.Contains(r.Cautions, c => c.StartsWith("The sensor coupling is not stated; it is taken as DC-coupled"));
        Assert.DoesNotContain(Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.014)).Cautions,
            c => c.Contains("coupling is not stated"));
    }

    [Fact]
    public void LimitLabelsFollowTheThresholdsApplied()
    {
        // IEC 61008-1: non-operating 0.5 IΔn; IEC 60364-5-53 §531.3.2: budget 0.3 IΔn; --leakage-budget 0.2 moves the
        // budget, and every label (plots, report, console) is built from these texts.
        var plain = Assess(new AnalysisBuilder().Sine(0.005));
        Assert.Equal("0.5 IΔn", plain.NonOperatingLimitText());
        Assert.Equal("0.3 IΔn", plain.LeakageBudgetText());
        var tighter = Assess(new AnalysisBuilder().Sine(0.005), new AssessmentOptions { LeakageBudgetFraction = 0.2 });
        Assert.Equal("0.2 IΔn", tighter.LeakageBudgetText());
        Assert.Equal(0.006, tighter.NuisanceTrip.LeakageBudgetA, 12);
    }

    [Fact]
    public void NorthAmericanRegimeAddsGfciFigures()
    {
        var r = Assess(new AnalysisBuilder().Sine(0.010), new AssessmentOptions { Regime = Regime.Na });
        Assert.Equal(Regime.Na, r.Regime);
        Assert.NotNull(r.Gfci);
        Assert.Null(Assess(new AnalysisBuilder().Sine(0.010)).Gfci);
    }

    [Fact]
    public void TouchCurrentReadingsAreComparedWhenPresent()
    {
        var t = new TouchCurrentResult(0.0006, 0.0008, 0.0008, 0.00055, 0.0008, 0.00055, 0.0001);
        var r = Assess(new AnalysisBuilder().Sine(0.0006).Touch(t));
        Assert.NotNull(r.TouchCurrent);
        Assert.Null(Assess(new AnalysisBuilder().Sine(0.0006)).TouchCurrent);
    }

    [Theory]
    [InlineData(0.0, "RatedResidualCurrentA")]
    [InlineData(-0.03, "RatedResidualCurrentA")]
    [InlineData(double.NaN, "RatedResidualCurrentA")]
    public void RatedCurrentOutOfRangeIsRejectedWithTheOptionName(double ratedA, string option)
    {
        var e = Assert.Throws<OptionValueException>(() => Assess(new AnalysisBuilder().Sine(0.01), new AssessmentOptions { RatedResidualCurrentA = ratedA }));
        Assert.Equal(option, e.Option);
        Assert.Contains("expected a current above 0", e.Message);
    }

    [Fact]
    public void RiskBoundariesOutOfOrderAreRejected()
    {
        var e = Assert.Throws<OptionValueException>(() => new AssessmentOptions { PossibleRiskFraction = 0.6 }.Validate());
        Assert.Equal("PossibleRiskFraction", e.Option);
        Assert.Throws<OptionValueException>(() => new AssessmentOptions { DcThresholdA = -0.001 }.Validate());
        Assert.Throws<OptionValueException>(() => new AssessmentOptions { LeakageBudgetFraction = 1.5 }.Validate());

        // Types are ordered by capability (IEC 60364-5-53 §531.3.3): A cannot tolerate more DC than F.
        var order = Assert.Throws<OptionValueException>(() => new AssessmentOptions { TypeASmoothDcToleranceA = 0.015 }.Validate());
        Assert.Equal("TypeASmoothDcToleranceA", order.Option);
    }

    // ---- The decision: installed protection, accepted protection, headline, cautions ------------------------------

    private static string Ma(double a) => CurrentText.WithUnit(a);

    [Theory]
    // IEC 60364-5-53 §531.3.3: each type detects the classes of the types below it.
    [InlineData(DeviceType.AC, false, false)] // pulsating DC: AC does not detect it
    [InlineData(DeviceType.A, false, true)]
    [InlineData(DeviceType.F, false, true)]
    [InlineData(DeviceType.B, false, true)]
    [InlineData(DeviceType.AC, true, false)]  // a DC detection device does not stand in for type A's pulsating DC
    public void An_installed_type_is_adequate_when_it_detects_every_class_present(DeviceType installed, bool rdcDd, bool adequate)
    {
        var r = Assess(new AnalysisBuilder().HalfWave(0.020, 90), new AssessmentOptions { InstalledType = installed, InstalledRdcDd = rdcDd });
        Assert.Equal(adequate, r.InstalledAdequate);
        Assert.Equal(installed.ToTradeName() + (rdcDd ? "+RDC-DD" : ""), r.InstalledProtection?.ToTradeName());
        Assert.Equal(installed, r.InstalledType);
    }

    [Fact]
    public void A_dc_detection_device_stands_in_for_type_b_only_below_its_6_ma()
    {
        // IEC 60364-7-722 / IEC 62955: type A + RDC-DD covers smooth DC while the standing DC stays below the 6 mA at
        // which the RDC-DD disconnects (at the limit counts as reaching it: 5.9 mA ± 0.218 mA).
        var protection = new AssessmentOptions { InstalledType = DeviceType.A, InstalledRdcDd = true };
        Assert.True(Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.004), protection).InstalledAdequate);
        Assert.False(Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.0059), protection).InstalledAdequate);
        Assert.False(Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.004), new AssessmentOptions { InstalledType = DeviceType.A }).InstalledAdequate);
        // Type B does not rely on the detection: adequate whatever the DC (blinding is judged apart).
        Assert.True(Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.008), new AssessmentOptions { InstalledType = DeviceType.B, InstalledRdcDd = true }).InstalledAdequate);
        // Beside a type AC the detection covers the DC but not the AC type's own gaps (pulsating DC): not adequate.
        Assert.False(Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.004), new AssessmentOptions { InstalledType = DeviceType.AC, InstalledRdcDd = true }).InstalledAdequate);
    }

    [Fact]
    public void A_charging_point_protection_is_judged_with_the_chargers_own_detection()
    {
        var charger = new AssessmentOptions { EvChargingPoint = true, ChargerDcDetection = true, InstalledType = DeviceType.A };
        var r = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.002), charger);
        Assert.Equal("A + charger DC detection", r.InstalledProtection?.ToTradeName());
        Assert.True(r.InstalledAdequate);
        // A type AC at a charging point is never adequate (its own RCD of at least type A, IEC 60364-7-722).
        Assert.False(Assess(new AnalysisBuilder().Sine(0.005), charger with { InstalledType = DeviceType.AC }).InstalledAdequate);
        // Declared charger detection without a charging point means nothing.
        var notEv = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.002), new AssessmentOptions { ChargerDcDetection = true, InstalledType = DeviceType.A });
        Assert.Equal("A", notEv.InstalledProtection?.ToTradeName());
        Assert.False(notEv.InstalledAdequate);
    }

    [Fact]
    public void An_open_class_the_installed_type_does_not_cover_leaves_adequacy_open()
    {
        // An AC-coupled sensor cannot show smooth DC: a type A is then neither adequate nor inadequate; type B is.
        var b = new AnalysisBuilder().Sine(0.005).Coupling(SensorCoupling.Ac);
        Assert.Null(Assess(b, new AssessmentOptions { InstalledType = DeviceType.A }).InstalledAdequate);
        Assert.True(Assess(b, new AssessmentOptions { InstalledType = DeviceType.B }).InstalledAdequate);
        Assert.Null(Assess(b).InstalledAdequate);
        Assert.Null(Assess(b).InstalledProtection);
    }

    [Fact]
    public void The_accepted_protection_names_the_dc_detection_alternative_only_where_it_applies()
    {
        // Smooth DC alone asks for B: B, or A with 6 mA DC detection (IEC 60364-7-722 at charging points, an
        // engineering choice elsewhere, said so).
        Assert.Equal("type B, or type A with 6 mA DC fault detection (an RDC-DD, IEC 62955; as IEC 60364-7-722 allows at charging points; engineering choice elsewhere)",
            Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.003)).AcceptedProtection);
        // With composite current beside it: F with DC detection.
        Assert.Equal("type B, or type F with 6 mA DC fault detection (an RDC-DD, IEC 62955; as IEC 60364-7-722 allows at charging points; engineering choice elsewhere)",
            Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.003).BelowMains(0.003)).AcceptedProtection);
        Assert.Equal("type B, or type A with 6 mA DC fault detection (an RDC-DD, IEC 62955, or the charger's own, declared by its maker; IEC 60364-7-722)",
            Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.003), new AssessmentOptions { EvChargingPoint = true }).AcceptedProtection);
        // DC reaching 6 mA, or a class only B detects besides DC: type B alone.
        Assert.Equal("type B", Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.007)).AcceptedProtection);
        Assert.Equal("type B", Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.003).Harmonic(5, 0.004)).AcceptedProtection);
        Assert.Equal("type A", Assess(new AnalysisBuilder().HalfWave(0.020, 90)).AcceptedProtection);
        Assert.Null(Assess(new AnalysisBuilder().Sine(0.005).Coupling(SensorCoupling.Ac)).AcceptedProtection);
    }

    [Fact]
    public void The_headline_names_the_deciding_class_and_the_dc_detection_alternative()
    {
        var dc = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.003));
        Assert.StartsWith("Type B (or type A with 6 mA DC fault detection, IEC 62955) required: DC 3.00 mA that does not rest at zero", dc.Headline, StringComparison.Ordinal);
        var harmonics = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.003).Harmonic(5, 0.004));
        Assert.StartsWith("Type B required: ", harmonics.Headline, StringComparison.Ordinal);
        var big = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.007));
        Assert.StartsWith("Type B required: DC 7.00 mA", big.Headline, StringComparison.Ordinal);
        Assert.Equal($"Type AC sufficient: sinusoidal residual current at mains frequency only (worst window {Ma(0.005)}), no other class of residual current present; check that type AC is permitted locally",
            Assess(new AnalysisBuilder().Sine(0.005)).Headline);
        // A charging point whose charger detects DC itself: type A for the charging point's own sake.
        var ev = Assess(new AnalysisBuilder().Sine(0.005), new AssessmentOptions { EvChargingPoint = true, ChargerDcDetection = true });
        Assert.Equal("Type A required: charging point: IEC 60364-7-722 asks for its own RCD of at least type A", ev.Headline);
        // Open above what is seen: "at least", with the first open reason.
        var open = Assess(new AnalysisBuilder().HalfWave(0.020, 90).Coupling(SensorCoupling.Ac));
        Assert.StartsWith("Required type cannot be determined from this capture: at least type A; smooth DC cannot be determined: the sensor is AC-coupled", open.Headline, StringComparison.Ordinal);
    }

    [Fact]
    public void Each_type_verdict_gives_its_reasons()
    {
        var r = Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.014));
        Assert.StartsWith("smooth DC 14.0 mA under the pulses", r.Types[0].Reasons[1], StringComparison.Ordinal);
        Assert.StartsWith("pulsating DC:", r.Types[0].Reasons[0], StringComparison.Ordinal);
        Assert.Single(r.Types[1].Reasons); // A detects the pulsating DC; only the smooth DC is against it
        Assert.Equal("detects every class of residual current present: pulsating DC, smooth DC or multi-phase rectified current (IEC 60364-5-53 §531.3.3, IEC 62423)", r.Types[3].Reasons[0]);
        // Type B beyond its 12 mA DC range (max(0.4 IΔn, 10 mA), IEC 62423): a second reason points at blinding.
        Assert.Equal($"smooth DC {Ma(0.014)} reaches the {Ma(0.012)} (max of 0.4 IΔn and {Ma(0.010)}) with which type B's tripping on superimposed currents is specified (IEC 62423): see blinding", r.Types[3].Reasons[1]);
        Assert.Single(Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.011)).Types[3].Reasons);
        Assert.Equal($"detects the sinusoidal mains-frequency current seen (worst window {Ma(0.005)}); no other class of residual current present (IEC 60364-5-53 §531.3.3)",
            Assess(new AnalysisBuilder().Sine(0.005)).Types[0].Reasons.Single());
        // A charging point's type AC: the charging-point reason first.
        var ev = Assess(new AnalysisBuilder().Sine(0.005), new AssessmentOptions { EvChargingPoint = true, ChargerDcDetection = true });
        Assert.Equal(["charging point: IEC 60364-7-722 asks for its own RCD of at least type A"], ev.Types[0].Reasons);
        // Open classes above a type: undetermined, with the open reason.
        var open = Assess(new AnalysisBuilder().Sine(0.005).Coupling(SensorCoupling.Ac));
        Assert.Null(open.Types[1].Suitable);
        Assert.StartsWith("smooth DC cannot be determined", open.Types[1].Reasons.Single(), StringComparison.Ordinal);
    }

    [Fact]
    public void Cautions_come_in_order_and_say_what_the_capture_cannot_show()
    {
        var r = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.008), new AssessmentOptions { InstalledType = DeviceType.A, EvChargingPoint = true });
        Assert.StartsWith("WARNING: the type A device MAY NOT TRIP", r.Cautions[0], StringComparison.Ordinal);
        Assert.StartsWith("EV charging point (IEC 60364-7-722)", r.Cautions[1], StringComparison.Ordinal);
        Assert.Contains("The verdict covers only the operating states in this capture (60 s); start-up, other speeds or charging phases may demand more: capture each.", r.Cautions);
        Assert.DoesNotContain(r.Cautions, c => c.Contains("sample rate", StringComparison.Ordinal));

        Assert.Contains("The sensor is AC-coupled (current transformer or Rogowski coil): smooth DC is invisible to it and pulsating DC is distorted, so the verdicts on types AC, A and F are open. Measure again with a DC-coupled clamp (fluxgate or Hall-effect).",
            Assess(new AnalysisBuilder().Sine(0.005).Coupling(SensorCoupling.Ac)).Cautions);
        Assert.Contains("The sensor coupling is not stated and the capture shows no DC: if the sensor is AC-coupled, DC is invisible. State the coupling, or measure again with a DC-coupled clamp (fluxgate or Hall-effect).",
            Assess(new AnalysisBuilder().Sine(0.005).Coupling(SensorCoupling.Unknown)).Cautions);
        Assert.Contains("The sample rate 30 kS/s shows content only up to 15 kHz: whether B+ is needed (content to 20 kHz) is open. Record at 50 kS/s or more.",
            Assess(new AnalysisBuilder().SampleRate(30_000).Sine(0.005)).Cautions);
        // Exactly 40 kS/s shows 20 kHz: covered, no caution, no open class.
        var at40 = Assess(new AnalysisBuilder().SampleRate(40_000).Sine(0.005));
        Assert.Equal(DeviceType.AC, at40.RequiredType);
        Assert.DoesNotContain(at40.Cautions, c => c.Contains("sample rate", StringComparison.Ordinal));
        // Content above 20 kHz at the threshold (3 mA on 30 mA): a caution, no type defined there.
        Assert.Contains($"Content above 20 kHz ({Ma(0.003)}): no RCD type's tripping is defined there; ask the equipment's maker about its leakage and the device to use.",
            Assess(new AnalysisBuilder().Sine(0.005).HighFrequency(22_000, 0.003)).Cautions);
        Assert.DoesNotContain(Assess(new AnalysisBuilder().Sine(0.005).HighFrequency(22_000, 0.0029)).Cautions, c => c.StartsWith("Content above 20 kHz", StringComparison.Ordinal));
    }

    [Fact]
    public void A_fallback_mains_frequency_is_a_caution()
    {
        var a = new AnalysisBuilder().SmoothDc(0.003).Build();
        a = a with { Mains = a.Mains with { Source = "fallback", NominalHz = 60 } };
        Assert.Contains("Too little mains-frequency content to track the mains: the nominal 60 Hz was assumed.", DeviceTypeAssessor.Assess(a, Defaults).Cautions);
    }

    [Fact]
    public void The_ac_coupling_signature_needs_a_mean_near_zero_and_a_floor_clear_of_the_significance()
    {
        // Closed form: a current transformer turns a half-wave into pulses on −Ipk/π with mean 0. Taken as AC-coupled
        // while |mean| ≤ max(its uncertainty, 2 % of the RMS) (Limits.AcCouplingMeanFraction, engineering choice).
        AnalysisResult Make(double meanA, SensorCoupling coupling = SensorCoupling.Unknown)
        {
            var a = new AnalysisBuilder().Coupling(coupling).HalfWave(0.020, 0).SmoothDc(-0.020 / Math.PI).Build();
            return a with { Summary = a.Summary with { DcA = meanA } };
        }

        var rms = Make(0).Windows.Statistics["rmsA"].Max;
        var signature = DeviceTypeAssessor.Assess(Make(0.02 * rms), Defaults);
        Assert.Null(signature.Blinding.Blinded);
        Assert.Contains(signature.Cautions, c => c.StartsWith("The sensor coupling is not stated, and the capture bears the signature of an AC-coupled sensor", StringComparison.Ordinal));
        Assert.NotNull(DeviceTypeAssessor.Assess(Make(0.021 * rms), Defaults).Blinding.Blinded);
        Assert.NotNull(DeviceTypeAssessor.Assess(Make(0, SensorCoupling.Dc), Defaults).Blinding.Blinded);
    }

    [Fact]
    public void Pulsating_windows_count_from_any_share_or_above_the_share_threshold()
    {
        // --pulsating-share 0 (default): any pulsating window; else strictly more than the share given.
        AnalysisResult Share(double share)
        {
            var a = new AnalysisBuilder().HalfWave(0.020, 90).Build();
            return a with { Components = a.Components with { PulsatingDcShare = share } };
        }

        Assert.Equal(DeviceType.A, DeviceTypeAssessor.Assess(Share(0.001), Defaults).RequiredType);
        Assert.Equal(DeviceType.A, DeviceTypeAssessor.Assess(Share(0.31), new AssessmentOptions { PulsatingShareThreshold = 0.3 }).RequiredType);
        Assert.NotEqual(DeviceType.A, DeviceTypeAssessor.Assess(Share(0.3), new AssessmentOptions { PulsatingShareThreshold = 0.3 }).RequiredType);
    }

    [Fact]
    public void The_result_carries_the_accuracy_regime_and_thresholds_applied()
    {
        var r = Assess(new AnalysisBuilder().Sine(0.005), new AssessmentOptions { Accuracy = new MeasurementAccuracy(0.03, 0.0005), RatedResidualCurrentA = 0.1 });
        Assert.Equal("3%+0.5mA", r.Accuracy);
        Assert.Equal(Regime.Iec, r.Regime);
        Assert.Equal(0.1, r.RatedResidualCurrentA);
        Assert.Contains(r.Thresholds, t => t.Name == "rdcDdThresholdA" && t.Value == 0.006);
        Assert.Equal(DeviceType.AC, r.MinimumType);
    }

    [Fact]
    public void Null_arguments_are_refused()
    {
        Assert.Throws<ArgumentNullException>(() => DeviceTypeAssessor.Assess(null!, Defaults));
        Assert.Throws<ArgumentNullException>(() => DeviceTypeAssessor.Assess(new AnalysisBuilder().Sine(0.005).Build(), null!));
    }

    [Fact]
    public void Unstated_coupling_with_dc_alone_is_judged_on_the_dc()
    {
        // No pulsating DC, smooth DC 5 mA seen: the sensor shows DC, so it is taken as DC-coupled (said so) and the
        // DC decides type B (IEC 62423).
        var r = Assess(new AnalysisBuilder().Coupling(SensorCoupling.Unknown).Sine(0.005).SmoothDc(0.005));
        Assert.Equal(DeviceType.B, r.RequiredType);
        Assert.False(r.Blinding.Blinded is null);
        // A DC that averages out over the capture (windows of either sign) with no pulsating window is no sign of a
        // current transformer: the AC-coupling signature needs pulses on a floor.
        var a = new AnalysisBuilder().Coupling(SensorCoupling.Unknown).Sine(0.005).SmoothDc(0.005).Build();
        a = a with { Summary = a.Summary with { DcA = 0 } };
        var zeroMean = DeviceTypeAssessor.Assess(a, Defaults);
        Assert.Equal(DeviceType.B, zeroMean.RequiredType);
        Assert.DoesNotContain(zeroMean.Cautions, c => c.Contains("signature of an AC-coupled sensor", StringComparison.Ordinal));
    }

    [Fact]
    public void Several_open_classes_leave_the_verdict_open_up_to_the_highest()
    {
        // AC-coupled sensor (smooth DC open, type B) at 25 kS/s (1-20 kHz open, B+), with harmonics that need type B:
        // the level is B, and B+ stays open, so no required type; the headline gives the reason above B.
        var r = Assess(new AnalysisBuilder().Coupling(SensorCoupling.Ac).SampleRate(25_000).Sine(0.005).Harmonic(5, 0.005));
        Assert.Equal(DeviceType.B, r.MinimumType);
        Assert.Null(r.RequiredType);
        Assert.StartsWith("Required type cannot be determined from this capture: at least type B; whether content between 1 and 20 kHz needs B+ cannot be determined", r.Headline, StringComparison.Ordinal);
    }

    [Fact]
    public void Too_few_pulsating_windows_weigh_their_dc_as_dc()
    {
        // --pulsating-share 0.5 with 30 % pulsating windows: no pulsating-DC class, and the DC above the floor is
        // weighted as DC, not by type A's 1.4 pulsating factor.
        var a = new AnalysisBuilder().HalfWave(0.020, 0).Build();
        a = a with { Components = a.Components with { PulsatingDcShare = 0.3 } };
        var r = DeviceTypeAssessor.Assess(a, new AssessmentOptions { PulsatingShareThreshold = 0.5, InstalledType = DeviceType.B });
        Assert.Equal("DC above the floor", r.NuisanceTrip.Contributions[1].Label);
        Assert.Equal(2, r.NuisanceTrip.Contributions[1].TripFactor);
    }

    [Fact]
    public void Outside_a_charging_point_there_is_no_charging_point_caution_and_at_one_type_a_is_not_refused_for_it()
    {
        var plain = Assess(new AnalysisBuilder().Sine(0.005).SmoothDc(0.002));
        Assert.DoesNotContain(plain.Cautions, c => c.Contains("charging point", StringComparison.Ordinal));
        var ev = Assess(new AnalysisBuilder().Sine(0.005), new AssessmentOptions { EvChargingPoint = true, ChargerDcDetection = true });
        Assert.Equal(true, ev.Types[1].Suitable);
        Assert.DoesNotContain(ev.Types[1].Reasons, c => c.StartsWith("charging point", StringComparison.Ordinal));
    }

    [Fact]
    public void Content_seen_above_1_khz_below_40_kS_per_s_requires_b_plus_without_an_open_remark()
    {
        // 4 mA at 8 kHz seen at 25 kS/s: the high-frequency class is present (DIN VDE 0664-400: B+ to 20 kHz), so
        // B+ is required, and nothing above it is left open.
        var r = Assess(new AnalysisBuilder().SampleRate(25_000).Sine(0.005).HighFrequency(8000, 0.004));
        Assert.Equal(DeviceType.BPlus, r.RequiredType);
        Assert.Equal("Type B+ required: " + r.Classes.Single(c => c.Class == ResidualCurrentClass.HighFrequency).Text, r.Headline);
    }
}

