using DistTree.Conductors;
using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

public sealed class RunElectricsTests
{
    private static readonly ConductorCatalog Catalog = ConductorCatalog.Standard;

    private static Run TwelveAwgCopper(int insulationC) => new()
    {
        LengthM = 30,
        Size = ConductorSize.Parse("12 AWG"),
        Material = Material.Copper,
        InsulationC = insulationC,
        Raceway = Raceway.Pvc,
    };

    // NEC Table 310.16 (REFERENCES.md, read): 12 AWG copper is 25 A in the 75 °C column and 30 A in the 90 °C
    // column at 30 °C; with 75 °C terminals a 90 °C conductor is allowed the 75 °C figure (NEC 110.14(C), read).
    [Fact]
    public void Compute_NinetyDegreeConductor_IsAllowedTheTerminalColumn()
    {
        var figures = RunElectrics.Compute(Catalog, new Rules { AmbientC = 30, TerminalC = 75 }, TwelveAwgCopper(90), ConductorSize.Parse("12 AWG"), 1, 60, 10);

        Assert.Equal(25, figures.AmpacityA);
    }

    // Parallel sets carry the current together: the run's ampacity is one set's times the sets (common practice),
    // and each set's conductor runs at the temperature of its own share of the current.
    [Fact]
    public void Compute_TwoSets_DoubleTheAmpacityAtTheTemperatureOfHalfTheCurrent()
    {
        var rules = new Rules();
        var run = TwelveAwgCopper(75);
        var size = ConductorSize.Parse("12 AWG");

        var one = RunElectrics.Compute(Catalog, rules, run, size, 1, 60, 10);
        var two = RunElectrics.Compute(Catalog, rules, run, size, 2, 60, 20);

        Assert.Equal(2 * one.AmpacityA!.Value, two.AmpacityA!.Value, 9);
        Assert.Equal(one.TemperatureC, two.TemperatureC, 9);
        Assert.Equal(one.ResistanceOhmPerKm, two.ResistanceOhmPerKm, 9);
    }

    // T = Ta + (Tr − Ta)·(I/Iz)² (REFERENCES.md, derived from the Neher–McGrath relation): no current leaves the
    // conductor at the ambient; the rules may instead fix it at the insulation's rating.
    [Fact]
    public void Compute_Temperature_FollowsTheRules()
    {
        var run = TwelveAwgCopper(75);
        var size = ConductorSize.Parse("12 AWG");

        var idle = RunElectrics.Compute(Catalog, new Rules { AmbientC = 30 }, run, size, 1, 60, 0);
        var rated = RunElectrics.Compute(Catalog, new Rules { Temperature = TemperatureMode.Rated }, run, size, 1, 60, 0);

        Assert.Equal(30, idle.TemperatureC, 9);
        Assert.Equal(75, rated.TemperatureC, 9);
        Assert.True(rated.ResistanceOhmPerKm > idle.ResistanceOhmPerKm);
        Assert.Equal(Catalog.AcResistanceOhmPerKm(size, Material.Copper, Raceway.Pvc, 75, 60), rated.ResistanceOhmPerKm);
    }

    // Past its ampacity the conductor runs hotter than its rating (issue 17): 30 A on 12 AWG copper, 75 °C, 25 A
    // (NEC Table 310.16, REFERENCES.md, read) is 120 % of the ampacity, so T = 30 + 45 · 1.2² = 94.8 °C, and its
    // resistance is the catalogue's at 94.8 °C, about 6 % above the rated figure (copper, α20 = 0.00393 /°C).
    [Fact]
    public void Compute_PastTheAmpacity_TemperatureAndResistanceAboveTheRating()
    {
        var run = TwelveAwgCopper(75);
        var size = ConductorSize.Parse("12 AWG");

        var overloaded = RunElectrics.Compute(Catalog, new Rules { AmbientC = 30 }, run, size, 1, 60, 30);

        Assert.Equal(94.8, overloaded.TemperatureC, 9);
        Assert.Equal(Catalog.AcResistanceOhmPerKm(size, Material.Copper, Raceway.Pvc, 94.8, 60), overloaded.ResistanceOhmPerKm, 12);
        Assert.InRange(overloaded.ResistanceOhmPerKm / Catalog.AcResistanceOhmPerKm(size, Material.Copper, Raceway.Pvc, 75, 60), 1.06, 1.07);
    }
}
