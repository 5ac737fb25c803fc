namespace DistTree.Tests.Solving.Passes;

public sealed class ReachTests
{
    // Reach: drop is proportional to length at a fixed temperature, so the run's own limit is met up to
    // L × limit / drop (common practice).
    [Fact]
    public void Solve_Reach_IsLengthScaledToTheLimit()
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 16 }, run: { length: 50, size: 12 AWG } }"));
        var run = s.Branch();
        Assert.Equal(run.LengthM * 3 / run.DropPercent, run.MaxLengthM!.Value, 6);
        Assert.Equal(run.LengthM * 5 / run.DropPercent, run.MaxLengthTotalM!.Value, 6);
    }

    // A run that drops nothing has no reach: any length would do.
    [Fact]
    public void Solve_NoLoad_NoReach()
    {
        var run = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { va: 0 }, run: { length: 50, size: 12 AWG } }")).Branch();
        Assert.Null(run.MaxLengthM);
        Assert.Null(run.MaxLengthTotalM);
    }
}
