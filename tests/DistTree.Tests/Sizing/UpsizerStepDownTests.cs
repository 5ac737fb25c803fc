using DistTree.Conductors;
using DistTree.Sizing;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Sizing;

/// <summary>
/// The optimiser prices a feeder in each end point's own voltage where the end point hangs on the feeder's far bus, and at
/// its worst line for every end point further down; an end point on a lighter line below a sub-panel can then make the
/// feeder larger than the solver's per-line figures need, and the step-down takes it back while the re-solved tree stays
/// free of new findings.
/// </summary>
public sealed class UpsizerStepDownTests
{
    // A 208Y/120 panel on 12 m of 12 AWG: three 16 A circuits on phase A alone (48 A on line A: the feeder's ampacity needs
    // 8 AWG, 50 A, NEC Table 310.16 at 75 °C copper; 10 AWG carries 35 A) and a 12 A circuit on phase C at the end of 26 m
    // of pinned 12 AWG. Line A's drop (48 A out and back through the neutral) is the feeder's worst; on line C the neutral's
    // current, 120° away, lowers the drop, so C's total fits with the feeder at 8 AWG although the worst-line price says not.
    private const string Unbalanced = """
        disttree: 1
        project: { name: Unbalanced, units: metric }
        service: { id: SVC, system: 208Y/120 }
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            feeder: { length: 12, size: 12 AWG }
            circuits:
              - { id: "1", poles: 1, phase: A, ocpd: 20, load: { amps: 16 }, run: { length: 3, size: 12 AWG } }
              - { id: "2", poles: 1, phase: A, ocpd: 20, load: { amps: 16 }, run: { length: 3, size: 12 AWG } }
              - { id: "3", poles: 1, phase: A, ocpd: 20, load: { amps: 16 }, run: { length: 3, size: 12 AWG } }
              - { id: "4", poles: 1, phase: C, ocpd: 20, load: { amps: 12 }, run: { length: 26, size: 12 AWG, fixed: true } }
        """;

    // The same loads one level down: P feeds a sub-panel S (1 m of pinned 4 AWG) that holds the circuits, so P's feeder is
    // priced at its worst line for them.
    private const string UnderSubPanel = """
        disttree: 1
        project: { name: Unbalanced, units: metric }
        service: { id: SVC, system: 208Y/120 }
        equipment:
          - { id: P, kind: panelboard, from: SVC, feeder: { length: 12, size: 12 AWG } }
          - id: S
            kind: panelboard
            from: P
            feeder: { length: 1, size: 4 AWG, fixed: true }
            circuits:
              - { id: "1", poles: 1, phase: A, ocpd: 20, load: { amps: 16 }, run: { length: 3, size: 12 AWG } }
              - { id: "2", poles: 1, phase: A, ocpd: 20, load: { amps: 16 }, run: { length: 3, size: 12 AWG } }
              - { id: "3", poles: 1, phase: A, ocpd: 20, load: { amps: 16 }, run: { length: 3, size: 12 AWG } }
              - { id: "4", poles: 1, phase: C, ocpd: 20, load: { amps: 12 }, run: { length: 26, size: 12 AWG, fixed: true } }
        """;

    // Fed directly, the circuits see the feeder's drop in their own voltages: the optimum itself takes 8 AWG.
    [Fact]
    public void Optimum_UnbalancedFeeder_PricedInEachEndPointsOwnVoltage()
    {
        var before = SolverHarness.Solve(Unbalanced);
        var problem = SizingProblem.Build(before, ConductorCatalog.Standard);
        var (choice, _) = FrontierSolver.Solve(problem);
        var feeder = before.Network.Nodes.Single(n => n.Id == "P").Index;
        Assert.Equal(ConductorSize.Parse("8 AWG"), problem.Options[feeder]![choice[feeder]].Size);
        var change = Assert.Single(Upsizer.Standard.Plan(before).Changes);
        Assert.Equal(("P", "8 AWG", 1), (change.RunId, change.SizeAfter, change.SetsAfter));
    }

    [Fact]
    public void Plan_UnbalancedFeeder_StepsDownBelowTheWorstLineOptimumAndPasses()
    {
        var before = SolverHarness.Solve(UnderSubPanel);
        var problem = SizingProblem.Build(before, ConductorCatalog.Standard);
        var (choice, worstLineCost) = FrontierSolver.Solve(problem);
        var feeder = before.Network.Nodes.Single(n => n.Id == "P").Index;
        var plan = Upsizer.Standard.Plan(before);

        // The worst-line optimum takes the feeder past the 8 AWG its ampacity needs; the plan stops at 8 AWG and still passes.
        Assert.True(problem.Options[feeder]![choice[feeder]].Size > ConductorSize.Parse("8 AWG"));
        Assert.False(plan.After.HasFindings);
        var change = Assert.Single(plan.Changes);
        Assert.Equal(("P", "8 AWG", 1), (change.RunId, change.SizeAfter, change.SetsAfter));

        // Material added, closed form: the areas of 8 and 12 AWG by the gauge's definition (ASTM B258: diameter
        // 0.127 mm × 92^((36 − n) / 39)) apart, × 12 m × 3 lines.
        static double AwgAreaMm2(int n) => Math.PI / 4 * Math.Pow(0.127 * Math.Pow(92, (36.0 - n) / 39), 2);
        Assert.Equal((AwgAreaMm2(8) - AwgAreaMm2(12)) * 12 * 3, plan.TotalCostAdded, 6);
        Assert.True(plan.TotalCostAdded < worstLineCost - 1);
    }
}
