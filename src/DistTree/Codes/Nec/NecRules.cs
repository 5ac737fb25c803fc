using System.Numerics;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Codes.Nec;

/// <summary>
/// The National Electrical Code's rule set (NFPA 70, 2020 edition; the clause numbers are recalled, not read: verify
/// them against the edition in force):
/// <list type="bullet">
/// <item>Voltage drop: 3 % in a feeder or a branch circuit, 5 % in all to the farthest outlet (NEC 215.2(A)(1)
/// Informational Note No. 2 and 210.19(A)(1) Informational Note No. 4: advice, not requirements).</item>
/// <item>The design current of a line is 125 % of the continuous load plus the rest (NEC 210.19(A)(1)(a) for branch
/// circuits, 215.2(A)(1)(a) for feeders); a neutral, which no device opens, carries 100 % of its load
/// (210.19(A)(1) Exception No. 2, 215.2(A)(1) Exception No. 3). The conductors' allowable ampacity must carry it.</item>
/// <item>The device must be rated for the same current (NEC 210.20(A), 215.3).</item>
/// <item>The device may be rated at the ampacity or below, or, at 800 A or less, at the next standard rating above
/// it (NEC 240.4(B)). The standard ratings of fuses and inverse-time circuit breakers are NEC 240.6(A)'s.</item>
/// <item>Small conductors (14 to 10 AWG copper, 12 and 10 AWG aluminium) may be protected at the catalogue's
/// <c>ocpd_cu</c> and <c>ocpd_al</c> columns at most (NEC 240.4(D), read; see conductors.tsv), times the parallel
/// sets.</item>
/// <item>An equipment grounding conductor is at least the size of Table 250.122 for the device ahead of it (see
/// <see cref="NecGroundingTable"/>); where the lines are larger than the smallest size that would meet the rules above
/// for the run's load, it grows in proportion to their circular-mil area, to the next size at or above (250.122(B));
/// it need not be larger than the lines (250.122(A)); in parallel sets each set's is sized on the device's full rating,
/// so the proportion is per set (250.122(F)). A metric run takes the smallest metric size at or above the area so found.
/// No device, no minimum.</item>
/// <item>Motors (Article 430): a motor's full-load current is the table's for <c>hp</c> (NEC 430.6(A)(1); Tables
/// 430.248 and 430.250, see <see cref="MotorTables"/>), the stated amperes for <c>fla</c>. A motor branch circuit's
/// conductors carry 125 % of it (NEC 430.22), whatever its <c>continuous</c> flag says; a feeder's line carries 125 %
/// of the largest motor's full-load current on that line plus the rest (NEC 430.24). A motor branch circuit's device
/// (an inverse-time breaker assumed, whatever <c>device_type</c> says: Table 430.52's fuse columns are not modelled)
/// may be at most 250 % of the full-load current, or the next standard rating above
/// that (NEC 430.52(C)(1) and Table 430.52, Exception No. 1); 240.4(B) and (D) do not apply (NEC 240.4(G)), nor does
/// 210.20(A).</item>
/// <item>Air-conditioning equipment given by its nameplate (Article 440): the conductors' ampacity at least the
/// minimum circuit ampacity (NEC 440.35, marked per 440.4(B)); the device at most the maximum overcurrent device
/// (NEC 440.22(C)); 240.4(B) and (D) and 210.20(A) do not apply.</item>
/// </list>
/// </summary>
public sealed partial class NecRules : CodeRules
{
    /// <summary>The short name and edition, as the outputs name the code assumed.</summary>
    internal const string Described = "NEC 2020";

    // NEC 240.6(A) (memory; verify against the edition in force), amperes, ascending.
    private static readonly double[] Standard =
    [
        15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450, 500,
        600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
    ];

    // NEC 430.24 and 430.22: the largest motor's full-load current counts 125 %, so 25 % more than as a load.
    private const double MotorExtra = 0.25;

    // NEC Table 430.52: an inverse-time breaker at most 250 % of the motor's full-load current.
    private const double MotorBreakerMultiple = 2.5;

    // NEC 240.4(B): the largest device that may take the next standard rating above the ampacity, amperes.
    private const double NextSizeUpMaxA = 800;

    private readonly ConductorCatalog _catalog;

