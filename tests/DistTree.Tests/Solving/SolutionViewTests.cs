using DistTree.Generating;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Reports;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>
/// Results are views into the solve's arrays: they read the same each time, compare by the row they show, and
/// a solve on every core gives the same bytes as one on a single thread.
/// </summary>
public sealed class SolutionViewTests
{
    // Invented demo data (disttree generate), large enough that every pass is cut into several ranges, and that
    // the passes along the tree split two levels over the cores: one of end points only, one of panels as well.
    private static readonly Lazy<DistributionNetwork> Campus = new(() =>
        NetworkBuilder.Build(ProjectLoader.Parse(ProjectGenerator.Generate(30_000, 3, 11), "generated.yaml")));

    [Fact]
    public void Solve_OnEveryCore_WritesTheSameBytesAsOnOneThread()
    {
        var network = Campus.Value;
        var wide = network.Levels.Steps.Where(step => step.Wide).ToArray();
        Assert.Equal(2, wide.Length);
        Assert.Contains(wide, step => network.NodeArray[step.Start..step.End].Any(node => node.Children.Count > 0));

        var allCores = JsonResults.Write(DropSolver.Standard.Solve(network));
        string oneThread;
        ParallelRanges.OnOneThread = true;
        try
        {
            oneThread = JsonResults.Write(DropSolver.Standard.Solve(network));
        }
        finally
        {
            ParallelRanges.OnOneThread = false;
        }

        Assert.Equal(oneThread, allCores);
    }

    [Fact]
    public void Views_OfTheSameRow_AreEqual_AndOfOthersNot()
    {
        var solution = DropSolver.Standard.Solve(Campus.Value);

        Assert.Equal(solution.Runs[5], solution.Runs[5]);
        Assert.NotEqual(solution.Runs[5], solution.Runs[6]);
        Assert.Equal(solution.EndPoints[7], solution.EndPoints[7]);
        Assert.NotEqual(solution.EndPoints[7], solution.EndPoints[8]);
        Assert.NotEqual(solution.Runs[5], DropSolver.Standard.Solve(Campus.Value).Runs[5]);
    }

    [Fact]
    public void EndPoint_Path_RunsFromTheServiceToItsNode()
    {
        var solution = DropSolver.Standard.Solve(Campus.Value);
        var nodes = solution.Network.NodeArray;

        foreach (var e in solution.EndPoints.Where((_, k) => k % 997 == 0))
        {
            var path = e.Path;
            Assert.Equal(nodes[0].Id, path[0]);
            Assert.Equal(nodes[e.NodeIndex].Id, path[^1]);
            Assert.Equal(e.Panel, path[^2]);
            var i = e.NodeIndex;
            for (var k = path.Count - 1; k >= 0; k--)
            {
                Assert.Equal(nodes[i].Id, path[k]);
                i = nodes[i].ParentIndex;
            }

            Assert.Equal(-1, i);
        }
    }

    [Fact]
    public void EndPoint_CountedRuns_AddUpToItsTotal()
    {
        // Percent sum: the total is the sum of the counted runs' shares (common practice: drops add along a path).
        var solution = DropSolver.Standard.Solve(Campus.Value);

        foreach (var e in solution.EndPoints)
        {
            Assert.Equal(e.RunIndices.Count, e.RunSharesPercent.Count);
            Assert.Equal(e.TotalDropPercent, e.RunSharesPercent.Sum(), 9);
            Assert.All(e.RunIndices, r => Assert.InRange(r, 0, solution.Runs.Count - 1));
        }
    }
}
