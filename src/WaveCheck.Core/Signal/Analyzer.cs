using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>The convenience entry: reads a whole capture through a <see cref="CaptureAnalysis"/> and returns its result.</summary>
public static class Analyzer
{
    /// <summary>Block size used to read the capture, samples.</summary>
    public const int BlockSamples = 65536;

    /// <summary>Analyses every sample of <paramref name="source"/> in one streaming pass.</summary>
    /// <param name="source">An opened capture; read to its end, not disposed.</param>
    /// <param name="options">Settings.</param>
    /// <param name="progress">Receives the share read, 0..1, after each block (when the length is known).</param>
    /// <param name="cancellationToken">Checked before each block is read.</param>
    /// <exception cref="CaptureFormatException">The reader found malformed data.</exception>
    /// <exception cref="OptionValueException">An option is out of range.</exception>
    /// <exception cref="OperationCanceledException">Cancelled.</exception>
    public static AnalysisResult Analyze(ICaptureSource source, AnalysisOptions options, IProgress<double>? progress = null,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(source);
        ArgumentNullException.ThrowIfNull(options);
        var analysis = new CaptureAnalysis(source.Info, options);
        var block = source.CreateBlock(BlockSamples);
        var expected = source.Info.SampleCount;
        while (!cancellationToken.IsCancellationRequested && source.Read(block))
        {
            analysis.Push(block);
            if (progress is not null && expected > 0)
            {
                progress.Report(Math.Min(1.0, analysis.SampleCount / (double)expected));
            }
        }

        cancellationToken.ThrowIfCancellationRequested();
        return analysis.Complete(source.Info, source.Warnings);
    }
}
