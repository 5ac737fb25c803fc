using DistTree.Generating;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>
/// The solution's lookups by node and by id: each checked against the tree's own objects (a node's incoming run,
/// its transformer, its circuit), which the lookups are not read from.
/// </summary>
public sealed class SolutionTests
{
    // The invented demo building: feeders, branch circuits and five transformers.
    private static readonly Lazy<Solution> Demo = new(() =>
        Analysis.Run(Path.Combine(TestPaths.RepoRoot, "projects", "quillfeather-medical.yaml")).Solution);

    // Invented generated data (disttree generate), large enough to hold every kind of node many times.
    private static readonly Lazy<Solution> Generated = new(() =>
        Analysis.Parse(ProjectGenerator.Generate(5_000, 4, 3), "generated.yaml").Solution);

    public static TheoryData<string> Solutions => new() { "demo", "generated" };

    private static Solution Of(string name) => name == "demo" ? Demo.Value : Generated.Value;

    [Theory]
    [MemberData(nameof(Solutions))]
    public void IncomingRun_EveryNode_IsTheFeederOrBranchCircuitThatFeedsIt(string name)
    {
        var s = Of(name);
        var nodes = s.Network.Nodes;

        var found = 0;
        for (var i = 0; i < nodes.Count; i++)
        {
            var run = s.IncomingRun(i);
            Assert.Equal(nodes[i].Incoming is not null, run is not null);
            if (run is { } r)
            {
                found++;
                Assert.Equal(i, r.NodeIndex);
                Assert.Equal(nodes[i].Incoming!.Kind == RunKind.Feeder ? RunResultKind.Feeder : RunResultKind.Branch, r.Kind);
                Assert.Equal(nodes[i].Incoming!.Source.Id, r.From);
            }
        }

        Assert.Null(s.IncomingRun(0));
        Assert.Equal(s.Runs.Count(r => r.Kind != RunResultKind.Transformer), found);
    }

    [Theory]
    [MemberData(nameof(Solutions))]
    public void TransformerRun_EveryNode_IsItsTransformersRegulation_AndNullElsewhere(string name)
    {
        var s = Of(name);
        var nodes = s.Network.Nodes;

        for (var i = 0; i < nodes.Count; i++)
        {
            var row = s.TransformerRun(i);
            Assert.Equal(nodes[i].Equipment?.Transformer is not null, row is not null);
            if (row is { } r)
            {
                Assert.Equal(RunResultKind.Transformer, r.Kind);
                Assert.Equal(i, r.NodeIndex);
            }
        }
    }

    [Fact]
    public void TransformerRun_Demo_FindsEveryTransformer()
    {
        var s = Demo.Value;

        var transformers = Enumerable.Range(0, s.Network.Nodes.Count).Count(i => s.TransformerRun(i) is not null);

        Assert.Equal(5, transformers);
    }

    [Theory]
    [MemberData(nameof(Solutions))]
    public void EndPointAt_EveryNode_IsTheCircuitThere_AndNullElsewhere(string name)
    {
        var s = Of(name);
        var nodes = s.Network.Nodes;

        var found = 0;
        for (var i = 0; i < nodes.Count; i++)
        {
            var e = s.EndPointAt(i);
            Assert.Equal(nodes[i].Circuit is not null, e is not null);
            if (e is { } point)
            {
                found++;
                Assert.Equal(i, point.NodeIndex);
                Assert.Equal(nodes[i].Circuit!.FullId, point.Id);
            }
        }

        Assert.Equal(s.EndPoints.Count, found);
    }

    [Theory]
    [MemberData(nameof(Solutions))]
    public void EndPointById_EveryEndPointsId_FindsThatEndPoint(string name)
    {
        var s = Of(name);

        foreach (var e in s.EndPoints)
        {
            Assert.Equal(e, s.EndPointById(e.Id));
        }
    }

    [Fact]
    public void EndPointById_UnknownOrOtherNodesId_IsNull()
    {
        var s = Demo.Value;
        var panel = s.Network.Nodes[s.EndPoints[0].NodeIndex].ParentIndex;

        Assert.Null(s.EndPointById("NO-SUCH/CIRCUIT"));
        Assert.Null(s.EndPointById(s.Network.Nodes[panel].Id));
        Assert.Null(s.EndPointById(s.EndPoints[0].Id.ToLowerInvariant()));
    }

    [Fact]
    public void Lookups_OfACopyWithOtherRows_ReadTheCopysRows()
    {
        var s = Demo.Value;
        var e = s.EndPoints[0];
        Assert.NotNull(s.EndPointAt(e.NodeIndex));
        Assert.NotNull(s.IncomingRun(e.NodeIndex));

        var empty = s with { Runs = [], EndPoints = [] };

        Assert.Null(empty.EndPointAt(e.NodeIndex));
        Assert.Null(empty.IncomingRun(e.NodeIndex));
        Assert.Null(empty.EndPointById(e.Id));
        Assert.Equal(e, s.EndPointAt(e.NodeIndex));
    }

    [Fact]
    public void LookupsByNode_NodeOutsideTheTree_Throw()
    {
        var s = Demo.Value;
        var n = s.Network.Nodes.Count;

        Assert.Throws<ArgumentOutOfRangeException>(() => s.IncomingRun(n));
        Assert.Throws<ArgumentOutOfRangeException>(() => s.TransformerRun(-1));
        Assert.Throws<ArgumentOutOfRangeException>(() => s.EndPointAt(n));
    }
}
