using DistTree.Codes.Cec;
using DistTree.Codes.Iec;
using DistTree.Codes.Nec;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Codes;

/// <summary>
/// The seam for the code in force: a rule set owns everything a code decides (the limits' defaults, the current each
/// check uses, the conductor-protection rules, and the clause each finding cites); the solver computes physics and
/// asks the rule set to judge it. <c>rules: code:</c> chooses one (<see cref="For(ElectricalCode, ConductorCatalog)"/>); nothing outside a rule set
/// knows a clause number.
/// </summary>
public abstract partial class CodeRules
{
    /// <summary>A figure breaks a rule when it is over its limit by more than this.</summary>
    protected const double Tolerance = 1e-9;

    /// <summary>A rule set whose conductor data (ampacities, small-conductor limits) come from <paramref name="catalog"/>.</summary>
    protected CodeRules(ConductorCatalog catalog) => Catalog = catalog;

    /// <summary>The conductor data the rules read.</summary>
    public ConductorCatalog Catalog { get; }

    /// <summary>Which code this is.</summary>
    public abstract ElectricalCode Code { get; }

    /// <summary>The code's short name, as a clause is cited: <c>NEC</c>.</summary>
    public abstract string Name { get; }

    /// <summary>The edition assumed: <c>2020</c>.</summary>
    public abstract string Edition { get; }

    /// <summary>The code's full title with its edition, for the caution and the report's method.</summary>
    public abstract string Title { get; }

    /// <summary>How the clause numbers were taken: read from the text, or recalled (and so to be verified).</summary>
    public abstract string ClauseSource { get; }

    /// <summary>
    /// What the code calls the conductor that bonds equipment to the supply's grounded point, as findings and plans
    /// name it: the NEC's equipment grounding conductor, the CEC's bonding conductor.
    /// </summary>
    public virtual string GroundingConductorTerm => "equipment grounding conductor";

    /// <summary>The limits and choices a project under this code starts from (its own keys override them).</summary>
    public abstract Rules Defaults { get; }

    /// <summary>The standard ratings of fuses and inverse-time circuit breakers, amperes, ascending.</summary>
    public abstract IReadOnlyList<double> StandardRatingsA { get; }

    /// <summary>Where the rule set's ampacities come from and how they are corrected, for the report's method.</summary>
    public abstract string AmpacitySource { get; }

    /// <summary>
    /// The factor a tabulated ampacity (30 °C ambient, no grouping) is corrected by for a conductor rated
    /// <paramref name="ratedC"/> at <paramref name="ambientC"/> in a raceway or group whose count is
    /// <paramref name="currentCarrying"/>, as the code counts it (<see cref="CurrentCarryingConductors"/>: current-carrying
    /// conductors under the NEC, grouped circuits under IEC 60364).
    /// </summary>
    public abstract double AmpacityFactor(double ratedC, double ambientC, int currentCarrying);

    /// <summary>
    /// The largest count of <see cref="CurrentCarryingConductors"/>' kind that the code makes no grouping adjustment for
    /// (three conductors under the NEC, one circuit under IEC 60364): a run at or below it shares its figures with every
    /// run of its conductor.
    /// </summary>
    public abstract int UngroupedCount { get; }

    /// <summary>
    /// The tabulated ampacity, amperes (30 °C ambient, no grouping), of <paramref name="size"/> in
    /// <paramref name="material"/> with insulation rated <paramref name="insulationC"/>, installed as
    /// <paramref name="installation"/> says; null where the table has no figure. By default the catalogue's column for
    /// the insulation, which has one figure whatever the installation.
    /// </summary>
    public virtual double? TableAmpacityA(ConductorSize size, Material material, int insulationC, Installation installation) =>
        Catalog.TableAmpacityA(size, material, insulationC);

    /// <summary>
    /// A conductor's own ampacity Iz, amperes: <see cref="TableAmpacityA"/> for its <paramref name="installation"/> (null:
    /// <see cref="Installation.Catalogue"/>) times <see cref="AmpacityFactor"/>; null where the table has no figure.
    /// </summary>
    public double? ThermalAmpacityA(ConductorSize size, Material material, int insulationC, double ambientC, int currentCarrying = 3, Installation? installation = null) =>
        TableAmpacityA(size, material, insulationC, installation ?? Installation.Catalogue)
        * AmpacityFactor(ConductorCatalog.RatedTemperatureC(size, insulationC), ambientC, Math.Max(1, currentCarrying));

