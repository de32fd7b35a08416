namespace WaveCheck.Cli.Tests;

/// <summary>
/// Runs every input of <see cref="BadInputCorpus"/> through the CLI in-process and checks the exit code and, for bad
/// input, that stderr is one line naming the file and the place (common practice for command-line tools, no source:
/// one diagnostic line per fault, no stack trace).
/// </summary>
public sealed class BadInputCorpusTests : IDisposable
{
    private static readonly Dictionary<string, BadInputCase> Cases = BadInputCorpus.All().ToDictionary(c => c.Name);

    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    public BadInputCorpusTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    public static TheoryData<string> Names()
    {
        var data = new TheoryData<string>();
        foreach (var name in Cases.Keys)
        {
            data.Add(name);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(Names))]
    public void Each_input_gets_its_exit_code_and_a_one_line_message_naming_the_place(string name)
    {
        var @case = Cases[name];
        var (args, places) = @case.Make(_folder);
        var (exit, _, error) = CliHarness.Run(args);
        Assert.True(exit == @case.Exit, $"{name}: exit {exit}, expected {@case.Exit}; stderr: {error}");
        if (@case.Exit != 2)
        {
            return;
        }

        var lines = error.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var line = Assert.Single(lines);
        Assert.StartsWith("wavecheck", line, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", line, StringComparison.Ordinal);
        Assert.DoesNotContain("internal error", line, StringComparison.Ordinal);
        foreach (var place in places)
        {
            Assert.True(line.Contains(place, StringComparison.Ordinal), $"{name}: '{place}' not in: {line}");
        }
    }

    [Fact]
    public void The_corpus_covers_every_format_and_both_outcomes()
    {
        foreach (var prefix in new[] { "wav-", "csv-", "cfg-", "dat-", "cff-", "site-", "option-" })
        {
            Assert.Contains(Cases.Keys, k => k.StartsWith(prefix, StringComparison.Ordinal));
        }

        Assert.Contains(Cases.Values, c => c.Exit == 0);
        Assert.True(Cases.Values.Count(c => c.Exit == 2) >= 150, $"{Cases.Values.Count(c => c.Exit == 2)} bad inputs");
    }
}
