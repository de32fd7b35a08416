using System.CommandLine;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Survey;

namespace WaveCheck.Cli.Commands;

/// <summary><c>wavecheck demo</c>: the whole job on the bundled captures of an invented workshop.</summary>
internal static class DemoCommand
{
    public static Command Create()
    {
        var output = new Option<string>("--output", "-o") { Description = "Folder for the demo's summary and reports.", DefaultValueFactory = _ => "wavecheck-demo" };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "No progress display." };
        var command = new Command("demo",
            "Run the whole job on the bundled captures of an invented joinery workshop and write its reports into ./wavecheck-demo/.")
        {
            output, quiet,
        };
        command.SetAction(parse => CliRun.Guard(parse, run =>
        {
            var samples = FindSamples();
            var siteFile = Path.Combine(samples, "site.json");
            var site = SiteConfigReader.Read(siteFile);
            var outputDirectory = parse.GetValue(output)!;
            var document = SurveyCommand.Run(site.Jobs(), site.Upstream, site.Site, siteFile, outputDirectory, parquet: false,
                parse.GetValue(quiet), run, identityOf: job => site.IdentityOf(job.File, job.Settings.Circuit));
            new Screen(run.Terminal).Paragraph(
                $"Open {Path.GetFullPath(Path.Combine(outputDirectory, "index.html"))} in a browser; each circuit links its report.", "", "  ");
            return SurveyCommand.Exit(run.Terminal, document, Core.Model.Finding.None);
        }));
        return command;
    }

    /// <summary>The bundled samples: beside the program (copied at build), else ./samples.</summary>
    private static string FindSamples()
    {
        foreach (var candidate in new[] { Path.Combine(AppContext.BaseDirectory, "samples"), Path.GetFullPath("samples") })
        {
            if (File.Exists(Path.Combine(candidate, "site.json")))
            {
                return candidate;
            }
        }

        throw new CaptureFormatException(Path.Combine(AppContext.BaseDirectory, "samples", "site.json"),
            "the bundled demo captures are missing: run from the repository root or rebuild");
    }
}
