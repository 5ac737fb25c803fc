using QuikGraph;

namespace DistTree.Network;

/// <summary>
/// An edge of the tree's graph: <see cref="Source"/> feeds <see cref="Target"/>, through the run
/// <see cref="Run"/> or, for equipment standing at its source (no feeder of its own), directly. Every node
/// but the service has exactly one feed coming in, so the graph is the whole tree.
/// </summary>
/// <param name="source">The node on the service side.</param>
/// <param name="target">The node fed.</param>
public sealed class NetworkFeed(NetworkNode source, NetworkNode target) : IEdge<NetworkNode>
{
    /// <summary>The node on the service side.</summary>
    public NetworkNode Source { get; } = source;

    /// <summary>The node fed.</summary>
    public NetworkNode Target { get; } = target;

    /// <summary>The feeder or branch circuit of this feed, or null when the equipment stands at its source.</summary>
    public NetworkRun? Run => Target.Incoming;

    /// <inheritdoc />
    public override string ToString() => $"{Source.Id} -> {Target.Id}";
}
