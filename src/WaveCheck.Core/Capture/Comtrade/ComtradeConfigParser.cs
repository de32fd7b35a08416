using System.Globalization;

namespace WaveCheck.Core.Capture.Comtrade;

/// <summary>
/// Reads a COMTRADE configuration (IEEE C37.111-1991, -1999, -2013 / IEC 60255-24:2013) line by line.
/// Clause numbers below are those of C37.111-2013 clause 7.4 (1999: clause 6.4, same order), from memory.
/// Errors name the line and the field (1-based, counted in comma-separated fields).
/// </summary>
public static class ComtradeConfigParser
{
    /// <summary>Most sample-rate sections (engineering choice: a recorder switches rate a handful of times).</summary>
    public const int MaxRateSections = 1000;

    /// <summary>Parses cfg text.</summary>
    /// <param name="filePath">The file named in error messages.</param>
    /// <param name="lines">The cfg lines in order.</param>
    /// <param name="firstLineNumber">1-based line number of the first line in the file (a .cff's CFG section starts after its header).</param>
    /// <param name="warnings">Receives recoverable findings (a date that is no calendar date).</param>
    /// <returns>The configuration.</returns>
    /// <exception cref="CaptureFormatException">A line does not parse; the place is line and field.</exception>
    public static ComtradeConfig Parse(string filePath, IReadOnlyList<string> lines, int firstLineNumber,
        ICollection<CaptureWarning> warnings)
    {
        ArgumentNullException.ThrowIfNull(lines);
        ArgumentNullException.ThrowIfNull(warnings);
        var cursor = new ComtradeCfgCursor(filePath, lines, firstLineNumber);

        // 7.4.2 line 1: station_name,rec_dev_id,rev_year (1991 has no rev_year).
        var id = cursor.Next("station name, device id and revision year");
        var revision = 1991;
        if (id.Count >= 3 && id[2].Length > 0)
        {
            revision = id[2] switch
            {
                "1991" => 1991,
                "1999" => 1999,
                "2013" => 2013,
                _ => throw id.Error(3, $"revision year '{id.Shown(2)}' is not 1991, 1999 or 2013"),
            };
        }

        // 7.4.2 line 2: TT,##A,##D.
        var counts = cursor.Next("channel counts TT,##A,##D");
        counts.RequireFields(3, "channel counts", "TT,##A,##D");
        var total = counts.Int(1, "total channel count");
        var analogCount = CountWithSuffix(counts, 2, 'A', "analog");
        var digitalCount = CountWithSuffix(counts, 3, 'D', "digital");
        if (analogCount > CaptureLimits.MaxChannels)
        {
            throw counts.Error(2, $"analog channel count {analogCount} is more than the {CaptureLimits.MaxChannels} channels read");
        }

        if (digitalCount > CaptureLimits.MaxDigitalChannels)
        {
            throw counts.Error(3, $"digital channel count {digitalCount} is more than the {CaptureLimits.MaxDigitalChannels} channels read");
        }

        if (total != analogCount + digitalCount)
        {
            throw counts.Error(1, $"total channel count {total} is not {analogCount}A + {digitalCount}D");
        }

        var analog = new List<ComtradeAnalogChannel>(analogCount);
        for (var i = 1; i <= analogCount; i++)
        {
            analog.Add(ParseAnalog(cursor.Next($"analog channel {i}"), i, revision));
        }

        var digital = new List<ComtradeDigitalChannel>(digitalCount);
        for (var i = 1; i <= digitalCount; i++)
        {
            digital.Add(ParseDigital(cursor.Next($"digital channel {i}"), i, revision));
        }

        // 7.4.5 line frequency.
        var lf = cursor.Next("line frequency");
        var lineFrequency = lf.Number(1, "line frequency");
        if (lineFrequency is < 0 or > 1000)
        {
            throw lf.Error(1, $"line frequency {lf.Shown(0)} Hz is outside 0 to 1000 Hz");
        }

        // 7.4.6 nrates, then nrates lines samp,endsamp; nrates = 0 is followed by one line 0,endsamp.
        var nratesLine = cursor.Next("number of sample rates nrates");
        var nrates = nratesLine.Int(1, "number of sample rates");
        if (nrates is < 0 or > MaxRateSections)
        {
            throw nratesLine.Error(1, $"number of sample rates {nrates} is outside 0 to {MaxRateSections}");
        }

        var sections = new List<ComtradeRateSection>();
        long previousEnd = 0;
        for (var i = 1; i <= Math.Max(nrates, 1); i++)
        {
            var rateLine = cursor.Next($"sample rate {i} samp,endsamp");
            rateLine.RequireFields(2, $"sample rate {i}", "samp,endsamp");
            var rate = rateLine.Number(1, $"sample rate {i}: rate");
            if (nrates > 0 && CaptureLimits.RateProblem(rate) is not null)
            {
                throw rateLine.Error(1, $"sample rate {i}: rate {CaptureLimits.Hz(rate)} is outside {CaptureLimits.RateRange}");
            }

            var end = rateLine.Long(2, $"sample rate {i}: last sample number");
            if (end <= previousEnd)
            {
                throw rateLine.Error(2, $"sample rate {i}: last sample number {end} does not follow {previousEnd}");
            }

            if (end > CaptureLimits.MaxSampleCount)
            {
                throw rateLine.Error(2, $"sample rate {i}: last sample number {end} is more than the {CaptureLimits.MaxSampleCount} samples a capture may hold");
            }

            sections.Add(new ComtradeRateSection(nrates == 0 ? 0 : rate, previousEnd + 1, end) { Line = rateLine.Line });
            previousEnd = end;
        }

        // 7.4.7 start (first data point) and trigger time stamps.
        var start = ParseStamp(cursor.Next("start date and time"), revision, "start", warnings, out var startDigits);
        var trigger = ParseStamp(cursor.Next("trigger date and time"), revision, "trigger", warnings, out _);

        // 7.4.8 data file type.
        var ftLine = cursor.Next("data file type");
        var fileType = ftLine[0].ToUpperInvariant() switch
        {
            "ASCII" => ComtradeDataFileType.Ascii,
            "BINARY" => ComtradeDataFileType.Binary,
            "BINARY32" => ComtradeDataFileType.Binary32,
            "FLOAT32" => ComtradeDataFileType.Float32,
            _ => throw ftLine.Error(1, $"data file type '{ftLine.Shown(0)}' is not ASCII, BINARY, BINARY32 or FLOAT32"),
        };

        // 7.4.9 timemult (1999 and later); absent in 1991.
        var timeMultiplier = 1.0;
        if (revision >= 1999 && cursor.TryNext(out var tm))
        {
            timeMultiplier = tm.Number(1, "time stamp multiplier");
            if (!(timeMultiplier > 0) || CaptureLimits.ScaleProblem("time stamp multiplier", timeMultiplier, string.Empty) is not null)
            {
                throw tm.Error(1, $"time stamp multiplier {tm.Shown(0)} is outside {CaptureLimits.MinScaleFactor:G3} to {CaptureLimits.MaxScaleFactor:G3}");
            }
        }

        // 7.4.10 time_code,local_code (2013): the offset from UTC in which the stamps are written.
        TimeSpan? offset = null;
        if (revision >= 2013 && cursor.TryNext(out var codes))
        {
            offset = ParseTimeCode(codes, 1, "time code");
            if (codes.Count >= 2 && !codes[1].Equals("x", StringComparison.OrdinalIgnoreCase) && codes[1].Length > 0)
            {
                ParseTimeCode(codes, 2, "local code");
            }

            // 7.4.11 tmq_code,leapsec: time quality; read past, not used.
            cursor.TryNext(out _);
        }

        return new ComtradeConfig
        {
            StationName = id[0],
            DeviceId = id.Count >= 2 ? id[1] : string.Empty,
            RevisionYear = revision,
            Analog = analog,
            Digital = digital,
            LineFrequencyHz = lineFrequency,
            RateSections = sections,
            StartTime = WithOffset(start, offset),
            TriggerTime = WithOffset(trigger, offset),
            TimeZoneStated = offset is not null,
            FileType = fileType,
            TimeMultiplier = timeMultiplier,
            // From memory (2013 7.4.7): stamps written to nanoseconds make the data time stamps count nanoseconds.
            TimestampBaseS = revision >= 2013 && startDigits > 6 ? 1e-9 : 1e-6,
        };
    }

