using System.Globalization;
using System.Text;

namespace WaveCheck.Cli.Tests;

/// <summary>COMTRADE records through <c>info</c> and <c>analyze</c>: the trigger time shown and marked on the plots.</summary>
public sealed class ComtradeCommandTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    public ComtradeCommandTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    /// <summary>
    /// An invented relay record (IEEE C37.111-1999 ASCII form): one residual channel IN in amperes, a = 0.0001 A per
    /// count, 1 kHz for 2 s, a 10 mA peak 50 Hz sine; start 10:00:00.000000, trigger 0.5 s later.
    /// </summary>
    private string WriteRecord()
    {
        var cfg = Path.Combine(_folder, "feeder7.cfg");
        File.WriteAllText(cfg, string.Join("\r\n",
            "Harbour Clinic Substation,REL-7,1999",
            "1,1A,0D",
            "1,IN,N,,A,0.0001,0,0,-32767,32767,400,1,S",
            "50",
            "1",
            "1000,2000",
            "01/12/2026,10:00:00.000000",
            "01/12/2026,10:00:00.500000",
            "ASCII",
            "1") + "\r\n");
        var dat = new StringBuilder();
        for (var n = 0; n < 2000; n++)
        {
            var counts = (int)Math.Round(100 * Math.Sin(2 * Math.PI * 50 * n / 1000.0));
            dat.Append(CultureInfo.InvariantCulture, $"{n + 1},{n * 1000},{counts}\r\n");
        }

        File.WriteAllText(Path.Combine(_folder, "feeder7.dat"), dat.ToString());
        return cfg;
    }

    [Fact]
    public void Info_shows_the_trigger_time()
    {
        var (exit, output, error) = CliHarness.Run("info", WriteRecord());
        Assert.True(exit == 0, error);
        Assert.Contains("comtrade", output, StringComparison.Ordinal);
        Assert.Contains("0.5 s after the start", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Analyze_marks_the_trigger_on_the_overview_plot()
    {
        // Closed form: a 10 mA peak sine has an RMS of 7.07 mA; the record's calibration a·x + b must reproduce it.
        var plots = Path.Combine(_folder, "plots");
        var json = Path.Combine(_folder, "r.json");
        var (exit, _, error) = CliHarness.Run("analyze", WriteRecord(), "--plots", plots, "--plot-format", "svg", "--json", json);
        Assert.True(exit == 0, error);
        Assert.Contains("trigger 0.5 s", File.ReadAllText(Path.Combine(plots, "overview.svg")), StringComparison.Ordinal);
        using var doc = System.Text.Json.JsonDocument.Parse(File.ReadAllText(json));
        Assert.Equal(0.010 / Math.Sqrt(2), doc.RootElement.GetProperty("summary").GetProperty("rmsA").GetDouble(), 0.0001);
    }
}
