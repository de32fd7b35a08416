namespace WaveCheck.Core.Signal;

/// <summary>
/// A consumer that rides on the analysis pass: it receives every sample of the residual current, in order, in the
/// blocks the analysis receives them (a touch-current meter, a filter bank). It knows its sample rate from its own
/// construction. Implementations need not be thread-safe: the analysis calls them from one thread.
/// </summary>
public interface ISampleSink
{
    /// <summary>Takes the next consecutive samples, amperes. The span is only valid during the call.</summary>
    void Push(ReadOnlySpan<double> samplesA);
}
