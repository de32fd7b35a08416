namespace WaveCheck.Rendering.Tests;

/// <summary>
/// A fresh folder for a test's outputs, deleted afterwards; with WAVECHECK_RENDER_KEEP set to a folder the outputs are
/// written there and kept, so a person can look at them.
/// </summary>
internal sealed class OutputFolder : IDisposable
{
    private readonly bool keep;

    public OutputFolder(string name)
    {
        var keepRoot = Environment.GetEnvironmentVariable("WAVECHECK_RENDER_KEEP");
        keep = !string.IsNullOrEmpty(keepRoot);
        Path = keep
            ? System.IO.Path.Combine(keepRoot!, name)
            : System.IO.Path.Combine(System.IO.Path.GetTempPath(), $"wavecheck-{name}-{Guid.NewGuid():N}");
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public void Dispose()
    {
        if (!keep && Directory.Exists(Path))
        {
            Directory.Delete(Path, recursive: true);
        }
    }
}
