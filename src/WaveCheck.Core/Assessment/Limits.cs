using WaveCheck.Core.Model;
namespace WaveCheck.Core.Assessment;

/// <summary>
/// Every threshold a verdict uses, in SI units, each with its source and status as listed in the project's
/// reference table: <b>std</b> (the standard's value as reproduced in public secondary sources), <b>from memory</b>
/// (not confirmed against the standard's text: overridable and marked so in the output), <b>practice</b>, or
/// <b>engineering choice</b> with the reasoning. Values a user may reasonably dispute can be overridden through
/// <see cref="AssessmentOptions"/>; the ones applied travel into <c>AssessmentResult.Thresholds</c>.
/// </summary>
public static partial class Limits
{
    /// <summary>Default rated residual operating current IΔn, 0.030 A.</summary>
    /// <remarks>Practice: 30 mA is the additional-protection rating (IEC 60364-4-41 §415.1); rated values in use are
    /// 10, 30, 100, 300, 500 mA.</remarks>
    public const double DefaultRatedResidualCurrentA = 0.030;

    /// <summary>Rated residual operating currents IΔn in use: 6, 10, 30, 100, 300 and 500 mA, and 1 A.</summary>
    /// <remarks>Practice (10, 30, 100, 300, 500 mA and 1 A for some, as in the project's reference table); 6 mA
    /// from memory (devices for personal protection in some markets). A rating off this list is accepted but
    /// cautioned about: it is more often a slip in the value or its unit than a device, and a unit slip changes every
    /// margin a thousandfold.</remarks>
    public static IReadOnlyList<double> RatedResidualCurrentsInUseA { get; } = [0.006, 0.010, 0.030, 0.100, 0.300, 0.500, 1.0];

    /// <summary>Whether <paramref name="ratedA"/> is one of <see cref="RatedResidualCurrentsInUseA"/> (to 0.1 %, the
    /// rounding of a value typed in another unit).</summary>
    /// <param name="ratedA">IΔn, amperes.</param>
    public static bool IsRatingInUse(double ratedA) =>
        RatedResidualCurrentsInUseA.Any(r => Math.Abs(ratedA - r) <= 1e-3 * r);

    /// <summary>A "residual current" whose mains-frequency RMS (harmonic group 1) reaches 1 A is implausible and
    /// warned about loudly.</summary>
    /// <remarks>Engineering choice: 1 A is the largest rating in <see cref="RatedResidualCurrentsInUseA"/>, twice its
    /// non-operating current; a circuit that really leaked this much at mains frequency would trip any residual-current
    /// device in use, so a capture showing it has almost always recorded one conductor's load current (a clamp round a
    /// phase, a logger channel of a phase current) instead of the sum of all live conductors. Its verdict would read
    /// "type AC sufficient" for a plain load current, which is why the warning comes first.</remarks>
    public const double ImplausibleResidualMainsRmsA = 1.0;

    /// <summary>Rated residual non-operating current as a fraction of IΔn: 0.5.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1 (Table 1: AC tripping range 0.5 to 1.0 IΔn), std. A standing current at or
    /// above it may trip a healthy device.</remarks>
    public const double NonOperatingFraction = 0.5;

    /// <summary>Leakage budget downstream of an RCD as a fraction of IΔn: 0.3 (9 mA for 30 mA).</summary>
    /// <remarks>IEC 60364-5-53:2015 §531.3.2 (as in national wiring rules), std.</remarks>
    public const double LeakageBudgetFraction = 0.3;

    /// <summary>Nuisance risk "likely" at or above this fraction of IΔn of weighted standing current: 0.5.</summary>
    /// <remarks>Engineering choice: the non-operating limit (IEC 61008-1) itself; above it the standard allows the
    /// device to trip.</remarks>
    public const double LikelyRiskFraction = NonOperatingFraction;

    /// <summary>Nuisance risk "possible" at or above this fraction of IΔn: 0.3.</summary>
    /// <remarks>Engineering choice: the 0.3 IΔn leakage budget (IEC 60364-5-53 §531.3.2); between it and 0.5 IΔn a
    /// transient (switch-on surge, a second load) can close the remaining gap.</remarks>
    public const double PossibleRiskFraction = LeakageBudgetFraction;

    /// <summary>Smooth DC a type A device still works with: 0.006 A.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1 type A (pulsating DC with 6 mA smooth DC superimposed), std.</remarks>
    public const double TypeASmoothDcToleranceA = 0.006;

    /// <summary>Smooth DC a type F device still works with: 0.010 A.</summary>
    /// <remarks>IEC 62423 type F (pulsating DC on smooth DC up to 10 mA), std.</remarks>
    public const double TypeFSmoothDcToleranceA = 0.010;