    /// <summary>The rules with the small-conductor limits of <paramref name="catalog"/>.</summary>
    public NecRules(ConductorCatalog catalog)
        : base(catalog) => _catalog = catalog;

    /// <summary>The limits a project under the NEC starts from: 3 % per feeder and per branch circuit, 5 % in all.</summary>
    internal static Rules RuleDefaults { get; } = new() { Code = ElectricalCode.Nec, FeederLimitPercent = 3, BranchLimitPercent = 3, TotalLimitPercent = 5 };

    /// <inheritdoc/>
    public override ElectricalCode Code => ElectricalCode.Nec;

    /// <inheritdoc/>
    public override string Name => "NEC";

    /// <inheritdoc/>
    public override string Edition => "2020";

    /// <inheritdoc/>
    public override string Title => "NFPA 70, National Electrical Code, 2020 edition";

    /// <inheritdoc/>
    public override string ClauseSource => "clause numbers recalled from the 2020 edition, not read from it: verify them against the edition in force";

    /// <inheritdoc/>
    public override Rules Defaults => RuleDefaults;

    /// <inheritdoc/>
    public override IReadOnlyList<double> StandardRatingsA => Standard;

    /// <inheritdoc/>
    public override string AmpacitySource =>
        "NEC Table 310.16 (the conductor catalogue's 60, 75 and 90 °C columns; IEC 60364-5-52 method B1 for mm² sizes), corrected for ambient by 310.15(B)(1) and for more than three current-carrying conductors by 310.15(C)(1), limited by the terminal rating (110.14(C))";

    /// <summary>NEC 310.15(B)(1)'s ambient factor times 310.15(C)(1)'s adjustment (see <see cref="Ampacity"/>).</summary>
    public override double AmpacityFactor(double ratedC, double ambientC, int currentCarrying) =>
        Ampacity.AmbientFactor(ratedC, ambientC) * Ampacity.AdjustmentFactor(currentCarrying);

    /// <summary>NEC 310.15(C)(1) adjusts above three current-carrying conductors.</summary>
    public override int UngroupedCount => 3;

    /// <inheritdoc/>
    public override string Cite(CodeCheck check) => check switch
    {
        CodeCheck.FeederDrop => "NEC 215.2(A)(1) Informational Note No. 2",
        CodeCheck.BranchDrop => "NEC 210.19(A)(1) Informational Note No. 4",
        CodeCheck.TotalDrop => "NEC 210.19(A)(1) Informational Note No. 4",
        CodeCheck.FeederAmpacity => "NEC 215.2(A)(1)(a)",
        CodeCheck.BranchAmpacity => "NEC 210.19(A)(1)(a)",
        CodeCheck.NeutralAmpacity => "NEC 310.14(A)",
        CodeCheck.FeederDevice => "NEC 215.3",
        CodeCheck.BranchDevice => "NEC 210.20(A)",
        CodeCheck.DeviceAboveAmpacity => "NEC 240.4(B)",
        CodeCheck.SmallConductor => "NEC 240.4(D)",
        CodeCheck.MotorBranchAmpacity => "NEC 430.22",
        CodeCheck.MotorFeederAmpacity => "NEC 430.24",
        CodeCheck.MotorDevice => "NEC 430.52(C)(1)",
        CodeCheck.AirConditioningAmpacity => "NEC 440.35",
        CodeCheck.AirConditioningDevice => "NEC 440.22(C)",
        CodeCheck.TransformerLoading => "nameplate rating (common practice; no NEC clause)",
        CodeCheck.MotorStart => "starting voltage (common practice; no NEC clause)",
        CodeCheck.GroundingConductor => "NEC 250.122",
    };

    /// <inheritdoc/>
    public override ConductorSize? MinimumGroundSize(in GroundingCase ground)
    {
        var row = NecGroundingTable.RowOf(ground.OcpdA);
        if (row < 0)
        {
            return null;
        }

        // 250.122(B): in proportion to the lines' area over the smallest that would do, where they are larger.
        var line = ground.LineSize;
        var requiredCmil = NecGroundingTable.AreaCmil(row, ground.Material);
        if (ground.SufficientSize is { } least && line.AreaCmil > least.AreaCmil * (1 + Tolerance))
        {
            requiredCmil *= line.AreaCmil / least.AreaCmil;
        }

        // 250.122(A): never larger than the lines. The lines' own size is in their series, so a size is always found.
        requiredCmil = Math.Min(requiredCmil, line.AreaCmil);
        foreach (var size in ConductorSize.All)
        {
            if (size.Series == line.Series && size.AreaCmil >= requiredCmil * (1 - Tolerance))
            {
                return size;
            }
        }

        return line;
    }

