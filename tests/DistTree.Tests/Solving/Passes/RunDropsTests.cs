using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Solving;

public sealed class LoadPointsTests
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
}
