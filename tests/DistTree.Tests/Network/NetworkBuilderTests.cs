using System.Text;
using DistTree.Model;
using DistTree.Network;
using DistTree.ProjectFiles;

namespace DistTree.Tests.Network;

/// <summary>NetworkBuilder: the tree's numbering, runs, supplies and limits.</summary>
public sealed class NetworkBuilderTests
{
    private const string TransformerProject = """
        disttree: 1
        project: { name: T }
        rules: { feeder_limit_percent: 2, branch_limit_percent: 2.5 }
        service: { id: SVC, system: 480Y/277 }
        equipment:
          - id: LP1
            kind: panelboard
            from: T1
            feeder: { length: 3, size: 250 kcmil }
            circuits:
              - { id: "1", poles: 1, load: { va: 900 }, run: { length: 10, size: 12 AWG } }
              - { id: "2", poles: 3, load: { kva: 9 }, run: { length: 10, size: 10 AWG, limit_percent: 1 } }
          - { id: T1, kind: transformer, from: MSB, kva: 75, secondary: 208Y/120, impedance_percent: 5, x_r: 4, feeder: { length: 40, size: 1 AWG, limit_percent: 1.5 } }
          - { id: MSB, kind: switchboard, from: SVC }
          - { id: HP1, kind: panelboard, from: MSB, feeder: { length: 30, size: 2 AWG }, circuits: [ { id: A, poles: 1, load: { va: 100 }, run: { length: 5, size: 12 AWG } } ] }
        """;

    private static DistributionNetwork Build(string text) => NetworkBuilder.Build(ProjectLoader.Parse(text, "t.yaml"));

    [Fact]
    public void Build_Tree_ServiceFirstAndParentsBeforeChildren()
    {
        var network = Build(TransformerProject);

        Assert.Equal(["SVC", "MSB", "T1", "HP1", "LP1", "HP1/A", "LP1/1", "LP1/2"], network.Nodes.Select(n => n.Id));
        Assert.Equal(NodeKind.Service, network.Root.Kind);
        Assert.Equal(-1, network.Root.ParentIndex);
        Assert.All(network.Nodes.Skip(1), n => Assert.True(n.ParentIndex < n.Index));
        Assert.All(network.Nodes, n => Assert.Equal(n.Index, network.Nodes.ToList().IndexOf(n)));
        Assert.Equal([0, 1, 2, 4, 6], network.PathTo(network.Nodes[6]));
        Assert.Equal([2, 3], network.Nodes[1].Children);
    }

    [Fact]
    public void Build_Systems_EachNodeKnowsWhatItDistributes()
    {
        var network = Build(TransformerProject);
        var byId = network.Nodes.ToDictionary(n => n.Id);

        Assert.Equal("480Y/277", byId["SVC"].System.Name);
        Assert.Equal("480Y/277", byId["MSB"].System.Name);
        Assert.Equal("208Y/120", byId["T1"].System.Name);
        Assert.Equal("208Y/120", byId["LP1"].System.Name);
        Assert.Equal("208Y/120", byId["LP1/1"].System.Name);
        Assert.Equal("480Y/277", byId["HP1/A"].System.Name);
        Assert.Equal(NodeKind.EndPoint, byId["LP1/1"].Kind);
        Assert.Equal(NodeKind.Transformer, byId["T1"].Kind);
    }

    [Fact]
    public void Build_Runs_CarryTheirSupplyAndLimit()
    {
        var network = Build(TransformerProject);
        var runs = network.Graph.Edges.Where(f => f.Run is not null).ToDictionary(f => f.Target.Id, f => f.Run!);

        // The transformer's feeder carries its primary; the panel below it its secondary.
        Assert.Equal((RunKind.Feeder, new CircuitSupply(480, 3), 1.5), (runs["T1"].Kind, runs["T1"].Supply, runs["T1"].LimitPercent));
        Assert.Equal((RunKind.Feeder, new CircuitSupply(208, 3), 2.0), (runs["LP1"].Kind, runs["LP1"].Supply, runs["LP1"].LimitPercent));
        Assert.Equal((RunKind.Branch, new CircuitSupply(120, 1), 2.5), (runs["LP1/1"].Kind, runs["LP1/1"].Supply, runs["LP1/1"].LimitPercent));
        Assert.Equal((RunKind.Branch, new CircuitSupply(208, 3), 1.0), (runs["LP1/2"].Kind, runs["LP1/2"].Supply, runs["LP1/2"].LimitPercent));
        Assert.Equal((RunKind.Branch, new CircuitSupply(277, 1), 2.5), (runs["HP1/A"].Kind, runs["HP1/A"].Supply, runs["HP1/A"].LimitPercent));
        Assert.Same(runs["LP1"], network.Nodes.Single(n => n.Id == "LP1").Incoming);
        Assert.Equal("T1", runs["LP1"].Source.Id);
    }

    [Fact]
    public void Build_EquipmentWithoutFeeder_HasNoIncomingRunButAFeedFromItsSource()
    {
        var network = Build(TransformerProject);
        var msb = network.Nodes.Single(n => n.Id == "MSB");

        Assert.Null(msb.Incoming);
        var feed = Assert.Single(network.Graph.InEdges(msb));
        Assert.Same(network.Root, feed.Source);
        Assert.Null(feed.Run);
        Assert.Equal(0, msb.ParentIndex);
        Assert.Equal(7, network.Graph.EdgeCount);
        Assert.Equal(8, network.Graph.VertexCount);
    }

