using System.Globalization;
using System.Text;
using CsCheck;
using Xunit.Abstractions;

namespace WaveCheck.Cli.Tests;

/// <summary>
/// Property: random byte mutations (flip, insert, delete, truncate, duplicate a range) of valid WAV, CSV, COMTRADE
/// and site files, run in-process through the same entry as the CLI, never escape as an exception (a stack trace),
/// never take longer than <see cref="CaseLimit"/>, and end with exit code 0, 1 or 2 (2 with one line on stderr).
/// Fixed seeds and iteration counts keep each run the same and the whole under a minute on two cores; CsCheck prints
/// the seed of a failure and the shrunk case, which then belongs in <see cref="InputRegressionTests"/>.
/// </summary>
public sealed class InputMutationTests : IDisposable
{
    /// <summary>Time allowed per case: the captures are 0.5 s long and read in tens of milliseconds.</summary>
    private static readonly TimeSpan CaseLimit = TimeSpan.FromSeconds(5);

    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    private readonly ITestOutputHelper _output;

    public InputMutationTests(ITestOutputHelper output)
    {
        _output = output;
        Directory.CreateDirectory(_folder);
    }

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    /// <summary>One change to a file's bytes at <see cref="At"/> (0..1) of a region: the first 64 bytes, the first
    /// 512 (where the headers are) or the whole file, so that header fields are hit as often as samples.</summary>
    public sealed record Mutation(int Kind, double At, int Region, int Length, byte Value)
    {
        public override string ToString() =>
            string.Create(CultureInfo.InvariantCulture, $"{Names[Kind]}@{At:0.####}/{Regions[Region]}x{Length}:{Value:X2}");

        public static readonly int[] Regions = [64, 512, int.MaxValue];

        private static readonly string[] Names = ["flip", "set", "insert", "delete", "truncate", "duplicate"];
    }

    /// <summary>A case: which of a family's files is changed and how.</summary>
    public sealed record Case(int File, Mutation[] Mutations)
    {
        public override string ToString() => $"file {File}: {string.Join(" ", Mutations.Select(m => m.ToString()))}";
    }

    private static readonly Gen<Mutation> MutationGen =
        Gen.Select(Gen.Int[0, 5], Gen.Double[0, 1], Gen.Int[0, 2], Gen.Int[1, 48], Gen.Byte,
            (kind, at, region, length, value) => new Mutation(kind, at, region, length, value));

    private static Gen<Case> CaseGen(int files) =>
        Gen.Select(Gen.Int[0, files - 1], MutationGen.Array[1, 3], (file, mutations) => new Case(file, mutations));

    /// <summary>Applies the mutations in order.</summary>
    public static byte[] Mutate(byte[] original, IEnumerable<Mutation> mutations)
    {
        var bytes = new List<byte>(original);
        foreach (var m in mutations)
        {
            var span = Math.Min(bytes.Count, Mutation.Regions[m.Region]);
            var at = Math.Min((int)(m.At * span), Math.Max(0, bytes.Count - 1));
            var length = Math.Min(m.Length, bytes.Count - at);
            switch (m.Kind)
            {
                case 0 when bytes.Count > 0:
                    bytes[at] ^= (byte)(1 << (m.Value & 7));
                    break;
                case 1 when bytes.Count > 0:
                    bytes[at] = m.Value;
                    break;
                case 2:
                    bytes.InsertRange(at, Enumerable.Repeat(m.Value, m.Length));
                    break;
                case 3 when length > 0:
                    bytes.RemoveRange(at, length);
                    break;
                case 4:
                    bytes.RemoveRange(at, bytes.Count - at);
                    break;
                case 5 when length > 0:
                    bytes.InsertRange(at, bytes.GetRange(at, length));
                    break;
            }
        }

        return [.. bytes];
    }

