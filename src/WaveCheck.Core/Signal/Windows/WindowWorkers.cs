namespace WaveCheck.Core.Signal;

/// <summary>
/// Measures a batch of windows (the spectrum, then <see cref="WindowMeasurement"/>) and feeds its samples to the
/// sample sinks, on worker threads while the caller reads on; the caller joins in when it waits, so a batch is shared
/// out to every participant by a job counter (no thread sits idle while another has work). Each participant has its
/// own plans and measurement (with its scratch). The work on a window depends only on the batch (two odd windows of
/// equal length in it share one complex transform), never on which thread does it, so the figures are the same for
/// every worker count. The sinks get the batch's windows in order, in one job, so they see the capture's samples in
/// order and never two threads at once. One batch in flight at a time; not thread-safe towards its caller.
/// </summary>
internal sealed class WindowWorkers
{
    private readonly (SpectrumPlans Plans, WindowMeasurement Measurement)[] _tools;
    private readonly List<(WindowSlot? First, WindowSlot? Second)> _jobs = [];
    private readonly Task[] _tasks;
    private readonly List<WindowSlot> _batch = [];
    private IReadOnlyList<ISampleSink> _sinks = [];
    private int _next;
    private bool _running;

    /// <summary>Creates the tools of <paramref name="workers"/> participants: the caller and workers − 1 threads
    /// (1: all the work runs on the calling thread in <see cref="Start"/>), each with its own measurement.</summary>
    public WindowWorkers(int workers, Func<WindowMeasurement> createMeasurement)
    {
        _tools = new (SpectrumPlans, WindowMeasurement)[workers];
        for (var i = 0; i < workers; i++)
        {
            _tools[i] = (new SpectrumPlans(), createMeasurement());
        }

        _tasks = new Task[workers - 1];
    }

    /// <summary>Starts measuring <paramref name="batch"/> and feeding it to <paramref name="sinks"/> (its slots must
    /// not change until <see cref="Wait"/>).</summary>
    public void Start(ReadOnlySpan<WindowSlot> batch, IReadOnlyList<ISampleSink> sinks)
    {
        Wait();
        _batch.Clear();
        foreach (var slot in batch)
        {
            _batch.Add(slot);
        }

        _sinks = sinks;
        _jobs.Clear();
        if (sinks.Count > 0 && !batch.IsEmpty)
        {
            // The sinks' job first: it is the longest and must not be left to the end.
            _jobs.Add((null, null));
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

            _jobs.Add((slot, partner));
        }

        _next = 0;
        if (_tasks.Length == 0)
        {
            Drain(0);
            return;
        }

        for (var w = 0; w < _tasks.Length; w++)
        {
            _tasks[w] = Task.Factory.StartNew(worker => Drain((int)worker!), w + 1, CancellationToken.None,
                TaskCreationOptions.None, TaskScheduler.Default);
        }

        _running = true;
    }

    /// <summary>Takes a share of the batch in flight, if any, then waits for the rest; a worker's exception is
    /// rethrown here.</summary>
    public void Wait()
    {
        if (!_running)
        {
            return;
        }

        _running = false;
        try
        {
            Drain(0);
        }
        finally
        {
            foreach (var task in _tasks)
            {
                task.GetAwaiter().GetResult();
            }
        }
    }

    private void Drain(int participant)
    {
        var (plans, measurement) = _tools[participant];
        int j;
        while ((j = Interlocked.Increment(ref _next) - 1) < _jobs.Count)
        {
            var (first, second) = _jobs[j];
            if (first is null)
            {
                FeedSinks();
                continue;
            }

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

    private void FeedSinks()
    {
        foreach (var slot in _batch)
        {
            foreach (var sink in _sinks)
            {
                sink.Push(slot.Window);
            }
        }
    }
}
