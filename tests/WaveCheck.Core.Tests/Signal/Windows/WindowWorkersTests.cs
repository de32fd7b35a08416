using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class WindowWorkersTests
{
    private const double Fs = 50_000;

    // A half-wave load on smooth DC whose mains frequency sweeps 49.9 -> 50.1 Hz (window lengths of 9 980 .. 10 020
    // samples, odd and even, so both the single and the paired transforms run), noise and one spike.
    private static double[] Capture()
    {
        var random = new Random(5);
        var n = (int)(30 * Fs);
        var samples = new double[n];
        var phase = 0.0;
        for (var i = 0; i < n; i++)
        {
            var t = i / Fs;
            var theta = phase % (2 * Math.PI);
            samples[i] = 0.004 + (theta >= 1.2 && theta < Math.PI ? 0.03 * Math.Sin(theta) : 0) +
                (0.0005 * Synth.Gaussian(random)) + (i == 700_001 ? 0.5 : 0);
            phase += 2 * Math.PI * (49.9 + (0.2 * t / 30)) / Fs;
        }

        return samples;
    }

    private static (string Json, List<double> Starts) Run(double[] samples, int workers, int block)
    {
        var starts = new List<double>();
        var meter = new TouchCurrentMeter(Fs);
        var options = new AnalysisOptions
        {
            WorkerCount = workers,
            WindowCompleted = w => starts.Add(w.StartS),
            Sinks = [meter],
        };
        var analysis = new CaptureAnalysis(new MemoryCaptureSource(samples, Fs, SensorCoupling.Dc).Info, options);
        for (var at = 0; at < samples.Length; at += block)
        {
            analysis.Push(samples.AsSpan(at, Math.Min(block, samples.Length - at)));
        }

        var result = analysis.Complete() with { TouchCurrent = meter.Result };
        return (ResultJson.Serialize(result), starts);
    }

    [Fact]
    public void SinksSeeEverySampleInOrder()
    {
        // Reference: the same meter fed the whole capture directly. Its filters are recursive, so any sample lost,
        // repeated or out of order (windows fed by worker threads, the tail after the last window) changes the
        // weighted figures; 1e-12 relative allows only the reordered additions of the unweighted block sums.
        var samples = Capture();
        var direct = new TouchCurrentMeter(Fs);
        direct.Push(samples);
        var expected = direct.Result;
        var meter = new TouchCurrentMeter(Fs);
        var analysis = new CaptureAnalysis(new MemoryCaptureSource(samples, Fs, SensorCoupling.Dc).Info,
            new AnalysisOptions { WorkerCount = 2, Sinks = [meter] });
        for (var at = 0; at < samples.Length; at += 7_919)
        {
            analysis.Push(samples.AsSpan(at, Math.Min(7_919, samples.Length - at)));
        }

        var result = analysis.Complete();
        Assert.Contains(result.Warnings, w => w.Code == "partial-window");
        var actual = meter.Result;
        Assert.Equal(expected.PerceptionRmsA, actual.PerceptionRmsA, 1e-12 * expected.PerceptionRmsA);
        Assert.Equal(expected.PerceptionPeakA, actual.PerceptionPeakA, 1e-12 * expected.PerceptionPeakA);
        Assert.Equal(expected.LetGoRmsA, actual.LetGoRmsA, 1e-12 * expected.LetGoRmsA);
        Assert.Equal(expected.LetGoPeakA, actual.LetGoPeakA, 1e-12 * expected.LetGoPeakA);
        Assert.Equal(expected.UnweightedRmsA, actual.UnweightedRmsA, 1e-12 * expected.UnweightedRmsA);
        Assert.Equal(expected.DcA, actual.DcA, 1e-12 * Math.Abs(expected.DcA));
    }

    [Theory]
    [InlineData(65_536)]
    [InlineData(7_919)]
    public void WorkerCountDoesNotChangeAnyFigure(int block)
    {
        // Reference: the analysis measured on the calling thread alone (WorkerCount = 1); the parallel path must give
        // the same result bit for bit (compared as the full JSON, every figure written with round-trip precision).
        // The block size stays fixed: the touch meter's unweighted sums are added per window, but the windows'
        // moments are vectorised sums whose order could change with how the samples arrive.
        var samples = Capture();
        var (sequential, sequentialStarts) = Run(samples, 1, block);
        Assert.Contains("\"transient\"", sequential);
        foreach (var workers in new[] { 2, 3 })
        {
            var (parallel, starts) = Run(samples, workers, block);
            Assert.Equal(sequential, parallel);
            Assert.Equal(sequentialStarts, starts);
        }

        // Callbacks in time order, one per window.
        for (var i = 1; i < sequentialStarts.Count; i++)
        {
            Assert.True(sequentialStarts[i] > sequentialStarts[i - 1]);
        }

        Assert.True(sequentialStarts.Count >= 140);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void A_sink_s_failure_reaches_the_caller_and_no_sink_runs_twice_at_once(int workers)
    {
        // Batches queue up behind each other at the workers; a sink's exception must still come out of the analysis
        // (as itself, not wrapped), and the sinks' jobs of consecutive batches must never overlap.
        var samples = Capture();
        var sink = new GuardedSink(failAtPush: 40);
        var analysis = new CaptureAnalysis(new MemoryCaptureSource(samples, Fs, SensorCoupling.Dc).Info,
            new AnalysisOptions { WorkerCount = workers, Sinks = [sink] });
        var ex = Assert.Throws<InvalidOperationException>(() =>
        {
            for (var at = 0; at < samples.Length; at += 65_536)
            {
                analysis.Push(samples.AsSpan(at, Math.Min(65_536, samples.Length - at)));
            }

            analysis.Complete();
        });
        Assert.Equal("sink failed at push 40", ex.Message);
        Assert.False(sink.Overlapped);

        var whole = new GuardedSink(failAtPush: int.MaxValue);
        var full = new CaptureAnalysis(new MemoryCaptureSource(samples, Fs, SensorCoupling.Dc).Info,
            new AnalysisOptions { WorkerCount = workers, Sinks = [whole] });
        full.Push(samples);
        full.Complete();
        Assert.False(whole.Overlapped);
        // Every window's samples, then the tail: the whole capture, once.
        Assert.Equal(samples.Length, whole.Samples);
        Assert.Equal(full.WindowCount + 1, whole.Pushes);
    }

    private sealed class GuardedSink(int failAtPush) : ISampleSink
    {
        private int _inside;

        public int Pushes { get; private set; }

        public long Samples { get; private set; }

        public bool Overlapped { get; private set; }

        public void Push(ReadOnlySpan<double> samplesA)
        {
            if (Interlocked.Exchange(ref _inside, 1) == 1)
            {
                Overlapped = true;
            }

            Thread.Sleep(0);
            Pushes++;
            Samples += samplesA.Length;
            Volatile.Write(ref _inside, 0);
            if (Pushes == failAtPush)
            {
                throw new InvalidOperationException($"sink failed at push {Pushes}");
            }
        }
    }

    [Fact]
    public void RejectsNoWorkers()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new AnalysisOptions { WorkerCount = 0 }.Validate());
        Assert.Contains("at least 1", ex.Message);
    }
}
