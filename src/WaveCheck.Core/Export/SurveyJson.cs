using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>Writes <see cref="SurveyDocument"/>.</summary>
public static class SurveyJson
{
    /// <summary>Writes the survey JSON whole or not at all (<c>-</c>: stdout).</summary>
    /// <param name="path">Target file or <c>-</c>.</param>
    /// <param name="document">The survey.</param>
    public static void Write(string path, SurveyDocument document)
    {
        ArgumentNullException.ThrowIfNull(document);
        ResultJson.Write(path, document);
    }
}
