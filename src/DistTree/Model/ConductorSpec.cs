using DistTree.Conductors;

namespace DistTree.Model;

/// <summary>Conductor choices that runs inherit unless they say otherwise.</summary>
/// <param name="Material">Copper or aluminium.</param>
/// <param name="InsulationC">Insulation temperature rating in °C: 60, 75 or 90.</param>
/// <param name="Raceway">The raceway kind.</param>
public sealed record ConductorDefaults(Material Material, int InsulationC, Raceway Raceway)
{
    /// <summary>Copper, 75 °C, PVC conduit.</summary>
    public static ConductorDefaults Standard { get; } = new(Material.Copper, 75, Raceway.Pvc);
}