    /// <summary>Type B works with superimposed smooth DC up to this fraction of IΔn (or <see cref="TypeBSmoothDcToleranceMinA"/>, whichever is higher): 0.4.</summary>
    /// <remarks>IEC 62423 type B, std.</remarks>
    public const double TypeBSmoothDcToleranceFraction = 0.4;

    /// <summary>Lower bound of the type B smooth-DC tolerance: 0.010 A.</summary>
    /// <remarks>IEC 62423 type B ("0.4 IΔn or 10 mA, whichever is higher"), std.</remarks>
    public const double TypeBSmoothDcToleranceMinA = 0.010;

    /// <summary>Smooth DC at which an RDC-DD disconnects: 0.006 A.</summary>
    /// <remarks>IEC 62955 (threshold std; its trip times 10 s at 6 mA, 0.3 s at 60 mA, 0.1 s at 200 mA from memory).
    /// IEC 60364-7-722 asks for type B, or type A plus an RDC-DD, where DC ≥ 6 mA cannot be ruled out (std).</remarks>
    public const double RdcDdThresholdA = 0.006;

    /// <summary>Upper tripping limit of type B (and F, per the same clause) at 150 Hz, multiples of IΔn: 2.4.</summary>
    /// <remarks>IEC 62423 §5.3, from memory.</remarks>
    public const double FrequencyFactor150Hz = 2.4;

    /// <summary>Upper tripping limit at 400 Hz, multiples of IΔn: 6.</summary>
    /// <remarks>IEC 62423 §5.3, from memory.</remarks>
    public const double FrequencyFactor400Hz = 6.0;

    /// <summary>Upper tripping limit at 1 kHz, multiples of IΔn: 14.</summary>
    /// <remarks>IEC 62423 §5.3, from memory. Above 1 kHz type B's response is not defined; the weighting holds this
    /// factor (engineering choice: no credit for a further fall in sensitivity the standard does not promise).</remarks>
    public const double FrequencyFactor1kHz = 14.0;

    /// <summary>Upper tripping limit of type B smooth DC, multiples of IΔn: 2.</summary>
    /// <remarks>IEC 62423 (B smooth DC trips between 0.5 and 2 IΔn), std.</remarks>
    public const double TypeBSmoothDcFactor = 2.0;

    /// <summary>Upper tripping limit of pulsating DC, multiples of IΔn: 1.4 (for IΔn above 10 mA).</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, type A half-wave at 0°, 90°, 135°: upper limit 1.4 IΔn, std.</remarks>
    public const double PulsatingDcFactor = 1.4;

    /// <summary>Upper limit of B+ (extended type B) up to 20 kHz: 0.420 A.</summary>
    /// <remarks>DIN VDE 0664-400/-401 (designation std; the 420 mA value from memory). Used as the B+ weighting
    /// above 1 kHz as 420 mA / IΔn, never above <see cref="FrequencyFactor1kHz"/> (engineering choice: conservative).</remarks>
    public const double BPlusUpperLimitA = 0.420;

    /// <summary>Upper frequency of B+'s defined tripping: 20 000 Hz.</summary>
    /// <remarks>DIN VDE 0664-400 (B+ tripping defined up to 20 kHz), std.</remarks>
    public const double BPlusUpperFrequencyHz = DeviceFrequencyRanges.TypeBPlusUpperHz;

    /// <summary>Upper frequency of type B's defined tripping (and of "composite" content for type F): 1000 Hz.</summary>
    /// <remarks>IEC 62423 (type B: sinusoidal AC up to 1 kHz; type F's composite test current includes a 1 kHz
    /// component), std.</remarks>
    public const double TypeBUpperFrequencyHz = DeviceFrequencyRanges.TypeFbUpperHz;

    /// <summary>Sample rate at which the B+ question can be answered: 2 × 20 kHz = 40 000 Hz (Nyquist).</summary>
    /// <remarks>Derived from <see cref="BPlusUpperFrequencyHz"/>. The caution recommends ≥ 50 kS/s
    /// (<see cref="RecommendedSampleRateHz"/>).</remarks>
    public const double BPlusMinimumSampleRateHz = 2 * BPlusUpperFrequencyHz;

    /// <summary>Sample rate recommended in cautions: 50 000 Hz.</summary>
    /// <remarks>Engineering choice: 25 % above the 40 kS/s Nyquist minimum so an anti-alias filter's transition band
    /// lies above 20 kHz.</remarks>
    public const double RecommendedSampleRateHz = 50_000;

