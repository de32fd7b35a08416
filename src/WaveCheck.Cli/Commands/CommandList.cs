using System.CommandLine;

namespace WaveCheck.Cli.Commands;

/// <summary>Every sub-command, in the order `--help` lists them. Add one line per command.</summary>
internal static class CommandList
{
    public static IEnumerable<Command> All()
    {
        yield return InfoCommand.Create();
        yield return AnalyzeCommand.Create();
        yield return SurveyCommand.Create();
        yield return CompareCommand.Create();
        yield return SynthCommand.Create();
        yield return DemoCommand.Create();
    }
}
