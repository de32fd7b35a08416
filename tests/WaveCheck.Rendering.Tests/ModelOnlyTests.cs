using System.Reflection.Metadata;
using System.Reflection.PortableExecutable;
using System.Runtime.CompilerServices;
using WaveCheck.Core.Model;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Rendering.Tests;

/// <summary>Rendering reads only the result model (Core's Model, Text, Export, Capture), never the assessment that
/// makes it (DEVELOPERS.md, Layout and Conventions: "Rendering ... reads only the result model"): a report written
/// from a result must not be able to redo or bend a verdict.</summary>
public sealed class ModelOnlyTests
{
    private const string AssessmentNamespace = "WaveCheck.Core.Assessment";

    /// <summary>The compiled assembly: every type it references, by name, from its metadata tables (ECMA-335 §II.22.38,
    /// TypeRef). A method called or a type named anywhere in Rendering leaves a TypeRef row.</summary>
    [Fact]
    public void TheRenderingAssemblyReferencesNoAssessmentType()
    {
        using var stream = File.OpenRead(typeof(ReportWriter).Assembly.Location);
        using var pe = new PEReader(stream);
        var metadata = pe.GetMetadataReader();
        var referenced = metadata.TypeReferences
            .Select(h => metadata.GetTypeReference(h))
            .Select(t => $"{metadata.GetString(t.Namespace)}.{metadata.GetString(t.Name)}")
            .ToList();

        // The scan sees the model it should see: without this, an empty list would pass.
        Assert.Contains($"{typeof(AnalysisResult).Namespace}.{nameof(AnalysisResult)}", referenced);
        Assert.Contains($"{typeof(AssessmentResult).Namespace}.{nameof(AssessmentResult)}", referenced);
        Assert.DoesNotContain(referenced, name => name.StartsWith(AssessmentNamespace + ".", StringComparison.Ordinal));
    }

    /// <summary>The source, for what compiles away: a constant from <c>Assessment.Limits</c> is copied into the IL and
    /// leaves no TypeRef, so the sources are read for the namespace too.</summary>
    [Fact]
    public void NoRenderingSourceNamesTheAssessment()
    {
        var folder = Path.GetFullPath(Path.Combine(Path.GetDirectoryName(ThisFile())!, "..", "..", "src", "WaveCheck.Rendering"));
        var sources = Directory.EnumerateFiles(folder, "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)
                && !f.Contains($"{Path.DirectorySeparatorChar}bin{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .ToList();

        // The report writer and its sections are among the files read: a wrong folder finds nothing and would pass.
        Assert.Contains(sources, f => Path.GetFileName(f) == "ReportWriter.cs");
        var offenders = sources
            .Where(f => File.ReadAllText(f).Contains("Core.Assessment", StringComparison.Ordinal))
            .Select(f => Path.GetRelativePath(folder, f))
            .ToList();
        Assert.Empty(offenders);
    }

    private static string ThisFile([CallerFilePath] string path = "") => path;
}
