using DistTree.Conductors;
using DistTree.Model;

namespace DistTree.Solving;

/// <summary>The electrical figures of one run at one size: what the solver reports and the sizer compares.</summary>
/// <param name="TemperatureC">Conductor temperature used for resistance.</param>
/// <param name="ResistanceOhmPerKm">AC resistance of one conductor at that temperature.</param>
/// <param name="ReactanceOhmPerKm">Reactance of one conductor.</param>
/// <param name="AmpacityA">Allowable ampacity of all sets together (terminal-limited), or null where the table has none.</param>
/// <param name="DropV">Voltage drop: line-to-line for three-phase, of the circuit voltage for single-phase.</param>
/// <param name="DropPercent">Drop in percent of the run's nominal voltage.</param>
public readonly record struct RunFigures(double TemperatureC, double ResistanceOhmPerKm, double ReactanceOhmPerKm, double? AmpacityA, double DropV, double DropPercent);

/// <summary>
/// Voltage drop of a run by the effective-impedance method: ΔV = k·I·L·(R·cos θ + X·sin θ), k = 2 single-phase,
/// √3 three-phase, R and X per conductor divided by the parallel sets (NEC Chapter 9 Table 9 note 2).
/// </summary>
public static class RunElectrics
{
    /// <summary>Computes the figures of a run carrying <paramref name="currentA"/> at power factor cos θ.</summary>
    /// <param name="catalog">Conductor data.</param>
    /// <param name="rules">Temperature mode, ambient and terminal rating.</param>
    /// <param name="run">The conductors (size, material, raceway, sets, length).</param>
    /// <param name="size">The size to compute at (the run's own, or a candidate when sizing).</param>
    /// <param name="sets">Parallel sets to compute at.</param>
    /// <param name="supply">Nominal voltage and phases.</param>
    /// <param name="frequencyHz">Supply frequency.</param>
    /// <param name="currentA">Line current of the whole run (all sets).</param>
    /// <param name="cosTheta">Power factor.</param>
    /// <param name="sinTheta">sin θ, positive lagging.</param>
    public static RunFigures Compute(
        ConductorCatalog catalog, Rules rules, Run run, ConductorSize size, int sets, CircuitSupply supply, double frequencyHz,
        double currentA, double cosTheta, double sinTheta)
    {
        var thermal = catalog.ThermalAmpacityA(size, run.Material, run.InsulationC, rules.AmbientC);
        var rated = ConductorCatalog.RatedTemperatureC(size, run.InsulationC);
        var temperature = rules.Temperature switch
        {
            TemperatureMode.Rated => rated,
            TemperatureMode.Fixed => rules.FixedTemperatureC ?? rated,
            _ => ConductorTemperature.Estimate(rules.AmbientC, rated, currentA / sets, thermal),
        };
        var r = catalog.AcResistanceOhmPerKm(size, run.Material, run.Raceway, temperature, frequencyHz);
        var x = catalog.ReactanceOhmPerKm(size, run.Raceway, frequencyHz);
        var k = supply.Phases == 3 ? Math.Sqrt(3) : 2.0;
        var dropV = k * currentA * run.LengthM / 1000.0 * ((r * cosTheta) + (x * sinTheta)) / sets;
        var allowable = catalog.AllowableAmpacityA(size, run.Material, run.InsulationC, rules.TerminalC, thermal);
        return new RunFigures(temperature, r, x, allowable * sets, dropV, dropV / supply.VoltageV * 100.0);
    }
}