    /// <summary>The allowable ampacity, amperes: <see cref="ThermalAmpacityA"/> limited by the terminal rating's column (see <see cref="ConductorCatalog"/>).</summary>
    public double? AllowableAmpacityA(ConductorSize size, Material material, int insulationC, int terminalC, double ambientC, int currentCarrying = 3, Installation? installation = null) =>
        Catalog.AllowableAmpacityA(size, material, insulationC, terminalC, ThermalAmpacityA(size, material, insulationC, ambientC, currentCarrying, installation));

    /// <summary>The design-current and device rule as a formula, for the report's method; a subscript is written <c>_{…}</c>.</summary>
    public abstract string DesignCurrentFormula { get; }

    /// <summary>What the formula's terms are and how the device is judged, in a sentence or two, for the report's method.</summary>
    public abstract string DesignCurrentRule { get; }

    /// <summary>What <see cref="CurrentCarryingConductors"/> counts, after the count in a run's description: <c>current-carrying</c> (conductors) under the NEC.</summary>
    public abstract string GroupingUnit { get; }

    /// <summary>The clause a finding of <paramref name="check"/> cites, e.g. <c>NEC 215.2(A)(1)</c>.</summary>
    public abstract string Cite(CodeCheck check);

    /// <summary>
    /// The rule set of <paramref name="rules"/>' code, whose conductor data come from <paramref name="catalog"/> and whose
    /// grounding table is the project's own where <paramref name="rules"/> bring one (<see cref="Rules.GroundingTable"/>).
    /// </summary>
    public static CodeRules For(Rules rules, ConductorCatalog catalog)
    {
        ArgumentNullException.ThrowIfNull(rules);
        var set = For(rules.Code, catalog);
        set.ProjectGroundingTable = rules.GroundingTable;
        return set;
    }

    /// <summary>The rule set of <paramref name="code"/>, whose small-conductor limits come from <paramref name="catalog"/>.</summary>
    public static CodeRules For(ElectricalCode code, ConductorCatalog catalog) => code switch
    {
        ElectricalCode.Nec => new NecRules(catalog),
        ElectricalCode.Cec => new CecRules(catalog),
        ElectricalCode.Iec => new IecRules(catalog),
    };

    /// <summary>
    /// The defaults of <paramref name="code"/>'s rule set (its limits), without a catalogue: where they depend on the
    /// supply, a public supply's.
    /// </summary>
    public static Rules DefaultsOf(ElectricalCode code) => DefaultsOf(code, SupplyKind.Public);

    /// <summary>
    /// The defaults of <paramref name="code"/>'s rule set for an installation of <paramref name="supply"/>; the same as
    /// <see cref="DefaultsOf(ElectricalCode)"/> where the code's limits do not depend on the supply.
    /// </summary>
    public static Rules DefaultsOf(ElectricalCode code, SupplyKind supply) => code switch
    {
        ElectricalCode.Nec => NecRules.RuleDefaults,
        ElectricalCode.Cec => CecRules.RuleDefaults,
        ElectricalCode.Iec => IecRules.DefaultsFor(supply),
    };

    /// <summary>The short name and edition of <paramref name="code"/>: <c>NEC 2020</c>.</summary>
    public static string Describe(ElectricalCode code) => code switch
    {
        ElectricalCode.Nec => NecRules.Described,
        ElectricalCode.Cec => CecRules.Described,
        ElectricalCode.Iec => IecRules.Described,
    };

    /// <summary>
    /// The design current of one conductor, amperes, from its current <paramref name="carried"/>, the continuous
    /// part of it, <paramref name="continuous"/> (phasors, amperes; a motor's current is never counted continuous),
    /// and the full-load current of the largest motor it carries, <paramref name="largestMotorA"/> (amperes, 0 for
    /// none), for a conductor that <paramref name="protectedByDevice"/> (a line) or not (a neutral).
    /// </summary>
    public abstract double DesignCurrentA(System.Numerics.Complex carried, System.Numerics.Complex continuous, double largestMotorA, bool protectedByDevice);

    /// <summary>
    /// The design current of each line of a branch circuit whose <paramref name="duty"/> sets it from the equipment
    /// rather than from its load (a motor's full-load current, air-conditioning equipment's nameplate), amperes; null
    /// for a general circuit.
    /// </summary>
    public abstract double? EquipmentDesignCurrentA(in CircuitDuty duty);

