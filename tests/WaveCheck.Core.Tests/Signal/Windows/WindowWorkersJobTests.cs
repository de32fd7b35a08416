using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// WindowWorkers on its own, with small windows built directly (issue 18: mutation testing): how a batch is cut into
/// jobs, that every window comes out measured as if alone, and the sinks' rule (the capture's samples in order,
/// never two threads at once), against the contract in the class's summary.
/// </summary>
public class WindowWorkersJobTests
{
    private const double Fs = 2_000;

    private static WindowMeasurement Measurement() => new(Fs, 10, 50, [], WaveformShape.DefaultRestBandA, null);

    // Window k: a half-wave rectified 50 Hz sine of 10 mA peak on k mA of DC, starting at sample 400·k, so its first
    // sample (sin 2π·50·400k/2000 = sin 2πk·10 = 0) is exactly k mA and names it. The spectrum is left to the workers
    // unless asked for.
    private static WindowSlot Slot(int length, int k, bool withSpectrum = false)
    {
        var samples = new double[length];
        for (var i = 0; i < length; i++)
        {
            var t = ((400.0 * k) + i) / Fs;
            samples[i] = (k * 0.001) + Math.Max(0, 0.01 * Math.Sin(2 * Math.PI * 50 * t));
        }

        var slot = WindowSlots.Load(samples, 400L * k, 50);
        if (!withSpectrum)
        {
            Array.Clear(slot.Power);
        }

        return slot;
    }