    /// <inheritdoc/>
    public override double DesignCurrentA(Complex carried, Complex continuous, double largestMotorA, bool protectedByDevice) =>
        protectedByDevice ? Magnitude(carried + (continuous * 0.25)) + (MotorExtra * largestMotorA) : Magnitude(carried);

    /// <summary>A motor's: 125 % of its full-load current (NEC 430.22); air conditioning's: the nameplate minimum circuit ampacity (NEC 440.35).</summary>
    public override double? EquipmentDesignCurrentA(in CircuitDuty duty) => duty.Kind switch
    {
        DutyKind.General => null,
        DutyKind.Motor => (1 + MotorExtra) * duty.FullLoadA,
        DutyKind.AirConditioning => duty.MinimumCircuitA,
    };

    /// <summary>
    /// A motor's: 250 % of its full-load current, or the next standard rating above that where it is not one (NEC
    /// 430.52(C)(1), Table 430.52 and Exception No. 1; an inverse-time breaker); air conditioning's: the nameplate
    /// maximum overcurrent device (NEC 440.22(C)).
    /// </summary>
    public override double? EquipmentMaxDeviceA(in CircuitDuty duty) => duty.Kind switch
    {
        DutyKind.General => null,
        DutyKind.Motor => NextStandardAtOrAbove(MotorBreakerMultiple * duty.FullLoadA),
        DutyKind.AirConditioning => duty.MaximumDeviceA,
    };

