namespace WaveCheck.Core.Signal;

/// <summary>A streaming consumer of residual-current samples (amperes), fed block by block.</summary>
public interface ISampleSink
{
    /// <summary>Consumes the next block of samples, amperes.</summary>
    void Push(ReadOnlySpan<double> samplesA);
}
