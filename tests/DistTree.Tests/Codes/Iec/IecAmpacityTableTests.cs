using DistTree.Codes.Iec;
using DistTree.Conductors;
using DistTree.Model;

namespace DistTree.Tests.Codes.Iec;

/// <summary>
/// Transcription test of the rule set's data file (<c>Codes/Iec/Data/iec-ampacity.tsv</c>) against figures written here
/// from IEC 60364-5-52:2009 Annex B (memory, not read: verify against the edition in force), one table column at a time,
/// copper, 30 °C air.
/// </summary>
public sealed class IecAmpacityTableTests
{
    private static readonly string[] Sizes = ["1.5", "2.5", "4", "6", "10", "16", "25", "35", "50", "70", "95", "120", "150", "185", "240", "300"];

    // Table B.52.2 (PVC 70 °C, two loaded conductors), B.52.4 (PVC, three), B.52.3 (XLPE 90 °C, two), B.52.5 (XLPE,
    // three), B.52.10 (PVC, method E), B.52.12 (XLPE, method E); memory. Methods B1 and B2 are held to 120 mm² only.
    [Theory]
    [InlineData(75, 2, InstallationMethod.A1, "14.5 19.5 26 34 46 61 80 99 119 151 182 210 240 273 321 367")]
    [InlineData(75, 2, InstallationMethod.B1, "17.5 24 32 41 57 76 101 125 151 192 232 269")]
    [InlineData(75, 2, InstallationMethod.B2, "16.5 23 30 38 52 69 90 111 133 168 201 232")]
    [InlineData(75, 2, InstallationMethod.C, "19.5 27 36 46 63 85 112 138 168 213 258 299 344 392 461 530")]
    [InlineData(75, 2, InstallationMethod.E, "22 30 40 51 70 94 119 148 180 232 282 328 379 434 514 593")]
    [InlineData(75, 3, InstallationMethod.A1, "13.5 18 24 31 42 56 73 89 108 136 164 188 216 245 286 328")]
    [InlineData(75, 3, InstallationMethod.B1, "15.5 21 28 36 50 68 89 110 134 171 207 239")]
    [InlineData(75, 3, InstallationMethod.B2, "15 20 27 34 46 62 80 99 118 149 179 206")]
    [InlineData(75, 3, InstallationMethod.C, "17.5 24 32 41 57 76 96 119 144 184 223 259 299 341 403 464")]
    [InlineData(75, 3, InstallationMethod.E, "18.5 25 34 43 60 80 101 126 153 196 238 276 319 364 430 497")]
    [InlineData(90, 2, InstallationMethod.A1, "19 26 35 45 61 81 106 131 158 200 241 278 318 362 424 486")]
    [InlineData(90, 2, InstallationMethod.B1, "23 31 42 54 75 100 133 164 198 253 306 354")]
    [InlineData(90, 2, InstallationMethod.B2, "22 30 40 51 69 91 119 146 175 221 265 305")]
    [InlineData(90, 2, InstallationMethod.C, "24 33 45 58 80 107 138 171 209 269 328 382 441 506 599 693")]
    [InlineData(90, 2, InstallationMethod.E, "26 36 49 63 86 115 149 185 225 289 352 410 473 542 641 741")]
    [InlineData(90, 3, InstallationMethod.A1, "17 23 31 40 54 73 95 117 141 179 216 249 285 324 380 435")]
    [InlineData(90, 3, InstallationMethod.B1, "20 28 37 48 66 88 117 144 175 222 269 312")]
    [InlineData(90, 3, InstallationMethod.B2, "19.5 26 35 44 60 80 105 128 154 194 233 268")]
    [InlineData(90, 3, InstallationMethod.C, "22 30 40 52 71 96 119 147 179 229 278 322 371 424 500 576")]
    [InlineData(90, 3, InstallationMethod.E, "23 32 42 54 75 100 127 158 192 246 298 346 399 456 538 621")]
    public void AmpacityA_EachColumn_IsTheStandardsTranscribed(int insulationC, int loaded, InstallationMethod method, string figures)
    {
        var expected = figures.Split(' ').Select(f => (double?)double.Parse(f, System.Globalization.CultureInfo.InvariantCulture)).ToList();
        expected.AddRange(Enumerable.Repeat<double?>(null, Sizes.Length - expected.Count));
        var held = Sizes.Select(s => IecAmpacityTable.Standard.AmpacityA(ConductorSize.Parse(s + " mm2"), Material.Copper, insulationC, new Installation(method, loaded)));
        Assert.Equal(expected, held);
    }

    // The conductor catalogue's metric cu75 and cu90 columns hold method B1, three loaded conductors (their header):
    // the two agree where both hold a figure (1.5 to 120 mm²).
    [Fact]
    public void AmpacityA_B1ThreeLoaded_AgreesWithTheCatalogue()
    {
        foreach (var text in Sizes.Take(12))
        {
            var size = ConductorSize.Parse(text + " mm2");
            foreach (var insulation in (int[])[75, 90])
            {
                Assert.Equal(ConductorCatalog.Standard.TableAmpacityA(size, Material.Copper, insulation), IecAmpacityTable.Standard.AmpacityA(size, Material.Copper, insulation, Installation.Catalogue));
            }
        }
    }

    // Not held: AWG sizes (the tables are by mm²), aluminium, a 60 °C rating, 400 mm², B1 from 150 mm².
    [Fact]
    public void AmpacityA_NotHeld_IsNull()
    {
        var b1 = Installation.Catalogue;
        Assert.Null(IecAmpacityTable.Standard.AmpacityA(ConductorSize.Parse("12 AWG"), Material.Copper, 75, b1));
        Assert.Null(IecAmpacityTable.Standard.AmpacityA(ConductorSize.Parse("16 mm2"), Material.Aluminum, 75, b1));
        Assert.Null(IecAmpacityTable.Standard.AmpacityA(ConductorSize.Parse("16 mm2"), Material.Copper, 60, b1));
        Assert.Null(IecAmpacityTable.Standard.AmpacityA(ConductorSize.Parse("400 mm2"), Material.Copper, 75, new Installation(InstallationMethod.C, 3)));
        Assert.Null(IecAmpacityTable.Standard.AmpacityA(ConductorSize.Parse("150 mm2"), Material.Copper, 75, b1));
    }

    // The header says the figures are recalled, and names the tables.
    [Fact]
    public void Header_StatesMemoryAndTables()
    {
        var header = string.Join('\n', IecAmpacityTable.Standard.Header);
        Assert.Contains("MEMORY", header, StringComparison.Ordinal);
        Assert.All((string[])["B.52.2", "B.52.3", "B.52.4", "B.52.5", "B.52.10", "B.52.12"], t => Assert.Contains(t, header, StringComparison.Ordinal));
    }

    // A malformed file is refused with its line.
    [Fact]
    public void Load_UnknownMethod_NamesTheLine()
    {
        var text = "# h\nmaterial\tinsulation_c\tloaded\tmethod\t1.5 mm2\ncu\t75\t2\tz9\t14.5\n";
        var error = Assert.Throws<FormatException>(() => IecAmpacityTable.Load(new StringReader(text)));
        Assert.StartsWith("iec-ampacity.tsv:3:", error.Message, StringComparison.Ordinal);
    }
}
