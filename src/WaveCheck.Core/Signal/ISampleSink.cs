namespace WaveCheck.Core.Signal;

/// <summary>
/// A consumer that rides on the analysis pass: it receives every sample of the residual current, in order, window by
/// window (a touch-current meter, a filter bank), the samples after the last whole window when the analysis completes.
/// It knows its sample rate from its own construction. Implementations need not be thread-safe: the analysis never
/// calls them from two threads at once, though not always from the caller's thread, and it has called them with every
/// sample by the time <see cref="CaptureAnalysis.Complete"/> returns.
/// </summary>
public interface ISampleSink
{
    /// <summary>Takes the next consecutive samples, amperes. The span is only valid during the call.</summary>
    void Push(ReadOnlySpan<double> samplesA);
}
