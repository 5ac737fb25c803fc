using DistTree.Solving.Passes;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Solving.Passes;

public sealed class RunDropsTests
{
    private static string Circuit(string loadOrPoints, double lengthM = 40) => SolverHarness.OneCircuit("480Y/277", "metric",
        $"{{ id: \"1\", poles: 1, ocpd: 20, {loadOrPoints}, run: {{ length: {lengthM}, size: 12 AWG }} }}");

    // n equal loads evenly spaced, the last at the end: the drop is (n + 1)/(2n) of the drop with all the
    // load at the end (sum of a uniform ladder; common practice). n = 4: 5/8.
    [Fact]
    public void Solve_FourEqualPoints_FiveEighthsOfTheLumpedDrop()
    {
        var lumped = SolverHarness.Solve(Circuit("load: { va: 2000, pf: 0.9 }"));
        var row = SolverHarness.Solve(Circuit(
            "points: [ { at: 10, load: { va: 500, pf: 0.9 } }, { at: 20, load: { va: 500, pf: 0.9 } }, { at: 30, load: { va: 500, pf: 0.9 } }, { at: 40, load: { va: 500, pf: 0.9 } } ]"));
        Assert.Equal(lumped.Branch().DropV * 5 / 8, row.Branch().DropV, 9);
        Assert.Equal(lumped.Branch().CurrentA, row.Branch().CurrentA, 9);
    }

    // Points with all the load at the far end equal the lumped circuit.
    [Property(MaxTest = 50)]
    public Property AllLoadAtTheFarEnd_EqualsLumped() => Prop.ForAll(
        Arb.From(Gen.Choose(100, 3000)), Arb.From(Gen.Choose(70, 100)), Arb.From(Gen.Choose(5, 80)), (va, pf, length) =>
        {
            var load = $"{{ va: {va}, pf: {pf / 100.0} }}";
            var lumped = SolverHarness.Solve(Circuit($"load: {load}", length));
            var points = SolverHarness.Solve(Circuit($"points: [ {{ at: {length}, load: {load} }} ]", length));
            return Math.Abs(lumped.Branch().DropPercent - points.Branch().DropPercent) < 1e-9
                && Math.Abs(lumped.EndPoints[0].TotalDropPercent - points.EndPoints[0].TotalDropPercent) < 1e-9;
        });

    // The current a branch circuit's drop is figured at, by the rules' basis: connected load, 80 % of the device
    // rating, or the lesser of the two.
    [Theory]
    [InlineData("connected", 10)]
    [InlineData("ocpd_80", 16)]
    [InlineData("lesser", 10)]
    public void Solve_BranchCurrentBasis_ChoosesTheCurrent(string basis, double expectedA)
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 10 }, run: { length: 50, size: 12 AWG } }", $"branch_current: {basis}"));
        Assert.Equal(expectedA, s.Branch().CurrentA, 6);
    }

    // A run's own drop is the worst of its own voltages (bits of Slots): one for a 1-pole branch circuit, three line
    // pairs for a 3-pole one, all its system's for a feeder; the others do not count.
    [Theory]
    [InlineData(0b000010, 2 * 0.5 + 3 * 0.25)]
    [InlineData(0b111000, 2 * 0.1 + 3 * 0.3)]
    [InlineData(0b111111, 2 * 0.9 + 3 * 0.1)]
    public void OwnDrop_TheWorstOfItsOwnVoltages(int own, double expected)
    {
        double[] unitR = [0.2, 0.5, 0.9, 0.1, 0.05, 0.1];
        double[] unitX = [0.1, 0.25, 0.1, 0.2, 0.2, 0.3];
        Assert.Equal(expected, RunDrops.OwnDrop(unitR, unitX, 2, 3, own), 12);
    }
}
