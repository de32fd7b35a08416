using System.Runtime.ExceptionServices;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Measures batches of windows (the spectrum, then <see cref="WindowMeasurement"/>) and feeds their samples to the
/// sample sinks, on worker threads while the caller reads on. Batches queue up: a batch started while the one before
/// is still being measured joins the queue, so a worker finishing the older batch's last window goes straight on to
/// the newer one instead of waiting for the caller. The caller joins in when it waits for a batch (taking queued jobs,
/// the older batch's first), so no participant sits idle while a job it may take is queued. Each participant has its
/// own plans and measurement (with its scratch). The work on a window depends only on its batch (two odd windows of
/// equal length in it share one complex transform), never on which thread does it, so the figures are the same for
/// every worker count. The sinks get each batch's windows in order, in one job per batch, and the sinks' job of a
/// batch waits in the queue until the one of the batch before has finished (the other jobs overtake it), so the
/// sinks see the capture's samples in order and never two threads at once. Not thread-safe towards its caller.
/// </summary>
internal sealed class WindowWorkers
{
    private readonly (SpectrumPlans Plans, WindowMeasurement Measurement)[] _tools;
    private readonly object _gate = new();
    private readonly List<Job> _queue = [];
    private readonly bool[] _workerRunning;
    private bool _sinksRunning;
    private Exception? _failure;

    /// <summary>Creates the tools of <paramref name="workers"/> participants: the caller and workers − 1 threads
    /// (1: all the work runs on the calling thread in <see cref="Wait"/>), each with its own measurement.</summary>
    public WindowWorkers(int workers, Func<WindowMeasurement> createMeasurement)
    {
        _tools = new (SpectrumPlans, WindowMeasurement)[workers];
        for (var i = 0; i < workers; i++)
        {
            _tools[i] = (new SpectrumPlans(), createMeasurement());
        }

        _workerRunning = new bool[workers - 1];
    }

    /// <summary>Queues <paramref name="batch"/> for measuring and feeding to <paramref name="sinks"/> (its slots must
    /// not change until <see cref="Wait"/> has returned for it) and wakes the workers.</summary>
    /// <returns>The batch's ticket, for <see cref="Wait"/>.</returns>
    public Ticket Start(ReadOnlySpan<WindowSlot> batch, IReadOnlyList<ISampleSink> sinks)
    {
        var ticket = new Ticket();
        var jobs = new List<Job>(batch.Length + 1);
        if (sinks.Count > 0 && !batch.IsEmpty)
        {
            // The sinks' job first: it is the longest and must not be left to the end.
            jobs.Add(new Job(ticket, null, null, batch.ToArray(), sinks));
        }

        // An odd window shares its complex transform with the next unpaired odd window of the same length in the
        // batch (an even one has its half-length transform alone).
        Span<bool> paired = stackalloc bool[batch.Length];
        for (var i = 0; i < batch.Length; i++)
        {
            if (paired[i])
            {
                continue;
            }

            var slot = batch[i];
            WindowSlot? partner = null;
            for (var j = i + 1; j < batch.Length && slot.Length % 2 == 1; j++)
            {
                if (!paired[j] && batch[j].Length == slot.Length)
                {
                    paired[j] = true;
                    partner = batch[j];
                    break;
                }
            }

            jobs.Add(new Job(ticket, slot, partner, null, null));
        }

        lock (_gate)
        {
            ticket.Remaining = jobs.Count;
            _queue.AddRange(jobs);
            WakeWorkers();
        }

        return ticket;
    }

    // Starts a thread for every idle worker while jobs are queued (under the lock).
    private void WakeWorkers()
    {
        for (var w = 0; w < _workerRunning.Length && _queue.Count > 0; w++)
        {
            if (!_workerRunning[w])
            {
                _workerRunning[w] = true;
                _ = Task.Factory.StartNew(worker => Work((int)worker!), w + 1, CancellationToken.None,
                    TaskCreationOptions.None, TaskScheduler.Default);
            }
        }
    }

    /// <summary>Takes queued jobs until the batch of <paramref name="ticket"/> is finished; a job's exception (any
    /// batch's) is rethrown here.</summary>
    public void Wait(Ticket ticket)
    {
        ArgumentNullException.ThrowIfNull(ticket);
        while (true)
        {
            Job? job;
            lock (_gate)
            {
                while (true)
                {
                    if (_failure is not null)
                    {
                        ExceptionDispatchInfo.Capture(_failure).Throw();
                    }

                    if (ticket.Remaining == 0)
                    {
                        return;
                    }

                    job = Take();
                    if (job is not null)
                    {
                        break;
                    }

                    Monitor.Wait(_gate);
                }
            }

            Run(job, 0);
        }
    }

    // A worker thread: takes jobs until none it may take is queued (a job that becomes takeable later, the next
    // sinks' job, is taken by whoever finishes the one it waits for, or by a worker started with the next batch).
    private void Work(int participant)
    {
        while (true)
        {
            Job? job;
            lock (_gate)
            {
                job = _failure is null ? Take() : null;
                if (job is null)
                {
                    _workerRunning[participant - 1] = false;
                    return;
                }
            }

            Run(job, participant);
        }
    }

    // The first queued job that may run now (under the lock): a sinks' job only while no other runs.
    private Job? Take()
    {
        for (var i = 0; i < _queue.Count; i++)
        {
            var job = _queue[i];
            if (job.Sinks is not null)
            {
                if (_sinksRunning)
                {
                    continue;
                }

                _sinksRunning = true;
            }

            _queue.RemoveAt(i);
            return job;
        }

        return null;
    }

    private void Run(Job job, int participant)
    {
        Exception? failure = null;
        try
        {
            if (job.Sinks is not null)
            {
                foreach (var slot in job.Batch!)
                {
                    foreach (var sink in job.Sinks)
                    {
                        sink.Push(slot.Window);
                    }
                }
            }
            else
            {
                var (plans, measurement) = _tools[participant];
                var (first, second) = (job.First!, job.Second);
                var plan = plans.For(first.Length);
                if (second is null)
                {
                    plan.Power(first.Window, first.Power);
                }
                else
                {
                    plan.PowerPair(first.Window, second.Window, first.Power, second.Power);
                    measurement.Measure(second);
                }

                measurement.Measure(first);
            }
        }
#pragma warning disable CA1031 // Any failure is handed to the caller's Wait, which rethrows it.
        catch (Exception ex)
#pragma warning restore CA1031
        {
            failure = ex;
        }

        lock (_gate)
        {
            if (job.Sinks is not null)
            {
                _sinksRunning = false;
            }

            _failure ??= failure;
            job.Ticket.Remaining--;
            if (job.Sinks is not null && _failure is null)
            {
                // The next batch's sinks' job may have been passed over by a worker that has since stopped.
                WakeWorkers();
            }

            Monitor.PulseAll(_gate);
        }
    }

    /// <summary>A batch in the queue: <see cref="Wait"/> returns once its jobs are done.</summary>
    public sealed class Ticket
    {
        /// <summary>Jobs of the batch not yet finished (under the workers' lock).</summary>
        internal int Remaining { get; set; }
    }

    // One window (or an odd pair sharing a transform), or the sinks' feed of a whole batch (Batch and Sinks set).
    private sealed record Job(Ticket Ticket, WindowSlot? First, WindowSlot? Second, WindowSlot[]? Batch,
        IReadOnlyList<ISampleSink>? Sinks);
}
