using DistTree.Codes;
using DistTree.Codes.Nec;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;

namespace DistTree.Tests.Codes;

/// <summary>
/// A grounding-conductor table read from a file (<c>rules: grounding_table</c>) and put in place of the rule set's own.
/// The tables here are invented (test data, not a code's table); the figures the NEC steps give are worked by hand from
/// NEC 250.122(B) (2020, memory: verify) with ASTM B258's areas: 6 AWG 26,240 cmil, 3 AWG 52,620, 2/0 133,100,
/// 1/0 105,600, 1 AWG 83,690, 8 AWG 16,510.
/// </summary>
public sealed class GroundingTableTests
{
    private const string Good = "# Invented test table, not a code's.\n#\ndevice_a\tcu\tal\n15\t14 AWG\t12 AWG\n60\t10 AWG\t\n100\t6 AWG\t4 AWG\n";

    private static readonly GroundingTable Table = GroundingTable.Load(new StringReader(Good), "own.tsv");

    [Fact]
    public void Load_GoodTable_ReadsHeaderAndRows()
    {
        Assert.Equal(["Invented test table, not a code's.", ""], Table.Header);
        Assert.Equal("own.tsv", Table.SourceName);
        Assert.Equal([15.0, 60.0, 100.0], Table.Rows.Select(r => r.DeviceA));
        Assert.Null(Table.Rows[1].Aluminum);
        Assert.Equal(GroundingTableSize.Of(ConductorSize.Parse("6 AWG")), Table.Rows[2].Copper);
    }

    // Each row reads "not exceeding", as NEC Table 250.122 is read: a device between two rows takes the row above.
    [Theory]
    [InlineData(15, "14 AWG")]
    [InlineData(16, "10 AWG")]
    [InlineData(60, "10 AWG")]
    [InlineData(70, "6 AWG")]
    [InlineData(100, "6 AWG")]
    public void SizeFor_Device_TakesTheRowOfTheSmallestRatingAtOrAbove(double deviceA, string expected) =>
        Assert.Equal(expected, Table.SizeFor(deviceA, Material.Copper)!.Value.Text);

    [Fact]
    public void SizeFor_AboveTheLastRowOrABlankCell_IsNone()
    {
        Assert.Null(Table.SizeFor(101, Material.Copper));
        Assert.Null(Table.SizeFor(40, Material.Aluminum));
        Assert.Equal("4 AWG", Table.SizeFor(80, Material.Aluminum)!.Value.Text);
    }

    [Theory]
    [InlineData("device_a\tcu\tal\n15\t14 AWG\t12 AWG\n", 1, 1, "the table states no source")]
    [InlineData("# src\ndevice_a\tcu\n15\t14 AWG\n", 2, 1, "expected the column line")]
    [InlineData("# src\ndevice_a\tcu\tal\n", 2, 1, "the table has no rows")]
    [InlineData("# src\n", 1, 1, "the column line 'device_a', 'cu', 'al' (separated by tabs) is missing")]
    [InlineData("# src\ndevice_a\tcu\tal\n15\t14 AWG\t12 AWG\n15\t12 AWG\t10 AWG\n", 4, 1, "column device_a: 15 A is not above the row before it (15 A)")]
    [InlineData("# src\ndevice_a\tcu\tal\n-5\t14 AWG\t12 AWG\n", 3, 1, "column device_a: '-5' is not a positive number")]
    [InlineData("# src\ndevice_a\tcu\tal\n15\t14 AWG\t13 AWG\n", 3, 11, "column al: '13 AWG' is not a standard size")]
    [InlineData("# src\ndevice_a\tcu\tal\n15\t7 furlongs\t\n", 3, 4, "column cu: '7 furlongs' has an unknown size unit")]
    [InlineData("# src\ndevice_a\tcu\tal\n15\t14 AWG\t12 AWG\tx\n", 3, 1, "expected 3 cells separated by tabs")]
    public void Load_BadLine_LocatedAtItsLineAndColumn(string text, int line, int column, string reason)
    {
        var e = Assert.Throws<DataFileException>(() => GroundingTable.Load(new StringReader(text), "g.tsv"));
        Assert.Equal(("g.tsv", line, column), (e.SourceName, e.Line, e.Column));
        Assert.StartsWith(reason, e.Reason, StringComparison.Ordinal);
    }

