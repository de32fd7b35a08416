using System.Numerics;

namespace WaveCheck.Core.Signal;

/// <summary>An analog transfer function H(s) = N(s)/D(s), coefficients in ascending powers of s.</summary>
/// <param name="Numerator">N(s) coefficients, s⁰ first.</param>
/// <param name="Denominator">D(s) coefficients, s⁰ first.</param>
public sealed record AnalogTransferFunction(IReadOnlyList<double> Numerator, IReadOnlyList<double> Denominator)
{
    /// <summary>H(j2πf).</summary>
    /// <param name="frequencyHz">Frequency, hertz.</param>
    public Complex Response(double frequencyHz)
    {
        var s = new Complex(0, 2 * Math.PI * frequencyHz);
        return Evaluate(Numerator, s) / Evaluate(Denominator, s);
    }

    private static Complex Evaluate(IReadOnlyList<double> poly, Complex s)
    {
        Complex sum = 0;
        for (var i = poly.Count - 1; i >= 0; i--)
        {
            sum = (sum * s) + poly[i];
        }

        return sum;
    }
}