    /// <summary>Absolute floor of every "significant content" threshold: 0.001 A.</summary>
    /// <remarks>Engineering choice: above the zero offset of a typical DC-capable leakage clamp (some 0.1 to 0.5 mA)
    /// and one sixth of the 6 mA type A tolerance, so a real 6 mA question is never hidden; one tenth of a 10 mA
    /// device's IΔn.</remarks>
    public const double SignificanceFloorA = 0.001;

    /// <summary>Smooth DC counts as present (class "smooth DC", type B) at or above <see cref="SignificanceFloorA"/>,
    /// 1 mA, within the measurement uncertainty (<see cref="MeasurementAccuracy"/>).</summary>
    /// <remarks>Engineering choice: a fixed level, not a share of the capture's other content, so that adding content
    /// to a waveform never hides its DC (the verdict is monotone). 1 mA lies above the zero offset of a DC-capable
    /// leakage clamp and is a sixth of the 6 mA that type A tolerates. The 6 mA (A) and 10 mA (F) tolerances say how
    /// much superimposed DC those types still work with; they do not make A or F fit for a circuit that itself
    /// produces smooth DC residual current (REFERENCE "tolerance is not fitness"; IEC 60364-5-53 §531.3.3).</remarks>
    public const double DcSignificanceA = SignificanceFloorA;

    /// <summary>A motor-frequency component (sub-mains content, or a non-harmonic tone up to
    /// <see cref="MotorFrequencyTopMultiple"/> × mains) marks a converter's composite current (type F) at or above
    /// max(<see cref="SignificanceFloorA"/>, this fraction × IΔn): 0.05.</summary>
    /// <remarks>Engineering choice: fixed for a given device (never a share of the capture's own content, so that
    /// adding content cannot hide the class); at 1.5 mA for 30 mA a motor-frequency part well above clamp noise and
    /// window-edge leakage of the mains component.</remarks>
    public const double MotorFrequencySignificanceFraction = 0.05;

    /// <summary>AC at frequencies other than mains up to 1 kHz (harmonic groups from order 2 of windows that are not
    /// pulsating DC, and non-harmonic tones above <see cref="MotorFrequencyTopMultiple"/> × mains) is present
    /// (type B: "sinusoidal AC up to 1 kHz", IEC 62423) at or above max(<see cref="SignificanceFloorA"/>, this
    /// fraction × IΔn): 0.1.</summary>
    /// <remarks>Engineering choice: a leakage within the 0.3 IΔn budget (IEC 60364-5-53 §531.3.2) with the 5 to 20 %
    /// harmonic content that a distorted supply drives through filter capacitance stays below it (at 33 % distortion
    /// it reaches it), while a converter's own non-mains current at a tenth of IΔn is counted. Fixed for a given
    /// device, so adding content never hides the class.</remarks>
    public const double HarmonicSignificanceFraction = 0.1;

    /// <summary>Content between 1 and 20 kHz is present (type B+) at or above max(<see cref="SignificanceFloorA"/>, this
    /// fraction × IΔn): 0.1.</summary>
    /// <remarks>Engineering choice, as for <see cref="HarmonicSignificanceFraction"/>. For a phase-controlled
    /// half-wave the content its own firing edge puts above 1 kHz (closed-form Fourier series of the ideal waveform)
    /// is taken off first, so a dimmer does not read as a switching converter.</remarks>
    public const double HighFrequencySignificanceFraction = 0.1;

    /// <summary>Non-harmonic tones up to this multiple of mains count as a motor frequency (type F's composite
    /// current); above it as AC at another frequency (type B): 2.</summary>
    /// <remarks>Practice: drive output (motor) frequencies run from 0 to about 100 Hz (REFERENCE, "which loads make
    /// which residual current"); IEC 62423's composite test current uses 10 Hz beside the rated frequency.</remarks>
    public const double MotorFrequencyTopMultiple = 2.0;

    /// <summary>Pulsating DC counts as present when at least this share of windows is pulsating DC with a pulse mean
    /// at or above <see cref="DcSignificanceA"/>: 0 (any one window).</summary>
    /// <remarks>Engineering choice: a load that runs phase-controlled for one window in a thousand still needs a device
    /// that detects it; a misjudged window only ever asks for a stronger type.</remarks>
    public const double PulsatingShareThreshold = 0;

