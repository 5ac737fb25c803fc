using DistTree.Solving;

namespace DistTree.Tests.Solving.Passes;

public sealed class PhaseAssignmentTests
{
    private static Dictionary<string, string> LinesOf(string system, params string[] circuits)
    {
        var yaml = SolverHarness.OneCircuit(system, "metric", circuits[0]) + string.Concat(circuits.Skip(1).Select(c => "\n      - " + c)) + "\n";
        return SolverHarness.Solve(yaml).Runs.Where(r => r.Kind == RunResultKind.Branch).ToDictionary(r => r.Id, r => r.Lines!);
    }

    // Automatic balancing: largest first onto the least-loaded line.
    [Fact]
    public void Solve_UnnumberedCircuits_AreBalancedLargestFirst()
    {
        var yaml = SolverHarness.OneCircuit("208Y/120", "metric",
            "{ id: \"L1\", poles: 1, load: { va: 3000 }, run: { length: 10, size: 12 AWG } }")
            + "\n      - { id: \"L2\", poles: 1, load: { va: 2000 }, run: { length: 10, size: 12 AWG } }"
            + "\n      - { id: \"L3\", poles: 1, load: { va: 1500 }, run: { length: 10, size: 12 AWG } }"
            + "\n      - { id: \"L4\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }\n";
        var s = SolverHarness.Solve(yaml);
        var lines = s.Runs.Where(r => r.Kind == DistTree.Solving.RunResultKind.Branch).ToDictionary(r => r.Id, r => r.Lines);
        Assert.Equal("A", lines["P/L1"]);
        Assert.Equal("B", lines["P/L2"]);
        Assert.Equal("C", lines["P/L3"]);
        Assert.Equal("C", lines["P/L4"]);
    }

    // Equal loads: ties go to the earlier line, so three equal 1-pole loads take A, B and C in id order.
    [Fact]
    public void Assign_EqualLoads_TiesGoToTheEarlierLine()
    {
        var lines = LinesOf("208Y/120",
            "{ id: \"L1\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }",
            "{ id: \"L2\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }",
            "{ id: \"L3\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }");
        Assert.Equal(["A", "B", "C"], [lines["P/L1"], lines["P/L2"], lines["P/L3"]]);
    }

    // A 2-pole circuit takes the pair of lines carrying least; a stated phase is kept and counts first.
    [Fact]
    public void Assign_TwoPoles_TakeTheLeastLoadedPair()
    {
        var lines = LinesOf("208Y/120",
            "{ id: \"S\", poles: 1, phase: B, load: { va: 500 }, run: { length: 10, size: 12 AWG } }",
            "{ id: \"L1\", poles: 1, load: { va: 3000 }, run: { length: 10, size: 12 AWG } }",
            "{ id: \"L2\", poles: 2, load: { va: 2000 }, run: { length: 10, size: 12 AWG } }");
        Assert.Equal("B", lines["P/S"]);
        Assert.Equal("A", lines["P/L1"]);
        Assert.Equal("BC", lines["P/L2"]);
    }
}
