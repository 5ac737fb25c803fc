namespace DistTree.Conductors;

/// <summary>
/// Operating temperature of a conductor from its loading: T = Ta + (Tr − Ta)·(I/Iz)², never below Ta.
/// Follows from the Neher–McGrath relation (NEC 310.14(B)) with the temperature rise proportional to
/// I² (resistance held fixed); derived, not quoted. Past the ampacity the square law goes on above Tr: an
/// overloaded conductor runs hotter than its rating, and its higher resistance belongs in its drop (the
/// ampacity check flags the overload itself). Holding it at Tr would make the drop too small.
/// </summary>
public static class ConductorTemperature
{
    /// <summary>The estimated temperature in °C.</summary>
    /// <param name="ambientC">Ambient Ta.</param>
    /// <param name="ratedC">Insulation rating Tr.</param>
    /// <param name="currentA">Load current I.</param>
    /// <param name="ampacityA">Ampacity Iz corrected to the ambient; null or zero gives Tr.</param>
    public static double Estimate(double ambientC, double ratedC, double currentA, double? ampacityA)
    {
        if (ampacityA is not > 0)
        {
            return ratedC;
        }

        var ratio = currentA / ampacityA.Value;
        var t = ambientC + ((ratedC - ambientC) * ratio * ratio);
        return Math.Max(t, Math.Min(ambientC, ratedC));
    }
}
