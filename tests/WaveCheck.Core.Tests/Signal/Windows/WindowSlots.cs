using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>Windows as the pipeline hands them on, built directly for the tests of its steps.</summary>
internal static class WindowSlots
{
    /// <summary>A slot holding <paramref name="samples"/> with its moments, start, frequency and spectrum (from the
    /// library's own <see cref="RealSpectrum"/>, checked against the plain DFT in RealSpectrumTests).</summary>
    public static WindowSlot Load(double[] samples, long start, double frequencyHz, int maxOrder = 50, int bandCount = 0)
    {
        var slot = new WindowSlot(samples.Length, maxOrder, bandCount);
        samples.CopyTo(slot.Samples, 0);
        slot.Length = samples.Length;
        slot.Start = start;
        slot.FrequencyHz = frequencyHz;
        slot.Moments = SampleMath.Moments(samples);
        new RealSpectrum(samples.Length).Power(samples, slot.Power);
        return slot;
    }

    /// <summary>Window figures with the given values and every other figure zero.</summary>
    public static WindowResult Result(double startS, double rmsA, double durationS = 0.2, bool clipped = false,
        double frequencyHz = 50, double smoothDcA = 0, double dcA = 0, bool pulsating = false) => new()
        {
            StartS = startS,
            DurationS = durationS,
            FrequencyHz = frequencyHz,
            RmsA = rmsA,
            DcA = dcA,
            AcRmsA = rmsA,
            PeakPositiveA = 0,
            PeakNegativeA = 0,
            CrestFactor = 0,
            SmoothDcA = smoothDcA,
            PulsatingDc = pulsating,
            MainsRmsA = 0,
            BelowMainsRmsA = 0,
            HarmonicsRmsA = 0,
            Above1kHzRmsA = 0,
            Above9kHzRmsA = 0,
            Clipped = clipped,
        };
}
