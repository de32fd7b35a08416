using System.Runtime.CompilerServices;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>A folder of its own per test, deleted afterwards.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "wavecheck-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public string File(string name) => System.IO.Path.Combine(Path, name);

    public string Write(string name, string text)
    {
        var path = File(name);
        System.IO.File.WriteAllText(path, text);
        return path;
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Path, recursive: true);
        }
        catch (IOException)
        {
            // Left for the OS to clean.
        }
    }

    /// <summary>A file of the test project's Fixtures folder, wherever the calling test lives.</summary>
    public static string Fixture(string name) =>
        System.IO.Path.Combine(System.IO.Path.GetDirectoryName(ThisFile())!, "..", "Fixtures", name);

    private static string ThisFile([CallerFilePath] string here = "") => here;
}

/// <summary>Test signals and reading helpers.</summary>
internal static class Signals
{
    /// <summary>amplitude·sin(2π f n / rate + phase) + offset.</summary>
    public static double[] Sine(int count, double rateHz, double frequencyHz, double amplitude, double phaseRad = 0, double offset = 0)
    {
        var x = new double[count];
        for (var n = 0; n < count; n++)
        {
            x[n] = amplitude * Math.Sin(2 * Math.PI * frequencyHz * n / rateHz + phaseRad) + offset;
        }

        return x;
    }

    /// <summary>Splits an array into blocks of <paramref name="size"/> (the last shorter), to exercise block edges.</summary>
    public static IEnumerable<double[]> Blocks(double[] x, int size)
    {
        for (var i = 0; i < x.Length; i += size)
        {
            yield return x.AsSpan(i, Math.Min(size, x.Length - i)).ToArray();
        }
    }

    /// <summary>Reads a whole source into arrays: residual, and every channel.</summary>
    public static (double[] Residual, double[][] Channels) ReadAll(WaveCheck.Core.Capture.ICaptureSource source, int blockSize = 1000)
    {
        var residual = new List<double>();
        var channels = new List<double>[source.Info.Channels.Count];
        for (var c = 0; c < channels.Length; c++)
        {
            channels[c] = [];
        }

        var block = source.CreateBlock(blockSize);
        while (source.Read(block))
        {
            residual.AddRange(block.ResidualA.ToArray());
            for (var c = 0; c < channels.Length; c++)
            {
                channels[c].AddRange(block.Channel(c).ToArray());
            }
        }

        return ([.. residual], [.. channels.Select(c => c.ToArray())]);
    }
}
