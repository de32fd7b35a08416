using NAudio.Wave;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

public sealed class WavCaptureSourceTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    public static TheoryData<WavSampleFormat, double> Formats => new()
    {
        // closed form: one LSB of an N-bit integer code is 2/2^N of full scale (the range -1..1 spans 2^N codes).
        { WavSampleFormat.Pcm16, 2.0 / Math.Pow(2, 16) },
        { WavSampleFormat.Pcm24, 2.0 / Math.Pow(2, 24) },
        { WavSampleFormat.Pcm32, 2.0 / Math.Pow(2, 32) },
        // IEEE 754: float32 keeps 24 significant bits, so |error| <= 2^-24 of a value below 1.0 (one ulp of 1.0 is 2^-23).
        { WavSampleFormat.Float32, Math.Pow(2, -24) },
        // IEEE 754 double: 2^-53; a product by the scale adds a rounding, 1e-15 of full scale covers both.
        { WavSampleFormat.Float64, 1e-15 },
    };

    [Theory]
    [MemberData(nameof(Formats))]
    public void RoundTripWithinOneLsbInEveryFormat(WavSampleFormat format, double lsbOfFullScale)
    {
        const double fullScaleA = 0.1;
        const double rate = 10_000;
        // 30 mA at 50 Hz plus 5 mA DC, within full scale; 10 001 samples so the last block is short.
        var x = Signals.Sine(10_001, rate, 50, 0.03, 0.3, 0.005);
        var path = _folder.File($"rt-{format}.wav");
        CaptureWriter.WriteWav(path, Signals.Blocks(x, 4096), rate, fullScaleA, format, SensorCoupling.Dc);

        using var source = CaptureOpener.Open(path, new ImportOptions());
        var (residual, _) = Signals.ReadAll(source, 777);
        Assert.Equal(x.Length, residual.Length);
        Assert.Equal(x.Length, source.Info.SampleCount);
        Assert.Equal(rate, source.Info.SampleRateHz);
        Assert.Equal(SensorCoupling.Dc, source.Info.SensorCoupling);
        Assert.Contains("wvck", source.Info.Calibration.Source);
        var tolerance = lsbOfFullScale * fullScaleA;
        for (var n = 0; n < x.Length; n++)
        {
            Assert.True(Math.Abs(residual[n] - x[n]) <= tolerance, $"sample {n}: {residual[n]} vs {x[n]} (tolerance {tolerance})");
        }
    }

    [Theory]
    [InlineData(WavSampleFormat.Pcm24, "PCM 24-bit (extensible), 3 channels")]
    [InlineData(WavSampleFormat.Float64, "IEEE float 64-bit, 3 channels")]
    public void MultiChannelFilesKeepChannelsApartAndPickByNameOrNumber(WavSampleFormat format, string encoding)
    {
        const double rate = 8000;
        var a = Signals.Sine(3000, rate, 50, 0.5);
        var b = Signals.Sine(3000, rate, 150, 0.2);
        var c = Signals.Sine(3000, rate, 250, 0.1, 1.0);
        var path = _folder.File("three.wav");
        CaptureWriter.WriteWav(path, [new[] { a, b, c }], rate, 1.0, format);

        using var byName = CaptureOpener.Open(path, new ImportOptions { Channel = "CH2" });
        Assert.Equal(encoding, byName.Info.Encoding);
        Assert.Equal(["ch1", "ch2", "ch3"], byName.Info.Channels.Select(ch => ch.Name));
        var (residual, channels) = Signals.ReadAll(byName);
        // closed form: 24-bit LSB is 2^-23 of full scale 1 A; float64 is exact to 1e-15.
        const double tol = 2.0 / (1 << 24);
        for (var n = 0; n < a.Length; n++)
        {
            Assert.Equal(b[n], residual[n], tol);
            Assert.Equal(a[n], channels[0][n], tol);
            Assert.Equal(c[n], channels[2][n], tol);
        }

        using var byNumber = CaptureOpener.Open(path, new ImportOptions { Channel = "3" });
        Assert.Equal("ch3", byNumber.Info.ResidualSource);
        Assert.Equal(c[100], Signals.ReadAll(byNumber).Residual[100], tol);
    }

    [Fact]
    public void FileWrittenByNAudioAloneNeedsAScaleAndTakesRangeOverSensitivity()
    {
        // A plain 16-bit file written directly with NAudio (no wvck chunk): like a logger's export.
        var path = _folder.File("plain.wav");
        var x = Signals.Sine(4800, 48_000, 50, 0.5);
        using (var writer = new WaveFileWriter(path, new WaveFormat(48_000, 16, 1)))
        {
            writer.WriteSamples(x.Select(v => (float)v).ToArray(), 0, x.Length);
        }

        var missing = Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(path, new ImportOptions()));
        Assert.Contains("ScaleA", missing.Message);
        Assert.Contains("SensitivityVPerA with RangeV", missing.Message);

        // range 1 V / sensitivity 10 mV/mA (= 10 V/A) -> 0.1 A at full scale (closed form: 1 / 10).
        using var source = CaptureOpener.Open(path, new ImportOptions { RangeV = 1.0, SensitivityVPerA = 10.0 });
        Assert.Equal(0.1, source.Info.Calibration.ScaleA, 12);
        Assert.Equal("range 1 V / sensitivity 10 mV/mA = 0.1 A full scale", source.Info.Calibration.Source);
        var residual = Signals.ReadAll(source).Residual;
        // NAudio stores round(x·32767); one LSB of 16 bits (2/2^16 of 0.1 A) plus the 32767/32768 gain difference (0.5·2^-15·0.05 A).
        var tol = 2.0 / 65536 * 0.1 + 0.05 / 32768;
        for (var n = 0; n < x.Length; n += 37)
        {
            Assert.Equal(0.1 * x[n], residual[n], tol);
        }
    }

    [Fact]
    public void EightBitUnsignedPcmIsCentredOn128()
    {
        // WAV 8-bit PCM is unsigned with 128 as zero (Microsoft RIFF specification); codes 0, 64, 128, 192, 255.
        var path = _folder.File("eight.wav");
        using (var writer = new WaveFileWriter(path, new WaveFormat(8000, 8, 1)))
        {
            writer.Write([0, 64, 128, 192, 255], 0, 5);
        }

        using var source = CaptureOpener.Open(path, new ImportOptions { ScaleA = 0.1 });
        Assert.Equal("PCM 8-bit, 1 channel", source.Info.Encoding);
        // closed form: (code − 128) / 128 of full scale 0.1 A.
        Assert.Equal([-0.1, -0.05, 0, 0.05, 0.1 * 127 / 128], Signals.ReadAll(source).Residual);
    }

    [Fact]
    public void ExplicitScaleWinsOverTheFileAndSaysSo()
    {
        var path = _folder.File("own.wav");
        var x = Signals.Sine(1000, 1000, 50, 0.01);
        CaptureWriter.WriteWav(path, [x], 1000, 0.02, WavSampleFormat.Float32);
        using var source = CaptureOpener.Open(path, new ImportOptions { ScaleA = 0.04 });
        Assert.Equal(0.04, source.Info.Calibration.ScaleA);
        Assert.Contains("overrides the file's 0.02 A full scale", source.Info.Calibration.Source);
        // closed form: a stored fraction read with twice the full scale doubles; float32 tolerance 2^-24 of 0.04 A.
        Assert.Equal(2 * x[3], Signals.ReadAll(source).Residual[3], 0.04 * Math.Pow(2, -24) * 2);
    }

    [Fact]
    public void TruncatedDataIsAnalysedAsFarAsItGoesWithAWarning()
    {
        var path = _folder.File("cut.wav");
        var x = Signals.Sine(2000, 1000, 50, 0.01);
        CaptureWriter.WriteWav(path, [x], 1000, 0.1, WavSampleFormat.Pcm16);
        var bytes = File.ReadAllBytes(path);
        // Cut 501 bytes off the end: 250 whole frames and one byte of a 2-byte frame are lost (closed form: 501 = 2·250 + 1).
        File.WriteAllBytes(path, bytes[..^501]);

        using var source = CaptureOpener.Open(path, new ImportOptions());
        Assert.Equal(1749, source.Info.SampleCount);
        var warning = Assert.Single(source.Warnings, w => w.Code == "truncated");
        Assert.Contains("251 frames (501 bytes) missing", warning.Message);
        Assert.Equal(1749, Signals.ReadAll(source).Residual.Length);
    }

    [Fact]
    public void NonWaveBytesInAWavFileAreRejectedWithTheByteOffset()
    {
        var text = _folder.Write("fake.wav", "time,I\n0,1\n");
        var ex = Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(text, new ImportOptions { ScaleA = 1 }));
        Assert.Equal(0, ex.ByteOffset);
        Assert.Contains("byte 0", ex.Message);

        var riffNotWave = _folder.File("avi.wav");
        File.WriteAllBytes(riffNotWave, [.. "RIFF"u8, 4, 0, 0, 0, .. "AVI "u8]);
        var ex2 = Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(riffNotWave, new ImportOptions { ScaleA = 1 }));
        Assert.Equal(8, ex2.ByteOffset);

        // A chunk header of binary noise where the fmt chunk should be: offset 12, just after RIFF....WAVE.
        var noise = _folder.File("noise.wav");
        File.WriteAllBytes(noise, [.. "RIFF"u8, 100, 0, 0, 0, .. "WAVE"u8, 0, 1, 2, 3, 4, 0, 0, 0, 9, 9, 9, 9]);
        var ex3 = Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(noise, new ImportOptions { ScaleA = 1 }));
        Assert.Equal(12, ex3.ByteOffset);
    }

    [Fact]
    public void SensitivityWithoutRangeIsRefusedForWav()
    {
        var path = _folder.File("s.wav");
        CaptureWriter.WriteWav(path, [new double[10]], 1000, 1, WavSampleFormat.Pcm16);
        var ex = Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(path, new ImportOptions { SensitivityVPerA = 10 }));
        Assert.Contains("RangeV", ex.Message);
    }
}
