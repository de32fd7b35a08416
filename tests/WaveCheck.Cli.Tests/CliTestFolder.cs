namespace WaveCheck.Cli.Tests;

/// <summary>A test class's own temporary folder (deleted after each test), and captures written into it by
/// <c>wavecheck synth</c>: the setup the command tests share.</summary>
public abstract class CliTestFolder : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    protected CliTestFolder() => Directory.CreateDirectory(_folder);

    public void Dispose()
    {
        Directory.Delete(_folder, recursive: true);
        GC.SuppressFinalize(this);
    }

    /// <summary>A path in the folder.</summary>
    protected string FilePath(string name) => Path.Combine(_folder, name);

    /// <summary>Writes a 1 s capture of <paramref name="parts"/> with <c>wavecheck synth</c>; fails the test if it cannot.</summary>
    protected string Synth(string name, params string[] parts)
    {
        var path = FilePath(name);
        var (exit, _, error) = CliHarness.Run(["synth", .. parts, "-o", path, "--duration", "1s"]);
        Assert.True(exit == 0, error);
        return path;
    }
}