    [Fact]
    public void Build_ProjectMadeInCode_WithUnreachedEquipment_Throws()
    {
        var project = ProjectLoader.Parse(TransformerProject, "t.yaml");
        var broken = project with { Equipment = [.. project.Equipment, project.Equipment[0] with { Id = "X", From = "NOWHERE", Circuits = [] }] };

        var error = Assert.Throws<InvalidOperationException>(() => NetworkBuilder.Build(broken));
        Assert.Contains("'X'", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Build_RandomTrees_NodesInBreadthFirstOrderAndTheGraphIsTheTree()
    {
        for (var seed = 0; seed < 200; seed++)
        {
            var (text, equipment) = RandomTree(new Random(seed));

            var network = Build(text);

            // By hand: from the service, each node's circuits in file order, then the equipment it feeds in file order.
            var expected = new List<string> { "SVC" };
            for (var next = 0; next < expected.Count; next++)
            {
                var id = expected[next];
                expected.AddRange(equipment.Where(e => e.Id == id).SelectMany(e => Enumerable.Range(1, e.Circuits).Select(c => $"{id}/{c}")));
                expected.AddRange(equipment.Where(e => e.From == id).Select(e => e.Id));
            }

            Assert.Equal(expected, network.Nodes.Select(n => n.Id));
            Assert.Equal(network.Nodes.Count, network.Graph.VertexCount);
            Assert.Equal(network.Nodes.Count - 1, network.Graph.EdgeCount);
            Assert.Empty(network.Graph.InEdges(network.Root));
            foreach (var node in network.Nodes)
            {
                Assert.Same(node, network.Nodes[node.Index]);
                Assert.Equal(node.Children, network.Graph.OutEdges(node).Select(f => f.Target.Index));
                Assert.All(node.Children, child => Assert.Equal(node.Index, network.Nodes[child].ParentIndex));
                if (node != network.Root)
                {
                    var feed = Assert.Single(network.Graph.InEdges(node));
                    Assert.Equal(node.ParentIndex, feed.Source.Index);
                    Assert.True(node.ParentIndex < node.Index);
                    Assert.Same(node.Incoming, feed.Run);
                }
            }
        }
    }

    [Fact]
    public void Build_OnePanelOf20000Circuits_CircuitsInFileOrderWithoutAScanPerEdge()
    {
        var text = new StringBuilder("disttree: 1\nproject: { name: Wide }\nservice: { id: SVC, system: 480Y/277 }\nequipment:\n");
        text.Append("  - id: LP1\n    kind: panelboard\n    from: SVC\n    feeder: { length: 3, size: 500 kcmil, sets: 8 }\n    circuits:\n");
        const int circuits = 20_000;
        for (var c = 1; c <= circuits; c++)
        {
            text.Append("      - { id: \"").Append(c).Append("\", poles: 1, load: { va: 100 }, run: { length: 10, size: 12 AWG } }\n");
        }

        var network = Build(text.ToString());

        // A graph refusing parallel edges scans the source's edges on every new edge: the square of a panel's circuits.
        Assert.True(network.Graph.AllowParallelEdges);
        Assert.Equal(circuits + 2, network.Nodes.Count);
        Assert.Equal(Enumerable.Range(2, circuits), network.Nodes[1].Children);
        Assert.Equal("LP1/20000", network.Nodes[^1].Id);
    }

    [Fact]
    public void LoadAndBuild_Chain100000Levels_NoStackOverflow()
    {
        const int levels = 100_000;

        var network = DeepChain.OnSmallStack(() => NetworkBuilder.Build(ProjectLoader.Parse(DeepChain.Text(levels), "chain.yaml")));

        Assert.Equal(levels + 3, network.Nodes.Count);
        var end = network.Nodes[^1];
        Assert.Equal("END/1", end.Id);
        Assert.Equal(levels + 3, network.PathTo(end).Count);
    }

    // A tree of panelboards and switchboards, parents made before children but written in a shuffled order, with
    // zero to four circuits on each panelboard.
    private static (string Text, List<(string Id, string From, int Circuits)> Equipment) RandomTree(Random random)
    {
        var count = random.Next(1, 30);
        var equipment = new List<(string Id, string From, int Circuits)>();
        for (var i = 0; i < count; i++)
        {
            var from = i == 0 || random.Next(4) == 0 ? "SVC" : equipment[random.Next(i)].Id;
            equipment.Add(($"E{i}", from, random.Next(3) == 0 ? 0 : random.Next(5)));
        }

        random.Shuffle(System.Runtime.InteropServices.CollectionsMarshal.AsSpan(equipment));
        var text = new StringBuilder("disttree: 1\nproject: { name: Random }\nservice: { id: SVC, system: 480Y/277 }\nequipment:\n");
        foreach (var (id, from, circuits) in equipment)
        {
            if (circuits == 0)
            {
                text.Append($"  - {{ id: {id}, kind: switchboard, from: {from} }}\n");
                continue;
            }

            text.Append($"  - id: {id}\n    kind: panelboard\n    from: {from}\n    feeder: {{ length: 30, size: 4/0 AWG }}\n    circuits:\n");
            for (var c = 1; c <= circuits; c++)
            {
                text.Append($"      - {{ id: \"{c}\", poles: 1, load: {{ va: 500 }}, run: {{ length: 20, size: 12 AWG }} }}\n");
            }
        }

        return (text.ToString(), equipment);
    }
}