    /// <summary>
    /// The largest overcurrent device the rules for <paramref name="duty"/> allow, amperes, where they set one in place
    /// of the general conductor-protection rules (a motor's, air-conditioning equipment's); null for a general circuit.
    /// </summary>
    public abstract double? EquipmentMaxDeviceA(in CircuitDuty duty);

    /// <summary>
    /// True when conductors of <paramref name="ampacityA"/> (all sets, amperes) carry a design current of
    /// <paramref name="designCurrentA"/>. A current that is not a number (an overflowing load) is not held against them.
    /// </summary>
    public bool Carries(double designCurrentA, double ampacityA) => !(designCurrentA > ampacityA + Tolerance);

    /// <summary>True when a <paramref name="device"/> of <paramref name="ocpdA"/> may protect conductors of <paramref name="ampacityA"/> (amperes).</summary>
    public abstract bool DevicePermits(double ocpdA, double ampacityA, DeviceType device);

    /// <summary>True when a device of <paramref name="ocpdA"/> amperes may protect <paramref name="sets"/> parallel sets of <paramref name="size"/> under the small-conductor rule.</summary>
    public abstract bool SmallConductorPermits(double ocpdA, ConductorSize size, Material material, int sets);

    /// <summary>True when a device of <paramref name="ocpdA"/> amperes is rated for a design current of <paramref name="designCurrentA"/>.</summary>
    public bool DeviceCarries(double ocpdA, double designCurrentA) => !(designCurrentA > ocpdA + Tolerance);

    /// <summary>
    /// True when <paramref name="sets"/> sets of <paramref name="size"/> with an allowable ampacity of
    /// <paramref name="ampacityA"/> (all sets) meet every conductor rule here for a design current of
    /// <paramref name="designCurrentA"/> under a <paramref name="device"/> of <paramref name="ocpdA"/> (amperes; null for
    /// none), on a run serving <paramref name="duty"/>: where the duty's own rules set the largest device
    /// (<see cref="EquipmentMaxDeviceA"/>), those replace the general device rules.
    /// </summary>
    public bool Meets(double designCurrentA, double? ocpdA, ConductorSize size, Material material, int sets, double ampacityA, DeviceType device, in CircuitDuty duty) =>
        Carries(designCurrentA, ampacityA)
        && (ocpdA is not { } ocpd || (EquipmentMaxDeviceA(duty) is { } maxA
            ? !(ocpd > maxA + Tolerance)
            : DevicePermits(ocpd, ampacityA, device) && SmallConductorPermits(ocpd, size, material, sets)));

    /// <summary>
    /// What one set of <paramref name="run"/> adds to the count of its raceway or group, as the code's grouping
    /// adjustment counts (see <see cref="AmpacityFactor"/>): under the NEC its current-carrying conductors (its lines,
    /// and its neutral where the code counts it); under IEC 60364 one circuit.
    /// </summary>
    public abstract int CurrentCarryingConductors(NetworkRun run);

    /// <summary>
    /// True where the code sizes the grounding (protective) conductor by the lines' size rather than by the device's rating
    /// (IEC 60364-5-54 Table 54.2): <see cref="MinimumGroundSize(in GroundingCase)"/> is then asked without a table's size,
    /// unless the project brings a table, which replaces the rule.
    /// </summary>
    public virtual bool SizesGroundingByLines => false;

    /// <summary>
    /// True when conductors of <paramref name="size"/> may be run in parallel sets. By default 1/0 AWG (53.5 mm²) and
    /// larger: NEC 310.10(G)(1) and CEC Rule 12-108 (both recalled, not read); a rule set without a minimum says so.
    /// </summary>
    public virtual bool ParallelSetsAllowed(ConductorSize size) => size.AreaCmil >= ParallelMinimum.AreaCmil * (1 - Tolerance);

    private static readonly ConductorSize ParallelMinimum = ConductorSize.Parse("1/0 AWG");

    /// <summary>The rule set's own table of grounding conductors by device rating, or null where it holds none.</summary>
    public virtual GroundingTable? OwnGroundingTable => null;

    /// <summary>The table the project brings (<c>rules: grounding_table:</c>), which replaces <see cref="OwnGroundingTable"/>; null for none.</summary>
    public GroundingTable? ProjectGroundingTable { get; internal set; }

    /// <summary>The grounding table in force: the project's where it brings one, else the rule set's own; null for neither.</summary>
    public GroundingTable? GroundingTableInForce => ProjectGroundingTable ?? OwnGroundingTable;

