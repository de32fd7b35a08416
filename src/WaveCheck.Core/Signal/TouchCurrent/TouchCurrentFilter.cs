using System.Numerics;

namespace WaveCheck.Core.Signal;

/// <summary>
/// One second-order IIR section in direct form II transposed:
/// y = b0 x + z1; z1 = b1 x − a1 y + z2; z2 = b2 x − a2 y. Starts from rest. Not thread-safe (holds state).
/// </summary>
public sealed class TouchCurrentFilter
{
    private readonly double _b0, _b1, _b2, _a1, _a2;
    private double _z1, _z2;

    /// <summary>Creates a section from normalised coefficients (a0 = 1).</summary>
    /// <param name="b0">Numerator z⁰.</param>
    /// <param name="b1">Numerator z⁻¹.</param>
    /// <param name="b2">Numerator z⁻².</param>
    /// <param name="a1">Denominator z⁻¹.</param>
    /// <param name="a2">Denominator z⁻².</param>
    /// <param name="sampleRateHz">Sample rate the coefficients are for, hertz.</param>
    public TouchCurrentFilter(double b0, double b1, double b2, double a1, double a2, double sampleRateHz)
    {
        (_b0, _b1, _b2, _a1, _a2) = (b0, b1, b2, a1, a2);
        SampleRateHz = sampleRateHz;
    }

    /// <summary>Sample rate, hertz.</summary>
    public double SampleRateHz { get; }

    /// <summary>Numerator coefficients b0, b1, b2 and denominator 1, a1, a2.</summary>
    public (double B0, double B1, double B2, double A1, double A2) Coefficients => (_b0, _b1, _b2, _a1, _a2);

    /// <summary>Filters one sample.</summary>
    /// <param name="x">Input.</param>
    /// <returns>Output.</returns>
    public double Process(double x)
    {
        var y = (_b0 * x) + _z1;
        _z1 = (_b1 * x) - (_a1 * y) + _z2;
        _z2 = (_b2 * x) - (_a2 * y);
        return y;
    }

    /// <summary>The two state values of the transposed direct form II, so that a caller's loop can hold them in
    /// registers and hand them back (<see cref="Process"/> on a heap object stores them every sample).</summary>
    internal (double Z1, double Z2) State
    {
        get => (_z1, _z2);
        set => (_z1, _z2) = value;
    }

    /// <summary>Frequency response H(e^{jω}), ω = 2πf/fs.</summary>
    /// <param name="frequencyHz">Frequency, hertz.</param>
    public Complex Response(double frequencyHz)
    {
        var w = 2 * Math.PI * frequencyHz / SampleRateHz;
        var z1 = Complex.FromPolarCoordinates(1, -w);
        var z2 = z1 * z1;
        return (_b0 + (_b1 * z1) + (_b2 * z2)) / (1 + (_a1 * z1) + (_a2 * z2));
    }
}
