using DistTree.Conductors;
using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Generating;

/// <summary>What a generated piece of equipment is.</summary>
internal enum PlannedKind
{
    /// <summary>A switchboard: the main one or a distribution one.</summary>
    Board,

    /// <summary>A 480Y/277 to 208Y/120 transformer.</summary>
    Transformer,

    /// <summary>A panelboard feeding branch circuits.</summary>
    Panel,
}

/// <summary>A piece of equipment of a generated project as it is invented and sized, before it is written.</summary>
internal sealed class PlannedEquipment(string id, PlannedKind kind, ElectricalSystem system, PlannedEquipment? parent, int level)
{
    public string Id { get; } = id;

    public PlannedKind Kind { get; } = kind;

    /// <summary>The system its feeder carries (a transformer's primary).</summary>
    public ElectricalSystem System { get; } = system;

    /// <summary>A transformer's secondary system; null for other equipment.</summary>
    public ElectricalSystem? Secondary { get; init; }

    /// <summary>What it distributes: a transformer's secondary, else its own system.</summary>
    public ElectricalSystem OutputSystem => Secondary ?? System;

    public PlannedEquipment? Parent { get; } = parent;

    /// <summary>A switchboard's level (the main switchboard is 1); 0 for other equipment.</summary>
    public int Level { get; } = level;

    public List<PlannedCircuit> Circuits { get; } = [];

    public ComplexPower Power { get; set; }

    public double LengthFt { get; set; }

    /// <summary>True for a switchboard too large for one feeder: a service section with no feeder.</summary>
    public bool StandsAtSource { get; set; }

    public ConductorSize Size { get; set; }

    public int Sets { get; set; } = 1;

    public double? OcpdA { get; set; }

    public double Kva { get; set; }

    public double ImpedancePercent { get; set; }

    public double XOverR { get; set; }

    /// <summary>The nameplate's primary tap, percent: negative raises the secondary.</summary>
    public double TapPercent { get; set; }

    /// <summary>Estimated drop from the service to this item's output, percent.</summary>
    public double UpstreamPercent { get; set; }

    /// <summary>The full-load current of the largest motor this item's feeder carries on its own system, amperes (0 for none).</summary>
    public double LargestMotorA { get; set; }
}
