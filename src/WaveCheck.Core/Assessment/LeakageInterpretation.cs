using System.Globalization;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// Reads a leakage split for a person: the resistive part as an insulation resistance against
/// <see cref="Limits.MinimumInsulationResistanceOhm"/>, the harmonic fit against
/// <see cref="Limits.LeakageFitResidualLimit"/>, with the measuring chain's uncertainty counted on the safe side.
/// </summary>
public static class LeakageInterpretation
{
    /// <summary>Adds the insulation finding, the fit's verdict and their notes to <paramref name="split"/>.</summary>
    /// <param name="split">The split as measured.</param>
    /// <param name="accuracy">Accuracy of the current measurement.</param>
    /// <param name="minimumOhm">Minimum insulation resistance, ohms.</param>
    /// <param name="residualLimit">Fit residual above which the leakage is not a simple R-C leakage.</param>
    /// <param name="phaseUncertaintyDeg">Phase uncertainty between the current and voltage channels, degrees.</param>
    public static LeakageSplitResult Interpret(LeakageSplitResult split, MeasurementAccuracy accuracy,
        double minimumOhm = Limits.MinimumInsulationResistanceOhm, double residualLimit = Limits.LeakageFitResidualLimit,
        double phaseUncertaintyDeg = Limits.LeakagePhaseUncertaintyDeg)
    {
        ArgumentNullException.ThrowIfNull(split);
        ArgumentNullException.ThrowIfNull(accuracy);
        var notes = new List<string>(split.Notes);
        var fit = split.Fit;
        if (fit is not null)
        {
            bool? simple = fit.WindowsTested == 0 ? null : !(fit.Residual.P95 > residualLimit);
            fit = fit with { ResidualLimit = residualLimit, SimpleRc = simple };
            notes.Add(simple switch
            {
                null => "The voltage carries no significant harmonic with a current beside it: R and C come from the fundamental alone, and the R-C model is not tested.",
                true => string.Create(CultureInfo.InvariantCulture,
                    $"The harmonic currents follow the voltage's harmonics as an R ∥ C leakage would (fit residual {fit.Residual.P95 * 100:0.#} % at the 95th percentile, limit {residualLimit * 100:0} %, engineering choice)."),
                false => string.Create(CultureInfo.InvariantCulture,
                    $"Not a simple R-C leakage: the harmonic currents do not follow I_n = V_n (G + jnωC) (fit residual {fit.Residual.P95 * 100:0.#} % at the 95th percentile, above the {residualLimit * 100:0} % limit, engineering choice). Part of the residual current comes from a load's own leakage (a rectifier, a converter), so R and C are equivalent figures at the fundamental, not components."),
            });
        }

        var insulation = Insulation(split, accuracy, minimumOhm, phaseUncertaintyDeg);
        notes.Add(insulation.Message);
        return split with { Fit = fit, Insulation = insulation, Notes = notes };
    }

    private static InsulationFinding Insulation(LeakageSplitResult split, MeasurementAccuracy accuracy, double minimumOhm,
        double phaseUncertaintyDeg)
    {
        var voltage = split.VoltageRmsV;
        if (split.Windows == 0 || !(voltage > 0))
        {
            return new InsulationFinding(InsulationState.NotResolved, null, minimumOhm, double.NaN, double.NaN,
                "No insulation finding: no window had a usable voltage.");
        }

        var limitA = voltage / minimumOhm;
        // The worst window: the largest conductance, read back as the resistive current at the mean voltage.
        var resistiveA = split.LeastResistanceOhm is { } least ? voltage / least : 0.0;
        var wholeA = Math.Sqrt((split.ResistiveA.Max * split.ResistiveA.Max) + (split.CapacitiveA.Max * split.CapacitiveA.Max));
        var uncertaintyA = accuracy.UncertaintyA(resistiveA) + (wholeA * Math.Sin(phaseUncertaintyDeg * Math.PI / 180));
        var r = split.LeastResistanceOhm;
        var rText = r is { } ohms ? ImpedanceText.Resistance(ohms) : "no resistive part";
        var minText = ImpedanceText.Resistance(minimumOhm);
        var test = "to be confirmed with an insulation resistance tester, the circuit isolated and its loads disconnected, by a qualified person";
        var note = "(a leakage at operating voltage with loads connected is not the insulation test of IEC 60364-6; heating elements, surge protective devices and filter resistors also draw resistive current)";
        if (resistiveA - uncertaintyA >= limitA)
        {
            return new InsulationFinding(InsulationState.BelowMinimum, r, minimumOhm, limitA, uncertaintyA, string.Create(CultureInfo.InvariantCulture,
                $"POSSIBLE INSULATION FAULT: the resistive leakage ({CurrentText.WithUnit(resistiveA)} at {voltage:0} V, the worst window) means a leakage resistance of {rText}, below the {minText} minimum insulation resistance of IEC 60364-6 (from memory) even counting ±{CurrentText.WithUnit(uncertaintyA)}; {test} {note}."))
            {
                Summary = $"POSSIBLE INSULATION FAULT: leakage resistance {rText} (worst window), below the {minText} minimum of IEC 60364-6 (from memory); {ShortTest}.",
            };
        }

        if (resistiveA + uncertaintyA < limitA)
        {
            return new InsulationFinding(InsulationState.AboveMinimum, r, minimumOhm, limitA, uncertaintyA, string.Create(CultureInfo.InvariantCulture,
                $"Insulation: the resistive leakage ({CurrentText.WithUnit(resistiveA)} at {voltage:0} V) stays below the {CurrentText.WithUnit(limitA)} a {minText} insulation resistance would draw, even counting ±{CurrentText.WithUnit(uncertaintyA)}: no sign of an insulation fault in this capture."));
        }

        return new InsulationFinding(InsulationState.AtLimit, r, minimumOhm, limitA, uncertaintyA, string.Create(CultureInfo.InvariantCulture,
            $"Insulation cannot be ruled out: the resistive leakage ({CurrentText.WithUnit(resistiveA)} at {voltage:0} V, leakage resistance {rText}) is within its uncertainty (±{CurrentText.WithUnit(uncertaintyA)}: the clamp's accuracy and a {phaseUncertaintyDeg:0.#}° phase error on the whole current) of the {CurrentText.WithUnit(limitA)} a {minText} insulation resistance would draw; resolved to the safe side: a possible insulation fault, {test} {note}."))
        {
            Summary = $"POSSIBLE INSULATION FAULT (at the limit, safe side): leakage resistance {rText} against the {minText} minimum of IEC 60364-6 (from memory); {ShortTest}.",
        };
    }

    /// <summary>What to do about a possible insulation fault, in short.</summary>
    private const string ShortTest = "to be confirmed with an insulation resistance tester, the circuit isolated, by a qualified person";
}
