using DistTree.Conductors;
using DistTree.Model;

namespace DistTree.Solving;

/// <summary>The conductor figures of one run at one size: what the solver reports and the sizer compares.</summary>
/// <param name="TemperatureC">Conductor temperature used for resistance.</param>
/// <param name="ResistanceOhmPerKm">AC resistance of one conductor at that temperature.</param>
/// <param name="ReactanceOhmPerKm">Reactance of one conductor.</param>
/// <param name="AmpacityA">Allowable ampacity of all sets together (terminal-limited), or null where the table has none.</param>
public readonly record struct RunFigures(double TemperatureC, double ResistanceOhmPerKm, double ReactanceOhmPerKm, double? AmpacityA);

/// <summary>
/// A run's conductor figures at the current it carries: the temperature from the loading, the AC resistance at
/// that temperature, the reactance and the allowable ampacity. The drop follows from R and X per line (see
/// <c>PhaseFlow</c>); divided by the parallel sets as NEC Chapter 9 Table 9 note 2 does.
/// </summary>
public static class RunElectrics
{
    /// <summary>Computes the figures of a run carrying <paramref name="currentA"/>.</summary>
    /// <param name="catalog">Conductor data.</param>
    /// <param name="rules">Temperature mode, ambient and terminal rating.</param>
    /// <param name="run">The conductors (material, insulation, raceway).</param>
    /// <param name="size">The size to compute at (the run's own, or a candidate when sizing).</param>
    /// <param name="sets">Parallel sets to compute at.</param>
    /// <param name="frequencyHz">Supply frequency.</param>
    /// <param name="currentA">Line current of the whole run (all sets).</param>
    public static RunFigures Compute(ConductorCatalog catalog, Rules rules, Run run, ConductorSize size, int sets, double frequencyHz, double currentA)
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
        var allowable = catalog.AllowableAmpacityA(size, run.Material, run.InsulationC, rules.TerminalC, thermal);
        return new RunFigures(temperature, r, x, allowable * sets);
    }
}