    [Theory]
    [InlineData(new[] { 400, 400, 400 }, false, 3)] // an even window has its half-length transform alone
    [InlineData(new[] { 400, 400, 400 }, true, 4)] // and the sinks have one job for the whole batch
    [InlineData(new[] { 401, 401, 401, 401 }, false, 2)] // odd windows of equal length share a transform in pairs
    [InlineData(new[] { 401, 401, 401 }, false, 2)] // the third has no partner
    [InlineData(new[] { 401, 399, 401, 399, 400 }, false, 3)] // pairs only of equal length: (401, 401), (399, 399), 400
    [InlineData(new[] { 401, 400, 399 }, true, 4)]
    [InlineData(new int[0], true, 0)] // nothing to measure: no job at all, not even the sinks'
    public void A_batch_is_cut_into_jobs_of_one_window_or_an_odd_pair(int[] lengths, bool withSink, int jobs)
    {
        // One participant, the caller: nothing runs before Wait, so the count of jobs queued is the plan's.
        var workers = new WindowWorkers(1, Measurement);
        var batch = lengths.Select((n, k) => Slot(n, k)).ToArray();
        var sink = new OrderSink(holdS: 0);
        var ticket = workers.Start(batch, withSink ? [sink] : []);
        Assert.Equal(jobs, ticket.Remaining);
        workers.Wait(ticket);
        Assert.Equal(0, ticket.Remaining);

        // Each window measured as if alone, paired or not. Reference: its spectrum from RealSpectrum's single-window
        // transform (checked against the plain DFT in RealSpectrumTests) and its figures measured from that; the
        // pair's complex transform agrees to rounding (1e-12 of the largest bin).
        for (var k = 0; k < batch.Length; k++)
        {
            var reference = Slot(lengths[k], k, withSpectrum: true);
            var expected = Measurement().Measure(reference);
            var top = reference.Bins.ToArray().Max();
            for (var b = 0; b < reference.Bins.Length; b++)
            {
                Assert.Equal(reference.Bins[b], batch[k].Bins[b], 1e-12 * top);
            }

            var actual = batch[k].Figures.Result;
            Assert.Equal(expected.RmsA, actual.RmsA, 1e-12 * expected.RmsA);
            Assert.Equal(expected.MainsRmsA, actual.MainsRmsA, 1e-9 * expected.RmsA);
            Assert.Equal(expected.HarmonicsRmsA, actual.HarmonicsRmsA, 1e-9 * expected.RmsA);
        }

        Assert.Equal(withSink ? lengths.Sum() : 0, sink.Samples);
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    public void A_later_batch_s_sinks_wait_for_the_earlier_batch_s(int participants)
    {
        // Contract (WindowWorkers summary): the sinks see the capture's samples in order and never two threads at
        // once. The sink's first push holds on for 0.3 s unless another push arrives meanwhile, which gives any
        // participant that would start the next batch's sinks' job early the time to do so and be seen.
        var workers = new WindowWorkers(participants, Measurement);
        var sink = new OrderSink(holdS: 0.3);
        var first = new[] { Slot(400, 0), Slot(400, 1), Slot(401, 2) };
        var second = new[] { Slot(401, 3), Slot(400, 4), Slot(400, 5) };
        var t1 = workers.Start(first, [sink]);
        var t2 = workers.Start(second, [sink]);
        workers.Wait(t1);
        workers.Wait(t2);
        Assert.False(sink.Overlapped);
        Assert.Equal(6, sink.Names.Count);
        for (var k = 0; k < 6; k++)
        {
            Assert.Equal(k * 0.001, sink.Names[k], 1e-15);
        }

        // No worker was lost on the way (a worker that stops on an error leaves its place taken for good).
        AssertWorkersTakeTheNextBatch(workers, 6);
    }

    // Waits for the workers of the batches before to stop, then starts one more batch and checks that it reaches its
    // sink without the caller waiting (at most 10 s, far beyond the milliseconds it takes).
    private static void AssertWorkersTakeTheNextBatch(WindowWorkers workers, int firstName)
    {
        Thread.Sleep(100);
        var sink = new OrderSink(holdS: 0);
        var batch = new[] { Slot(400, firstName), Slot(401, firstName + 1), Slot(400, firstName + 2) };
        var ticket = workers.Start(batch, [sink]);
        Assert.True(sink.ReachedCount(3, TimeSpan.FromSeconds(10)), "a batch did not reach its sink without Wait");
        workers.Wait(ticket);
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    public void Worker_threads_take_a_batch_while_the_caller_reads_on(int participants)
    {
        // Contract (WindowWorkers summary): batches are measured and fed to the sinks on worker threads while the
        // caller reads on, so a started batch reaches its sink without the caller waiting for it; and a worker that
        // has run out of jobs and stopped is started again by the next batch (two rounds, see
        // AssertWorkersTakeTheNextBatch).
        var workers = new WindowWorkers(participants, Measurement);
        AssertWorkersTakeTheNextBatch(workers, 0);
        AssertWorkersTakeTheNextBatch(workers, 3);
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    public void Queued_batches_give_every_window_the_figures_of_one_participant(int participants)
    {
        // Contract (WindowWorkers summary): the work on a window depends only on its batch, never on which thread does
        // it, so the figures are the same for every worker count, bit for bit. Reference: the same batches measured
        // by the caller alone. Six batches of eight windows (odd and even lengths, so pairs and single transforms)
        // are queued at once, so several participants work side by side, each on its own scratch.
        WindowSlot[][] Batches() => [.. Enumerable.Range(0, 6).Select(b =>
            Enumerable.Range(0, 8).Select(i => NoisySlot(4000 + ((b + i) % 3), (b * 8) + i)).ToArray())];
        var reference = Batches();
        var serial = new WindowWorkers(1, Measurement20k);
        foreach (var batch in reference)
        {
            serial.Wait(serial.Start(batch, []));
        }

        var parallel = Batches();
        var workers = new WindowWorkers(participants, Measurement20k);
        var tickets = parallel.Select(batch => workers.Start(batch, [])).ToList();
        tickets.ForEach(workers.Wait);
        for (var b = 0; b < reference.Length; b++)
        {
            for (var i = 0; i < reference[b].Length; i++)
            {
                Assert.Equal(reference[b][i].Figures.Result, parallel[b][i].Figures.Result);
            }
        }
    }

    private static WindowMeasurement Measurement20k() => new(20_000, 10, 50, [], WaveformShape.DefaultRestBandA, null);

    // A 10-cycle window at 20 kS/s: a half-wave rectified 50 Hz sine of 10 mA peak, a 3 kHz tone and seeded noise,
    // so every part of the measurement has something to work on.
    private static WindowSlot NoisySlot(int length, int seed)
    {
        var random = new Random(seed);
        var samples = new double[length];
        for (var i = 0; i < length; i++)
        {
            var t = i / 20_000.0;
            samples[i] = Math.Max(0, 0.01 * Math.Sin(2 * Math.PI * 50 * t)) + (0.001 * Math.Sin(2 * Math.PI * 3000 * t)) +
                (0.0002 * Synth.Gaussian(random));
        }

        var slot = WindowSlots.Load(samples, (long)seed * length, 50);
        Array.Clear(slot.Power);
        return slot;
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void After_a_failure_no_further_job_is_started(int participants)
    {
        // Contract (Wait: "a job's exception (any batch's) is rethrown here"): the sink's exception comes out of Wait
        // as itself, and the batch queued behind never reaches the sink (workers stop taking jobs once one failed).
        // The pause after the failure gives a worker that would go on the time to do so.
        var workers = new WindowWorkers(participants, Measurement);
        var sink = new FailingSink();
        var t1 = workers.Start([Slot(400, 0)], [sink]);
        var t2 = workers.Start([Slot(400, 1), Slot(400, 2)], [sink]);
        var ex = Assert.Throws<InvalidOperationException>(() => workers.Wait(t1));
        Assert.Equal("sink failed", ex.Message);
        Thread.Sleep(200);
        Assert.Equal(1, sink.Pushes);
        Assert.Throws<InvalidOperationException>(() => workers.Wait(t2));
    }

    private sealed class FailingSink : ISampleSink
    {
        private int _pushes;

        public int Pushes => Volatile.Read(ref _pushes);

        public void Push(ReadOnlySpan<double> samplesA)
        {
            Interlocked.Increment(ref _pushes);
            throw new InvalidOperationException("sink failed");
        }
    }

    // Records each pushed window's first sample (its name, see Slot) and whether two pushes ever overlapped; the very
    // first push waits up to holdS seconds for another to begin.
    private sealed class OrderSink(double holdS) : ISampleSink
    {
        private readonly ManualResetEventSlim _another = new();
        private int _inside;
        private int _pushes;

        public List<double> Names { get; } = [];

        public long Samples { get; private set; }

        public bool Overlapped { get; private set; }

        // Waits until count windows have arrived or the time is up; true when they arrived.
        public bool ReachedCount(int count, TimeSpan limit)
        {
            var until = DateTime.UtcNow + limit;
            lock (Names)
            {
                while (Names.Count < count)
                {
                    var left = until - DateTime.UtcNow;
                    if (left <= TimeSpan.Zero || !Monitor.Wait(Names, left))
                    {
                        return Names.Count >= count;
                    }
                }

                return true;
            }
        }

        public void Push(ReadOnlySpan<double> samplesA)
        {
            if (Interlocked.Increment(ref _inside) > 1)
            {
                Overlapped = true;
            }

            if (Interlocked.Increment(ref _pushes) == 1)
            {
                _another.Wait(TimeSpan.FromSeconds(holdS));
            }
            else
            {
                _another.Set();
            }

            lock (Names)
            {
                Names.Add(samplesA[0]);
                Samples += samplesA.Length;
                Monitor.PulseAll(Names);
            }

            Interlocked.Decrement(ref _inside);
        }
    }
}
