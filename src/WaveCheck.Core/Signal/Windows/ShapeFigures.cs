namespace WaveCheck.Core.Signal;

/// <summary>Waveform-shape figures of one window.</summary>
/// <param name="SmoothDcA">The floor the current rides on, amperes, signed (see <see cref="WaveformShape"/>).</param>
/// <param name="PulsatingDc">Unipolar pulses that return to the floor in every mains cycle.</param>
/// <param name="CurrentDelayAngleDeg">Delay angle of a phase-controlled half-wave, degrees; null when not one.</param>
public readonly record struct ShapeFigures(double SmoothDcA, bool PulsatingDc, double? CurrentDelayAngleDeg);
