using System.Runtime.CompilerServices;

namespace WaveCheck.Core.Tests.Model;

/// <summary>
/// The result model and its writers sit below the pipeline: Signal, Assessment, Survey and Synthesis build results,
/// Model/Export/Text never reach back into them (DEVELOPERS.md, layout). Read from the sources, since a constant or an
/// enum value compiles away and leaves no reference in the assembly. Common practice, no source.
/// </summary>
public sealed class LayeringTests
{
    public static TheoryData<string> Layers => new() { "Model", "Export", "Text" };

    [Theory]
    [MemberData(nameof(Layers))]
    public void Model_export_and_text_name_no_stage_of_the_pipeline(string layer)
    {
        var folder = Path.GetFullPath(Path.Combine(Path.GetDirectoryName(ThisFile())!, "..", "..", "..", "src",
            "WaveCheck.Core", layer));
        var sources = Directory.EnumerateFiles(folder, "*.cs", SearchOption.AllDirectories).ToList();

        // A wrong folder finds nothing and would pass: each layer holds several files.
        Assert.True(sources.Count >= 3, $"{folder}: {sources.Count} source files");
        string[] stages = ["Core.Assessment", "Core.Signal", "Core.Survey", "Core.Synthesis"];
        var offenders = sources
            .SelectMany(f => stages.Where(s => File.ReadAllText(f).Contains(s, StringComparison.Ordinal))
                .Select(s => $"{Path.GetFileName(f)} names {s}"))
            .ToList();
        Assert.Empty(offenders);
    }

    private static string ThisFile([CallerFilePath] string path = "") => path;
}
