namespace DistTree.Network;

/// <summary>What a node of the distribution tree is.</summary>
public enum NodeKind
{
    /// <summary>The service: the root.</summary>
    Service,

    /// <summary>A switchboard.</summary>
    Switchboard,

    /// <summary>A panelboard.</summary>
    Panelboard,

    /// <summary>A transformer; what it feeds is at its secondary system.</summary>
    Transformer,

    /// <summary>A splitter or tap box.</summary>
    Splitter,

    /// <summary>A branch circuit's point of use: a leaf.</summary>
    EndPoint,
}

/// <summary>What a run of the tree is.</summary>
public enum RunKind
{
    /// <summary>Conductors from a source to a piece of equipment.</summary>
    Feeder,

    /// <summary>A branch circuit's conductors from its panel to the point of use.</summary>
    Branch,
}
