using System.Text;
using static WaveCheck.Cli.Tests.InputMutationTests;

namespace WaveCheck.Cli.Tests;

/// <summary>Counterexamples found by <see cref="InputMutationTests"/> (against the readers before they were hardened),
/// as shrunk by CsCheck and kept as ordinary tests so that each stays fixed whatever the property test's seeds become.
/// Each applies the exact mutations CsCheck printed to the same valid file.</summary>
public sealed class InputRegressionTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    public InputRegressionTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private static Mutation M(int kind, double at, int region, int length, byte value) => new(kind, at, region, length, value);

    private static byte[] Utf8(string text) => new UTF8Encoding(false).GetBytes(text);

    private static string OneLine(string error)
    {
        var lines = error.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        return Assert.Single(lines);
    }

    [Fact]
    public void A_csv_cut_to_its_header_and_one_row_names_the_row_instead_of_throwing()
    {
        // Was: ArgumentOutOfRangeException "sample rate must be a positive number of hertz" (one time value, no step).
        var bytes = Mutate(Utf8("# invented logger\n" + InputFiles.Csv()),
            [M(4, 0.027, 2, 44, 0xCE), M(4, 0.5791, 0, 46, 0x8B), M(3, 1, 1, 12, 0xA7)]);
        var path = InputFiles.Write(_folder, "cut.csv", bytes);
        var (exit, _, error) = CliHarness.Run("analyze", path, "-q");
        Assert.Equal(2, exit);
        Assert.Contains("cut.csv:3:1: only one data row", OneLine(error), StringComparison.Ordinal);
    }

    [Fact]
    public void A_cfg_date_too_long_for_a_number_names_its_line_instead_of_overflowing()
    {
        // Was: OverflowException "Value was either too large or too small for an Int32" from the start stamp.
        var cfg = Mutate(Utf8(InputFiles.Cfg(InputFiles.CfgLines("BINARY"))),
            [M(2, 1, 1, 22, 0xD9), M(2, 0.6277, 2, 24, 0x34), M(1, 0, 1, 14, 0x92)]);
        var path = InputFiles.Write(_folder, "b.cfg", cfg);
        InputFiles.Write(_folder, "b.dat", InputFiles.DatBinary("BINARY"));
        var (exit, _, error) = CliHarness.Run("analyze", path, "-q");
        Assert.Equal(2, exit);
        Assert.Contains("b.cfg:8:1: start date '01/12/4444444444444444444444442026' is not dd/mm/yyyy", OneLine(error), StringComparison.Ordinal);
    }

    [Fact]
    public void A_site_file_with_a_stray_byte_names_the_byte_instead_of_throwing()
    {
        // Was: InvalidOperationException "Cannot transcode invalid UTF-8 JSON text to UTF-16 string".
        var site = Mutate(Utf8(InputFiles.Site()), [M(1, 0.7885, 1, 3, 0x98)]);
        var path = InputFiles.Write(_folder, "site.json", site);
        InputFiles.Write(_folder, "c1.wav", InputFiles.Wav(s => s.SampleCount = 1000));
        var (exit, _, error) = CliHarness.Run("survey", "--config", path, "-o", Path.Combine(_folder, "out"), "-q");
        Assert.Equal(2, exit);
        Assert.Contains("invalid UTF-8 (byte 0x98)", OneLine(error), StringComparison.Ordinal);
    }
}