    /// <summary>With the sensor coupling not stated, a capture whose mean stays within this share of its RMS (and
    /// within the measurement uncertainty) while its windows are one-sided pulses on a floor far from zero bears the
    /// signature of an AC-coupled sensor, and is treated as one: 0.02.</summary>
    /// <remarks>Engineering choice: a DC-coupled capture of pulsating DC has a mean of about a third of its peak
    /// (closed form Ipk/π at 0°); a mean near zero with a floor at −Ipk/π is what a current transformer makes of it.</remarks>
    public const double AcCouplingMeanFraction = 0.02;

    /// <summary>A tone within this fraction of the mains frequency from a harmonic is counted as that harmonic: 0.05.</summary>
    /// <remarks>Engineering choice: half a 5 Hz bin at 50 Hz, the resolution of IEC 61000-4-7 windows.</remarks>
    public const double HarmonicToneToleranceFraction = 0.05;

    /// <summary>Phase-controlled half-waves with a delay angle below this are treated as uncontrolled: 10°.</summary>
    /// <remarks>Engineering choice: below 10° the firing edge is under 17 % of the peak and its high-frequency content
    /// negligible.</remarks>
    public const double MinimumDelayAngleDeg = 10;

    /// <summary>UL 943 Class A GFCI must trip at or above 0.006 A.</summary>
    /// <remarks>UL 943, std.</remarks>
    public const double GfciClassAMustTripA = 0.006;

    /// <summary>UL 943 Class A GFCI must not trip below 0.004 A.</summary>
    /// <remarks>UL 943, std.</remarks>
    public const double GfciClassAMustNotTripA = 0.004;

    /// <summary>Special-purpose GFCI (UL 943C classes C, D, E) trip threshold, upper end: 0.020 A.</summary>
    /// <remarks>UL 943C (15 to 20 mA), std.</remarks>
    public const double GfciSpecialPurposeTripA = 0.020;

    /// <summary>Special-purpose GFCI trip threshold, lower end: 0.015 A.</summary>
    /// <remarks>UL 943C (15 to 20 mA), std.</remarks>
    public const double GfciSpecialPurposeLowA = 0.015;

    /// <summary>UL 943 trip-time formula T = (<see cref="GfciTripTimeReferenceA"/> / I)^<see cref="GfciTripTimeExponent"/> s: reference current 0.020 A.</summary>
    /// <remarks>UL 943 (I in mA rms, valid 6 to 264 mA), std.</remarks>
    public const double GfciTripTimeReferenceA = 0.020;

    /// <summary>Exponent of the UL 943 trip-time formula: 1.43.</summary>
    /// <remarks>UL 943, std.</remarks>
    public const double GfciTripTimeExponent = 1.43;

    /// <summary>Upper end of the UL 943 trip-time formula's range: 0.264 A.</summary>
    /// <remarks>UL 943, std.</remarks>
    public const double GfciTripTimeMaxA = 0.264;

    /// <summary>General type: break time at IΔn, 0.300 s.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, table of break times for AC residual current, general type: 300 ms at IΔn, std.</remarks>
    public const double GeneralBreakTimeAt1S = 0.300;

    /// <summary>General type: break time at 2 IΔn, 0.150 s.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, general type: 150 ms at 2 IΔn, std.</remarks>
    public const double GeneralBreakTimeAt2S = 0.150;

    /// <summary>General type: break time at 5 IΔn, 0.040 s.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, general type: 40 ms at 5 IΔn, std. Above 5 IΔn the same limit is applied
    /// (the standard's higher test currents share it; from memory).</remarks>
    public const double GeneralBreakTimeAt5S = 0.040;

    /// <summary>Type S: break time at IΔn, 0.500 s.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, time-delayed type S: 500 ms at IΔn, std.</remarks>
    public const double TimeDelayedBreakTimeAt1S = 0.500;

    /// <summary>Type S: break time at 2 IΔn, 0.200 s.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, type S: 200 ms at 2 IΔn, std.</remarks>
    public const double TimeDelayedBreakTimeAt2S = 0.200;

    /// <summary>Type S: break time at 5 IΔn, 0.150 s.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, type S: 150 ms at 5 IΔn, std.</remarks>
    public const double TimeDelayedBreakTimeAt5S = 0.150;

    /// <summary>Type S: minimum non-actuating time at IΔn, 0.130 s: a compliant S device holds for at least this long.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, type S: 130 ms at IΔn, std.</remarks>
    public const double TimeDelayedNonActuatingAt1S = 0.130;

    /// <summary>Type S: minimum non-actuating time at 2 IΔn, 0.060 s.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, type S: 60 ms at 2 IΔn, std (50 ms is also seen in secondary sources; the
    /// replay's ride-through finding then needs a shorter surge: state the device's own figure where it matters).</remarks>
    public const double TimeDelayedNonActuatingAt2S = 0.060;

