using DistTree.Codes.Nec;
using DistTree.Conductors;

namespace DistTree.Tests.Codes.Nec;

public sealed class NecGroundingTableTests
{
    // A transcription test: the table's rows reproduce the list they were taken from, NEC 2020 Table 250.122 as
    // recalled (issue 18, item 5; memory: verify against the edition in force). Device rating (A), copper, aluminium.
    [Theory]
    [InlineData(15, "14 AWG", "12 AWG")]
    [InlineData(20, "12 AWG", "10 AWG")]
    [InlineData(60, "10 AWG", "8 AWG")]
    [InlineData(100, "8 AWG", "6 AWG")]
    [InlineData(200, "6 AWG", "4 AWG")]
    [InlineData(300, "4 AWG", "2 AWG")]
    [InlineData(400, "3 AWG", "1 AWG")]
    [InlineData(500, "2 AWG", "1/0 AWG")]
    [InlineData(600, "1 AWG", "2/0 AWG")]
    [InlineData(800, "1/0 AWG", "3/0 AWG")]
    [InlineData(1000, "2/0 AWG", "4/0 AWG")]
    [InlineData(1200, "3/0 AWG", "250 kcmil")]
    [InlineData(1600, "4/0 AWG", "350 kcmil")]
    [InlineData(2000, "250 kcmil", "400 kcmil")]
    [InlineData(2500, "350 kcmil", "600 kcmil")]
    [InlineData(3000, "400 kcmil", "600 kcmil")]
    [InlineData(4000, "500 kcmil", "750 kcmil")]
    [InlineData(5000, "700 kcmil", "1200 kcmil")]
    [InlineData(6000, "800 kcmil", "1200 kcmil")]
    public void Rows_TranscribeNecTable250_122(double deviceA, string copper, string aluminum)
    {
        var row = NecGroundingTable.RowOf(deviceA);
        Assert.Equal(deviceA, NecGroundingTable.Rows[row].DeviceA);
        Assert.Equal(copper, NecGroundingTable.SizeText(row, Material.Copper));
        Assert.Equal(aluminum, NecGroundingTable.SizeText(row, Material.Aluminum));
    }

    [Fact]
    public void Rows_TranscribeNecTable250_122_NineteenRowsAscending()
    {
        var rows = NecGroundingTable.Rows;
        Assert.Equal(19, rows.Length);
        Assert.True(rows.Zip(rows.Skip(1)).All(p => p.First.DeviceA < p.Second.DeviceA));
    }

    // The table's rows are "not exceeding": a device between two rows takes the row above; below the first, the first.
    [Theory]
    [InlineData(10, 15)]
    [InlineData(15, 15)]
    [InlineData(25, 60)]
    [InlineData(70, 100)]
    [InlineData(100, 100)]
    [InlineData(225, 300)]
    [InlineData(5500, 6000)]
    public void RowOf_BetweenRows_TakesTheRowAbove(double deviceA, double rowA) =>
        Assert.Equal(rowA, NecGroundingTable.Rows[NecGroundingTable.RowOf(deviceA)].DeviceA);

    [Fact]
    public void RowOf_AboveTheTable_IsNone() => Assert.Equal(-1, NecGroundingTable.RowOf(6001));

    // The areas by ASTM B258 (the catalogue's own, ConductorSize), and 1200 kcmil, off DistTree's ladder, by definition.
    [Fact]
    public void AreaCmil_IsTheSizesArea()
    {
        Assert.Equal(ConductorSize.Parse("8 AWG").AreaCmil, NecGroundingTable.AreaCmil(NecGroundingTable.RowOf(100), Material.Copper));
        Assert.Equal(1_200_000, NecGroundingTable.AreaCmil(NecGroundingTable.RowOf(6000), Material.Aluminum));
    }
}