    /// <summary>
    /// The smallest equipment grounding conductor each set of a run needs, from the table's size for its device
    /// (<see cref="GroundingCase.TableSize"/>, looked up in <see cref="GroundingTableInForce"/>) and the rule set's other
    /// steps. <paramref name="ground"/> holds what the rule reads: the device, the material, the lines' size, the smallest
    /// size that would meet the conductor rules for the run's load, and the table's size. Unless a rule set says more, the
    /// table read as it stands: the smallest size of the lines' series whose area is at least the table's (null where none
    /// is).
    /// </summary>
    public virtual ConductorSize? MinimumGroundSize(in GroundingCase ground)
    {
        foreach (var size in ConductorSize.All)
        {
            if (size.Series == ground.LineSize.Series && size.AreaCmil >= ground.TableSize.AreaCmil * (1 - Tolerance))
            {
                return size;
            }
        }

        return null;
    }

    /// <summary>
    /// The smallest equipment grounding conductor each set of <paramref name="conductors"/> needs with lines of
    /// <paramref name="sets"/> sets of <paramref name="size"/>, carrying a design current of <paramref name="designCurrentA"/>
    /// under <paramref name="rules"/> (ambient and terminal rating) in a raceway of <paramref name="currentCarrying"/>
    /// current-carrying conductors, serving <paramref name="duty"/> (a motor's or air conditioning's device rules), or null
    /// where none is given: no device stated, no table in force (<see cref="GroundingTableInForce"/>), or no size in it for
    /// the device (above its last row, or a blank cell). A rule set that sizes the conductor by the lines
    /// (<see cref="SizesGroundingByLines"/>) needs neither device nor table unless the project brings a table.
    /// </summary>
    public ConductorSize? MinimumGroundSize(Run conductors, ConductorSize size, int sets, double designCurrentA, Rules rules, int currentCarrying = 3, in CircuitDuty duty = default)
    {
        ArgumentNullException.ThrowIfNull(conductors);
        if (SizesGroundingByLines && ProjectGroundingTable is null)
        {
            return MinimumGroundSize(new GroundingCase(conductors.OcpdA ?? 0, conductors.Material, size, null, default));
        }

        return conductors.OcpdA is not { } ocpd || GroundingTableInForce?.SizeFor(ocpd, conductors.Material) is not { } tableSize
            ? null
            : MinimumGroundSize(new GroundingCase(ocpd, conductors.Material, size, SmallestSufficientSize(designCurrentA, ocpd, conductors, size.Series, sets, rules, currentCarrying, duty), tableSize));
    }

    /// <summary>
    /// The table's grounding conductor for <paramref name="conductors"/>' device as <see cref="MinimumGroundSize(Run, ConductorSize, int, double, Rules, int, in CircuitDuty)"/>
    /// gives it, but without any increase for lines larger than the load needs (NEC 250.122(B)): never larger than that
    /// minimum, and found without sizing the lines for the load. Null where that gives none.
    /// </summary>
    internal ConductorSize? TableGroundSize(Run conductors)
    {
        ArgumentNullException.ThrowIfNull(conductors);
        if (SizesGroundingByLines && ProjectGroundingTable is null)
        {
            return MinimumGroundSize(new GroundingCase(conductors.OcpdA ?? 0, conductors.Material, conductors.Size, null, default));
        }

        return conductors.OcpdA is not { } ocpd || GroundingTableInForce?.SizeFor(ocpd, conductors.Material) is not { } tableSize
            ? null
            : MinimumGroundSize(new GroundingCase(ocpd, conductors.Material, conductors.Size, null, tableSize));
    }

    /// <summary>
    /// The smallest size of <paramref name="series"/> in the catalogue whose <paramref name="sets"/> sets, of the material and
    /// insulation of <paramref name="conductors"/>, meet every conductor rule here (<see cref="Meets"/>) for a design current
    /// of <paramref name="designCurrentA"/> under a device of <paramref name="ocpdA"/>, their ampacity worked out as the solver
    /// and the sizer do (<paramref name="rules"/>' ambient and terminal rating, adjusted for
    /// <paramref name="currentCarrying"/> conductors in the raceway) and the device rules of <paramref name="duty"/>; null
    /// where no size does.
    /// </summary>
    public ConductorSize? SmallestSufficientSize(double designCurrentA, double? ocpdA, Run conductors, SizeSeries series, int sets, Rules rules, int currentCarrying = 3, in CircuitDuty duty = default)
    {
        ArgumentNullException.ThrowIfNull(conductors);
        ArgumentNullException.ThrowIfNull(rules);
        foreach (var size in ConductorSize.All)
        {
            if (size.Series != series || !Catalog.Contains(size)
                || AllowableAmpacityA(size, conductors.Material, conductors.InsulationC, rules.TerminalC, rules.AmbientC, currentCarrying, conductors.Installation) is not { } oneSetA)
            {
                continue;
            }

            if (Meets(designCurrentA, ocpdA, size, conductors.Material, sets, oneSetA * sets, conductors.DeviceType, duty))
            {
                return size;
            }
        }

        return null;
    }

