using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Generating;

/// <summary>
/// Chooses overcurrent devices and copper conductors for generated runs the way a designer would: the device
/// at the next standard rating above the design current, the smallest conductor whose ampacity the device may
/// protect, then larger sizes (or more parallel sets) until the estimated drop meets a target. The estimate
/// takes the conductor at its rated 75 °C, so the solver (which estimates a cooler conductor) finds no more.
/// </summary>
internal static class RunSizer
{
    /// <summary>The insulation rating of every generated conductor, °C (the project's default, written in its <c>defaults</c>).</summary>
    public const int InsulationC = 75;

    private const int MaxSets = ProjectFiles.ValueRanges.MaxSets;

    private static readonly ConductorCatalog Catalog = ConductorCatalog.Standard;
    private static readonly CodeRules Protection = CodeRules.For(ElectricalCode.Nec, Catalog);

    /// <summary>Copper sizes a designer reaches for, 14 AWG to 500 kcmil (500 kcmil is the usual paralleled size).</summary>
    private static readonly ConductorSize[] Sizes =
        new[]
        {
            "14 AWG", "12 AWG", "10 AWG", "8 AWG", "6 AWG", "4 AWG", "3 AWG", "2 AWG", "1 AWG", "1/0 AWG", "2/0 AWG", "3/0 AWG",
         "4/0 AWG", "250 kcmil", "300 kcmil", "350 kcmil", "400 kcmil", "500 kcmil",
        }.Select(ConductorSize.Parse).ToArray();

    /// <summary>The standard device rating at or above <paramref name="designA"/> and at least <paramref name="minimumA"/>; null above 6000 A.</summary>
    public static double? Ocpd(double designA, double minimumA)
    {
        foreach (var rating in Protection.StandardRatingsA)
        {
            if (rating >= minimumA && rating >= designA - 1e-9)
            {
                return rating;
            }
        }

        return null;
    }

    /// <summary>The smallest size and sets that carry <paramref name="designA"/> under the device <paramref name="ocpdA"/>.</summary>
    public static (ConductorSize Size, int Sets) ForAmpacity(double designA, double? ocpdA)
    {
        var needA = Math.Max(designA, ocpdA ?? 0);
        for (var sets = 1; sets <= MaxSets; sets++)
        {
            foreach (var size in Sizes)
            {
                if (sets > 1 && size != Sizes[^1])
                {
                    continue;
                }

                var ampacity = Ampacity(size) * sets;
                if (ampacity >= needA - 1e-9 && (ocpdA is null || Protection.SmallConductorPermits(ocpdA.Value, size, Material.Copper, sets)))
                {
                    return (size, sets);
                }
            }
        }

        return (Sizes[^1], MaxSets);
    }

    /// <summary>Makes the run larger (next size, then more sets of 500 kcmil) until its estimated drop is at most <paramref name="targetPercent"/>.</summary>
    public static (ConductorSize Size, int Sets) ForDrop(
        (ConductorSize Size, int Sets) start, double lengthFt, double currentA, ComplexPower power, CircuitSupply supply, Raceway raceway, double targetPercent)
    {
        var (size, sets) = start;
        while (DropPercent(size, sets, lengthFt, currentA, power, supply, raceway) > targetPercent && sets < MaxSets)
        {
            var index = Array.IndexOf(Sizes, size);
            if (sets == 1 && index < Sizes.Length - 1)
            {
                size = Sizes[index + 1];
            }
            else
            {
                sets++;
            }
        }

        return (size, sets);
    }

    /// <summary>The estimated drop in percent: k·I·L·(R·cos θ + X·sin θ)/sets at 75 °C, as the solver computes it.</summary>
    public static double DropPercent(ConductorSize size, int sets, double lengthFt, double currentA, ComplexPower power, CircuitSupply supply, Raceway raceway)
    {
        var r = Catalog.AcResistanceOhmPerKm(size, Material.Copper, raceway, InsulationC, 60);
        var x = Catalog.ReactanceOhmPerKm(size, raceway, 60);
        var k = supply.Phases == 3 ? Math.Sqrt(3) : 2.0;
        var dropV = k * currentA * lengthFt * UnitFactors.MetresPerFoot / 1000.0 * ((r * power.PowerFactor) + (x * power.SinTheta)) / sets;
        return dropV / supply.VoltageV * 100.0;
    }

    /// <summary>The length in feet at which the run's estimated drop reaches <paramref name="dropPercent"/>.</summary>
    public static double LengthForDrop(ConductorSize size, int sets, double currentA, ComplexPower power, CircuitSupply supply, Raceway raceway, double dropPercent) =>
        dropPercent / DropPercent(size, sets, 1.0, currentA, power, supply, raceway);

    private static double Ampacity(ConductorSize size) =>
        Protection.AllowableAmpacityA(size, Material.Copper, InsulationC, 75, 30) ?? 0;
}
