using DistTree.Model;
using QuikGraph;

namespace DistTree.Network;

/// <summary>
/// Builds the distribution tree of a validated project: the service is node 0, then breadth first
/// (iteratively, never recursively) each node's branch circuits in file order and then the equipment
/// it feeds in file order, so that every parent precedes its children.
/// </summary>
public static class NetworkBuilder
{
    /// <summary>Builds the tree; feeders and branch circuits become runs (edges).</summary>
    /// <exception cref="InvalidOperationException">
    /// The project is inconsistent (an id used twice, or equipment the service does not reach); the loader
    /// never produces such a project.
    /// </exception>
    public static DistributionNetwork Build(Project project)
    {
        var fedFrom = new Dictionary<string, List<Equipment>>(StringComparer.Ordinal);
        foreach (var equipment in project.Equipment)
        {
            if (!fedFrom.TryGetValue(equipment.From, out var list))
            {
                fedFrom[equipment.From] = list = [];
            }

            list.Add(equipment);
        }

        var rules = project.Rules;
        var expected = 1 + project.Equipment.Count;
        foreach (var equipment in project.Equipment)
        {
            expected += equipment.Circuits.Count;
        }

        var nodes = new List<NetworkNode>(expected);
        var graph = new BidirectionalGraph<NetworkNode, NetworkRun>(allowParallelEdges: false, capacity: expected);
        var root = new NetworkNode(0, project.Service.Id, NodeKind.Service, project.Service.System, -1);
        nodes.Add(root);
        graph.AddVertex(root);
        var ids = new HashSet<string>(expected, StringComparer.Ordinal) { root.Id };

        for (var next = 0; next < nodes.Count; next++)
        {
            var parent = nodes[next];
            if (parent.Equipment is { } panel)
            {
                foreach (var circuit in panel.Circuits)
                {
                    var end = Add(nodes, graph, ids, new NetworkNode(nodes.Count, circuit.FullId, NodeKind.EndPoint, panel.OutputSystem, parent.Index) { Circuit = circuit });
                    parent.MutableChildren.Add(end.Index);
                    var limit = circuit.Run.LimitPercent ?? rules.BranchLimitPercent;
                    Connect(graph, new NetworkRun(parent, end, RunKind.Branch, circuit.Run, circuit.Supply, limit));
                }
            }

            if (parent.Kind == NodeKind.EndPoint || !fedFrom.TryGetValue(parent.Id, out var fed))
            {
                continue;
            }

            foreach (var equipment in fed)
            {
                var node = Add(nodes, graph, ids, new NetworkNode(nodes.Count, equipment.Id, KindOf(equipment.Kind), equipment.OutputSystem, parent.Index) { Equipment = equipment });
                parent.MutableChildren.Add(node.Index);
                if (equipment.Feeder is { } feeder)
                {
                    var limit = feeder.LimitPercent ?? rules.FeederLimitPercent;
                    Connect(graph, new NetworkRun(parent, node, RunKind.Feeder, feeder, equipment.System.FeederSupply, limit));
                }
            }
        }

        if (nodes.Count != expected)
        {
            var missing = project.Equipment.Where(e => !ids.Contains(e.Id)).Select(e => e.Id).FirstOrDefault();
            throw new InvalidOperationException(missing is null
                ? "the project has equipment or circuits that the tree cannot place"
                : $"equipment '{missing}' is not reached from the service '{project.Service.Id}'");
        }

        return new DistributionNetwork(project, nodes, graph);
    }

    private static NetworkNode Add(List<NetworkNode> nodes, BidirectionalGraph<NetworkNode, NetworkRun> graph, HashSet<string> ids, NetworkNode node)
    {
        if (!ids.Add(node.Id))
        {
            throw new InvalidOperationException($"the id '{node.Id}' is used twice");
        }

        nodes.Add(node);
        graph.AddVertex(node);
        return node;
    }

    private static void Connect(BidirectionalGraph<NetworkNode, NetworkRun> graph, NetworkRun run)
    {
        graph.AddEdge(run);
        run.Target.Incoming = run;
    }

    private static NodeKind KindOf(EquipmentKind kind) => kind switch
    {
        EquipmentKind.Switchboard => NodeKind.Switchboard,
        EquipmentKind.Panelboard => NodeKind.Panelboard,
        EquipmentKind.Transformer => NodeKind.Transformer,
        _ => NodeKind.Splitter,
    };
}
