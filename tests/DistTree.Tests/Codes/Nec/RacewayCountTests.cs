using DistTree.Tests.Solving;

namespace DistTree.Tests.Codes.Nec;

/// <summary>
/// Conductors sharing a raceway (issue 18, item 3): the count of current-carrying conductors and the adjustment it
/// drives. NEC Table 310.15(C)(1) (read): 4–6 conductors 80 %, 7–9 70 %; NEC Table 310.16 (read): 12 AWG copper
/// 25 A in the 75 °C column. NEC 310.15(E) (memory) for when a neutral counts.
/// </summary>
public sealed class RacewayCountTests
{
    // Three 1-pole circuits in one named raceway: each a line and a neutral that carries its current, 6 in all,
    // so 12 AWG carries 0.80 × 25 = 20 A. 21 A is over it; alone in its raceway the same circuit carries 25 A.
    [Theory]
    [InlineData(true, 6, 20.0, true)]
    [InlineData(false, 2, 25.0, false)]
    public void Solve_SharedRaceway_AdjustsTheAmpacity(bool shared, int count, double ampacityA, bool over)
    {
        var raceway = shared ? ", raceway_id: R1" : "";
        var s = SolverHarness.Solve(Panel(Enumerable.Range(1, 3).Select(i =>
            $"{{ id: \"{i}\", poles: 1, load: {{ amps: 21 }}, run: {{ length: 5, size: 12 AWG{raceway} }} }}").ToArray()));
        Assert.All(s.Runs.Where(r => r.Kind == DistTree.Solving.RunResultKind.Branch), r =>
        {
            Assert.Equal(count, r.CurrentCarryingConductors);
            Assert.Equal(ampacityA, r.AmpacityA!.Value, 9);
            Assert.Equal(over, r.Findings.Any(f => f.Code == "ampacity"));
        });
    }

    // A stated count takes the place of the counted one: 9 conductors, 70 %: 17.5 A.
    [Fact]
    public void Solve_StatedCount_IsUsedAsGiven()
    {
        var s = SolverHarness.Solve(Panel("{ id: \"1\", poles: 1, load: { amps: 10 }, run: { length: 5, size: 12 AWG, current_carrying: 9 } }"));
        var branch = s.Branch();
        Assert.Equal(9, branch.CurrentCarryingConductors);
        Assert.Equal(17.5, branch.AmpacityA!.Value, 9);
    }

    // NEC 310.15(E) (memory): a 3-phase 4-wire feeder's neutral carries only the imbalance and is not counted (3);
    // a 2-pole circuit has two lines (2); a 3-pole one three (3); a 1-pole one its line and neutral (2).
    [Fact]
    public void Solve_OwnCount_FollowsTheNeutralRule()
    {
        var s = SolverHarness.Solve(Panel(
            "{ id: \"1\", poles: 1, load: { amps: 10 }, run: { length: 5, size: 12 AWG } }",
            "{ id: \"2\", poles: 2, load: { amps: 10 }, run: { length: 5, size: 12 AWG } }",
            "{ id: \"3\", poles: 3, load: { amps: 10 }, run: { length: 5, size: 12 AWG } }"));
        Assert.Equal(3, s.Runs.Single(r => r.Id == "P").CurrentCarryingConductors);
        Assert.Equal([2, 2, 3], s.Runs.Where(r => r.Kind == DistTree.Solving.RunResultKind.Branch).OrderBy(r => r.Id, StringComparer.Ordinal).Select(r => r.CurrentCarryingConductors!.Value));
    }

    // A 208Y/120 panel P on a short 2/0 feeder with the given circuits.
    private static string Panel(params string[] circuits) => SolverHarness.PanelOnFeeder("length: 5, size: 2/0 AWG", circuits);
}
