using DistTree.Conductors;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Conductors;

public sealed class ConductorPropertyTests
{
    private static readonly ConductorCatalog Catalog = ConductorCatalog.Standard;

    private static Arbitrary<ConductorSize> Sizes => Arb.From(Gen.Elements(ConductorSize.All.ToArray()));

    private static Arbitrary<Material> Materials => Arb.From(Gen.Elements(Material.Copper, Material.Aluminum));

    private static Arbitrary<Raceway> Raceways => Arb.From(Gen.Elements(Raceway.Pvc, Raceway.Aluminum, Raceway.Steel));

    [Property]
    public Property AcResistance_FallsStrictlyAsSizeRises() =>
        Prop.ForAll(Sizes, Materials, Raceways, (size, material, raceway) =>
            size.NextLarger is not { } next
            || Catalog.AcResistanceOhmPerKm(next, material, raceway, 75, 60) < Catalog.AcResistanceOhmPerKm(size, material, raceway, 75, 60));

    [Property]
    public Property DcResistance_AluminumAboveCopper() =>
        Prop.ForAll(Sizes, size =>
            Catalog.DcResistanceOhmPerKm(size, Material.Aluminum, 75) > Catalog.DcResistanceOhmPerKm(size, Material.Copper, 75));

    [Property]
    public Property AcResistance_RisesWithTemperature() =>
        Prop.ForAll(Sizes, Materials, Arb.From(Gen.Choose(-20, 150)), (size, material, t) =>
            Catalog.AcResistanceOhmPerKm(size, material, Raceway.Pvc, t + 1, 60) > Catalog.AcResistanceOhmPerKm(size, material, Raceway.Pvc, t, 60));

    // Common practice (rule of thumb): an aluminium conductor two AWG sizes larger than a copper one has
    // about the same resistance; within 10 %.
    [Fact]
    public void Aluminum_TwoAwgSizesLarger_Within10PercentOfCopper()
    {
        var gauges = new[] { 14, 12, 10, 8, 6, 4, 3, 2, 1, 0, -1, -2, -3 };
        string Text(int g) => g > 0 ? $"{g} AWG" : $"{1 - g}/0 AWG";
        var pairs = gauges.Where(g => gauges.Contains(g - 2)).ToArray();
        Assert.NotEmpty(pairs);
        foreach (var g in pairs)
        {
            var cu = Catalog.AcResistanceOhmPerKm(ConductorSize.Parse(Text(g)), Material.Copper, Raceway.Pvc, 75, 60);
            var al = Catalog.AcResistanceOhmPerKm(ConductorSize.Parse(Text(g - 2)), Material.Aluminum, Raceway.Pvc, 75, 60);
            Assert.InRange(al / cu, 0.90, 1.10);
        }
    }
}
