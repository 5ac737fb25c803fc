using System.Numerics;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Codes;

/// <summary>
/// What the NEC's and the CEC's rule sets share in form, each citing its own clauses (<see cref="CodeRules.Cite"/>):
/// a line's design current of 125 % of its continuous load plus the rest and 25 % more of its largest motor (the
/// continuous part at 100 % where the run's device is marked for continuous operation at 100 %,
/// <see cref="Run.DeviceRatedContinuous"/>), a neutral at 100 %; the device rated for that current; the device at most
/// the ampacity, or the next standard rating above it up to <see cref="NextSizeUpMaxA"/> where the code allows it; the
/// small-conductor limits of the catalogue's <c>ocpd_cu</c>/<c>ocpd_al</c> columns; a motor branch circuit's
/// conductors at 125 % of the full-load current and its inverse-time breaker at most 250 % of it (or the next standard
/// rating above); air-conditioning equipment's nameplate minimum circuit ampacity and maximum device.
/// </summary>
public abstract class NorthAmericanRules : CodeRules
{
    // Both codes: the largest motor's full-load current counts 125 %, so 25 % more than as a load.
    private const double MotorExtra = 0.25;

    // Both codes: an inverse-time breaker at most 250 % of the motor's full-load current.
    private const double MotorBreakerMultiple = 2.5;

    private readonly ConductorCatalog _catalog;

    /// <summary>The rules with the ampacities and small-conductor limits of <paramref name="catalog"/>.</summary>
    protected NorthAmericanRules(ConductorCatalog catalog)
        : base(catalog) => _catalog = catalog;

    /// <summary>
    /// The largest device that may take the next standard rating above the conductors' ampacity, amperes, or null where
    /// the rule set holds every device at or below the ampacity.
    /// </summary>
    protected abstract double? NextSizeUpMaxA { get; }

    /// <inheritdoc/>
    public override double DesignCurrentA(Complex carried, Complex continuous, double largestMotorA, bool protectedByDevice) =>
        protectedByDevice ? Magnitude(carried + (continuous * 0.25)) + (MotorExtra * largestMotorA) : Magnitude(carried);

    /// <summary>A motor's: 125 % of its full-load current; air conditioning's: the nameplate minimum circuit ampacity.</summary>
    public override double? EquipmentDesignCurrentA(in CircuitDuty duty) => duty.Kind switch
    {
        DutyKind.General => null,
        DutyKind.Motor => (1 + MotorExtra) * duty.FullLoadA,
        DutyKind.AirConditioning => duty.MinimumCircuitA,
    };

    /// <summary>
    /// A motor's: 250 % of its full-load current, or the next standard rating above that where it is not one (an
    /// inverse-time breaker); air conditioning's: the nameplate maximum overcurrent device.
    /// </summary>
    public override double? EquipmentMaxDeviceA(in CircuitDuty duty) => duty.Kind switch
    {
        DutyKind.General => null,
        DutyKind.Motor => NextStandardAtOrAbove(MotorBreakerMultiple * duty.FullLoadA),
        DutyKind.AirConditioning => duty.MaximumDeviceA,
    };

    /// <summary>NEC 310.15(C)(1) and CEC Table 5C adjust above three current-carrying conductors.</summary>
    public override int UngroupedCount => 3;

    /// <inheritdoc/>
    public override string GroupingUnit => "current-carrying";

    /// <inheritdoc/>
    public override string DesignCurrentFormula => "I_{design} = 1.25 · I_{continuous} + I_{other} + 0.25 · I_{largest motor} ≤ I_{z}";

    /// <inheritdoc/>
    public override string DesignCurrentRule =>
        "The allowable ampacity of all sets, corrected for ambient and limited by the terminal rating; the overcurrent device may not exceed what the conductors permit. A motor's branch circuit takes 1.25 times its full-load current and its device by the motor rules; air-conditioning equipment given by its nameplate takes its minimum circuit ampacity and maximum overcurrent device.";

