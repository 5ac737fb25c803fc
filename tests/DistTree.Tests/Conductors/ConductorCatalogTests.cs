using DistTree.Conductors;
using DistTree.Diagnostics;

namespace DistTree.Tests.Conductors;

public sealed class ConductorCatalogTests
{
    private const double OhmPerKmToOhmPerKft = 0.3048;
    private static readonly ConductorCatalog Catalog = ConductorCatalog.Standard;

    // NEC Chapter 9 Table 8, DC resistance at 75 °C, stranded, ohm/kft (REFERENCES.md, read).
    // Ours: physics from the area (ASTM B258), resistivity (IACS / 61 % IACS) and the stranding factor;
    // no Table 8 figure is in the data file, so this checks the method.
    [Theory]
    [InlineData("14 AWG", 3.14, null)]
    [InlineData("12 AWG", 1.98, 3.25)]
    [InlineData("10 AWG", 1.24, 2.04)]
    [InlineData("8 AWG", 0.778, 1.28)]
    [InlineData("6 AWG", 0.491, 0.808)]
    [InlineData("4 AWG", 0.308, 0.508)]
    [InlineData("3 AWG", 0.245, 0.403)]
    [InlineData("2 AWG", 0.194, 0.319)]
    [InlineData("1 AWG", 0.154, 0.253)]
    [InlineData("1/0", 0.122, 0.201)]
    [InlineData("2/0", 0.0967, 0.159)]
    [InlineData("3/0", 0.0766, 0.126)]
    [InlineData("4/0", 0.0608, 0.100)]
    [InlineData("250 kcmil", 0.0515, 0.0847)]
    [InlineData("300 kcmil", 0.0429, 0.0707)]
    [InlineData("350 kcmil", 0.0367, 0.0605)]
    [InlineData("500 kcmil", 0.0258, 0.0424)]
    [InlineData("750 kcmil", 0.0171, 0.0282)]
    [InlineData("1000 kcmil", 0.0129, 0.0212)]
    public void DcResistance_At75C_Within2PercentOfTable8(string size, double copper, double? aluminum)
    {
        var s = ConductorSize.Parse(size);
        Assert.InRange(Catalog.DcResistanceOhmPerKm(s, Material.Copper, 75) * OhmPerKmToOhmPerKft / copper, 0.98, 1.02);
        if (aluminum is { } al)
        {
            Assert.InRange(Catalog.DcResistanceOhmPerKm(s, Material.Aluminum, 75) * OhmPerKmToOhmPerKft / al, 0.98, 1.02);
        }
    }

    // NEC Chapter 9 Table 9, AC resistance at 75 °C, 60 Hz, three single conductors in conduit, ohm/kft
    // (REFERENCES.md, read). PVC: a check of the physics (IEC 60287-1-1 skin and proximity effect on the
    // computed DC resistance). Steel: the steel-to-PVC ratio is data taken from Table 9 itself, so the steel
    // rows are a transcription test of that ratio on top of the PVC physics.
    [Theory]
    [InlineData("12 AWG", 2.0, 2.0, 3.2, 3.2)]
    [InlineData("10 AWG", 1.2, 1.2, 2.0, 2.0)]
    [InlineData("8 AWG", 0.78, 0.78, 1.3, 1.3)]
    [InlineData("6 AWG", 0.49, 0.49, 0.81, 0.81)]
    [InlineData("4 AWG", 0.31, 0.31, 0.51, 0.51)]
    [InlineData("2 AWG", 0.19, 0.20, 0.32, 0.32)]
    [InlineData("1/0", 0.12, 0.12, 0.20, 0.20)]
    [InlineData("2/0", 0.10, 0.10, 0.16, 0.16)]
    [InlineData("4/0", 0.062, 0.063, 0.10, 0.10)]
    [InlineData("250 kcmil", 0.052, 0.054, 0.085, 0.086)]
    [InlineData("350 kcmil", 0.038, 0.039, 0.061, 0.063)]
    [InlineData("500 kcmil", 0.027, 0.029, 0.043, 0.045)]
    [InlineData("750 kcmil", 0.019, 0.021, 0.029, 0.031)]
    [InlineData("1000 kcmil", 0.015, 0.018, 0.023, 0.025)]
    public void AcResistance_At75C60Hz_Within5PercentOfTable9(string size, double cuPvc, double cuSteel, double alPvc, double alSteel)
    {
        var s = ConductorSize.Parse(size);
        double Rac(Material m, Raceway r) => Catalog.AcResistanceOhmPerKm(s, m, r, 75, 60) * OhmPerKmToOhmPerKft;
        Assert.InRange(Rac(Material.Copper, Raceway.Pvc) / cuPvc, 0.95, 1.05);
        Assert.InRange(Rac(Material.Copper, Raceway.Steel) / cuSteel, 0.95, 1.05);
        Assert.InRange(Rac(Material.Aluminum, Raceway.Pvc) / alPvc, 0.95, 1.05);
        Assert.InRange(Rac(Material.Aluminum, Raceway.Steel) / alSteel, 0.95, 1.05);
    }

