using DistTree.Model;
using QuikGraph;

namespace DistTree.Network;

/// <summary>A feeder or branch circuit: an edge of the tree from its source node to the node it feeds.</summary>
public sealed class NetworkRun : IEdge<NetworkNode>
{
    internal NetworkRun(NetworkNode source, NetworkNode target, RunKind kind, Run conductors, ElectricalSystem system, CircuitSupply supply, double limitPercent)
    {
        System = system;
        Source = source;
        Target = target;
        Kind = kind;
        Conductors = conductors;
        Supply = supply;
        LimitPercent = limitPercent;
    }

    /// <summary>The run's id: the id of the node it feeds.</summary>
    public string Id => Target.Id;

    /// <summary>The node on the service side.</summary>
    public NetworkNode Source { get; }

    /// <summary>The node on the load side.</summary>
    public NetworkNode Target { get; }

    /// <summary>Feeder or branch circuit.</summary>
    public RunKind Kind { get; }

    /// <summary>The conductors as the project gives them.</summary>
    public Run Conductors { get; }

    /// <summary>
    /// The system the run carries: its source bus's, but a transformer's feeder carries the transformer's primary, so
    /// a delta primary on a wye bus makes it three lines and no neutral. A branch circuit's is its panel's.
    /// </summary>
    public ElectricalSystem System { get; }

    /// <summary>Nominal voltage and phases the run carries.</summary>
    public CircuitSupply Supply { get; }

    /// <summary>The run's own limit in percent: its override, else the rules' feeder or branch limit.</summary>
    public double LimitPercent { get; }
}
