using WaveCheck.Core.Capture;
using WaveCheck.Core.Capture.Comtrade;

namespace WaveCheck.Core.Tests.Capture.Comtrade;

/// <summary>
/// Round trips of invented records: feeder 3 of "Harbour Clinic Substation", 50 Hz, 4 kHz, 0.2 s. Phase currents
/// IL1 = 10 A∠0°, IL2 = 10 A∠−120°, IL3 = 9 A∠+120° (1 A imbalance), earth leakage 12.5 mA peak ∠60°, and the
/// neutral carries IN = Ileak − (IL1 + IL2 + IL3), so IL1 + IL2 + IL3 + IN = Ileak (Kirchhoff's current law).
/// CTs 400 A : 1 A. IL1, IL2 (b = 0.05 A), IL3 (in kA) are stored as primary values, IN as secondary mA.
/// </summary>
public sealed class ComtradeCaptureSourceTests : IDisposable
{
    private const double W = 2 * Math.PI * 50;
    private const double LeakPeakA = 0.0125;
    private const double CtRatio = 400;
    private readonly TempDir _dir = new();

    public void Dispose() => _dir.Dispose();

    private static double Il1(double t) => 10 * Math.Sin(W * t);

    private static double Il2(double t) => 10 * Math.Sin((W * t) - (2 * Math.PI / 3));

    private static double Il3(double t) => 9 * Math.Sin((W * t) + (2 * Math.PI / 3));

    private static double Leak(double t) => LeakPeakA * Math.Sin((W * t) + (Math.PI / 3));

    private static double InPrimary(double t) => Leak(t) - (Il1(t) + Il2(t) + Il3(t));

    /// <summary>Multiplier a for a channel of the given full scale (in its unit) in each stored form.</summary>
    private static double StepFor(ComtradeDataFileType type, double fullScale) => type switch
    {
        ComtradeDataFileType.Binary or ComtradeDataFileType.Ascii => fullScale / 32767,
        ComtradeDataFileType.Binary32 => fullScale / int.MaxValue,
        _ => fullScale / 1000, // float32: x within ±1000, relative error 2^-24, far below half a step of a
    };

    internal static ComtradeRecordBuilder Feeder(ComtradeDataFileType type)
    {
        var b = new ComtradeRecordBuilder { FileType = type };
        b.Sections.Add((4000, 800));
        b.Channels.Add(new TestChannel("IL1", "A", "A", StepFor(type, 20), 0, -32767, 32767, CtRatio, 1, 'P', Il1));
        b.Channels.Add(new TestChannel("IL2", "B", "A", StepFor(type, 20), 0.05, -32767, 32767, CtRatio, 1, 'P', Il2));
        b.Channels.Add(new TestChannel("IL3", "C", "kA", StepFor(type, 0.02), 0, -32767, 32767, CtRatio, 1, 'P', t => Il3(t) / 1000));
        b.Channels.Add(new TestChannel("IN", "N", "mA", StepFor(type, 5), 0, -32767, 32767, CtRatio, 1, 'S', t => InPrimary(t) / CtRatio * 1000));
        b.Channels.Add(new TestChannel("UL1", "A", "kV", StepFor(type, 0.5), 0, -32767, 32767, 1, 1, 'P', t => 0.325 * Math.Sin(W * t)));
        return b;
    }

    /// <summary>Half a quantisation step of a channel, in delivered amperes: the rounding bound of the integer forms.</summary>
    private static double HalfStepA(TestChannel ch, bool primary)
    {
        var unit = ch.Unit switch { "kA" => 1e3, "mA" => 1e-3, _ => 1.0 };
        var ratio = (ch.PS, primary) switch { ('P', false) => 1 / CtRatio, ('S', true) => CtRatio, _ => 1.0 };
        return 0.5 * ch.A * unit * ratio;
    }

