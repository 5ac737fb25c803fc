namespace DistTree.Conductors;

/// <summary>
/// Operating temperature of a conductor from its loading: T = Ta + (Tr − Ta)·(I/Iz)², clamped to [Ta, Tr].
/// Follows from the Neher–McGrath relation (NEC 310.14(B)) with the temperature rise proportional to
/// I² (resistance held fixed); derived, not quoted.
/// </summary>
public static class ConductorTemperature
{
    /// <summary>The estimated temperature in °C.</summary>
    /// <param name="ambientC">Ambient Ta.</param>
    /// <param name="ratedC">Insulation rating Tr.</param>
    /// <param name="currentA">Load current I.</param>
    /// <param name="ampacityA">Ampacity Iz corrected to the ambient; null or zero gives Tr (conservative).</param>
    public static double Estimate(double ambientC, double ratedC, double currentA, double? ampacityA)
    {
        if (ampacityA is not > 0)
        {
            return ratedC;
        }

        var ratio = currentA / ampacityA.Value;
        var t = ambientC + ((ratedC - ambientC) * ratio * ratio);
        return Math.Clamp(t, Math.Min(ambientC, ratedC), ratedC);
    }
}
