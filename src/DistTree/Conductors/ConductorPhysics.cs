namespace DistTree.Conductors;

/// <summary>
/// The physics of a conductor: DC resistance from area and resistivity, temperature correction,
/// and the skin and proximity effects of IEC 60287-1-1. Constants name their source.
/// </summary>
public static class ConductorPhysics
{
    /// <summary>Resistivity of annealed copper at 20 °C, ohm·mm²/m: 1/58 (IACS, NBS Handbook 100; read).</summary>
    public const double CopperResistivity20 = 1.0 / 58.0;

    /// <summary>Resistivity of aluminium building-wire alloy at 20 °C, ohm·mm²/m: 61 % IACS (quoted).</summary>
    public const double AluminumResistivity20 = CopperResistivity20 / 0.61;

    /// <summary>Temperature coefficient of copper at 20 °C, per °C (IEC 60287-1-1 Table 1; memory).</summary>
    public const double CopperAlpha20 = 0.00393;

    /// <summary>Temperature coefficient of aluminium at 20 °C, per °C (IEC 60287-1-1 Table 1; memory).</summary>
    public const double AluminumAlpha20 = 0.00403;

    /// <summary>
    /// Stranding factor: a concentric-lay stranded conductor is longer than its axis, so its resistance
    /// is about 2 % above a solid rod of the same area (ASTM B8 allowance; memory).
    /// </summary>
    public const double StrandingFactor = 1.02;

    /// <summary>
    /// Overall diameter of a concentric stranded conductor over that of a solid rod of equal area:
    /// 1/√0.75, a fill of 75 % (common practice; it gives Table 8's stranded diameters within 2 %).
    /// </summary>
    public const double StrandedDiameterFactor = 1.1547;

    /// <summary>Skin-effect factor ks for round stranded conductors (IEC 60287-1-1 Table 2; memory).</summary>
    public const double SkinKs = 1.0;

    /// <summary>Proximity-effect factor kp for round stranded conductors (IEC 60287-1-1 Table 2; memory).</summary>
    public const double ProximityKp = 0.8;

    /// <summary>Resistivity at 20 °C in ohm·mm²/m.</summary>
    public static double Resistivity20(Material material) =>
        material == Material.Copper ? CopperResistivity20 : AluminumResistivity20;

    /// <summary>Temperature coefficient at 20 °C, per °C.</summary>
    public static double Alpha20(Material material) =>
        material == Material.Copper ? CopperAlpha20 : AluminumAlpha20;

    /// <summary>DC resistance at 20 °C in ohm/km of a stranded conductor of <paramref name="areaMm2"/>.</summary>
    public static double DcResistance20OhmPerKm(double areaMm2, Material material) =>
        Resistivity20(material) / areaMm2 * StrandingFactor * 1000.0;

    /// <summary>Resistance at <paramref name="temperatureC"/> from the 20 °C value: R20·(1 + α20·(T − 20)).</summary>
    public static double AtTemperature(double r20, Material material, double temperatureC) =>
        r20 * (1.0 + (Alpha20(material) * (temperatureC - 20.0)));

    /// <summary>Diameter in mm of a stranded conductor of the given area.</summary>
    public static double StrandedDiameterMm(double areaMm2) =>
        Math.Sqrt(4.0 * areaMm2 / Math.PI) * StrandedDiameterFactor;

    /// <summary>
    /// AC resistance over DC resistance, 1 + ys + yp, for three single conductors touching in a triangle
    /// (IEC 60287-1-1, 2.1.2 and 2.1.4.1).
    /// </summary>
    /// <param name="rdcOhmPerKm">DC resistance at operating temperature, ohm/km.</param>
    /// <param name="frequencyHz">Supply frequency.</param>
    /// <param name="conductorDiameterMm">Conductor diameter dc.</param>
    /// <param name="axialSpacingMm">Distance s between conductor axes.</param>
    public static double AcOverDc(double rdcOhmPerKm, double frequencyHz, double conductorDiameterMm, double axialSpacingMm)
    {
        var rPerM = rdcOhmPerKm / 1000.0;
        var x2 = 8.0 * Math.PI * frequencyHz / rPerM * 1e-7;
        var ys = EffectFunction(Math.Sqrt(x2 * SkinKs));
        var fp = EffectFunction(Math.Sqrt(x2 * ProximityKp));
        var ratio = conductorDiameterMm / axialSpacingMm;
        var r2 = ratio * ratio;
        var yp = fp * r2 * ((0.312 * r2) + (1.18 / (fp + 0.27)));
        return 1.0 + ys + yp;
    }

    // IEC 60287-1-1's function of x for skin (ys) and proximity (the F(xp) factor): three ranges of x.
    private static double EffectFunction(double x)
    {
        if (x <= 2.8)
        {
            var x4 = x * x * x * x;
            return x4 / (192.0 + (0.8 * x4));
        }

        return x <= 3.8 ? -0.136 - (0.0177 * x) + (0.0563 * x * x) : (0.354 * x) - 0.733;
    }
}