    // NEC Chapter 9 Table 9's aluminium-conduit column, AC resistance at 75 °C, 60 Hz, ohm/kft (REFERENCES.md: memory,
    // verify before relying). The aluminium-conduit-to-PVC ratio is data taken from that column, so these rows are a
    // transcription test of the ratio on top of the PVC physics, as the steel rows above are.
    [Theory]
    [InlineData("4/0", 0.067, 0.11)]
    [InlineData("250 kcmil", 0.057, 0.090)]
    [InlineData("350 kcmil", 0.043, 0.066)]
    [InlineData("500 kcmil", 0.032, 0.048)]
    [InlineData("750 kcmil", 0.024, 0.033)]
    [InlineData("1000 kcmil", 0.019, 0.027)]
    public void AcResistance_AluminumConduit_Within5PercentOfTable9(string size, double cu, double al)
    {
        var s = ConductorSize.Parse(size);
        double Rac(Material m) => Catalog.AcResistanceOhmPerKm(s, m, Raceway.Aluminum, 75, 60) * OhmPerKmToOhmPerKft;
        Assert.InRange(Rac(Material.Copper) / cu, 0.95, 1.05);
        Assert.InRange(Rac(Material.Aluminum) / al, 0.95, 1.05);
    }

    // Table 9's order for large sizes (REFERENCES.md: aluminium conduit the highest of the three, eddy currents in the
    // conduit; steel above PVC): an aluminium raceway never takes less resistance than a steel one, nor steel than PVC.
    [Theory]
    [InlineData("4/0")]
    [InlineData("300 kcmil")]
    [InlineData("600 kcmil")]
    [InlineData("1000 kcmil")]
    [InlineData("1500 kcmil")]
    public void AcResistance_LargeSizes_AluminumConduitAtLeastSteelAtLeastPvc(string size)
    {
        var s = ConductorSize.Parse(size);
        foreach (var m in new[] { Material.Copper, Material.Aluminum })
        {
            double Rac(Raceway r) => Catalog.AcResistanceOhmPerKm(s, m, r, 75, 60);
            Assert.True(Rac(Raceway.Aluminum) >= Rac(Raceway.Steel), $"{size} {m}: aluminium conduit below steel");
            Assert.True(Rac(Raceway.Steel) >= Rac(Raceway.Pvc), $"{size} {m}: steel below PVC");
        }
    }

    [Fact]
    public void Load_EarlierLayoutWithoutAluminumConduit_IsRefusedWithAHint()
    {
        var text = "size\tper\tx_pvc\tx_steel\trpvc_cu\trsteel_cu\trpvc_al\trsteel_al\tr20_cu\tr20_al\tcu60\tcu75\tcu90\tal60\tal75\tal90\tins_mm\tocpd_cu\tocpd_al\n";

        var e = Assert.Throws<DataFileException>(() => ConductorCatalog.Load(new StringReader(text), "mine.tsv"));

        Assert.StartsWith("mine.tsv:1: expected the columns", e.Message, StringComparison.Ordinal);
        Assert.Equal((1, 1), (e.Line, e.Column));
        Assert.Contains("add the aluminium-conduit columns ral_cu and ral_al", e.Message, StringComparison.Ordinal);
    }

