using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Reports;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>The solver's scratch arrays come from a shared pool: a solve that reuses them gives the same results.</summary>
public sealed class ScratchReuseTests
{
    [Fact]
    public void Solve_AfterALargerSolve_GivesTheSameResults()
    {
        var small = Build("small-office.yaml");
        var large = Build(Path.Combine("campus", "campus.yaml"));
        var first = JsonResults.Write(DropSolver.Standard.Solve(small));

        DropSolver.Standard.Solve(large);
        var again = JsonResults.Write(DropSolver.Standard.Solve(small));

        Assert.Equal(first, again);
    }

    [Fact]
    public void Solve_TwiceOnOneNetwork_GivesTheSameResults()
    {
        var network = Build(Path.Combine("campus", "campus.yaml"));

        Assert.Equal(JsonResults.Write(DropSolver.Standard.Solve(network)), JsonResults.Write(DropSolver.Standard.Solve(network)));
    }

    private static DistributionNetwork Build(string name) =>
        NetworkBuilder.Build(ProjectLoader.Load(Path.Combine(TestPaths.RepoRoot, "projects", name)));
}