    private static List<double[]> ReadAll(ICaptureSource source, int capacity = 300)
    {
        var block = source.CreateBlock(capacity);
        var channels = new List<double>[source.Info.Channels.Count + 1];
        for (var c = 0; c < channels.Length; c++)
        {
            channels[c] = [];
        }

        while (source.Read(block))
        {
            for (var c = 0; c < source.Info.Channels.Count; c++)
            {
                channels[c].AddRange(block.Channel(c).ToArray());
            }

            channels[^1].AddRange(block.ResidualA.ToArray());
        }

        return channels.Select(l => l.ToArray()).ToList();
    }

    public static TheoryData<ComtradeDataFileType, bool> Forms => new()
    {
        { ComtradeDataFileType.Ascii, false },
        { ComtradeDataFileType.Binary, false },
        { ComtradeDataFileType.Binary32, false },
        { ComtradeDataFileType.Float32, false },
        { ComtradeDataFileType.Ascii, true },
        { ComtradeDataFileType.Binary, true },
        { ComtradeDataFileType.Float32, true },
    };

    [Theory]
    [MemberData(nameof(Forms))]
    public void Sum_of_phases_and_neutral_is_the_leakage_in_primary_amperes(ComtradeDataFileType type, bool cff)
    {
        var builder = Feeder(type);
        var path = builder.Write(_dir.Path, "feeder3", cff);
        using var source = ComtradeCaptureSource.Open(path, new ImportOptions { Primary = true, SumChannels = ["il1", "IL2", "IL3", "IN"] });
        var data = ReadAll(source);

        Assert.Equal("comtrade", source.Info.Format);
        Assert.Equal(4000, source.Info.SampleRateHz);
        Assert.Equal(800, source.Info.SampleCount);
        Assert.Equal("IL1+IL2+IL3+IN", source.Info.ResidualSource);
        Assert.Equal(800, data[^1].Length);

        // Closed form: each channel is a·x + b with x rounded, so within half a step of the waveform it encodes.
        Func<double, double>[] expected = [Il1, Il2, Il3, InPrimary];
        var sumTolerance = 1e-12;
        for (var c = 0; c < 4; c++)
        {
            var tol = HalfStepA(builder.Channels[c], primary: true) + 1e-12;
            sumTolerance += tol;
            for (var i = 0; i < 800; i++)
            {
                Assert.True(Math.Abs(data[c][i] - expected[c](i / 4000.0)) <= tol,
                    $"{builder.Channels[c].Id} sample {i}: {data[c][i]} vs {expected[c](i / 4000.0)} (±{tol})");
            }
        }

        // Kirchhoff's current law: IL1 + IL2 + IL3 + IN = Ileak, within the sum of the four half steps
        // (BINARY: 3 × 0.305 mA + 0.031 mA = 0.95 mA against a 12.5 mA peak).
        for (var i = 0; i < 800; i++)
        {
            Assert.True(Math.Abs(data[^1][i] - Leak(i / 4000.0)) <= sumTolerance,
                $"sample {i}: {data[^1][i]} vs {Leak(i / 4000.0)} (±{sumTolerance})");
        }
    }

    [Fact]
    public void Secondary_values_by_default_divide_primary_channels_by_the_ratio()
    {
        var builder = Feeder(ComtradeDataFileType.Binary32);
        var path = builder.Write(_dir.Path, "feeder3");
        using var source = ComtradeCaptureSource.Open(path, new ImportOptions());
        var data = ReadAll(source);

        // IL1 flagged P: secondary = primary / (400/1). IN flagged S: delivered as stored (mA → A).
        for (var i = 0; i < 800; i += 7)
        {
            var t = i / 4000.0;
            Assert.Equal(Il1(t) / CtRatio, data[0][i], HalfStepA(builder.Channels[0], false) + 1e-12);
            Assert.Equal(InPrimary(t) / CtRatio, data[3][i], HalfStepA(builder.Channels[3], false) + 1e-12);
        }

        // ScaleToSi carries the unit and ratio: IL3 in kA, P → S: a × 1000 / 400.
        Assert.Equal(builder.Channels[2].A * 1000 / CtRatio, source.Info.Channels[2].ScaleToSi, 1e-15);
        Assert.Equal(ChannelQuantity.Voltage, source.Info.Channels[4].Quantity);
    }

