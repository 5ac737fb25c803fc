using DistTree.Model;
using QuikGraph;

namespace DistTree.Network;

/// <summary>
/// The distribution tree of a project: a QuikGraph graph whose root is the service, with the nodes
/// also held, in the order the graph's breadth-first search reached them, in an array in which every parent
/// precedes its children, so that stages can walk the tree iteratively (top-down forwards, bottom-up
/// backwards) without recursion.
/// </summary>
public sealed class DistributionNetwork
{
    internal DistributionNetwork(Project project, IReadOnlyList<NetworkNode> nodes, BidirectionalGraph<NetworkNode, NetworkFeed> graph)
    {
        Project = project;
        Nodes = nodes;
        Graph = graph;
    }

    /// <summary>The project the tree was built from.</summary>
    public Project Project { get; }

    /// <summary>Every node; a parent's index is always smaller than its children's. Index 0 is the service.</summary>
    public IReadOnlyList<NetworkNode> Nodes { get; }

    /// <summary>The nodes as an array, for the solver's loops (indexing an array costs less than an interface call).</summary>
    internal NetworkNode[] NodeArray => _nodeArray ??= [.. Nodes];

    /// <summary>Every node's parent index (-1 for the service), in node order.</summary>
    internal int[] ParentIndices => _parentIndices ??= NodeArray.Select(node => node.ParentIndex).ToArray();

    /// <summary>The nodes of each depth and the children of each node as ranges of indices, for passes that take the tree a level at a time.</summary>
    internal TreeLevels Levels => _levels ??= TreeLevels.Of(ParentIndices);

    /// <summary>
    /// The tree as a QuikGraph graph: vertices are nodes, edges are feeds (one into every node but the service,
    /// each with its run, if any), a node's feeds out in the order of its children.
    /// </summary>
    public BidirectionalGraph<NetworkNode, NetworkFeed> Graph { get; }

    /// <summary>The service.</summary>
    public NetworkNode Root => Nodes[0];

    private NetworkNode[]? _nodeArray;
    private int[]? _parentIndices;
    private TreeLevels? _levels;

    /// <summary>The path of node indices from the service to <paramref name="node"/>, service first.</summary>
    public IReadOnlyList<int> PathTo(NetworkNode node)
    {
        var path = new List<int>();
        for (var i = node.Index; i >= 0; i = Nodes[i].ParentIndex)
        {
            path.Add(i);
        }

        path.Reverse();
        return path;
    }
}
