using System.Numerics;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Codes.Iec;

/// <summary>
/// The rule set of IEC 60364, low-voltage electrical installations: Part 4-43 (protection against overcurrent, 2008
/// edition assumed), Part 5-52 (wiring systems, 2009) and Part 5-54 (earthing arrangements and protective conductors,
/// 2011). Every clause number, table and figure here is recalled from memory, not read: verify against the editions in
/// force.
/// <list type="bullet">
/// <item>Voltage drop (IEC 60364-5-52 clause 525 and Annex G, Table G.52.1; memory): from the origin of the installation
/// to any point of use, 3 % for lighting and 5 % for other uses where the installation is supplied directly from a public
/// low-voltage network, 6 % and 8 % where it has a private supply (<c>rules: supply:</c>); on a path longer than 100 m,
/// each limit grows by 0.005 % per metre of wiring beyond 100 m, at most by 0.5 %. Annex G sets no limit per feeder or
/// per branch circuit: those limits default to the largest total an end point can have, so they never decide alone
/// (state them to hold a run to less).</item>
/// <item>Current-carrying capacity Iz (clause 523, Annex B): the tables of <see cref="IecAmpacityTable"/> by the run's
/// <c>installation_method</c> (default B1, what the conductor catalogue's metric columns hold) and its circuit's loaded
/// conductors (2 single-phase, 3 three-phase), corrected for ambient by Table B.52.14 (air, 30 °C reference; the
/// factors are √((θmax − θa)/(θmax − 30)) with θmax 70 °C for PVC, 90 °C for XLPE, rounded to two decimals as the
/// table prints them, a temperature between rows taking the next row up: PVC 35 °C 0.94, 40 °C 0.87, 45 °C 0.79,
/// 50 °C 0.71; XLPE 35 °C 0.96, 40 °C 0.91, 45 °C 0.87, 50 °C 0.82) and for grouping by Table B.52.17 row 1 by the number
/// of circuits (<see cref="Ampacity.GroupingFactor"/>).</item>
/// <item>Grouping counts circuits (<see cref="CurrentCarryingConductors"/> gives one per set): a shared
/// <c>raceway_id</c> sums them, each parallel set a circuit; a stated <c>current_carrying</c> states the number of
/// grouped circuits.</item>
/// <item>Overload (IEC 60364-4-43 433.1): IB ≤ In ≤ Iz and I2 ≤ 1.45·Iz, with I2 the device's conventional operating
/// current: a circuit-breaker to IEC 60898-1, 1.45·In (one to IEC 60947-2 trips at 1.30·In, within this); a gG fuse
/// to IEC 60269-2, 1.6·In from 16 A, 1.9·In above 4 A, 2.1·In at 4 A and below (<c>device_type</c>).</item>
/// <item>The design current IB is the load's current: no 125 % for a continuous load, none for the largest motor;
/// a motor's IB is its full-load current. No motor multiple limits its device (the NEC's Article 430 has no counterpart
/// here: 433.1 applies), and air-conditioning equipment's nameplate <c>mca</c> and <c>mocp</c> (marks of the North
/// American product standards) are not read: its IB is its load's current. No small-conductor rule.</item>
/// <item>Protective conductor (IEC 60364-5-54 543.1.2, Table 54.2; the same material as the lines): S ≤ 16 mm², S;
/// 16 &lt; S ≤ 35 mm², 16 mm²; S &gt; 35 mm², S/2, taken up to the next size.</item>
/// <item>Standard device ratings: the preferred rated currents of IEC 60898-1 and the R10 series.</item>
/// </list>
/// </summary>
public sealed partial class IecRules : CodeRules
{
    /// <summary>The short name, as the outputs name the code assumed.</summary>
    internal const string Described = "IEC 60364";

    // IEC 60898-1 preferred rated currents and the R10 series above them (memory), amperes, ascending.
    private static readonly double[] Standard =
    [
        6, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250, 1600, 2000,
        2500, 3200, 4000, 5000, 6300,
    ];

    // IEC 60364-4-43 433.1 b): I2 ≤ 1.45·Iz.
    private const double OverloadMultiple = 1.45;

    private readonly IecAmpacityTable _table;

    /// <summary>The rules with the ampacity table embedded in the library; <paramref name="catalog"/> gives the rest of the conductor data.</summary>
    public IecRules(ConductorCatalog catalog)
        : this(catalog, IecAmpacityTable.Standard)
    {
    }

    /// <summary>The rules with the ampacities of <paramref name="table"/>.</summary>
    public IecRules(ConductorCatalog catalog, IecAmpacityTable table)
        : base(catalog) => _table = table;

