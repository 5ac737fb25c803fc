using DistTree.Network;
using DistTree.ProjectFiles;

namespace DistTree.Tests.Network;

/// <summary>TreeLevels: the ranges of each depth and of each node's children, and the steps a pass takes.</summary>
public sealed class TreeLevelsTests
{
    [Fact]
    public void Levels_SmallTree_RangesOfEachDepthAndOfEachNodesChildren()
    {
        // SVC, MSB, T1, HP1, LP1, HP1/A, LP1/1, LP1/2 (breadth first, see NetworkBuilderTests).
        var network = NetworkBuilder.Build(ProjectLoader.Parse("""
            disttree: 1
            project: { name: T }
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - { id: LP1, kind: panelboard, from: T1, feeder: { length: 3, size: 250 kcmil }, circuits: [ { id: "1", poles: 1, load: { va: 900 }, run: { length: 10, size: 12 AWG } }, { id: "2", poles: 3, load: { kva: 9 }, run: { length: 10, size: 10 AWG } } ] }
              - { id: T1, kind: transformer, from: MSB, kva: 75, secondary: 208Y/120, impedance_percent: 5, x_r: 4, feeder: { length: 40, size: 1 AWG } }
              - { id: MSB, kind: switchboard, from: SVC }
              - { id: HP1, kind: panelboard, from: MSB, feeder: { length: 30, size: 2 AWG }, circuits: [ { id: A, poles: 1, load: { va: 100 }, run: { length: 5, size: 12 AWG } } ] }
            """, "t.yaml"));

        var levels = network.Levels;

        Assert.Equal(["SVC", "MSB", "T1", "HP1", "LP1", "HP1/A", "LP1/1", "LP1/2"], network.Nodes.Select(n => n.Id));
        Assert.Equal([0, 1, 2, 4, 6, 8], levels.LevelStarts);
        Assert.Equal([1, 2, 4, 5, 6, 8, 8, 8, 8], levels.ChildStarts);
        foreach (var node in network.Nodes)
        {
            Assert.Equal(node.Children, Enumerable.Range(levels.ChildStarts[node.Index], levels.ChildStarts[node.Index + 1] - levels.ChildStarts[node.Index]));
        }

        // Every level is narrow: one step below the service.
        Assert.Equal([new LevelStep(1, 8, false)], levels.Steps);
    }

    [Fact]
    public void Of_WideLevelBetweenNarrowOnes_IsAStepOfItsOwn()
    {
        // The service, one panel, 10,000 circuits on it, and under the first circuit's place a chain of 3.
        var wide = 10_000;
        var parents = new List<int> { -1, 0 };
        parents.AddRange(Enumerable.Repeat(1, wide));
        parents.AddRange([2, wide + 2, wide + 3]);

        var levels = TreeLevels.Of([.. parents]);

        Assert.Equal([0, 1, 2, wide + 2, wide + 3, wide + 4, wide + 5], levels.LevelStarts);
        Assert.Equal(
            [new LevelStep(1, 2, false), new LevelStep(2, wide + 2, true), new LevelStep(wide + 2, wide + 5, false)],
            levels.Steps);
    }

    [Fact]
    public void Of_Chain100000_OneStepAndALevelPerNode()
    {
        var parents = Enumerable.Range(-1, 100_000).ToArray();

        var levels = TreeLevels.Of(parents);

        Assert.Equal(Enumerable.Range(0, 100_001), levels.LevelStarts);
        Assert.Equal([new LevelStep(1, 100_000, false)], levels.Steps);
    }

    [Theory]
    [InlineData(new[] { -1, 0, 1, 0 })]
    [InlineData(new[] { -1, 1 })]
    [InlineData(new[] { -1, -1 })]
    public void Of_NotBreadthFirst_Throws(int[] parents) =>
        Assert.Throws<ArgumentException>(() => TreeLevels.Of(parents));
}
