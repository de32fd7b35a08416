using System.Buffers;
using System.Globalization;

namespace WaveCheck.Core.Capture.Comtrade;

/// <summary>
/// Which sample-rate section of a record is delivered, and at what rate. One block carries one rate, so where the cfg
/// has several sections only the longest is analysed (resampling would either invent bandwidth the slow section never
/// had or throw away what the fast section recorded); a cfg with no rate has it derived from the data's time stamps.
/// </summary>
internal static class ComtradeSections
{
    /// <summary>Most frames read to derive a rate from time stamps.</summary>
    private const int RateProbeFrames = 65536;

    /// <summary>The section delivered: the longest in seconds, on a tie the faster; with a <c>rate-sections</c>
    /// warning when there are several.</summary>
    /// <param name="config">The cfg.</param>
    /// <param name="warnings">Receives the warning.</param>
    /// <returns>The section, and its start in seconds from the record's start.</returns>
    public static (ComtradeRateSection Section, double StartS) Choose(ComtradeConfig config, List<CaptureWarning> warnings)
    {
        var sections = config.RateSections;
        var best = 0;
        for (var i = 1; i < sections.Count; i++)
        {
            var (d, bd) = (sections[i].DurationS, sections[best].DurationS);
            if (d > bd || (d == bd && sections[i].RateHz > sections[best].RateHz))
            {
                best = i;
            }
        }

        var startS = 0.0;
        for (var i = 0; i < best; i++)
        {
            startS += sections[i].DurationS;
        }

        if (sections.Count > 1)
        {
            var list = string.Join("; ", sections.Select(s =>
                $"{s.RateHz.ToString(CultureInfo.InvariantCulture)} Hz for samples {s.FirstSample}-{s.LastSample} ({s.DurationS.ToString("0.###", CultureInfo.InvariantCulture)} s)"));
            var chosen = sections[best];
            warnings.Add(new CaptureWarning("rate-sections",
                $"the record has {sections.Count} sample-rate sections ({list}); only the longest, {chosen.RateHz.ToString(CultureInfo.InvariantCulture)} Hz for samples {chosen.FirstSample}-{chosen.LastSample}, is analysed; times count from its start",
                startS));
        }

        return (sections[best], startS);
    }

    /// <summary>The rate of a cfg that states none (<c>nrates = 0</c>), from the time stamps of the first samples
    /// (at most <see cref="RateProbeFrames"/>), with a <c>rate-from-timestamps</c> warning.</summary>
    /// <param name="container">Where the data lies.</param>
    /// <param name="config">The cfg.</param>
    /// <param name="warnings">Receives the warning.</param>
    /// <exception cref="CaptureFormatException">The stamps do not increase, or give a rate out of bounds.</exception>
    public static double RateFromTimestamps(ComtradeContainer container, ComtradeConfig config, List<CaptureWarning> warnings)
    {
        // At most 4 M values, whatever the channel count, so the probe's memory stays bounded.
        var frames = (int)Math.Min(config.TotalSamples, Math.Max(2, Math.Min(RateProbeFrames, (1 << 22) / config.Analog.Count)));
        var raw = ArrayPool<double>.Shared.Rent(frames * config.Analog.Count);
        var stamps = ArrayPool<long>.Shared.Rent(frames);
        try
        {
            using var probe = ComtradeDataReader.Open(container, config);
            var got = probe.Read(raw, stamps, frames);
            int first = -1, last = -1;
            for (var i = 0; i < got; i++)
            {
                if (stamps[i] >= 0)
                {
                    first = first < 0 ? i : first;
                    last = i;
                }
            }

            var spanS = first >= 0 ? (stamps[last] - stamps[first]) * config.TimeMultiplier * config.TimestampBaseS : 0;
            if (last <= first || !(spanS > 0))
            {
                throw new CaptureFormatException(container.DataPath,
                    "the cfg gives no sample rate (nrates = 0) and the data's time stamps do not increase, so no rate can be derived");
            }

            var rateHz = (last - first) / spanS;
            if (CaptureLimits.RateProblem(rateHz) is { } rateProblem)
            {
                throw new CaptureFormatException(container.DataPath, string.Create(CultureInfo.InvariantCulture,
                    $"the cfg gives no sample rate (nrates = 0) and the time stamps of samples {first + 1} to {last + 1} (time multiplier {config.TimeMultiplier}) give a {rateProblem}"));
            }

            warnings.Add(new CaptureWarning("rate-from-timestamps",
                $"the cfg gives no sample rate (nrates = 0); {rateHz.ToString("0.###", CultureInfo.InvariantCulture)} Hz is derived from the time stamps of samples {first + 1} to {last + 1} (time multiplier {config.TimeMultiplier.ToString(CultureInfo.InvariantCulture)})"));
            return rateHz;
        }
        finally
        {
            ArrayPool<double>.Shared.Return(raw);
            ArrayPool<long>.Shared.Return(stamps);
        }
    }
}
