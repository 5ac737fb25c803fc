namespace DistTree.Conductors;

/// <summary>Conductor metal.</summary>
public enum Material
{
    /// <summary>Annealed copper, 100 % IACS.</summary>
    Copper,

    /// <summary>Aluminium building-wire alloy, 61 % IACS.</summary>
    Aluminum,
}

/// <summary>The raceway the conductors run in: it sets reactance and, for steel, extra AC losses.</summary>
public enum Raceway
{
    /// <summary>Non-metallic (PVC) conduit.</summary>
    Pvc,

    /// <summary>Aluminium conduit.</summary>
    Aluminum,

    /// <summary>Steel conduit.</summary>
    Steel,
}