    /// <summary>
    /// True when a device of <paramref name="ocpdA"/> may protect conductors of <paramref name="ampacityA"/>
    /// (amperes): the rating does not exceed the ampacity, or (800 A and less) it is the next standard rating above it.
    /// NEC 240.4 reads a fuse and a breaker alike, so <paramref name="device"/> does not change it.
    /// </summary>
    public override bool DevicePermits(double ocpdA, double ampacityA, DeviceType device)
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
        return ocpdA <= NextStandardAtOrAbove(ampacityA) + Tolerance;
    }

    /// <summary>The largest device one set of small conductors of <paramref name="size"/> may have, amperes, or null where no such limit applies.</summary>
    public double? SmallConductorMaxOcpdA(ConductorSize size, Material material) => _catalog.SmallConductorMaxOcpdA(size, material);

    /// <inheritdoc/>
    public override bool SmallConductorPermits(double ocpdA, ConductorSize size, Material material, int sets) =>
        SmallConductorMaxOcpdA(size, material) is not { } smallMax || !AboveSmallMax(ocpdA, smallMax, sets);

    /// <inheritdoc/>
    internal override List<Finding>? AddFindings(List<Finding>? findings, NetworkRun run, in CurrentFigures figures)
    {
        var conductors = run.Conductors;
        var what = Words.Noun(run.Kind);
        var size = conductors.Size.Text;
        var sets = conductors.Sets;
        var design = figures.DesignCurrentA;
        var duty = figures.Duty;
        var maxDeviceA = EquipmentMaxDeviceA(duty);
        if (figures.AmpacityA is { } ampacity)
        {
            if (!Carries(design, ampacity))
            {
                (findings ??= []).Add(AmpacityFinding(run, figures, ampacity));
            }

            if (maxDeviceA is null && conductors.OcpdA is { } ocpd && !DevicePermits(ocpd, ampacity, conductors.DeviceType))
            {
                (findings ??= []).Add(Finding.Written(
                    FindingKind.OcpdAboveAmpacity,
                    Cite(CodeCheck.DeviceAboveAmpacity),
                    run.Id,
                    ocpd,
                    ampacity,
                    $"{what} {run.Id}: the {ocpd:0} A overcurrent device is above the {sets}×{size} ampacity of {ampacity:0.#} A (and not the next standard rating above it)",
                    conductors.Location));
            }
        }

        if (figures is { NeutralCurrentA: { } neutralA, NeutralAmpacityA: { } neutralAmpacity } && !Carries(neutralA, neutralAmpacity))
        {
            var neutralSize = (conductors.NeutralSize ?? conductors.Size).Text;
            (findings ??= []).Add(Finding.Written(
                FindingKind.NeutralAmpacity,
                Cite(CodeCheck.NeutralAmpacity),
                run.Id,
                neutralA,
                neutralAmpacity,
                $"{what} {run.Id}: the neutral carries {neutralA:0.0} A, above the {sets}×{neutralSize} ampacity of {neutralAmpacity:0.#} A",
                conductors.Location));
        }

        if (conductors.GroundSize is { } ground && figures.GroundMinSize is { } least && ground.AreaCmil < least.AreaCmil * (1 - Tolerance))
        {
            (findings ??= []).Add(GroundingFinding(run, ground, least));
        }

        if (conductors.OcpdA is { } device)
        {
            findings = maxDeviceA is { } maxA
                ? EquipmentDeviceFindings(findings, run, duty, device, maxA)
                : GeneralDeviceFindings(findings, run, figures, device);
        }

        return findings;
    }

    /// <summary>
    /// NEC 310.15(E) (memory): a neutral that carries only the unbalanced current of the other conductors of its
    /// circuit is not counted (a three-phase four-wire feeder, a three-wire single-phase one); it is counted on a
    /// two-wire circuit (it carries the line's current) and on two lines and the neutral of a three-phase wye
    /// (310.15(E)(2)). A neutral counted because most of the load is nonlinear (310.15(E)(3)) is not modelled: state
    /// <c>current_carrying</c> for it.
    /// </summary>
    public override int CurrentCarryingConductors(NetworkRun run)
    {
        var system = run.System;
        var lines = run.Kind == RunKind.Branch && run.Target.Circuit is { } circuit ? circuit.Poles : PhaseRules.Lines(system);
        var neutral = run.Kind == RunKind.Branch ? lines == 1 : system.HasNeutral;
        var counted = neutral && (lines == 1 || (lines == 2 && system.Phases == 3));
        return lines + (counted ? 1 : 0);
    }

    // A stated grounding conductor below the minimum: its area against the minimum's, mm².
    private Finding GroundingFinding(NetworkRun run, ConductorSize ground, ConductorSize least)
    {
        var conductors = run.Conductors;
        var device = conductors.OcpdA ?? 0;
        var row = NecGroundingTable.RowOf(device);
        var table = row < 0 ? least.Text : NecGroundingTable.SizeText(row, conductors.Material);
        var why = table == least.Text
            ? FormattableString.Invariant($"the table's size for a {device:0} A device")
            : FormattableString.Invariant($"the table's {table} for a {device:0} A device, increased in proportion to lines of {conductors.Size.Text}, larger than the load needs");
        return Finding.Written(
            FindingKind.GroundingConductor,
            Cite(CodeCheck.GroundingConductor),
            run.Id,
            ground.AreaMm2,
            least.AreaMm2,
            $"{Words.Noun(run.Kind)} {run.Id}: the stated {ground.Text} {GroundingConductorTerm} is smaller than the {least.Text} it needs ({why})",
            conductors.Location);
    }

    // The conductors below the design current, citing the rule that counted it.
    private Finding AmpacityFinding(NetworkRun run, in CurrentFigures figures, double ampacityA)
    {
        var conductors = run.Conductors;
        var (what, size, sets, design, line) = (Words.Noun(run.Kind), conductors.Size.Text, conductors.Sets, figures.DesignCurrentA, figures.Line);
        (CodeCheck Check, FormattableString Text) cited = figures.Duty.Kind switch
        {
            DutyKind.Motor => (CodeCheck.MotorBranchAmpacity, $"{what} {run.Id}: design current {design:0.0} A (125 % of the motor's full-load current of {figures.Duty.FullLoadA:0.#} A) exceeds the {sets}×{size} ampacity of {ampacityA:0.#} A"),
            DutyKind.AirConditioning => (CodeCheck.AirConditioningAmpacity, $"{what} {run.Id}: the nameplate minimum circuit ampacity of {design:0.#} A exceeds the {sets}×{size} ampacity of {ampacityA:0.#} A"),
            DutyKind.General when figures.LargestMotorA > 0 => (CodeCheck.MotorFeederAmpacity, $"{what} {run.Id}: design current {design:0.0} A on line {line} (125 % of the largest motor's full-load current of {figures.LargestMotorA:0.#} A and of continuous load, plus the rest) exceeds the {sets}×{size} ampacity of {ampacityA:0.#} A"),
            DutyKind.General => (run.Kind == RunKind.Branch ? CodeCheck.BranchAmpacity : CodeCheck.FeederAmpacity, $"{what} {run.Id}: design current {design:0.0} A on line {line} (125 % of continuous load plus the rest) exceeds the {sets}×{size} ampacity of {ampacityA:0.#} A"),
        };
        return Finding.Written(FindingKind.Ampacity, Cite(cited.Check), run.Id, design, ampacityA, cited.Text, conductors.Location);
    }

    // A motor's or air-conditioning equipment's device above the largest its own rules allow (these replace the
    // general rules: NEC 240.4(G)).
    private List<Finding>? EquipmentDeviceFindings(List<Finding>? findings, NetworkRun run, in CircuitDuty duty, double deviceA, double maxA)
    {
        if (!(deviceA > maxA + Tolerance))
        {
            return findings;
        }

        var what = Words.Noun(run.Kind);
        var motor = duty.Kind == DutyKind.Motor;
        (findings ??= []).Add(Finding.Written(
            FindingKind.OcpdAboveAmpacity,
            Cite(motor ? CodeCheck.MotorDevice : CodeCheck.AirConditioningDevice),
            run.Id,
            deviceA,
            maxA,
            motor
                ? (FormattableString)$"{what} {run.Id}: the {deviceA:0} A overcurrent device is above the {maxA:0} A the motor rules allow (250 % of the {duty.FullLoadA:0.#} A full-load current, or the next standard rating above it; an inverse-time breaker)"
                : (FormattableString)$"{what} {run.Id}: the {deviceA:0} A overcurrent device is above the nameplate maximum overcurrent device of {maxA:0} A",
            run.Conductors.Location));
        return findings;
    }

    // The general device rules: rated for the load (on a feeder, less the largest motor's extra 25 %, which sizes
    // conductors, not devices) and the small-conductor limit.
    private List<Finding>? GeneralDeviceFindings(List<Finding>? findings, NetworkRun run, in CurrentFigures figures, double deviceA)
    {
        var conductors = run.Conductors;
        var (what, size, sets, line) = (Words.Noun(run.Kind), conductors.Size.Text, conductors.Sets, figures.Line);
        var loadA = figures.DesignCurrentA - (MotorExtra * figures.LargestMotorA);
        if (!DeviceCarries(deviceA, loadA))
        {
            (findings ??= []).Add(Finding.Written(
                FindingKind.DeviceBelowLoad,
                Cite(run.Kind == RunKind.Branch ? CodeCheck.BranchDevice : CodeCheck.FeederDevice),
                run.Id,
                loadA,
                deviceA,
                $"{what} {run.Id}: design current {loadA:0.0} A on line {line} (125 % of continuous load plus the rest) exceeds its {deviceA:0} A overcurrent device",
                conductors.Location));
        }

        if (SmallConductorMaxOcpdA(conductors.Size, conductors.Material) is { } smallMax && AboveSmallMax(deviceA, smallMax, sets))
        {
            (findings ??= []).Add(Finding.Written(
                FindingKind.OcpdAboveAmpacity,
                Cite(CodeCheck.SmallConductor),
                run.Id,
                deviceA,
                smallMax,
                $"{what} {run.Id}: a {size} {Words.Material.Of(conductors.Material)} conductor may be protected at {smallMax:0} A at most (small-conductor rule), not {deviceA:0} A",
                conductors.Location));
        }

        return findings;
    }

    // The smallest standard rating at or above amperesA; above the largest, amperesA itself.
    private static double NextStandardAtOrAbove(double amperesA)
    {
        foreach (var next in Standard)
        {
            if (next >= amperesA - Tolerance)
            {
                return next;
            }
        }

        return amperesA;
    }

    private static bool AboveSmallMax(double ocpdA, double smallMaxA, int sets) => ocpdA > (smallMaxA * sets) + Tolerance;

    // |c|, without the call for no current: the magnitude of zero is zero.
    private static double Magnitude(Complex c) => c.Real == 0 && c.Imaginary == 0 ? 0.0 : c.Magnitude;
}