    /// <summary>The limits of Annex G for an installation supplied from a public low-voltage network (see <see cref="DefaultsFor"/>).</summary>
    internal static Rules RuleDefaults { get; } = DefaultsFor(SupplyKind.Public);

    /// <summary>
    /// IEC 60364-5-52 Annex G's limits (memory) for an installation of <paramref name="supply"/>: lighting 3 % and other
    /// uses 5 % on a public supply, 6 % and 8 % on a private one, each + 0.005 % per metre of path beyond 100 m, at most
    /// + 0.5 %; the per-run limits at the largest total an end point can have.
    /// </summary>
    internal static Rules DefaultsFor(SupplyKind supply)
    {
        var (lighting, other) = supply switch
        {
            SupplyKind.Public => (3.0, 5.0),
            SupplyKind.Private => (6.0, 8.0),
        };
        var rules = new Rules { Code = ElectricalCode.Iec, Supply = supply, TotalLimitPercent = other, LightingLimitPercent = lighting, LongPathAllowance = new LengthAllowance(100, 0.005, 0.5) };
        return rules with { FeederLimitPercent = rules.LargestTotalLimitPercent, BranchLimitPercent = rules.LargestTotalLimitPercent };
    }

    /// <inheritdoc/>
    public override ElectricalCode Code => ElectricalCode.Iec;

    /// <inheritdoc/>
    public override string Name => "IEC 60364";

    /// <inheritdoc/>
    public override string Edition => "4-43:2008, 5-52:2009, 5-54:2011";

    /// <inheritdoc/>
    public override string Title => "IEC 60364, Low-voltage electrical installations: Part 4-43 (2008), Part 5-52 (2009), Part 5-54 (2011)";

    /// <inheritdoc/>
    public override string ClauseSource => "clause numbers, tables and figures recalled, not read: verify them against the editions in force";

    /// <inheritdoc/>
    public override Rules Defaults => RuleDefaults;

    /// <inheritdoc/>
    public override IReadOnlyList<double> StandardRatingsA => Standard;

    /// <inheritdoc/>
    public override string AmpacitySource =>
        "IEC 60364-5-52 Tables B.52.2 to B.52.5 (methods A1, B1, B2, C) and B.52.10, B.52.12 (method E), by the run's reference method and loaded conductors, corrected for ambient by Table B.52.14 and for grouping by Table B.52.17 row 1 (by number of circuits)";

    /// <inheritdoc/>
    public override string GroundingConductorTerm => "protective conductor";

    /// <summary>
    /// IEC 60364-5-52 523.7 (memory) asks parallel conductors to share the load equally (same material, cross-section,
    /// length and route) but sets no smallest size: any size may be run in parallel.
    /// </summary>
    public override bool ParallelSetsAllowed(ConductorSize size) => true;

    /// <summary>Table 54.2 sizes the protective conductor by the line conductors' cross-section.</summary>
    public override bool SizesGroundingByLines => true;

    /// <summary>Table B.52.17 adjusts from two circuits on.</summary>
    public override int UngroupedCount => 1;

    /// <summary>Table B.52.14's ambient factor (see <see cref="Ampacity.AmbientFactor"/>) times Table B.52.17's grouping factor by circuits.</summary>
    public override double AmpacityFactor(double ratedC, double ambientC, int currentCarrying) =>
        Ampacity.AmbientFactor(ratedC, ambientC) * Ampacity.GroupingFactor(currentCarrying);

    /// <summary>The figure of <see cref="IecAmpacityTable"/> for the run's method and loaded conductors.</summary>
    public override double? TableAmpacityA(ConductorSize size, Material material, int insulationC, Installation installation) =>
        _table.AmpacityA(size, material, insulationC, installation);