    /// <summary>Type S: minimum non-actuating time at 5 IΔn, 0.050 s.</summary>
    /// <remarks>IEC 61008-1 / IEC 61009-1, type S: 50 ms at 5 IΔn, std; applied above 5 IΔn as well (from memory).</remarks>
    public const double TimeDelayedNonActuatingAt5S = 0.050;

    /// <summary>Type B, smooth or rectified DC: break time at 2 IΔn, 0.300 s.</summary>
    /// <remarks>IEC 62423, break times for smooth DC: 300 / 150 / 40 ms at 2 / 4 / 10 IΔn, std.</remarks>
    public const double DcBreakTimeAt2S = 0.300;

    /// <summary>Type B, smooth DC: break time at 4 IΔn, 0.150 s.</summary>
    /// <remarks>IEC 62423, std.</remarks>
    public const double DcBreakTimeAt4S = 0.150;

    /// <summary>Type B, smooth DC: break time at 10 IΔn, 0.040 s.</summary>
    /// <remarks>IEC 62423, std.</remarks>
    public const double DcBreakTimeAt10S = 0.040;

    /// <summary>An episode counts as smooth DC for type B's DC break times when its mean is at least this share of its
    /// RMS: 0.9.</summary>
    /// <remarks>Engineering choice: a six-pulse rectified current has a mean of 0.9983 of its RMS, a 50 % AC ripple
    /// on DC 0.94; a sine 0. Anything less DC-like is replayed against the AC break times, which are shorter at the
    /// same current (the safe side for the "would have tripped" finding).</remarks>
    public const double DcDominatedMeanShare = 0.9;

    /// <summary>Time resolution of a replayed duration, in half-cycles: 2 (one mains cycle).</summary>
    /// <remarks>Engineering choice: a duration is counted in whole half-cycles at or above a level, and each end of a
    /// surge may fall in a half-cycle that it only partly fills, so the true duration lies within two half-cycles of
    /// the count. A duration within this of a time limit is "at the limit" and resolved to the safe side: counted as
    /// reaching a must-trip time, not counted as riding through a non-actuating time.</remarks>
    public const int ReplayTimeResolutionHalfCycles = 2;

    /// <summary>General type: the break times as (multiple of IΔn, seconds), ascending.</summary>
    public static IReadOnlyList<(double Multiple, double TimeS)> GeneralBreakTimes { get; } =
        [(1, GeneralBreakTimeAt1S), (2, GeneralBreakTimeAt2S), (5, GeneralBreakTimeAt5S)];

    /// <summary>Type S: the break times.</summary>
    public static IReadOnlyList<(double Multiple, double TimeS)> TimeDelayedBreakTimes { get; } =
        [(1, TimeDelayedBreakTimeAt1S), (2, TimeDelayedBreakTimeAt2S), (5, TimeDelayedBreakTimeAt5S)];

    /// <summary>Type S: the non-actuating times.</summary>
    public static IReadOnlyList<(double Multiple, double TimeS)> TimeDelayedNonActuatingTimes { get; } =
        [(1, TimeDelayedNonActuatingAt1S), (2, TimeDelayedNonActuatingAt2S), (5, TimeDelayedNonActuatingAt5S)];

    /// <summary>Type B, smooth DC: the break times.</summary>
    public static IReadOnlyList<(double Multiple, double TimeS)> DcBreakTimes { get; } =
        [(2, DcBreakTimeAt2S), (4, DcBreakTimeAt4S), (10, DcBreakTimeAt10S)];

    /// <summary>Rated residual currents replayed as alternatives to the installed one: the next two of these above it, amperes.</summary>
    /// <remarks>Practice: rated IΔn values in use are 10, 30, 100, 300, 500 mA (REFERENCE "rated IΔn values in use").</remarks>
    public static IReadOnlyList<double> RatingsInUseA { get; } = [0.010, 0.030, 0.100, 0.300, 0.500];

    /// <summary>Highest IΔn of the additional protection a final circuit needs: 0.030 A.</summary>
    /// <remarks>IEC 60364-4-41 §415.1 (additional protection by RCDs with IΔn not above 30 mA), std.</remarks>
    public const double AdditionalProtectionMaxA = 0.030;

    /// <summary>Type B smooth-DC tolerance at a rating: max(0.4 IΔn, 10 mA) (IEC 62423).</summary>
    /// <param name="ratedA">IΔn, amperes.</param>
    public static double TypeBSmoothDcToleranceA(double ratedA) =>
        Math.Max(TypeBSmoothDcToleranceFraction * ratedA, TypeBSmoothDcToleranceMinA);
}
