using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Vocabulary;

namespace DistTree.Solving;

/// <summary>
/// What the code says about a run's conductors and its overcurrent device, in one place: the solver's findings,
/// the sizer's choices and the generator's devices all ask here, so a rule set can later take this type's place.
/// The rules are the NEC's:
/// <list type="bullet">
/// <item>The design current is 125 % of the continuous load plus the rest (NEC 210.19(A)(1) for branch circuits,
/// 215.2(A)(1) for feeders; memory), and the conductors' allowable ampacity must carry it.</item>
/// <item>The device may be rated at the ampacity or below, or, at 800 A or less, at the next standard rating above
/// it (NEC 240.4(B); memory). The standard ratings of fuses and inverse-time circuit breakers are NEC 240.6(A)'s
/// (memory; verify against the edition in force).</item>
/// <item>Small conductors (14 to 10 AWG copper, 12 and 10 AWG aluminium) may be protected at the catalogue's
/// <c>ocpd_cu</c> and <c>ocpd_al</c> columns at most (NEC 240.4(D), read; see conductors.tsv), times the parallel
/// sets.</item>
/// </list>
/// A figure breaks a rule when it is over its limit by more than 1e-9.
/// </summary>
public sealed class ProtectionRules
{
    private const double Tolerance = 1e-9;

    // NEC 240.6(A) (memory; verify against the edition in force), amperes, ascending.
    private static readonly double[] Standard =
    [
        15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450, 500,
        600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
    ];

    // NEC 240.4(B): the largest device that may take the next standard rating above the ampacity, amperes.
    private const double NextSizeUpMaxA = 800;

    private readonly ConductorCatalog _catalog;

    /// <summary>The rules with the small-conductor limits of <paramref name="catalog"/>.</summary>
    public ProtectionRules(ConductorCatalog catalog) => _catalog = catalog;

    /// <summary>The standard ratings of fuses and inverse-time circuit breakers, amperes, ascending.</summary>
    public IReadOnlyList<double> StandardRatingsA => Standard;

    /// <summary>
    /// The design current of a run, amperes: 125 % of the continuous part of its load plus the rest, taken as a
    /// phasor sum (S + 0.25·S_continuous) at the run's supply.
    /// </summary>
    /// <param name="carried">The complex power the run carries, after demand factors.</param>
    /// <param name="continuous">The continuous part of <paramref name="carried"/>.</param>
    /// <param name="supply">The run's supply (voltage and phases).</param>
    public double DesignCurrentA(ComplexPower carried, ComplexPower continuous, CircuitSupply supply) =>
        LoadPower.CurrentA((carried + (continuous * 0.25)).VoltAmperes, supply);

    /// <summary>
    /// True when conductors of <paramref name="ampacityA"/> (all sets, amperes) carry a design current of
    /// <paramref name="designCurrentA"/>. A current that is not a number (an overflowing load) is not held against them.
    /// </summary>
    public bool Carries(double designCurrentA, double ampacityA) => !(designCurrentA > ampacityA + Tolerance);

    /// <summary>
    /// True when a device of <paramref name="ocpdA"/> may protect conductors of <paramref name="ampacityA"/>
    /// (amperes): the rating does not exceed the ampacity, or (800 A and less) it is the next standard rating above it.
    /// </summary>
    public bool DevicePermits(double ocpdA, double ampacityA)
    {
        if (ocpdA <= ampacityA + Tolerance)
        {
            return true;
        }

        if (ocpdA > NextSizeUpMaxA)
        {
            return false;
        }

        // The next standard rating at or above the ampacity (none above the largest).
        foreach (var next in Standard)
        {
            if (next >= ampacityA - Tolerance)
            {
                return ocpdA <= next + Tolerance;
            }
        }

        return false;
    }

    /// <summary>The largest device one set of small conductors of <paramref name="size"/> may have, amperes, or null where no such limit applies.</summary>
    public double? SmallConductorMaxOcpdA(ConductorSize size, Material material) => _catalog.SmallConductorMaxOcpdA(size, material);

    /// <summary>True when a device of <paramref name="ocpdA"/> amperes may protect <paramref name="sets"/> parallel sets of <paramref name="size"/> under the small-conductor rule.</summary>
    public bool SmallConductorPermits(double ocpdA, ConductorSize size, Material material, int sets) =>
        SmallConductorMaxOcpdA(size, material) is not { } smallMax || !AboveSmallMax(ocpdA, smallMax, sets);

    /// <summary>
    /// True when <paramref name="sets"/> sets of <paramref name="size"/> with an allowable ampacity of
    /// <paramref name="ampacityA"/> (all sets) meet every rule here for a design current of
    /// <paramref name="designCurrentA"/> under a device of <paramref name="ocpdA"/> (amperes; null for none).
    /// </summary>
    public bool Meets(double designCurrentA, double? ocpdA, ConductorSize size, Material material, int sets, double ampacityA) =>
        Carries(designCurrentA, ampacityA)
        && (ocpdA is not { } ocpd || (DevicePermits(ocpd, ampacityA) && SmallConductorPermits(ocpd, size, material, sets)));

    /// <summary>
    /// Adds to <paramref name="findings"/> (made when first needed) a finding for each rule <paramref name="run"/>
    /// breaks at its own size, with a design current of <paramref name="designCurrentA"/> and an allowable ampacity
    /// of <paramref name="ampacityA"/> (all sets; null where the table has none, and then only the small-conductor
    /// rule is checked). Gives the list, or null while there is none.
    /// </summary>
    internal List<Finding>? AddFindings(List<Finding>? findings, NetworkRun run, double designCurrentA, double? ampacityA)
    {
        var conductors = run.Conductors;
        var what = Words.Noun(run.Kind);
        var size = conductors.Size.Text;
        var sets = conductors.Sets;
        if (ampacityA is { } ampacity)
        {
            if (!Carries(designCurrentA, ampacity))
            {
                (findings ??= []).Add(Finding.Written(
                    FindingKind.Ampacity,
                    run.Id,
                    designCurrentA,
                    ampacity,
                    $"{what} {run.Id}: design current {designCurrentA:0.0} A (125 % of continuous load plus the rest) exceeds the {sets}×{size} ampacity of {ampacity:0.#} A",
                    conductors.Location));
            }

            if (conductors.OcpdA is { } ocpd && !DevicePermits(ocpd, ampacity))
            {
                (findings ??= []).Add(Finding.Written(
                    FindingKind.OcpdAboveAmpacity,
                    run.Id,
                    ocpd,
                    ampacity,
                    $"{what} {run.Id}: the {ocpd:0} A overcurrent device is above the {sets}×{size} ampacity of {ampacity:0.#} A (and not the next standard rating above it)",
                    conductors.Location));
            }
        }

        if (conductors.OcpdA is { } device && SmallConductorMaxOcpdA(conductors.Size, conductors.Material) is { } smallMax && AboveSmallMax(device, smallMax, sets))
        {
            (findings ??= []).Add(Finding.Written(
                FindingKind.OcpdAboveAmpacity,
                run.Id,
                device,
                smallMax,
                $"{what} {run.Id}: a {size} {Words.Material.Of(conductors.Material)} conductor may be protected at {smallMax:0} A at most (small-conductor rule), not {device:0} A",
                conductors.Location));
        }

        return findings;
    }

    private static bool AboveSmallMax(double ocpdA, double smallMaxA, int sets) => ocpdA > (smallMaxA * sets) + Tolerance;
}