    private static ComtradeAnalogChannel ParseAnalog(ComtradeCfgFields f, int i, int revision)
    {
        // 7.4.3 An,ch_id,ph,ccbm,uu,a,b,skew,min,max[,primary,secondary,PS] (the last three from 1999).
        var what = $"analog channel {i}";
        if (revision >= 1999 || f.Count > 10)
        {
            f.RequireFields(13, what, "An,ch_id,ph,ccbm,uu,a,b,skew,min,max,primary,secondary,PS");
        }
        else
        {
            f.RequireFields(10, what, "An,ch_id,ph,ccbm,uu,a,b,skew,min,max");
        }

        char? ps = null;
        double primary = 0, secondary = 0;
        if (f.Count >= 13)
        {
            primary = Ratio(f, 11, $"{what}: primary factor");
            secondary = Ratio(f, 12, $"{what}: secondary factor");
            ps = f[12].ToUpperInvariant() switch
            {
                "P" => 'P',
                "S" => 'S',
                _ => throw f.Error(13, $"{what}: primary/secondary flag '{f.Shown(12)}' is not P or S"),
            };
        }

        var number = f.Int(1, $"{what}: channel number");
        if (number is < 1 or > 999_999)
        {
            throw f.Error(1, $"{what}: channel number {number} is outside 1 to 999999");
        }

        var multiplier = f.Number(6, $"{what}: multiplier");
        if (CaptureLimits.ScaleProblem($"{what}: multiplier", multiplier, f[4]) is { } multiplierProblem)
        {
            throw f.Error(6, multiplierProblem);
        }

        var adder = f.Number(7, $"{what}: offset");
        if (Math.Abs(adder) > CaptureLimits.MaxSampleMagnitude)
        {
            throw f.Error(7, $"{what}: offset {f.Shown(6)} is beyond ±{CaptureLimits.MaxSampleMagnitude:G3}");
        }

        return new ComtradeAnalogChannel(
            number, f[1], f[2], f[3], f[4], multiplier, adder,
            f[7].Length == 0 ? 0 : f.Number(8, $"{what}: skew") * 1e-6,
            f.Number(9, $"{what}: minimum"), f.Number(10, $"{what}: maximum"), primary, secondary, ps)
        { Line = f.Line };
    }