    [Fact]
    public void Default_residual_is_the_one_channel_named_as_neutral_or_earth()
    {
        var path = Feeder(ComtradeDataFileType.Binary).Write(_dir.Path, "feeder3");
        using var source = ComtradeCaptureSource.Open(path, new ImportOptions());
        Assert.Equal("IN", source.Info.ResidualSource);
        Assert.Equal([3], source.Info.ResidualChannels);
        Assert.DoesNotContain(source.Warnings, w => w.Code == "channel-guessed");
    }

    [Fact]
    public void Without_a_residual_name_several_currents_are_refused_and_named()
    {
        var builder = Feeder(ComtradeDataFileType.Binary);
        builder.Channels.RemoveAt(3);
        var path = builder.Write(_dir.Path, "phases");
        // The words of the shared channel choice (CSV and WAV give the same), with the reason no channel is taken.
        var error = Assert.Throws<CaptureFormatException>(() => ComtradeCaptureSource.Open(path, new ImportOptions()));
        Assert.Contains("(IL1, IL2, IL3) and no channel is named as the residual or earth current", error.Problem, StringComparison.Ordinal);
        Assert.Contains("give SumChannels IL1,IL2,IL3", error.Problem, StringComparison.Ordinal);
        Assert.DoesNotContain("UL1", error.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void The_only_current_without_a_residual_name_is_used_with_a_warning()
    {
        var builder = Feeder(ComtradeDataFileType.Binary);
        builder.Channels.RemoveRange(1, 3);
        using var source = ComtradeCaptureSource.Open(builder.Write(_dir.Path, "one"), new ImportOptions());
        Assert.Equal("IL1", source.Info.ResidualSource);
        var warning = Assert.Single(source.Warnings, w => w.Code == "channel-guessed");
        Assert.StartsWith("The only current channel, 'IL1', is used as the residual current", warning.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_channel_summed_twice_is_refused_as_in_the_other_formats()
    {
        var path = Feeder(ComtradeDataFileType.Binary).Write(_dir.Path, "feeder3");
        var error = Assert.Throws<CaptureFormatException>(() => ComtradeCaptureSource.Open(path, new ImportOptions { SumChannels = ["IL1", "IL2", "il1"] }));
        Assert.Equal(path, error.FilePath);
        Assert.Equal("SumChannels names channel 'IL1' twice", error.Problem);
    }

    [Fact]
    public void Channel_by_number_and_unknown_channel()
    {
        var path = Feeder(ComtradeDataFileType.Binary).Write(_dir.Path, "feeder3");
        using (var source = ComtradeCaptureSource.Open(path, new ImportOptions { Channel = "2" }))
        {
            Assert.Equal("IL2", source.Info.ResidualSource);
        }

        var error = Assert.Throws<CaptureFormatException>(() => ComtradeCaptureSource.Open(path, new ImportOptions { Channel = "IL9" }));
        Assert.Equal("Channel: no channel named 'IL9' (channels: IL1, IL2, IL3, IN, UL1)", error.Problem);
        var number = Assert.Throws<CaptureFormatException>(() => ComtradeCaptureSource.Open(path, new ImportOptions { Channel = "6" }));
        Assert.Equal("Channel 6: channel number out of range 1..5", number.Problem);
    }

    [Fact]
    public void Voltage_channel_needs_a_sensitivity()
    {
        var builder = Feeder(ComtradeDataFileType.Binary32);
        var path = builder.Write(_dir.Path, "feeder3");
        var error = Assert.Throws<CaptureFormatException>(() => ComtradeCaptureSource.Open(path, new ImportOptions { Channel = "UL1" }));
        Assert.Contains("'UL1' is a voltage (kV)", error.Message, StringComparison.Ordinal);
        Assert.Contains("SensitivityVPerA", error.Message, StringComparison.Ordinal);

        // Closed form: 0.325 kV peak through 10 V/A reads as 32.5 A peak; half a step 0.5 kV/2^31/2 /10 V/A.
        using var source = ComtradeCaptureSource.Open(path, new ImportOptions { Channel = "UL1", SensitivityVPerA = 10 });
        var residual = ReadAll(source)[^1];
        for (var i = 0; i < 800; i += 11)
        {
            Assert.Equal(32.5 * Math.Sin(W * i / 4000.0), residual[i], (0.5 * builder.Channels[4].A * 1000 / 10) + 1e-12);
        }
    }

    [Fact]
    public void Start_and_trigger_times_carry_the_2013_time_code()
    {
        var path = Feeder(ComtradeDataFileType.Binary).Write(_dir.Path, "feeder3");
        using var source = ComtradeCaptureSource.Open(path, new ImportOptions());
        // cfg: 01/12/2026,08:15:30.125000 and .225000 (dd/mm/yyyy), time code +1 (one hour east of UTC).
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 8, 15, 30, 125, TimeSpan.FromHours(1)), source.Info.StartTime);
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 8, 15, 30, 225, TimeSpan.FromHours(1)), source.Info.TriggerTime);
        Assert.DoesNotContain(source.Warnings, w => w.Code == "time-zone-unstated");
    }