    /// <summary>
    /// True when a device of <paramref name="ocpdA"/> may protect conductors of <paramref name="ampacityA"/>
    /// (amperes): the rating does not exceed the ampacity, or (at <see cref="NextSizeUpMaxA"/> and less, where the code
    /// allows it) it is the next standard rating above it. Both codes read a fuse and a breaker alike here, so
    /// <paramref name="device"/> does not change it.
    /// </summary>
    public override bool DevicePermits(double ocpdA, double ampacityA, DeviceType device)
    {
        if (ocpdA <= ampacityA + Tolerance)
        {
            return true;
        }

        if (NextSizeUpMaxA is not { } nextUpMaxA || ocpdA > nextUpMaxA)
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
                var nextUp = NextSizeUpMaxA is null ? "" : " (and not the next standard rating above it)";
                (findings ??= []).Add(Finding.Written(
                    FindingKind.OcpdAboveAmpacity,
                    Cite(CodeCheck.DeviceAboveAmpacity),
                    run.Id,
                    ocpd,
                    ampacity,
                    $"{what} {run.Id}: the {ocpd:0} A overcurrent device is above the {sets}×{size} ampacity of {ampacity:0.#} A{nextUp}",
                    conductors.Location));
            }
        }

        findings = AddNeutralFinding(findings, run, figures, "ampacity");

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
    /// The current-carrying conductors of one set of <paramref name="run"/>: its lines, and its neutral where it carries
    /// more than the unbalanced current of the others (a two-wire circuit, two lines and the neutral of a three-phase
    /// wye), not on a three-phase four-wire or three-wire single-phase run. A neutral counted because most of the load is
    /// nonlinear is not modelled: state <c>current_carrying</c> for it.
    /// </summary>
    public override int CurrentCarryingConductors(NetworkRun run)
    {
        var system = run.System;
        var lines = run.Kind == RunKind.Branch && run.Target.Circuit is { } circuit ? circuit.Poles : PhaseRules.Lines(system);
        var neutral = run.Kind == RunKind.Branch ? lines == 1 : system.HasNeutral;
        var counted = neutral && (lines == 1 || (lines == 2 && system.Phases == 3));
        return lines + (counted ? 1 : 0);
    }

    /// <summary>
    /// The finding of a stated grounding (bonding) conductor <paramref name="ground"/> below the <paramref name="least"/>
    /// the rule set asks of <paramref name="run"/>: its area against the minimum's, mm².
    /// </summary>
    protected abstract Finding GroundingFinding(NetworkRun run, ConductorSize ground, ConductorSize least);

    // The conductors below the design current, citing the rule that counted it.
    private Finding AmpacityFinding(NetworkRun run, in CurrentFigures figures, double ampacityA)
    {
        var conductors = run.Conductors;
        var (what, size, sets, design, line) = (Words.Noun(run.Kind), conductors.Size.Text, conductors.Sets, figures.DesignCurrentA, figures.Line);
        var continuous = ContinuousText(conductors);
        (CodeCheck Check, FormattableString Text) cited = figures.Duty.Kind switch
        {
            DutyKind.Motor => (CodeCheck.MotorBranchAmpacity, $"{what} {run.Id}: design current {design:0.0} A (125 % of the motor's full-load current of {figures.Duty.FullLoadA:0.#} A) exceeds the {sets}×{size} ampacity of {ampacityA:0.#} A"),
            DutyKind.AirConditioning => (CodeCheck.AirConditioningAmpacity, $"{what} {run.Id}: the nameplate minimum circuit ampacity of {design:0.#} A exceeds the {sets}×{size} ampacity of {ampacityA:0.#} A"),
            DutyKind.General when figures.LargestMotorA > 0 => (CodeCheck.MotorFeederAmpacity, conductors.DeviceRatedContinuous
                ? (FormattableString)$"{what} {run.Id}: design current {design:0.0} A on line {line} (125 % of the largest motor's full-load current of {figures.LargestMotorA:0.#} A, continuous load at 100 % under a device rated for it, plus the rest) exceeds the {sets}×{size} ampacity of {ampacityA:0.#} A"
                : (FormattableString)$"{what} {run.Id}: design current {design:0.0} A on line {line} (125 % of the largest motor's full-load current of {figures.LargestMotorA:0.#} A and of continuous load, plus the rest) exceeds the {sets}×{size} ampacity of {ampacityA:0.#} A"),
            DutyKind.General => (run.Kind == RunKind.Branch ? CodeCheck.BranchAmpacity : CodeCheck.FeederAmpacity, $"{what} {run.Id}: design current {design:0.0} A on line {line} ({continuous}) exceeds the {sets}×{size} ampacity of {ampacityA:0.#} A"),
        };
        return Finding.Written(FindingKind.Ampacity, Cite(cited.Check), run.Id, design, ampacityA, cited.Text, conductors.Location);
    }

    // How a general run's design current counted its continuous load.
    private static string ContinuousText(Run conductors) => conductors.DeviceRatedContinuous
        ? "continuous load at 100 % under a device rated for it, plus the rest"
        : "125 % of continuous load plus the rest";

    // A motor's or air-conditioning equipment's device above the largest its own rules allow (these replace the
    // general rules).
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
                $"{what} {run.Id}: design current {loadA:0.0} A on line {line} ({ContinuousText(conductors)}) exceeds its {deviceA:0} A overcurrent device",
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
    private double NextStandardAtOrAbove(double amperesA)
    {
        var ratings = StandardRatingsA;
        for (var k = 0; k < ratings.Count; k++)
        {
            if (ratings[k] >= amperesA - Tolerance)
            {
                return ratings[k];
            }
        }

        return amperesA;
    }

    private static bool AboveSmallMax(double ocpdA, double smallMaxA, int sets) => ocpdA > (smallMaxA * sets) + Tolerance;

    // |c|, without the call for no current: the magnitude of zero is zero.
    private static double Magnitude(Complex c) => c.Real == 0 && c.Imaginary == 0 ? 0.0 : c.Magnitude;
}