    // The NEC's own table, as a GroundingTable, gives what NecGroundingTable's rows give at every rating (the restructure
    // changes no NEC figure; the rows themselves are checked against Table 250.122 in GroundingConductorTests).
    [Fact]
    public void NecOwnTable_EveryRating_SameAsTheRows()
    {
        var own = new NecRules(ConductorCatalog.Standard).OwnGroundingTable;
        for (var deviceA = 1; deviceA <= 6100; deviceA += 7)
        {
            foreach (var material in new[] { Material.Copper, Material.Aluminum })
            {
                var row = NecGroundingTable.RowOf(deviceA);
                var expected = row < 0 ? (GroundingTableSize?)null : new GroundingTableSize(NecGroundingTable.SizeText(row, material), NecGroundingTable.AreaCmil(row, material));
                Assert.Equal(expected, own.SizeFor(deviceA, material));
            }
        }
    }

    // In force: the project's table where the rules bring one, else the rule set's own.
    [Fact]
    public void For_RulesWithATable_PutsItInForce()
    {
        Assert.Same(Table, CodeRules.For(new Rules { GroundingTable = Table }, ConductorCatalog.Standard).GroundingTableInForce);
        Assert.Same(NecGroundingTable.Table, CodeRules.For(new Rules(), ConductorCatalog.Standard).GroundingTableInForce);
    }

    // 80 A under a 100 A device: 3 AWG is the smallest size that meets the rules (GroundingConductorTests). On 3 AWG lines
    // the project's 6 AWG stands (the NEC's own gives 8 AWG). On 250 kcmil lines, 250.122(B) still applies to the project's
    // size: 26,240 × 250,000 / 52,620 = 124,667 cmil, above 1/0 (105,600), so 2/0; the NEC's own table gives 16,510 ×
    // 250,000 / 52,620 = 78,440 cmil, so 1 AWG (83,690).
    [Theory]
    [InlineData("3 AWG", "6 AWG", "8 AWG")]
    [InlineData("250 kcmil", "2/0 AWG", "1 AWG")]
    public void MinimumGroundSize_ProjectTable_ReplacesTheTableAndKeepsTheNecSteps(string lines, string withTable, string withNec)
    {
        var run = new Run { LengthM = 10, Size = ConductorSize.Parse(lines), Material = Material.Copper, InsulationC = 75, Raceway = Raceway.Pvc, OcpdA = 100 };
        var rules = new Rules();
        var own = CodeRules.For(rules with { GroundingTable = Table }, ConductorCatalog.Standard);
        var nec = CodeRules.For(rules, ConductorCatalog.Standard);
        Assert.Equal(withTable, own.MinimumGroundSize(run, run.Size, 1, 80, rules)!.Value.Text);
        Assert.Equal(withNec, nec.MinimumGroundSize(run, run.Size, 1, 80, rules)!.Value.Text);
    }

    // Above the project's last row, its table gives no minimum, even where the NEC's own would.
    [Fact]
    public void MinimumGroundSize_DeviceAboveTheProjectsLastRow_IsNone()
    {
        var run = new Run { LengthM = 10, Size = ConductorSize.Parse("3/0 AWG"), Material = Material.Copper, InsulationC = 75, Raceway = Raceway.Pvc, OcpdA = 200 };
        var rules = new Rules();
        Assert.Null(CodeRules.For(rules with { GroundingTable = Table }, ConductorCatalog.Standard).MinimumGroundSize(run, run.Size, 1, 150, rules));
        Assert.NotNull(CodeRules.For(rules, ConductorCatalog.Standard).MinimumGroundSize(run, run.Size, 1, 150, rules));
    }
}
