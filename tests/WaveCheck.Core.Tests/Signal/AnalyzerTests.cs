using WaveCheck.Core.Capture;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="Analyzer.Analyze"/>: reads the capture in blocks of <see cref="Analyzer.BlockSamples"/>, reports the share
/// read after each block, stops when cancelled, and refuses missing arguments.
/// </summary>
public class AnalyzerTests
{
    private const double Fs = 10_000;

    // 140 000 samples: two whole blocks of 65 536 and a last one of 8 928 (closed form: 140 000 − 2·65 536).
    private static readonly double[] Samples = Synth.Make(Fs, 14, t => 0.01 * Math.Sin(2 * Math.PI * 50 * t));

    /// <summary>A source whose header may claim a length other than the samples it holds, and that counts its reads.</summary>
    private sealed class ClaimingSource(double[] samplesA, long claimedSamples) : ICaptureSource
    {
        private readonly MemoryCaptureSource _inner = new(samplesA, Fs);

        public int Reads { get; private set; }

        public CaptureInfo Info => _inner.Info with { SampleCount = claimedSamples };

        public IReadOnlyList<CaptureWarning> Warnings => _inner.Warnings;

        public CaptureBlock CreateBlock(int capacity = 65536) => _inner.CreateBlock(capacity);

        public bool Read(CaptureBlock block)
        {
            Reads++;
            return _inner.Read(block);
        }

        public void Dispose() => _inner.Dispose();
    }

    private sealed class Recorder : IProgress<double>
    {
        public List<double> Values { get; } = [];

        public void Report(double value) => Values.Add(value);
    }

    [Fact]
    public void Progress_is_the_share_read_after_each_block()
    {
        // Closed form: after k blocks, min(65 536·k, 140 000)/140 000.
        Assert.Equal(140_000, Samples.Length);
        var progress = new Recorder();
        var result = Analyzer.Analyze(new ClaimingSource(Samples, Samples.Length), new AnalysisOptions(), progress);
        Assert.Equal([65_536 / 140_000.0, 131_072 / 140_000.0, 1.0], progress.Values);
        Assert.Equal(14, result.Capture.DurationS, 1e-9);
    }

    [Fact]
    public void A_header_claiming_too_few_samples_never_reports_more_than_all()
    {
        // A header may understate the length (a recorder stopped before it rewrote its header): the share is held at 1
        // (common practice, no source: a progress bar never passes 100 %). Claimed 100 000: 0.65536, then 1, 1.
        var progress = new Recorder();
        Analyzer.Analyze(new ClaimingSource(Samples, 100_000), new AnalysisOptions(), progress);
        Assert.Equal([0.65536, 1.0, 1.0], progress.Values);
    }

    [Fact]
    public void An_unknown_length_reports_no_progress()
    {
        // SampleCount 0 means the length is not known in advance (a share of it would divide by zero).
        var progress = new Recorder();
        var result = Analyzer.Analyze(new ClaimingSource(Samples, 0), new AnalysisOptions(), progress);
        Assert.Empty(progress.Values);
        Assert.Equal(0.01 / Math.Sqrt(2), result.Summary.RmsA, 1e-6);
    }

    [Fact]
    public void Cancelling_stops_before_the_next_block_and_throws()
    {
        // Documented: the token is checked before each block is read; cancelled after the first report, the source
        // is read once more only if the check were missing.
        using var cts = new CancellationTokenSource();
        var source = new ClaimingSource(Samples, Samples.Length);
        var progress = new SynchronousProgress(_ => cts.Cancel());
        Assert.Throws<OperationCanceledException>(() => Analyzer.Analyze(source, new AnalysisOptions(), progress, cts.Token));
        Assert.Equal(1, source.Reads);
    }

    [Fact]
    public void A_token_cancelled_before_the_start_reads_nothing()
    {
        using var cts = new CancellationTokenSource();
        cts.Cancel();
        var source = new ClaimingSource(Samples, Samples.Length);
        Assert.Throws<OperationCanceledException>(() => Analyzer.Analyze(source, new AnalysisOptions(), null, cts.Token));
        Assert.Equal(0, source.Reads);
    }

    [Fact]
    public void Missing_arguments_are_refused_by_name()
    {
        Assert.Equal("source", Assert.Throws<ArgumentNullException>(() => Analyzer.Analyze(null!, new AnalysisOptions())).ParamName);
        Assert.Equal("options", Assert.Throws<ArgumentNullException>(() =>
            Analyzer.Analyze(new MemoryCaptureSource(Samples, Fs), null!)).ParamName);
    }

    private sealed class SynchronousProgress(Action<double> report) : IProgress<double>
    {
        public void Report(double value) => report(value);
    }
}