    /// <inheritdoc/>
    public override string Cite(CodeCheck check) => check switch
    {
        CodeCheck.FeederDrop => "IEC 60364-5-52 525, Annex G",
        CodeCheck.BranchDrop => "IEC 60364-5-52 525, Annex G",
        CodeCheck.TotalDrop => "IEC 60364-5-52 525, Annex G",
        CodeCheck.FeederAmpacity => "IEC 60364-4-43 433.1 a)",
        CodeCheck.BranchAmpacity => "IEC 60364-4-43 433.1 a)",
        CodeCheck.NeutralAmpacity => "IEC 60364-5-52 523.1",
        CodeCheck.FeederDevice => "IEC 60364-4-43 433.1 a)",
        CodeCheck.BranchDevice => "IEC 60364-4-43 433.1 a)",
        CodeCheck.DeviceAboveAmpacity => "IEC 60364-4-43 433.1",
        CodeCheck.SmallConductor => "no IEC 60364 rule (not checked)",
        CodeCheck.MotorBranchAmpacity => "IEC 60364-4-43 433.1 a)",
        CodeCheck.MotorFeederAmpacity => "IEC 60364-4-43 433.1 a)",
        CodeCheck.MotorDevice => "IEC 60364-4-43 433.1",
        CodeCheck.AirConditioningAmpacity => "no IEC 60364 rule (the nameplate's mca is not read)",
        CodeCheck.AirConditioningDevice => "no IEC 60364 rule (the nameplate's mocp is not read)",
        CodeCheck.TransformerLoading => "nameplate rating (common practice; no IEC 60364 clause)",
        CodeCheck.MotorStart => "starting voltage (common practice; no IEC 60364 limit)",
        CodeCheck.GroundingConductor => "IEC 60364-5-54 543.1.2, Table 54.2",
        CodeCheck.InterruptingRating => "IEC 60364-4-43 434.5.1",
        CodeCheck.FaultClearing => "IEC 60364-4-41 411.4.4",
        CodeCheck.NoLoadRise => "IEC 60038 voltage ranges (recalled; no IEC 60364 clause)",
    };

    /// <summary>
    /// IEC 60364-5-54 Table 54.2 (memory): lines of S ≤ 16 mm², S; 16 &lt; S ≤ 35 mm², 16 mm²; S &gt; 35 mm², S/2, the
    /// smallest size of the lines' series at or above it. The device is not read.
    /// </summary>
    public override ConductorSize? MinimumGroundSize(in GroundingCase ground)
    {
        if (ProjectGroundingTable is not null)
        {
            return base.MinimumGroundSize(ground);
        }

        var line = ground.LineSize;
        var lineMm2 = line.AreaMm2;
        var requiredMm2 = lineMm2 <= 16 * (1 + Tolerance) ? lineMm2 : lineMm2 <= 35 * (1 + Tolerance) ? 16 : lineMm2 / 2;
        foreach (var size in ConductorSize.All)
        {
            if (size.Series == line.Series && size.AreaMm2 >= requiredMm2 * (1 - Tolerance))
            {
                return size;
            }
        }

        return line;
    }

    /// <summary>IB: the load's current, on a line and on a neutral alike (no continuous factor, no motor's extra).</summary>
    public override double DesignCurrentA(Complex carried, Complex continuous, double largestMotorA, bool protectedByDevice) =>
        carried.Real == 0 && carried.Imaginary == 0 ? 0.0 : carried.Magnitude;

    /// <summary>A motor's IB is its full-load current; any other circuit's is its load's current (null).</summary>
    public override double? EquipmentDesignCurrentA(in CircuitDuty duty) => duty.Kind switch
    {
        DutyKind.General => null,
        DutyKind.Motor => duty.FullLoadA,
        DutyKind.AirConditioning => null,
    };

    /// <summary>None: 433.1 judges every device, a motor's and air-conditioning equipment's too.</summary>
    public override double? EquipmentMaxDeviceA(in CircuitDuty duty) => null;

    /// <summary>
    /// IEC 60364-4-43 433.1: In ≤ Iz and I2 ≤ 1.45·Iz, I2 the <paramref name="device"/>'s conventional operating current
    /// (<see cref="ConventionalOperatingFactor"/> times In).
    /// </summary>
    public override bool DevicePermits(double ocpdA, double ampacityA, DeviceType device) =>
        !(ocpdA > ampacityA + Tolerance) && !(ConventionalOperatingFactor(device, ocpdA) * ocpdA > (OverloadMultiple * ampacityA) + Tolerance);

    /// <summary>
    /// I2 / In (memory): a circuit-breaker to IEC 60898-1, 1.45; a gG fuse to IEC 60269-2, 1.6 for In ≥ 16 A, 1.9 for
    /// 4 A &lt; In &lt; 16 A, 2.1 for In ≤ 4 A.
    /// </summary>
    public static double ConventionalOperatingFactor(DeviceType device, double ratedA) => device switch
    {
        DeviceType.Breaker => 1.45,
        DeviceType.Fuse => ratedA >= 16 ? 1.6 : ratedA > 4 ? 1.9 : 2.1,
    };

    /// <summary>IEC 60364 has no small-conductor rule: always true.</summary>
    public override bool SmallConductorPermits(double ocpdA, ConductorSize size, Material material, int sets) => true;

    /// <summary>One circuit per set: Table B.52.17 groups by circuits, whatever their conductors.</summary>
    public override int CurrentCarryingConductors(NetworkRun run) => 1;
}