    /// <summary>A transformer ratio factor: 0 (not given) or within the scale bounds, never negative.</summary>
    private static double Ratio(ComtradeCfgFields f, int field, string what)
    {
        var value = f.Number(field, what);
        if (value < 0 || (value != 0 && CaptureLimits.ScaleProblem(what, value, string.Empty) is not null))
        {
            throw f.Error(field, $"{what} {f.Shown(field - 1)} is outside 0 and {CaptureLimits.MinScaleFactor:G3} to {CaptureLimits.MaxScaleFactor:G3}");
        }

        return value;
    }

    private static ComtradeDigitalChannel ParseDigital(ComtradeCfgFields f, int i, int revision)
    {
        // 7.4.4 Dn,ch_id,ph,ccbm,y (1991: Dn,ch_id,y).
        var what = $"digital channel {i}";
        var stateField = revision >= 1999 ? 5 : 3;
        f.RequireFields(stateField, what, revision >= 1999 ? "Dn,ch_id,ph,ccbm,y" : "Dn,ch_id,y");
        var state = f[stateField - 1].Length == 0 ? 0 : f.Int(stateField, $"{what}: normal state");
        if (state is not (0 or 1))
        {
            throw f.Error(stateField, $"{what}: normal state '{f.Shown(stateField - 1)}' is not 0 or 1");
        }

        return new ComtradeDigitalChannel(f.Int(1, $"{what}: channel number"), f[1], state);
    }

    private static int CountWithSuffix(ComtradeCfgFields f, int field, char suffix, string what)
    {
        var text = f[field - 1];
        if (text.Length < 2 || char.ToUpperInvariant(text[^1]) != suffix ||
            !long.TryParse(text.AsSpan(0, text.Length - 1), NumberStyles.None, CultureInfo.InvariantCulture, out var n))
        {
            throw f.Error(field, $"{what} channel count '{ShownText.Of(text)}' is not a number followed by {suffix}");
        }

        return (int)Math.Min(n, int.MaxValue);
    }

