namespace WaveCheck.Core.Signal;

/// <summary>
/// One analysis window on its way through <see cref="CaptureAnalysis"/>: its samples, where it starts and the
/// frequency tracked for it (set by the calling thread), then its spectrum and shape (set by a worker).
/// </summary>
internal sealed class WindowSlot(int capacity)
{
    /// <summary>Sample buffer, filled from the start; <see cref="Length"/> values are the window.</summary>
    public double[] Samples { get; } = new double[capacity];

    /// <summary>Mean-square spectrum, <see cref="Length"/>/2 + 1 bins.</summary>
    public double[] Power { get; } = new double[(capacity / 2) + 1];

    /// <summary>Samples in the window.</summary>
    public int Length { get; set; }

    /// <summary>Index of the window's first sample in the capture.</summary>
    public long Start { get; set; }

    /// <summary>Mains frequency tracked for the window, hertz.</summary>
    public double FrequencyHz { get; set; }

    /// <summary>Sum, sum of squares, least and greatest sample of the window.</summary>
    public (double Sum, double Squares, double Min, double Max) Moments { get; set; }

    /// <summary>Smooth DC, pulsating DC and current delay angle of the window.</summary>
    public ShapeFigures Shape { get; set; }

    /// <summary>The window's samples.</summary>
    public ReadOnlySpan<double> Window => Samples.AsSpan(0, Length);

    /// <summary>The window's spectrum.</summary>
    public ReadOnlySpan<double> Bins => Power.AsSpan(0, (Length / 2) + 1);
}

/// <summary>
/// Measures the spectra and shapes of a batch of windows on worker threads while the caller reads on; each worker has
/// its own plans and scratch. The work on a window depends only on the batch (two odd windows of equal length in it
/// share one complex transform), never on which thread does it, so the figures are the same for every worker
/// count. One batch in flight at a time; not thread-safe towards its caller.
/// </summary>
internal sealed class WindowWorkers
{
    private readonly (SpectrumPlans Plans, WaveformShape Shape)[] _tools;
    private readonly int _cycles;
    private readonly List<(WindowSlot First, WindowSlot? Second)> _jobs = [];
    private readonly Task[] _tasks;
    private bool _running;

    /// <summary>Creates <paramref name="workers"/> workers (1: the work runs on the calling thread in
    /// <see cref="Start"/>).</summary>
    public WindowWorkers(int workers, int cycles)
    {
        _cycles = cycles;
        _tools = new (SpectrumPlans, WaveformShape)[workers];
        for (var i = 0; i < workers; i++)
        {
            _tools[i] = (new SpectrumPlans(), new WaveformShape());
        }

        _tasks = new Task[workers];
    }

    /// <summary>Starts measuring <paramref name="batch"/> (its slots must not change until <see cref="Wait"/>).</summary>
    public void Start(ReadOnlySpan<WindowSlot> batch)
    {
        Wait();
        // An odd window shares its complex transform with the next unpaired odd window of the same length in the
        // batch (an even one has its half-length transform alone).
        _jobs.Clear();
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

        if (_tools.Length == 1)
        {
            Run(0);
            return;
        }

        for (var w = 0; w < _tools.Length; w++)
        {
            _tasks[w] = Task.Factory.StartNew(worker => Run((int)worker!), w, CancellationToken.None,
                TaskCreationOptions.None, TaskScheduler.Default);
        }

        _running = true;
    }

    /// <summary>Waits for the batch in flight, if any; a worker's exception is rethrown here.</summary>
    public void Wait()
    {
        if (!_running)
        {
            return;
        }

        _running = false;
        foreach (var task in _tasks)
        {
            task.GetAwaiter().GetResult();
        }
    }

    private void Run(int worker)
    {
        var (plans, shape) = _tools[worker];
        for (var j = worker; j < _jobs.Count; j += _tools.Length)
        {
            var (first, second) = _jobs[j];
            var plan = plans.For(first.Length);
            if (second is null)
            {
                plan.Power(first.Window, first.Power);
            }
            else
            {
                plan.PowerPair(first.Window, second.Window, first.Power, second.Power);
                Measure(second, shape);
            }

            Measure(first, shape);
        }
    }

    private void Measure(WindowSlot slot, WaveformShape shape)
    {
        var (sum, squares, min, max) = slot.Moments;
        var mean = sum / slot.Length;
        var figures = shape.Measure(slot.Window, _cycles, mean, min, max);
        if (!figures.PulsatingDc)
        {
            // The DC a bipolar window rides on, unbiased by a sub-mains motor frequency (see SubMainsDc).
            var acRms = Math.Sqrt(Math.Max(0, (squares / slot.Length) - (mean * mean)));
            figures = figures with { SmoothDcA = SubMainsDc.Estimate(slot.Window, slot.Bins, _cycles, mean, acRms) };
        }

        slot.Shape = figures;
    }
}