    [Fact]
    public void A_1999_record_without_time_code_warns_that_the_zone_is_unstated()
    {
        var builder = Feeder(ComtradeDataFileType.Ascii);
        builder.RevisionField = "1999";
        builder.TimeCodeLine = null;
        builder.Start = "28/02/2027,23:59:59.999999";
        using var source = ComtradeCaptureSource.Open(builder.Write(_dir.Path, "r1999"), new ImportOptions());
        Assert.Equal(new DateTimeOffset(2027, 2, 28, 23, 59, 59, TimeSpan.Zero).AddTicks(9_999_990), source.Info.StartTime);
        Assert.Contains(source.Warnings, w => w.Code == "time-zone-unstated");
    }

    [Fact]
    public void A_1991_record_reads_month_first_two_digit_years()
    {
        // C37.111-1991 (from memory): line 1 without revision year, analog lines of 10 fields, digital Dn,ch_id,y,
        // dates mm/dd/yy, no timemult line.
        var cfg = """
            Harbour Clinic Substation,OLD-1
            3,2A,1D
            1,IE,N,Feeder 1,mA,0.01,0,0,-32767,32767
            2,IL1,A,Feeder 1,A,0.001,0,0,-32767,32767
            1,Trip,0
            50
            1
            1000,4
            12/01/98,10:00:00.000000
            12/01/98,10:00:00.002000
            ASCII
            """;
        File.WriteAllText(Path.Combine(_dir.Path, "old.cfg"), cfg);
        File.WriteAllText(Path.Combine(_dir.Path, "old.DAT"), "1,0,1250,100,0\n2,1000,0,200,0\n3,2000,-1250,300,1\n4,3000,0,400,1\n");
        using var source = ComtradeCaptureSource.Open(Path.Combine(_dir.Path, "old.cfg"), new ImportOptions { Primary = true });
        Assert.Equal(new DateTime(1998, 12, 1, 10, 0, 0), source.Info.StartTime!.Value.DateTime);
        Assert.Equal("IE", source.Info.ResidualSource);
        Assert.Contains(source.Warnings, w => w.Code == "primary-secondary");
        var residual = ReadAll(source)[^1];
        // a·x + b: 0.01 mA × 1250 = 12.5 mA (exact in binary64 to 1e-15).
        Assert.Equal([0.0125, 0, -0.0125, 0], residual, (a, b) => Math.Abs(a - b) < 1e-15);
    }

