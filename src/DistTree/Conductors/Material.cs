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

/// <summary>The words a project file uses for materials and raceways, as the outputs write them.</summary>
internal static class ConductorWords
{
    /// <summary><c>cu</c> or <c>al</c>.</summary>
    public static string Of(Material material) => material == Material.Copper ? "cu" : "al";

    /// <summary><c>pvc</c>, <c>aluminum</c> or <c>steel</c>.</summary>
    public static string Of(Raceway raceway) => raceway switch
    {
        Raceway.Pvc => "pvc",
        Raceway.Aluminum => "aluminum",
        _ => "steel",
    };
}
