// Core-level benchmark of the analysis engine: a synthetic capture generated block by block (no file, no reader),
// so the figures are the engine's own. Usage: dotnet run -c Release -- [minutes=10] [rateHz=50000]; WORKERS=n sets
// AnalysisOptions.WorkerCount (default the processor count; 1 measures windows on the calling thread).
// `wav FILE` times the whole analysis of a real file in-process; `stages` the per-window cost of each stage; `fft`
// the hand-written FFT against the library baseline (MathNet.Numerics).
using System.Diagnostics;
using System.Globalization;
using WaveCheck.AnalyzeBench;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Signal;


if (args.Length > 1 && args[0] == "wav")
{
    // The whole analysis of `wavecheck analyze` (reading, analysis, touch-current meter, assessment; not the console
    // table or the JSON) on a real file, in-process after a warm-up run, so start-up is excluded by construction:
    // the best of ROUNDS (default 5) runs, and the median (the machine is shared).
    var import = new ImportOptions { ScaleA = 1, Sensor = SensorCoupling.Dc };
    var rounds = Environment.GetEnvironmentVariable("ROUNDS") is { } r ? int.Parse(r, CultureInfo.InvariantCulture) : 5;
    long samples = 0;
    void Evaluate()
    {
        var evaluation = WaveCheck.Core.Evaluation.Run(args[1], import, new AnalysisOptions(),
            new WaveCheck.Core.Assessment.AssessmentOptions());
        samples = evaluation.Analysis.Capture.SampleCount;
    }

    Evaluate();
    var walls = new List<double>();
    var cpus = new List<double>();
    var allocatedBefore = GC.GetTotalAllocatedBytes(true);
    var collectionsBefore = GC.CollectionCount(0);
    for (var round = 0; round < rounds; round++)
    {
        var cpuBefore = Process.GetCurrentProcess().TotalProcessorTime;
        var clock = Stopwatch.StartNew();
        Evaluate();
        walls.Add(clock.Elapsed.TotalSeconds);
        cpus.Add((Process.GetCurrentProcess().TotalProcessorTime - cpuBefore).TotalSeconds);
    }

    var allocatedMb = (GC.GetTotalAllocatedBytes(true) - allocatedBefore) / 1048576.0 / rounds;
    var collections = (GC.CollectionCount(0) - collectionsBefore) / (double)rounds;
    walls.Sort();
    cpus.Sort();
    Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
        $"in-process, after warm-up, {samples} samples: best {walls[0]:0.000} s ({samples / walls[0] / 1e6:0.0} Msamples/s), median {walls[rounds / 2]:0.000} s ({samples / walls[rounds / 2] / 1e6:0.0} Msamples/s), CPU best {cpus[0]:0.000} s; {allocatedMb:0.0} MB allocated and {collections:0.#} gen-0 collections a run"));
    return;
}

if (args.Length > 0 && args[0] == "fft")
{
    FourierBaseline.Run();
    return;
}

if (args.Length > 0 && args[0] == "stages")
{
    Stages.Run(args.Length > 1 ? double.Parse(args[1], CultureInfo.InvariantCulture) : 50_000);
    return;
}

var minutes = args.Length > 0 ? double.Parse(args[0], CultureInfo.InvariantCulture) : 10;
var rate = args.Length > 1 ? double.Parse(args[1], CultureInfo.InvariantCulture) : 50_000;
var total = (long)(minutes * 60 * rate);

// Warm-up on a short capture so the timing excludes JIT.
Run((long)(5 * rate), rate);
var before = Process.GetCurrentProcess().PeakWorkingSet64;
var cpu = Process.GetCurrentProcess().TotalProcessorTime;
var watch = Stopwatch.StartNew();
var result = Run(total, rate);
watch.Stop();
var peak = Process.GetCurrentProcess().PeakWorkingSet64;
var seconds = watch.Elapsed.TotalSeconds;
var cpuSeconds = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds;
Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
    $"samples {total}, windows {result.Windows.Count}, analysis {seconds:0.000} s wall ({total / seconds / 1e6:0.0} Msamples/s), {cpuSeconds:0.000} s CPU ({total / cpuSeconds / 1e6:0.0} Msamples/s), peak working set {peak / 1048576.0:0} MB (before {before / 1048576.0:0} MB), mains {result.Mains.FrequencyHz:0.000} Hz"));

static WaveCheck.Core.Model.AnalysisResult Run(long samples, double rate)
{
    using var source = new SyntheticSource(samples, rate);
    var workers = Environment.GetEnvironmentVariable("WORKERS") is { } text ? int.Parse(text, CultureInfo.InvariantCulture) : Environment.ProcessorCount;
    return Analyzer.Analyze(source, new AnalysisOptions { WorkerCount = workers });
}
