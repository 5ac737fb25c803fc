using DistTree.Model;

namespace DistTree.Tests.Solving;

public sealed class PhaseFlowTests
{
    // The usual panelboard numbering (common practice): 1-2 on A, 3-4 on B, 5-6 on C, 7-8 on A; a 3-pole
    // circuit at 13 takes rows 13, 15, 17: A, B, C. On 120/240 rows alternate A, B.
    [Theory]
    [InlineData("1", 1, 3, Phases.A)]
    [InlineData("2", 1, 3, Phases.A)]
    [InlineData("3", 1, 3, Phases.B)]
    [InlineData("6", 1, 3, Phases.C)]
    [InlineData("7", 1, 3, Phases.A)]
    [InlineData("3", 2, 3, Phases.BC)]
    [InlineData("5", 2, 3, Phases.CA)]
    [InlineData("13", 3, 3, Phases.ABC)]
    [InlineData("3", 1, 2, Phases.B)]
    [InlineData("5", 1, 2, Phases.A)]
    [InlineData("1", 2, 2, Phases.AB)]
    public void FromNumber_FollowsPanelboardNumbering(string id, int poles, int lines, Phases expected) =>
        Assert.Equal(expected, PhaseRules.FromNumber(id, poles, lines));

    [Fact]
    public void FromNumber_NotANumber_IsNull() => Assert.Null(PhaseRules.FromNumber("L1", 1, 3));

    // Three equal 1-pole loads on A, B and C at the same power factor: the neutral carries nothing and the
    // panel is balanced (phasor sum of three equal currents 120° apart; common practice).
    [Fact]
    public void Solve_EqualLoadsOnThreeLines_NeutralZeroAndBalanced()
    {
        var yaml = SolverHarness.OneCircuit("208Y/120", "metric",
            "{ id: \"1\", poles: 1, load: { va: 1000, pf: 0.9 }, run: { length: 10, size: 12 AWG } }")
            + "\n      - { id: \"3\", poles: 1, load: { va: 1000, pf: 0.9 }, run: { length: 10, size: 12 AWG } }"
            + "\n      - { id: \"5\", poles: 1, load: { va: 1000, pf: 0.9 }, run: { length: 10, size: 12 AWG } }\n";
        var s = SolverHarness.Solve(yaml);
        var panel = Assert.Single(s.Panels);
        Assert.Equal(0, panel.NeutralCurrentA!.Value, 9);
        Assert.Equal(0, panel.ImbalancePercent, 9);
        Assert.Equal(["A", "B", "C"], s.Runs.Where(r => r.Kind == DistTree.Solving.RunResultKind.Branch).Select(r => r.Lines!));
    }

    // One 1-pole load alone: its current returns through the neutral, so the neutral carries the line current,
    // and the branch drop is the single-phase 2·I·Z (k = 2, NEC Chapter 9 Table 9 note 2). The phase frame's
    // line-to-neutral base is 208/√3 V (the source a balanced set at 208 V), so 1200 VA draw 1200/(208/√3) A.
    [Fact]
    public void Solve_OneLoadAlone_NeutralCarriesItAndImbalanceIsTwoHundredPercent()
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("208Y/120", "metric",
            "{ id: \"1\", poles: 1, load: { va: 1200, pf: 1.0 }, run: { length: 10, size: 12 AWG } }"));
        var panel = Assert.Single(s.Panels);
        var vln = 208 / Math.Sqrt(3);
        Assert.Equal(1200 / vln, panel.NeutralCurrentA!.Value, 9);
        Assert.Equal(200, panel.ImbalancePercent, 9);
        var run = s.Branch();
        Assert.Equal(2 * (1200 / vln) * 0.01 * run.ResistanceOhmPerKm!.Value / vln * 100, run.DropPercent, 9);
    }

    [Fact]
    public void Load_StatedPhase_WrongForThePoles_IsAnError()
    {
        var e = Assert.Throws<DistTree.Diagnostics.ProjectException>(() => SolverHarness.Solve(SolverHarness.OneCircuit("208Y/120", "metric",
            "{ id: \"1\", poles: 2, phase: A, load: { va: 1200 }, run: { length: 10, size: 12 AWG } }")));
        Assert.Contains("cannot be on A", e.Message, StringComparison.Ordinal);
    }
}
