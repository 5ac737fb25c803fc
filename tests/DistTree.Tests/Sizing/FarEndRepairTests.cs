using DistTree.Conductors;
using DistTree.Sizing;
using DistTree.Solving;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Sizing;

/// <summary>
/// The far-end fault repair (issue 23, item 5): where the least far-end fault is line to ground through a grounding
/// conductor smaller than the lines, the plan may raise that conductor alone, or with the lines, whichever costs less.
/// The clearing itself is judged by the solver's own fault study (checked against an independent nodal solution in
/// FaultNodalTests); these tests check what the plan chooses against the solver solving the alternatives.
/// </summary>
public sealed class FarEndRepairTests
{
    // A 150 A feeder of 1/0 AWG copper to a 208Y/120 panel on a 10 kA, X/R 4 service (invented, demo-like data). Its breaker
    // trips without delay at the default 10 × 150 A = 1,500 A (common practice); the grounding conductor is the code's
    // minimum. Long enough, the line-to-ground fault at its far end falls below that.
    internal static string Feeder(double lengthFt, string? ground = null, string size = "1/0 AWG") => $$"""
        disttree: 1
        project: { name: Far end, units: imperial }
        service: { id: SVC, system: 208Y/120, available_fault_current_ka: 10, fault_x_r: 4 }
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            feeder: { length: {{lengthFt}}, size: {{size}}, {{(ground is null ? "" : $"ground_size: {ground}, ")}}ocpd: 150 }
            circuits:
              - { id: "1", poles: 3, ocpd: 100, load: { amps: 80 }, run: { length: 10, size: 3 AWG } }
        """;

    private static bool Clears(Solution s) => s.AllFindings.All(f => f.Kind != FindingKind.FaultClearing);

    // NEC Chapter 9 Table 8 areas (ASTM B258), in mm² from circular mils × 5.067e-4.
    private static double AreaMm2(string size) => ConductorSize.Parse(size).AreaMm2;

    [Fact]
    public void Plan_LineToGroundFarEndShort_RaisesTheGroundingConductorAlone_TheSmallestThatClears()
    {
        var before = SolverHarness.Solve(Feeder(220));
        Assert.False(Clears(before));
        var plan = Upsizer.Standard.Plan(before);
        Assert.False(plan.After.HasFindings);

        var change = Assert.Single(plan.Changes);
        Assert.Equal(("1/0 AWG", "1/0 AWG", 1), (change.SizeBefore, change.SizeAfter, change.SetsAfter));
        var ground = Assert.IsType<string>(change.GroundSizeAfter);
        Assert.Contains("so that a fault at its far end trips its device without delay", change.FaultClearingNote, StringComparison.Ordinal);
        Assert.Contains($"{ground}, larger than it need be for the code alone", change.GroundingNote, StringComparison.Ordinal);

        // The solver, given the grounding conductor as stated: the plan's clears; the next smaller does not.
        var smaller = ConductorSize.InSeries(SizeSeries.NorthAmerican).Last(s => s < ConductorSize.Parse(ground));
        Assert.True(Clears(SolverHarness.Solve(Feeder(220, ground))));
        Assert.False(Clears(SolverHarness.Solve(Feeder(220, smaller.Text))));

        // Priced as one conductor of the run's length over the code's minimum: Δarea × 220 ft × 0.3048 m/ft.
        Assert.Equal((AreaMm2(ground) - AreaMm2(change.GroundMinSize!)) * 220 * 0.3048, change.CostAdded, 6);

        // The drop limits needed no change: the whole cost is the repair's, though the lines kept their size.
        Assert.Equal(change.CostAdded, plan.FarEndRepairCostAdded, 6);
    }

    [Fact]
    public void Plan_LongerFeeder_CostsLessThanTheLinesAloneThatClear()
    {
        var before = SolverHarness.Solve(Feeder(300));
        var plan = Upsizer.Standard.Plan(before);
        Assert.False(plan.After.HasFindings);

        // The lines alone (the grounding conductor following as the code sizes it): the smallest size the solver finds clearing.
        var alone = ConductorSize.InSeries(SizeSeries.NorthAmerican).Where(s => s > ConductorSize.Parse("1/0 AWG"))
            .First(s => Clears(SolverHarness.Solve(Feeder(300, size: s.Text))));
        var aloneCost = (alone.AreaMm2 - AreaMm2("1/0 AWG")) * 3 * 300 * 0.3048;
        Assert.True(plan.TotalCostAdded < aloneCost, $"plan {plan.TotalCostAdded:0} against {alone} alone {aloneCost:0}");
        Assert.NotNull(Assert.Single(plan.Changes).GroundSizeAfter);
    }

    [Fact]
    public void Plan_LineToGroundShort_NamesTheDeviceThatWouldClearItInstead()
    {
        var before = SolverHarness.Solve(Feeder(220));
        var far = before.Faults.FarEndAt(before.Runs.Single(r => r.Id == "P").NodeIndex)!.Value;
        var change = Assert.Single(Upsizer.Standard.Plan(before).Changes);
        Assert.Contains(FormattableString.Invariant($"it drew {far.MinimumCurrentA:0} A against the 1500 A trip; a device that trips without delay at or below {far.MinimumCurrentA:0} A ({far.MinimumCurrentA / 150:0.#} × 150 A)"), change.FaultClearingNote, StringComparison.Ordinal);
    }

    // A branch circuit whose fault at its source end (the panel's bus) already draws less than its breaker's trip current:
    // no change of its own clears it, so the feeder above is raised until the bus draws enough. The feeder's own breaker
    // trips at 5 × (a stated multiple), so its own far end clears as it is. (The branch circuit may then take a step of its own.)
    [Fact]
    public void Plan_BranchSourceEndShort_RaisesTheFeederAbove()
    {
        var before = SolverHarness.Solve(Feeder(300).Replace("ocpd: 150 }", "ocpd: 150, trip: 5 }", StringComparison.Ordinal));
        var branch = before.Runs.Single(r => r.Id == "P/1");
        var far = before.Faults.FarEndAt(branch.NodeIndex)!.Value;
        Assert.True(far.SourceEndA < far.TripCurrentA);
        Assert.DoesNotContain(before.Runs.Single(r => r.Id == "P").Findings, f => f.Kind == FindingKind.FaultClearing);

        var plan = Upsizer.Standard.Plan(before);
        Assert.False(plan.After.HasFindings);
        var change = Assert.Single(plan.Changes, c => c.RunId == "P");
        Assert.Contains("so that a fault at the source end of P/1", change.FaultClearingNote, StringComparison.Ordinal);
    }

    [Fact]
    public void Plan_PinnedRun_NoGroundRaiseEither()
    {
        var before = SolverHarness.Solve(Feeder(220).Replace("ocpd: 150 }", "ocpd: 150, fixed: true }", StringComparison.Ordinal));
        var plan = Upsizer.Standard.Plan(before);
        Assert.Empty(plan.Changes);
        Assert.Contains(plan.Unresolvable, u => u.Subject == "P");
    }
}
