using DistTree.Model;

namespace DistTree.Network;

/// <summary>
/// A node of the distribution tree: the service, a piece of equipment, or a circuit's end point.
/// Nodes are numbered so that a parent always comes before its children.
/// </summary>
public sealed class NetworkNode
{
    /// <summary>
    /// A node numbered <paramref name="index"/> under <paramref name="parentIndex"/>. The builder makes its nodes
    /// with the number they are made in and no parent, then numbers them in the order the tree's graph is traversed
    /// (<see cref="Place"/>); the number made with stays the node's hash code, as the graph's dictionaries need.
    /// </summary>
    internal NetworkNode(int index, string id, NodeKind kind, ElectricalSystem system, int parentIndex)
    {
        _key = index;
        Index = index;
        Id = id;
        Kind = kind;
        System = system;
        ParentIndex = parentIndex;
    }

    /// <summary>Position in <see cref="DistributionNetwork.Nodes"/>; a parent's index is smaller than its children's.</summary>
    public int Index { get; private set; }

    /// <summary>The node's id: equipment id, the service id, or a circuit's full id (<c>LP1/3</c>).</summary>
    public string Id { get; }

    /// <summary>What the node is.</summary>
    public NodeKind Kind { get; }

    /// <summary>The system this node distributes (a transformer's secondary; an end point's panel system).</summary>
    public ElectricalSystem System { get; }

    /// <summary>The parent's index, or -1 for the service.</summary>
    public int ParentIndex { get; private set; }

    /// <summary>The run that feeds this node, or null for the service and for equipment standing at its source.</summary>
    public NetworkRun? Incoming { get; internal set; }

    /// <summary>The equipment this node is, when it is equipment.</summary>
    public Equipment? Equipment { get; internal init; }

    /// <summary>The circuit this node ends, when it is an end point.</summary>
    public Circuit? Circuit { get; internal init; }

    /// <summary>Children's indices, in file order.</summary>
    public IReadOnlyList<int> Children => _children;

    internal List<int> MutableChildren => _children;

    private readonly List<int> _children = [];
    private readonly int _key;

    /// <inheritdoc />
    public override string ToString() => Id;

    /// <summary>
    /// The number the node was made with: a node is equal only to itself, and that number is fixed (unlike
    /// <see cref="Index"/> while the builder numbers the tree), so the graph's dictionaries hash it without the
    /// runtime's per-object hash code.
    /// </summary>
    public override int GetHashCode() => _key;

    /// <summary>Gives the node its place in the tree: its index and its parent's.</summary>
    internal void Place(int index, int parentIndex)
    {
        Index = index;
        ParentIndex = parentIndex;
    }
}
