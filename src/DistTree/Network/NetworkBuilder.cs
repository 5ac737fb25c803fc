using DistTree.Model;
using QuikGraph;

namespace DistTree.Network;

/// <summary>
/// Builds the distribution tree of a validated project as a QuikGraph graph (a node per service, equipment and
/// branch circuit; a feed from each node's source to it), then numbers the nodes in the order of a breadth-first
/// search from the service: the service is node 0, then each node's branch circuits in file order
/// and then the equipment it feeds in file order, so that every parent precedes its children.
/// </summary>
public static class NetworkBuilder
{
    /// <summary>Builds the tree; feeders and branch circuits become runs, each the run of a feed (edge).</summary>
    /// <exception cref="InvalidOperationException">
    /// The project is inconsistent (an id used twice, or equipment the service does not reach); the loader
    /// never produces such a project.
    /// </exception>
    public static DistributionNetwork Build(Project project)
    {
        var expected = 1 + project.Equipment.Count;
        foreach (var equipment in project.Equipment)
        {
            expected += equipment.Circuits.Count;
        }

        // Parallel edges allowed: a tree has none, and refusing them would make each new edge scan its source's
        // edges, a cost in the square of the circuits of one panel.
        var graph = new BidirectionalGraph<NetworkNode, NetworkFeed>(allowParallelEdges: true, capacity: expected);
        var byId = new Dictionary<string, NetworkNode>(expected, StringComparer.Ordinal);
        var root = Add(graph, byId, new NetworkNode(0, project.Service.Id, NodeKind.Service, project.Service.System, -1));
        var equipmentNodes = AddEquipmentAndCircuits(project, graph, byId);
        AddFeeders(project, graph, byId, equipmentNodes);

        var nodes = ParentFirst(graph, root, expected);
        if (nodes.Count != graph.VertexCount)
        {
            // Only the service has no parent once the search has placed the nodes it reaches.
            var missing = project.Equipment[Array.FindIndex(equipmentNodes, node => node.ParentIndex == Unplaced)];
            throw new InvalidOperationException($"equipment '{missing.Id}' is not reached from the service '{project.Service.Id}'");
        }

        return new DistributionNetwork(project, nodes, graph);
    }

    // The parent index of a node made and not yet placed by the search.
    private const int Unplaced = -1;

    // Every piece of equipment and its branch circuits, fed from the equipment. The circuits' feeds are added
    // before any feeder's, so that a node's feeds out are its circuits in file order, then (AddFeeders) the
    // equipment it feeds in file order: the order the search takes them in.
    private static NetworkNode[] AddEquipmentAndCircuits(Project project, BidirectionalGraph<NetworkNode, NetworkFeed> graph, Dictionary<string, NetworkNode> byId)
    {
        var rules = project.Rules;
        var equipmentNodes = new NetworkNode[project.Equipment.Count];
        for (var i = 0; i < equipmentNodes.Length; i++)
        {
            var equipment = project.Equipment[i];
            var node = equipmentNodes[i] = Add(graph, byId, new NetworkNode(graph.VertexCount, equipment.Id, KindOf(equipment.Kind), equipment.OutputSystem, Unplaced) { Equipment = equipment });
            foreach (var circuit in equipment.Circuits)
            {
                var end = Add(graph, byId, new NetworkNode(graph.VertexCount, circuit.FullId, NodeKind.EndPoint, equipment.OutputSystem, Unplaced) { Circuit = circuit });
                var limit = circuit.Run.LimitPercent ?? rules.BranchLimitPercent;
                end.Incoming = new NetworkRun(node, end, RunKind.Branch, circuit.Run, equipment.OutputSystem, circuit.Supply, limit);
                graph.AddEdge(new NetworkFeed(node, end));
            }
        }

        return equipmentNodes;
    }

    // Each piece of equipment fed from its source (the service or other equipment), through its feeder if it has one.
    private static void AddFeeders(Project project, BidirectionalGraph<NetworkNode, NetworkFeed> graph, Dictionary<string, NetworkNode> byId, NetworkNode[] equipmentNodes)
    {
        var rules = project.Rules;
        for (var i = 0; i < equipmentNodes.Length; i++)
        {
            var (equipment, node) = (project.Equipment[i], equipmentNodes[i]);
            if (!byId.TryGetValue(equipment.From, out var source) || source.Kind == NodeKind.EndPoint)
            {
                continue; // not reached: Build names it
            }

            if (equipment.Feeder is { } feeder)
            {
                var limit = feeder.LimitPercent ?? rules.FeederLimitPercent;
                node.Incoming = new NetworkRun(source, node, RunKind.Feeder, feeder, equipment.System, equipment.System.FeederSupply, limit);
            }

            graph.AddEdge(new NetworkFeed(source, node));
        }
    }

    // The nodes in breadth-first order from the service (a queue, no recursion), each numbered and told its parent as it
    // is first reached, each node's feeds out taken in the order they were added. A search of its own over the graph's
    // feeds rather than QuikGraph's: that one keeps a colour per node in a dictionary of a value type, whose code is
    // compiled at start (DEVELOPERS.md, Start-up). A node reached is placed; the tree has no other way into it.
    private static List<NetworkNode> ParentFirst(BidirectionalGraph<NetworkNode, NetworkFeed> graph, NetworkNode root, int expected)
    {
        var nodes = new List<NetworkNode>(expected) { root };
        root.Place(0, -1);
        for (var next = 0; next < nodes.Count; next++)
        {
            var source = nodes[next];
            foreach (var feed in graph.OutEdges(source))
            {
                if (feed.Target.ParentIndex != Unplaced || feed.Target == root)
                {
                    continue;
                }

                feed.Target.Place(nodes.Count, source.Index);
                source.MutableChildren.Add(nodes.Count);
                nodes.Add(feed.Target);
            }
        }

        return nodes;
    }

    private static NetworkNode Add(BidirectionalGraph<NetworkNode, NetworkFeed> graph, Dictionary<string, NetworkNode> byId, NetworkNode node)
    {
        if (!byId.TryAdd(node.Id, node))
        {
            throw new InvalidOperationException($"the id '{node.Id}' is used twice");
        }

        graph.AddVertex(node);
        return node;
    }

    private static NodeKind KindOf(EquipmentKind kind) => kind switch
    {
        EquipmentKind.Switchboard => NodeKind.Switchboard,
        EquipmentKind.Panelboard => NodeKind.Panelboard,
        EquipmentKind.Transformer => NodeKind.Transformer,
        _ => NodeKind.Splitter,
    };
}
