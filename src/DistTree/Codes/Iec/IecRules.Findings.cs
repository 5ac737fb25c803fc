using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Codes.Iec;

/// <summary>The findings of IEC 60364's conductor and device rules (see <see cref="IecRules"/>; clauses from memory).</summary>
public sealed partial class IecRules
{
    /// <summary>Table B.52.17 counts circuits.</summary>
    public override string GroupingUnit => "grouped circuits";

    /// <inheritdoc/>
    public override string DesignCurrentFormula => "I_{B} ≤ I_{n} ≤ I_{z}; I_{2} ≤ 1.45 · I_{z}";

    /// <inheritdoc/>
    public override string DesignCurrentRule =>
        "IB is the load's current (no factor for a continuous load or a motor; a motor's is its full-load current); Iz the table's current-carrying capacity for the run's reference method and loaded conductors, of all sets, corrected for ambient and grouping; In the device's rated current; I2 its conventional operating current (1.45 In for a circuit-breaker, 1.6 In for a gG fuse from 16 A).";

    /// <inheritdoc/>
    internal override List<Finding>? AddFindings(List<Finding>? findings, NetworkRun run, in CurrentFigures figures)
    {
        var conductors = run.Conductors;
        var (what, size, sets, design, line) = (Words.Noun(run.Kind), conductors.Size.Text, conductors.Sets, figures.DesignCurrentA, figures.Line);
        var branch = run.Kind == RunKind.Branch;
        if (figures.AmpacityA is { } ampacity)
        {
            if (!Carries(design, ampacity))
            {
                (findings ??= []).Add(Finding.Written(
                    FindingKind.Ampacity,
                    Cite(branch ? CodeCheck.BranchAmpacity : CodeCheck.FeederAmpacity),
                    run.Id,
                    design,
                    ampacity,
                    $"{what} {run.Id}: design current IB {design:0.0} A on line {line} exceeds the {sets}×{size} current-carrying capacity Iz of {ampacity:0.#} A",
                    conductors.Location));
            }

            if (conductors.OcpdA is { } ocpd)
            {
                findings = OverloadFindings(findings, run, ocpd, ampacity);
            }
        }

        findings = AddNeutralFinding(findings, run, figures, "current-carrying capacity");

        if (conductors.GroundSize is { } ground && figures.GroundMinSize is { } least && ground.AreaCmil < least.AreaCmil * (1 - Tolerance))
        {
            (findings ??= []).Add(Finding.Written(
                FindingKind.GroundingConductor,
                Cite(CodeCheck.GroundingConductor),
                run.Id,
                ground.AreaMm2,
                least.AreaMm2,
                $"{what} {run.Id}: the stated {ground.Text} {GroundingConductorTerm} is smaller than the {least.Text} it needs (Table 54.2 for lines of {size})",
                conductors.Location));
        }

        if (conductors.OcpdA is { } device && !DeviceCarries(device, design))
        {
            (findings ??= []).Add(Finding.Written(
                FindingKind.DeviceBelowLoad,
                Cite(branch ? CodeCheck.BranchDevice : CodeCheck.FeederDevice),
                run.Id,
                design,
                device,
                $"{what} {run.Id}: design current IB {design:0.0} A on line {line} exceeds its device's rated current In of {device:0} A (IB ≤ In)",
                conductors.Location));
        }

        return findings;
    }

    // 433.1: In ≤ Iz, and (where it does not already follow, a fuse's) I2 ≤ 1.45·Iz.
    private List<Finding>? OverloadFindings(List<Finding>? findings, NetworkRun run, double ratedA, double ampacityA)
    {
        var conductors = run.Conductors;
        var (what, size, sets) = (Words.Noun(run.Kind), conductors.Size.Text, conductors.Sets);
        if (ratedA > ampacityA + Tolerance)
        {
            (findings ??= []).Add(Finding.Written(
                FindingKind.OcpdAboveAmpacity,
                Cite(CodeCheck.DeviceAboveAmpacity),
                run.Id,
                ratedA,
                ampacityA,
                $"{what} {run.Id}: the device's rated current In of {ratedA:0} A is above the {sets}×{size} current-carrying capacity Iz of {ampacityA:0.#} A (In ≤ Iz)",
                conductors.Location));
            return findings;
        }

        var factor = ConventionalOperatingFactor(conductors.DeviceType, ratedA);
        var i2 = factor * ratedA;
        if (i2 > (OverloadMultiple * ampacityA) + Tolerance)
        {
            (findings ??= []).Add(Finding.Written(
                FindingKind.OcpdAboveAmpacity,
                Cite(CodeCheck.DeviceAboveAmpacity),
                run.Id,
                i2,
                OverloadMultiple * ampacityA,
                $"{what} {run.Id}: the {ratedA:0} A {Words.DeviceType.Of(conductors.DeviceType)}'s conventional operating current I2 = {factor:0.0#} × In = {i2:0.#} A is above 1.45 × Iz = {OverloadMultiple * ampacityA:0.#} A (the {sets}×{size} Iz of {ampacityA:0.#} A)",
                conductors.Location));
        }

        return findings;
    }
}