    // The ratio the physics reaches at 1000 kcmil copper: REFERENCES.md notes IEC 60287-1-1 gives about
    // 1.16 against Table 9's 1.16 (0.015 / 0.0129).
    [Fact]
    public void AcResistance_1000KcmilCopperPvc_SkinAndProximityNear116()
    {
        var s = ConductorSize.Parse("1000 kcmil");
        var ratio = Catalog.AcResistanceOhmPerKm(s, Material.Copper, Raceway.Pvc, 75, 60) / Catalog.DcResistanceOhmPerKm(s, Material.Copper, 75);
        Assert.InRange(ratio, 1.12, 1.22);
    }

    // Transcription test: the reactance column reproduces NEC Chapter 9 Table 9's XL (REFERENCES.md, read).
    [Theory]
    [InlineData("12 AWG", 0.054, 0.068)]
    [InlineData("10 AWG", 0.050, 0.063)]
    [InlineData("8 AWG", 0.052, 0.065)]
    [InlineData("6 AWG", 0.051, 0.064)]
    [InlineData("4 AWG", 0.048, 0.060)]
    [InlineData("2 AWG", 0.045, 0.057)]
    [InlineData("1/0", 0.044, 0.055)]
    [InlineData("2/0", 0.043, 0.054)]
    [InlineData("4/0", 0.041, 0.051)]
    [InlineData("250 kcmil", 0.041, 0.052)]
    [InlineData("350 kcmil", 0.040, 0.050)]
    [InlineData("500 kcmil", 0.039, 0.048)]
    [InlineData("750 kcmil", 0.038, 0.048)]
    [InlineData("1000 kcmil", 0.037, 0.046)]
    public void Reactance_At60Hz_TranscribesTable9(string size, double pvc, double steel)
    {
        var s = ConductorSize.Parse(size);
        Assert.InRange(Catalog.ReactanceOhmPerKm(s, Raceway.Pvc, 60) * OhmPerKmToOhmPerKft / pvc, 0.95, 1.05);
        Assert.InRange(Catalog.ReactanceOhmPerKm(s, Raceway.Aluminum, 60) * OhmPerKmToOhmPerKft / pvc, 0.95, 1.05);
        Assert.InRange(Catalog.ReactanceOhmPerKm(s, Raceway.Steel, 60) * OhmPerKmToOhmPerKft / steel, 0.95, 1.05);
    }

    // A check of the reactance data against physics: three conductors in a raceway are never closer than
    // touching, so their reactance is at least that of a touching triangle, X = ω·2e-7·ln(s/GMR) ohm/m,
    // with GMR ≈ 0.768 r for 37-strand conductors (common practice geometry; the GMR ratio recalled from memory).
    [Theory]
    [InlineData("12 AWG")]
    [InlineData("2 AWG")]
    [InlineData("4/0")]
    [InlineData("500 kcmil")]
    [InlineData("1000 kcmil")]
    [InlineData("2000 kcmil")]
    public void Reactance_Pvc_NotBelowTouchingTriangle(string size)
    {
        var s = ConductorSize.Parse(size);
        var dc = ConductorPhysics.StrandedDiameterMm(s.AreaMm2);
        var spacing = dc + (2 * 2.0);
        var touching = 2 * Math.PI * 60 * 2e-7 * Math.Log(spacing / (0.768 * dc / 2)) * 1000;
        Assert.True(Catalog.ReactanceOhmPerKm(s, Raceway.Pvc, 60) >= touching);
    }

    [Fact]
    public void Reactance_ScalesWithFrequency()
    {
        var s = ConductorSize.Parse("4/0");
        Assert.Equal(Catalog.ReactanceOhmPerKm(s, Raceway.Pvc, 60) * 50 / 60, Catalog.ReactanceOhmPerKm(s, Raceway.Pvc, 50), 12);
    }

    [Fact]
    public void Reactance_Metric_IsAnnexGLambda() =>
        Assert.Equal(0.08, Catalog.ReactanceOhmPerKm(ConductorSize.Parse("95 mm2"), Raceway.Pvc, 50), 12);