    [Fact]
    public void Several_rate_sections_deliver_the_longest_and_say_so()
    {
        var builder = Feeder(ComtradeDataFileType.Binary);
        builder.Sections.Clear();
        builder.Sections.Add((4000, 400)); // 0.1 s
        builder.Sections.Add((1000, 900)); // 500 samples, 0.5 s: the longest
        builder.Sections.Add((500, 1000)); // 100 samples, 0.2 s
        using var source = ComtradeCaptureSource.Open(builder.Write(_dir.Path, "rates"), new ImportOptions { Primary = true, Channel = "IL1" });
        Assert.Equal(1000, source.Info.SampleRateHz);
        Assert.Equal(500, source.Info.SampleCount);
        var warning = Assert.Single(source.Warnings, w => w.Code == "rate-sections");
        Assert.Contains("4000 Hz for samples 1-400", warning.Message, StringComparison.Ordinal);
        Assert.Contains("1000 Hz for samples 401-900", warning.Message, StringComparison.Ordinal);
        Assert.Contains("500 Hz for samples 901-1000", warning.Message, StringComparison.Ordinal);
        // Times count from the section's start: 0.1 s after the cfg's start time.
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 8, 15, 30, 225, TimeSpan.FromHours(1)), source.Info.StartTime);

        var data = ReadAll(source, 128);
        var tol = HalfStepA(builder.Channels[0], true) + 1e-12;
        for (var i = 0; i < 500; i++)
        {
            Assert.Equal(Il1(0.1 + (i / 1000.0)), data[^1][i], tol);
        }
    }

    [Fact]
    public void No_stated_rate_is_derived_from_timestamps_and_timemult()
    {
        var builder = Feeder(ComtradeDataFileType.Binary32);
        builder.Sections.Clear();
        builder.TimestampOnlyEnd = 800;
        builder.StampRateHz = 4000;
        builder.TimeMultiplier = 0.5; // stamps count half-microseconds: 500 per sample at 4 kHz
        using var source = ComtradeCaptureSource.Open(builder.Write(_dir.Path, "stamps"), new ImportOptions());
        // Closed form: 799 intervals over 799 × 500 × 0.5 µs.
        Assert.Equal(4000, source.Info.SampleRateHz, 1e-9);
        Assert.Contains(source.Warnings, w => w.Code == "rate-from-timestamps");
        Assert.Equal(800, ReadAll(source)[^1].Length);
    }

    [Theory]
    [InlineData(ComtradeDataFileType.Binary)]
    [InlineData(ComtradeDataFileType.Binary32)]
    [InlineData(ComtradeDataFileType.Ascii)]
    public void Missing_values_hold_the_previous_value_with_a_warning(ComtradeDataFileType type)
    {
        var builder = Feeder(type);
        builder.Missing.Add((3, 100));
        builder.Missing.Add((3, 101));
        using var source = ComtradeCaptureSource.Open(builder.Write(_dir.Path, "gaps"), new ImportOptions { Primary = true });
        var residual = ReadAll(source, 64)[^1];
        Assert.Equal(residual[99], residual[100]);
        Assert.Equal(residual[99], residual[101]);
        Assert.NotEqual(residual[99], residual[102]);
        var warning = Assert.Single(source.Warnings, w => w.Code == "missing-values");
        Assert.StartsWith("2 values", warning.Message, StringComparison.Ordinal);
        Assert.Contains("sample 101", warning.Message, StringComparison.Ordinal);
        Assert.Contains("'IN'", warning.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Missing_data_file_names_the_expected_path()
    {
        var path = Feeder(ComtradeDataFileType.Binary).Write(_dir.Path, "alone");
        File.Delete(Path.Combine(_dir.Path, "alone.dat"));
        var error = Assert.Throws<CaptureFormatException>(() => ComtradeCaptureSource.Open(path, new ImportOptions()));
        Assert.Contains(Path.Combine(_dir.Path, "alone.dat"), error.Message, StringComparison.Ordinal);
        Assert.Contains(".DAT", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Upper_case_dat_beside_the_cfg_is_found()
    {
        var path = Feeder(ComtradeDataFileType.Binary).Write(_dir.Path, "upper");
        File.Move(Path.Combine(_dir.Path, "upper.dat"), Path.Combine(_dir.Path, "upper.DAT"));
        using var source = ComtradeCaptureSource.Open(path, new ImportOptions());
        Assert.Equal(800, ReadAll(source)[^1].Length);
    }

    [Fact]
    public void Short_binary_data_names_byte_and_sample()
    {
        var path = Feeder(ComtradeDataFileType.Binary).Write(_dir.Path, "short");
        var dat = Path.Combine(_dir.Path, "short.dat");
        // Frame: 8 + 5 × 2 + 2 = 20 bytes; cut inside sample 700 (0-based).
        File.WriteAllBytes(dat, File.ReadAllBytes(dat)[..((700 * 20) + 7)]);
        var error = Assert.Throws<CaptureFormatException>(() => ComtradeCaptureSource.Open(path, new ImportOptions()));
        Assert.Equal(14007, error.ByteOffset);
        Assert.Equal(700, error.SampleIndex);
        Assert.Contains("800 samples of 20 bytes", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Short_ascii_data_names_line_and_sample()
    {
        var path = Feeder(ComtradeDataFileType.Ascii).Write(_dir.Path, "short");
        var dat = Path.Combine(_dir.Path, "short.dat");
        File.WriteAllLines(dat, File.ReadAllLines(dat)[..650]);
        using var source = ComtradeCaptureSource.Open(path, new ImportOptions());
        var error = Assert.Throws<CaptureFormatException>(() => ReadAll(source));
        Assert.Equal(650, error.SampleIndex);
        Assert.Contains("line 650", error.Message, StringComparison.Ordinal);
        Assert.Contains("the cfg says 800", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Bad_ascii_value_names_line_and_field()
    {
        var path = Feeder(ComtradeDataFileType.Ascii).Write(_dir.Path, "bad");
        var dat = Path.Combine(_dir.Path, "bad.dat");
        var lines = File.ReadAllLines(dat);
        var fields = lines[9].Split(',');
        fields[4] = "12x";
        lines[9] = string.Join(',', fields);
        File.WriteAllLines(dat, lines);
        using var source = ComtradeCaptureSource.Open(path, new ImportOptions());
        var error = Assert.Throws<CaptureFormatException>(() => ReadAll(source));
        Assert.Equal(10, error.Line);
        Assert.Equal(5, error.Column);
        Assert.Contains("analog channel 3 value '12x' is not a number", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Unknown_cff_section_is_rejected_with_its_line()
    {
        var path = Feeder(ComtradeDataFileType.Ascii).Write(_dir.Path, "odd", singleFile: true);
        var text = File.ReadAllText(path).Replace("--- file type: HDR ---", "--- file type: XYZ ---", StringComparison.Ordinal);
        File.WriteAllText(path, text);
        var error = Assert.Throws<CaptureFormatException>(() => ComtradeCaptureSource.Open(path, new ImportOptions()));
        Assert.Contains("unknown section type 'XYZ'", error.Message, StringComparison.Ordinal);
        Assert.Equal(File.ReadAllLines(path).ToList().FindIndex(l => l.Contains("XYZ", StringComparison.Ordinal)) + 1, error.Line);
    }

    [Fact]
    public void Extra_data_after_the_declared_samples_is_warned_about()
    {
        var path = Feeder(ComtradeDataFileType.Binary).Write(_dir.Path, "long");
        var dat = Path.Combine(_dir.Path, "long.dat");
        File.WriteAllBytes(dat, [.. File.ReadAllBytes(dat), .. new byte[40]]);
        using var source = ComtradeCaptureSource.Open(path, new ImportOptions());
        ReadAll(source);
        Assert.Contains(source.Warnings, w => w.Code == "extra-data");
    }
}