    /// <summary>Writes the family's files, replaces file <see cref="Case.File"/> by its mutation, runs the command;
    /// fails on an exception, a time-out, an unexpected exit code or a message that is not one line.</summary>
    private string Check(Case c, (string Name, byte[] Bytes)[] files, Func<string, string[]> args)
    {
        var folder = Path.Combine(_folder, "case");
        if (Directory.Exists(folder))
        {
            Directory.Delete(folder, recursive: true);
        }

        Directory.CreateDirectory(folder);
        for (var i = 0; i < files.Length; i++)
        {
            File.WriteAllBytes(Path.Combine(folder, files[i].Name), i == c.File ? Mutate(files[i].Bytes, c.Mutations) : files[i].Bytes);
        }

        var run = Task.Run(() => CliHarness.Run(args(folder)));
        if (!run.Wait(CaseLimit))
        {
            throw new TimeoutException($"{c}: no answer within {CaseLimit.TotalSeconds} s ({files[c.File].Name})");
        }

        var (exit, _, error) = run.Result;
        Assert.True(exit is 0 or 1 or 2, $"{c}: exit {exit}");
        if (exit == 2)
        {
            var lines = error.Split('\n', StringSplitOptions.RemoveEmptyEntries);
            Assert.True(lines.Length == 1 && lines[0].StartsWith("wavecheck", StringComparison.Ordinal),
                $"{c}: stderr is not one line: {error}");
            Assert.DoesNotContain("internal error", error, StringComparison.Ordinal);
        }

        return $"exit {exit}";
    }

    private static (string, byte[]) Text(string name, string text) => (name, new UTF8Encoding(false).GetBytes(text));

    private void Sample((string Name, byte[] Bytes)[] files, Func<string, string[]> args, string seed, int iterations) =>
        CaseGen(files.Length).Sample(c => Check(c, files, args), _output.WriteLine, seed: seed,
            iter: Environment.GetEnvironmentVariable("WAVECHECK_MUTATION_ITER") is { } more ? int.Parse(more, CultureInfo.InvariantCulture) : iterations,
            threads: 1, print: c => c.ToString());

    [Fact]
    public void Mutated_wav_files_end_in_0_1_or_2()
    {
        (string, byte[])[] files =
        [
            ("a.wav", InputFiles.Wav()),
            ("b.wav", InputFiles.Wav(s => { s.Tag = 1; s.Bits = 16; })),
        ];
        Sample(files, folder => ["analyze", Path.Combine(folder, "a.wav"), "-q"], "000000000vwFf", 300);
        Sample(files, folder => ["info", Path.Combine(folder, "b.wav")], "000000000vzGf", 150);
    }

    [Fact]
    public void Mutated_csv_files_end_in_0_1_or_2()
    {
        (string, byte[])[] files = [Text("a.csv", "# invented logger\n" + InputFiles.Csv())];
        Sample(files, folder => ["analyze", Path.Combine(folder, "a.csv"), "-q"], "000000000vCHf", 300);
        Sample(files, folder => ["info", Path.Combine(folder, "a.csv")], "000000000vRMf", 100);
    }

    [Fact]
    public void Mutated_comtrade_files_end_in_0_1_or_2()
    {
        (string, byte[])[] ascii = [Text("a.cfg", InputFiles.Cfg(InputFiles.CfgLines())), Text("a.dat", InputFiles.DatAscii())];
        Sample(ascii, folder => ["analyze", Path.Combine(folder, "a.cfg"), "-q"], "000000000vFIf", 250);
        (string, byte[])[] binary = [Text("b.cfg", InputFiles.Cfg(InputFiles.CfgLines("BINARY"))), ("b.dat", InputFiles.DatBinary("BINARY"))];
        Sample(binary, folder => ["analyze", Path.Combine(folder, "b.cfg"), "-q"], "000000000vIJf", 200);
        (string, byte[])[] cff = [Text("c.cff", "--- file type: CFG ---\n" + InputFiles.Cfg(InputFiles.CfgLines()) + "--- file type: DAT ASCII ---\n" + InputFiles.DatAscii())];
        Sample(cff, folder => ["analyze", Path.Combine(folder, "c.cff"), "-q"], "000000000vLKf", 150);
        Sample(binary, folder => ["info", Path.Combine(folder, "b.cfg")], "000000000vRMf", 100);
    }

    [Fact]
    public void Mutated_site_files_end_in_0_1_or_2()
    {
        (string, byte[])[] files = [Text("site.json", InputFiles.Site()), ("c1.wav", InputFiles.Wav(s => s.SampleCount = 1000))];
        Sample([files[0], files[1]], folder => ["survey", "--config", Path.Combine(folder, "site.json"), "-o", Path.Combine(folder, "out"), "-q"],
            "000000000vOLf", 60);
    }
}