    // Metric resistance comes from IEC 60228's maxima (the choice designers working in mm² expect).
    // Transcription test against IEC 60228 Table A.2 via vendor reprints (REFERENCES.md, read).
    [Theory]
    [InlineData("1.5 mm2", 12.1)]
    [InlineData("2.5 mm2", 7.41)]
    [InlineData("4 mm2", 4.61)]
    [InlineData("6 mm2", 3.08)]
    [InlineData("10 mm2", 1.83)]
    [InlineData("16 mm2", 1.15)]
    [InlineData("25 mm2", 0.727)]
    [InlineData("35 mm2", 0.524)]
    [InlineData("50 mm2", 0.387)]
    [InlineData("70 mm2", 0.268)]
    [InlineData("95 mm2", 0.193)]
    [InlineData("120 mm2", 0.153)]
    [InlineData("150 mm2", 0.124)]
    [InlineData("185 mm2", 0.0991)]
    [InlineData("240 mm2", 0.0754)]
    [InlineData("300 mm2", 0.0601)]
    public void DcResistance20_Metric_IsIec60228Maximum(string size, double maximum)
    {
        var s = ConductorSize.Parse(size);
        Assert.Equal(maximum, Catalog.DcResistance20OhmPerKm(s, Material.Copper), 6);
        Assert.Equal("IEC 60228 maximum", Catalog.DcResistanceBasis(s, Material.Copper));
        // Against the physics: the maximum lies above the nominal-area resistance of annealed copper (its
        // effective area is a little under nominal), by less than 15 % (IACS resistivity; common practice).
        var nominal = ConductorPhysics.CopperResistivity20 / s.AreaMm2 * 1000;
        Assert.InRange(maximum / nominal, 1.0, 1.15);
    }

    // Transcription test: NEC Table 310.16 at 30 °C (REFERENCES.md, read).
    [Theory]
    [InlineData("14 AWG", 15, 20, 25, null, null, null)]
    [InlineData("12 AWG", 20, 25, 30, 15, 20, 25)]
    [InlineData("8 AWG", 40, 50, 55, 35, 40, 45)]
    [InlineData("1/0", 125, 150, 170, 100, 120, 135)]
    [InlineData("4/0", 195, 230, 260, 150, 180, 205)]
    [InlineData("500 kcmil", 320, 380, 430, 260, 310, 350)]
    [InlineData("1000 kcmil", 455, 545, 615, 375, 445, 500)]
    public void TableAmpacity_TranscribesTable310_16(string size, int? cu60, int? cu75, int? cu90, int? al60, int? al75, int? al90)
    {
        var s = ConductorSize.Parse(size);
        Assert.Equal((double?)cu60, Catalog.TableAmpacityA(s, Material.Copper, 60));
        Assert.Equal((double?)cu75, Catalog.TableAmpacityA(s, Material.Copper, 75));
        Assert.Equal((double?)cu90, Catalog.TableAmpacityA(s, Material.Copper, 90));
        Assert.Equal((double?)al60, Catalog.TableAmpacityA(s, Material.Aluminum, 60));
        Assert.Equal((double?)al75, Catalog.TableAmpacityA(s, Material.Aluminum, 75));
        Assert.Equal((double?)al90, Catalog.TableAmpacityA(s, Material.Aluminum, 90));
    }

    [Fact]
    public void SmallConductorMaxOcpd_Is240_4D()
    {
        Assert.Equal(15, Catalog.SmallConductorMaxOcpdA(ConductorSize.Parse("14 AWG"), Material.Copper));
        Assert.Equal(20, Catalog.SmallConductorMaxOcpdA(ConductorSize.Parse("12 AWG"), Material.Copper));
        Assert.Equal(30, Catalog.SmallConductorMaxOcpdA(ConductorSize.Parse("10 AWG"), Material.Copper));
        Assert.Equal(25, Catalog.SmallConductorMaxOcpdA(ConductorSize.Parse("10 AWG"), Material.Aluminum));
        Assert.Null(Catalog.SmallConductorMaxOcpdA(ConductorSize.Parse("8 AWG"), Material.Copper));
    }

    [Fact]
    public void Standard_HasEverySize() =>
        Assert.Equal(ConductorSize.All.Count, Catalog.Sizes.Count());

    [Fact]
    public void Load_BadHeader_NamesTheLine()
    {
        var e = Assert.Throws<DataFileException>(() => ConductorCatalog.Load(new StringReader("# x\nsize\tper\n"), "mine.tsv"));
        Assert.StartsWith("mine.tsv:2:", e.Message, StringComparison.Ordinal);
        Assert.Equal(("mine.tsv", 2, 1), (e.SourceName, e.Line, e.Column));
    }
}
