using System.Globalization;
using WaveCheck.Core.Capture;

// Writes a large float32 mono WAV for bench/stream-wav.sh, streaming so the generator's memory stays small.
// usage: WaveCheck.Bench OUT.wav MEGABYTES [RATE_HZ]
if (args.Length < 2)
{
    Console.Error.WriteLine("usage: WaveCheck.Bench OUT.wav MEGABYTES [RATE_HZ]");
    return 2;
}

var path = args[0];
var megabytes = long.Parse(args[1], CultureInfo.InvariantCulture);
var rateHz = args.Length > 2 ? double.Parse(args[2], CultureInfo.InvariantCulture) : 100_000;
var frames = megabytes * 1024 * 1024 / sizeof(float);
const int blockSize = 1 << 16;

IEnumerable<double[]> Blocks()
{
    var block = new double[blockSize];
    for (long start = 0; start < frames; start += blockSize)
    {
        var length = (int)Math.Min(blockSize, frames - start);
        if (length != block.Length)
        {
            block = new double[length];
        }

        for (var n = 0; n < length; n++)
        {
            // 15 mA at 50 Hz, 4 mA DC and a 1.2 mA tone at 8 kHz: an invented drive's leakage.
            var t = (start + n) / rateHz;
            block[n] = 0.015 * Math.Sin(2 * Math.PI * 50 * t) + 0.004 + 0.0012 * Math.Sin(2 * Math.PI * 8000 * t);
        }

        yield return block;
    }
}

var written = CaptureWriter.WriteWav(path, Blocks(), rateHz, 0.1, WavSampleFormat.Float32, SensorCoupling.Dc);
Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"wrote {written} frames ({written / rateHz:0} s at {rateHz} Hz) to {path}"));
return 0;