    private static DateTime? ParseStamp(ComtradeCfgFields f, int revision, string what, ICollection<CaptureWarning> warnings,
        out int fractionDigits)
    {
        // 7.4.7 dd/mm/yyyy,hh:mm:ss.ssssss (1991: mm/dd/yy,hh:mm:ss.ssssss).
        var form = revision == 1991 ? "mm/dd/yy" : "dd/mm/yyyy";
        f.RequireFields(2, $"{what} time", $"{form},hh:mm:ss.ssssss");
        var date = f[0].Split('/');
        if (date.Length != 3 || !AllDigits(date) || date[0].Length > 2 || date[1].Length > 2 || date[2].Length > 4)
        {
            throw f.Error(1, $"{what} date '{f.Shown(0)}' is not {form}");
        }

        var time = f[1].Split(':');
        var dot = time.Length == 3 ? time[2].IndexOf('.', StringComparison.Ordinal) : -1;
        var wholeSeconds = dot < 0 ? (time.Length == 3 ? time[2] : string.Empty) : time[2][..dot];
        var fraction = dot < 0 ? string.Empty : time[2][(dot + 1)..];
        if (time.Length != 3 || !AllDigits([time[0], time[1], wholeSeconds]) ||
            time[0].Length > 2 || time[1].Length > 2 || wholeSeconds.Length > 2 ||
            (fraction.Length > 0 && !AllDigits([fraction])) || fraction.Length > 9)
        {
            throw f.Error(2, $"{what} time '{f.Shown(1)}' is not hh:mm:ss.ssssss");
        }

        fractionDigits = fraction.Length;
        int day = int.Parse(date[0], CultureInfo.InvariantCulture), month = int.Parse(date[1], CultureInfo.InvariantCulture);
        if (revision == 1991)
        {
            (day, month) = (month, day);
        }

        var year = int.Parse(date[2], CultureInfo.InvariantCulture);
        if (date[2].Length <= 2)
        {
            year += year >= 70 ? 1900 : 2000; // engineering choice: two-digit years of 1991 files pivot at 1970
        }

        int hour = int.Parse(time[0], CultureInfo.InvariantCulture), minute = int.Parse(time[1], CultureInfo.InvariantCulture);
        var second = int.Parse(wholeSeconds, CultureInfo.InvariantCulture);
        var ticks = fraction.Length == 0 ? 0 : (long)Math.Round(double.Parse("0." + fraction, CultureInfo.InvariantCulture) * TimeSpan.TicksPerSecond);
        if (year is < 1 or > 9999 || month is < 1 or > 12 || day < 1 || day > DateTime.DaysInMonth(year, month) ||
            hour > 23 || minute > 59 || second > 60)
        {
            warnings.Add(new CaptureWarning("bad-timestamp",
                $"the {what} time '{f.Shown(0)},{f.Shown(1)}' on line {f.Line} is not a calendar date and time; it is left out"));
            return null;
        }

        // A leap second (ss = 60) is folded onto the next second: DateTime has none.
        return new DateTime(year, month, day, hour, minute, 0, DateTimeKind.Unspecified)
            .AddSeconds(second).AddTicks(ticks);
    }

    private static TimeSpan ParseTimeCode(ComtradeCfgFields f, int field, string what)
    {
        // 7.4.10 from memory: [+|-]hh[hmm], e.g. -5h30, +10, 0.
        var text = f[field - 1];
        var span = text.AsSpan();
        var sign = 1;
        if (span.Length > 0 && span[0] is '+' or '-')
        {
            sign = span[0] == '-' ? -1 : 1;
            span = span[1..];
        }

        var h = span.IndexOfAny('h', 'H');
        var hoursText = h < 0 ? span : span[..h];
        var minutesText = h < 0 ? ReadOnlySpan<char>.Empty : span[(h + 1)..];
        var minutes = 0;
        if (!int.TryParse(hoursText, NumberStyles.None, CultureInfo.InvariantCulture, out var hours) || hours > 14 ||
            (h >= 0 && (!int.TryParse(minutesText, NumberStyles.None, CultureInfo.InvariantCulture, out minutes) || minutes > 59)))
        {
            throw f.Error(field, $"{what} '{ShownText.Of(text)}' is not an offset from UTC such as -5h30, +1 or 0");
        }

        return sign * new TimeSpan(hours, minutes, 0);
    }

    private static DateTimeOffset? WithOffset(DateTime? stamp, TimeSpan? offset) =>
        stamp is null ? null : new DateTimeOffset(stamp.Value, offset ?? TimeSpan.Zero);

    private static bool AllDigits(string[] parts)
    {
        foreach (var p in parts)
        {
            if (p.Length == 0 || !p.All(char.IsAsciiDigit))
            {
                return false;
            }
        }

        return true;
    }
}
