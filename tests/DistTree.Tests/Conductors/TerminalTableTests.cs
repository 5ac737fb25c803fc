using DistTree.Conductors;
using DistTree.Diagnostics;

namespace DistTree.Tests.Conductors;

public sealed class TerminalTableTests
{
    private static ConductorSize Size(string text) => ConductorSize.Parse(text);

    // Transcription test: the embedded table reproduces its own rows (terminal-limits.tsv, recalled common practice for
    // moulded-case breakers' standard lugs, marked there to be verified against the maker's data).
    [Theory]
    [InlineData(20, 1, "8 AWG", "10 mm2")]
    [InlineData(50, 1, "4 AWG", "25 mm2")]
    [InlineData(100, 1, "1/0 AWG", "50 mm2")]
    [InlineData(225, 1, "300 kcmil", "150 mm2")]
    [InlineData(400, 1, "600 kcmil", "300 mm2")]
    [InlineData(400, 2, "250 kcmil", "120 mm2")]
    [InlineData(600, 3, "400 kcmil", "185 mm2")]
    public void Standard_Band_GivesItsRowsLargestSizes(double deviceA, int sets, string awg, string mm2)
    {
        Assert.Equal((true, Size(awg)), TerminalTable.Standard.LargestFor(deviceA, sets, SizeSeries.NorthAmerican));
        Assert.Equal((true, Size(mm2)), TerminalTable.Standard.LargestFor(deviceA, sets, SizeSeries.Metric));
    }

    // The reading rules the file's header states: a band is "not exceeding"; a terminal for more conductors takes fewer;
    // more conductors than any row of the band is not accepted; above the last band there is no limit.
    [Fact]
    public void LargestFor_ReadsBandsAndSetsAsTheHeaderSays()
    {
        var t = TerminalTable.Standard;
        Assert.Equal((true, Size("1/0 AWG")), t.LargestFor(70, 1, SizeSeries.NorthAmerican));
        Assert.Equal((true, Size("500 kcmil")), t.LargestFor(600, 1, SizeSeries.NorthAmerican));
        Assert.Equal((false, (ConductorSize?)null), t.LargestFor(100, 2, SizeSeries.NorthAmerican));
        Assert.Equal((true, (ConductorSize?)null), t.LargestFor(3000, 8, SizeSeries.NorthAmerican));
        Assert.True(t.Accepts(20, Size("8 AWG"), 1));
        Assert.False(t.Accepts(20, Size("6 AWG"), 1));
        Assert.False(t.Accepts(225, Size("800 kcmil"), 2));
        Assert.Equal(60, t.SmallestBandAccepting(Size("6 AWG"), 1));
    }

    [Fact]
    public void Load_OwnTable_IsRead()
    {
        var t = TerminalTable.Load(new StringReader("# from a maker's catalogue (invented for this test)\ndevice_a\tsets\tawg\tmm2\n20\t1\t6 AWG\t16 mm2\n"), "own.tsv");
        Assert.Equal("own.tsv", t.SourceName);
        Assert.True(t.Accepts(20, Size("6 AWG"), 1));
        Assert.False(t.Accepts(20, Size("4 AWG"), 1));
    }

    [Theory]
    [InlineData("device_a\tsets\tawg\tmm2\n20\t1\t8 AWG\t10 mm2\n", 1, 1, "states no source")]
    [InlineData("# s\ndevice_a\tcu\tal\n", 2, 1, "expected the column line")]
    [InlineData("# s\ndevice_a\tsets\tawg\tmm2\n", 2, 1, "no rows")]
    [InlineData("# s\ndevice_a\tsets\tawg\tmm2\n20\t1\t8 AWG\n", 3, 1, "expected 4 cells")]
    [InlineData("# s\ndevice_a\tsets\tawg\tmm2\n0\t1\t8 AWG\t10 mm2\n", 3, 1, "not a positive number")]
    [InlineData("# s\ndevice_a\tsets\tawg\tmm2\n20\tone\t8 AWG\t10 mm2\n", 3, 4, "column sets")]
    [InlineData("# s\ndevice_a\tsets\tawg\tmm2\n30\t1\t8 AWG\t10 mm2\n20\t1\t8 AWG\t10 mm2\n", 4, 1, "ascend")]
    [InlineData("# s\ndevice_a\tsets\tawg\tmm2\n20\t1\t10 mm2\t10 mm2\n", 3, 6, "not a size of this column's series")]
    [InlineData("# s\ndevice_a\tsets\tawg\tmm2\n20\t1\t8 AWG\tten\n", 3, 12, "column mm2")]
    public void Load_BadFile_ErrorAtItsLineAndColumn(string text, int line, int column, string why)
    {
        var e = Assert.Throws<DataFileException>(() => TerminalTable.Load(new StringReader(text), "t.tsv"));
        Assert.Equal((line, column), (e.Line, e.Column));
        Assert.Contains(why, e.Reason, StringComparison.Ordinal);
    }
}
