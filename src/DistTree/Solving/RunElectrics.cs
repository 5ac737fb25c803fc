using System.Runtime.CompilerServices;
using DistTree.Codes;
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
    /// <param name="currentCarrying">The current-carrying conductors in its raceway (above 3, its ampacity is adjusted).</param>
    public static RunFigures Compute(ConductorCatalog catalog, Rules rules, Run run, ConductorSize size, int sets, double frequencyHz, double currentA, int currentCarrying = 3) =>
        Compute(CodeRules.For(rules, catalog), rules, run, size, sets, frequencyHz, currentA, currentCarrying);

    /// <summary>
    /// Computes the figures of a run carrying <paramref name="currentA"/> with the ampacity and its corrections of
    /// <paramref name="code"/> (see <see cref="Compute(ConductorCatalog, Rules, Run, ConductorSize, int, double, double, int)"/>).
    /// </summary>
    public static RunFigures Compute(CodeRules code, Rules rules, Run run, ConductorSize size, int sets, double frequencyHz, double currentA, int currentCarrying = 3)
    {
        ArgumentNullException.ThrowIfNull(code);
        return Compute(code.Catalog, rules, run, size, sets, frequencyHz, currentA, BasisOf(code, rules, run, size, frequencyHz, currentCarrying));
    }

    /// <summary>The figures of <see cref="Compute(ConductorCatalog, Rules, Run, ConductorSize, int, double, double, int)"/> from the conductor's <paramref name="basis"/>.</summary>
    internal static RunFigures Compute(
        ConductorCatalog catalog, Rules rules, Run run, ConductorSize size, int sets, double frequencyHz, double currentA, ConductorBasis basis)
    {
        var temperature = rules.Temperature switch
        {
            TemperatureMode.Rated => basis.RatedC,
            TemperatureMode.Fixed => rules.FixedTemperatureC ?? basis.RatedC,
            _ => ConductorTemperature.Estimate(rules.AmbientC, basis.RatedC, currentA / sets, basis.ThermalA),
        };
        var r = catalog.AcResistanceOhmPerKm(size, run.Material, run.Raceway, temperature, frequencyHz);
        return new RunFigures(temperature, r, basis.ReactanceOhmPerKm, basis.AllowableA * sets);
    }

    /// <summary>
    /// A conductor's figures that its current does not change, under <paramref name="rules"/> at
    /// <paramref name="frequencyHz"/>, in a raceway of <paramref name="currentCarrying"/> current-carrying conductors.
    /// </summary>
    internal static ConductorBasis BasisOf(CodeRules code, Rules rules, Run run, ConductorSize size, double frequencyHz, int currentCarrying = 3)
    {
        var catalog = code.Catalog;
        var thermal = code.ThermalAmpacityA(size, run.Material, run.InsulationC, rules.AmbientC, currentCarrying, run.Installation);
        return new ConductorBasis(
            thermal,
            ConductorCatalog.RatedTemperatureC(size, run.InsulationC),
            catalog.ReactanceOhmPerKm(size, run.Raceway, frequencyHz),
            catalog.AllowableAmpacityA(size, run.Material, run.InsulationC, rules.TerminalC, thermal));
    }

    /// <summary>
    /// The conductor bases of one solve, one per size, material, insulation rating (60, 75, 90 °C), raceway, reference
    /// method and loaded conductors (2 or 3), each worked out when first asked for: the rules and the frequency are the solve's. Threads may ask at once;
    /// two that work out the same basis get equal ones, each kept whole in a box of its own.
    /// </summary>
    internal sealed class Bases(CodeRules code, Rules rules, double frequencyHz)
    {
        private const int Methods = 5;

        private readonly StrongBox<ConductorBasis>?[] _bases = new StrongBox<ConductorBasis>?[ConductorSize.All.Count * 2 * 3 * 3 * Methods * 2];

        public ConductorBasis Of(Run run, int currentCarrying)
        {
            if (currentCarrying > code.UngroupedCount)
            {
                // Adjusted for a shared raceway: few runs, each worked out on its own.
                return BasisOf(code, rules, run, run.Size, frequencyHz, currentCarrying);
            }

            var rating = run.InsulationC switch
            {
                60 => 0,
                75 => 1,
                90 => 2,
                _ => -1,
            };
            var method = (int)run.InstallationMethod;
            var loaded = run.LoadedConductors - 2;
            if (rating < 0 || method is < 0 or >= Methods || loaded is not (0 or 1))
            {
                return BasisOf(code, rules, run, run.Size, frequencyHz, currentCarrying);
            }

            var key = ((((((((run.Size.Index * 2) + (int)run.Material) * 3) + rating) * 3) + (int)run.Raceway) * Methods) + method) * 2 + loaded;
            return (_bases[key] ??= new StrongBox<ConductorBasis>(BasisOf(code, rules, run, run.Size, frequencyHz, currentCarrying))).Value;
        }
    }
}

/// <summary>A conductor's figures that its current does not change (see <see cref="RunElectrics.BasisOf"/>).</summary>
/// <param name="ThermalA">Its own ampacity at the ambient, or null where the table has none.</param>
/// <param name="RatedC">The temperature its insulation is rated at.</param>
/// <param name="ReactanceOhmPerKm">Reactance of one conductor.</param>
/// <param name="AllowableA">The allowable ampacity of one set, or null where the table has none.</param>
internal readonly record struct ConductorBasis(double? ThermalA, double RatedC, double ReactanceOhmPerKm, double? AllowableA);