    /// <summary>
    /// Adds to <paramref name="findings"/> (made when first needed) a finding where the neutral's design current in
    /// <paramref name="figures"/> is above its ampacity, named in the code's words (<paramref name="capacityTerm"/>: the
    /// NEC's <c>ampacity</c>, IEC 60364's <c>current-carrying capacity</c>). Gives the list, or null while there is none.
    /// </summary>
    private protected List<Finding>? AddNeutralFinding(List<Finding>? findings, NetworkRun run, in CurrentFigures figures, string capacityTerm)
    {
        ArgumentNullException.ThrowIfNull(run);
        if (figures is not { NeutralCurrentA: { } neutralA, NeutralAmpacityA: { } neutralAmpacity } || Carries(neutralA, neutralAmpacity))
        {
            return findings;
        }

        var conductors = run.Conductors;
        var neutralSize = (conductors.NeutralSize ?? conductors.Size).Text;
        (findings ??= []).Add(Finding.Written(
            FindingKind.NeutralAmpacity,
            Cite(CodeCheck.NeutralAmpacity),
            run.Id,
            neutralA,
            neutralAmpacity,
            $"{Vocabulary.Words.Noun(run.Kind)} {run.Id}: the neutral carries {neutralA:0.0} A, above the {conductors.Sets}×{neutralSize} {capacityTerm} of {neutralAmpacity:0.#} A",
            conductors.Location));
        return findings;
    }

    /// <summary>
    /// Adds to <paramref name="findings"/> (made when first needed) a finding for each conductor or device rule
    /// <paramref name="run"/> breaks with the figures <paramref name="figures"/>. Gives the list, or null while there is none.
    /// </summary>
    internal abstract List<Finding>? AddFindings(List<Finding>? findings, NetworkRun run, in CurrentFigures figures);
}

/// <summary>The currents and ampacities a run's conductor and device rules judge.</summary>
/// <param name="DesignCurrentA">The most loaded line's design current, amperes.</param>
/// <param name="Line">Which line that is (<c>A</c>, <c>B</c>, <c>C</c>), for the sentence.</param>
/// <param name="AmpacityA">The lines' allowable ampacity, all sets, or null where the table has none.</param>
/// <param name="NeutralCurrentA">The neutral's design current, amperes, or null where the run has no neutral.</param>
/// <param name="NeutralAmpacityA">The neutral's allowable ampacity, all sets, or null.</param>
/// <param name="LargestMotorA">The full-load current of the largest motor on the most loaded line, amperes (0 for none).</param>
/// <param name="Duty">What the run serves (general for a feeder).</param>
/// <param name="GroundMinSize">The smallest equipment grounding conductor each set needs, or null where the rule set gives none.</param>
internal readonly record struct CurrentFigures(
    double DesignCurrentA, char Line, double? AmpacityA, double? NeutralCurrentA, double? NeutralAmpacityA, double LargestMotorA = 0, CircuitDuty Duty = default,
    ConductorSize? GroundMinSize = null);

/// <summary>What a rule set reads to size a run's equipment grounding conductor.</summary>
/// <param name="OcpdA">The rating of the overcurrent device ahead of the run, amperes.</param>
/// <param name="Material">The conductors' metal (the grounding conductor is taken to be of the same).</param>
/// <param name="LineSize">The size of the lines in each set.</param>
/// <param name="SufficientSize">
/// The smallest size of the lines' series that would meet the conductor rules for the run's design current under its
/// device at the same sets, or null where none in the catalogue does.
/// </param>
/// <param name="TableSize">The size the grounding table in force names for the device and the material (see <see cref="GroundingTable.SizeFor"/>).</param>
public readonly record struct GroundingCase(double OcpdA, Material Material, ConductorSize LineSize, ConductorSize? SufficientSize, GroundingTableSize TableSize);
