using System.Globalization;
using System.Text;
using DistTree.Reports.Schedules;
using Microsoft.VisualBasic.FileIO;

namespace DistTree.Tests.Reports.Schedules;

/// <summary>
/// The schedules' CSV, read back with .NET's own CSV reader (Microsoft.VisualBasic.FileIO.TextFieldParser, quoted
/// fields per RFC 4180), against the solution's figures.
/// </summary>
public sealed class ScheduleCsvTests
{
    private static string[][] Parse(string csv)
    {
        using var parser = new TextFieldParser(new StringReader(csv)) { HasFieldsEnclosedInQuotes = true, TrimWhiteSpace = false };
        parser.SetDelimiters(",");
        var rows = new List<string[]>();
        while (!parser.EndOfData)
        {
            rows.Add(parser.ReadFields()!);
        }

        return rows.ToArray();
    }

    private static (DistTree.Solving.Solution Solution, ScheduleFile File) Small()
    {
        var s = ReportFixtures.SolveText(ReportFixtures.OnePanel("Csv", PanelSchedulesTests.Circuits, panel: "LP 1:a"));
        return (s, Assert.Single(ScheduleCsv.Write(s)));
    }

    [Fact]
    public void Write_Header_IsTheDocumentedColumns()
    {
        var rows = Parse(Small().File.Content);
        Assert.Equal(ScheduleCsv.Columns, rows[0]);
        Assert.All(rows, r => Assert.Equal(ScheduleCsv.Columns.Count, r.Length));
        var documented = File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "docs", "schedules.md"));
        Assert.All(ScheduleCsv.Columns, c => Assert.Contains($"| `{c}` |", documented, StringComparison.Ordinal));
    }

    [Fact]
    public void Write_NameWithCommaAndQuote_ReadsBackExactly()
    {
        var rows = Parse(Small().File.Content);
        var ten = rows.Single(r => r[5] == "10");
        Assert.Equal("Ten, \"quoted\"", ten[6]);
        Assert.Contains("\"Ten, \"\"quoted\"\"\"", Small().File.Content, StringComparison.Ordinal);
    }

    [Fact]
    public void Write_Circuits_InNaturalOrderWithSpacesAndSides()
    {
        var rows = Parse(Small().File.Content);
        var circuits = rows.Where(r => r[0] == "circuit").ToArray();
        Assert.Equal(["1", "2", "10", "11", "31", "EV"], circuits.Select(r => r[5]));
        Assert.Equal(["left", "right", "right", "left", "left", ""], circuits.Select(r => r[3]));
        Assert.Equal(["1 3 5", "2", "10", "11 13", "31", ""], circuits.Select(r => r[4]));
        Assert.Equal(["3", "1", "1", "2", "1", "2"], circuits.Select(r => r[7]));
        Assert.All(circuits, r => Assert.Equal("LP 1:a", r[1]));
        Assert.Equal("total", rows[^1][0]);
    }

    [Fact]
    public void Write_Figures_AreTheSolutions()
    {
        var (s, file) = Small();
        var rows = Parse(file.Content);
        foreach (var r in rows.Where(r => r[0] == "circuit"))
        {
            var run = s.IncomingRun(s.EndPointById("LP 1:a/" + r[5])!.Value.NodeIndex)!.Value;
            Assert.Equal(run.Lines, r[10]);
            Assert.Equal(Math.Round(run.ApparentPowerVa), double.Parse(r[11], CultureInfo.InvariantCulture));
            Assert.Equal(run.OcpdA, double.Parse(r[8], CultureInfo.InvariantCulture));
            for (var x = 0; x < 3; x++)
            {
                var on = run.Lines!.Contains((char)('A' + x), StringComparison.Ordinal);
                Assert.Equal(on ? Math.Round(run.LineVa[x]).ToString(CultureInfo.InvariantCulture) : "", r[12 + x]);
            }
        }

        var total = rows[^1];
        var panel = Assert.Single(s.Panels);
        Assert.Equal(panel.LineVa.Select(v => Math.Round(v)), total[12..15].Select(t => double.Parse(t, CultureInfo.InvariantCulture)));
        Assert.Equal(Math.Round(panel.ConnectedVa), double.Parse(total[15], CultureInfo.InvariantCulture));
        Assert.Equal(Math.Round(panel.NeutralCurrentA!.Value, 1), double.Parse(total[16], CultureInfo.InvariantCulture));
    }

    [Fact]
    public void Write_Text_IsRfc4180LinesInvariantAndTheSameEachTime()
    {
        var (s, file) = Small();
        Assert.EndsWith("\r\n", file.Content, StringComparison.Ordinal);
        Assert.DoesNotContain("\n", file.Content.Replace("\r\n", "", StringComparison.Ordinal), StringComparison.Ordinal);
        Assert.Equal(file.Content, ScheduleCsv.Write(s)[0].Content);
        Assert.Equal(file.Content, Assert.Single(ScheduleCsv.Write(ReportFixtures.SolveText(ReportFixtures.OnePanel("Csv", PanelSchedulesTests.Circuits, panel: "LP 1:a")))).Content);
        Assert.Equal("LP_1_a.csv", file.FileName);
    }

    [Fact]
    public void Write_NameWithALineBreak_QuotedAndReadBack()
    {
        var s = ReportFixtures.SolveText(ReportFixtures.OnePanel("Csv",
            ["{ id: '1', name: \"two\\nlines\", poles: 1, ocpd: 20, load: { va: 100 }, run: { length: 10, size: 12 AWG } }"]));
        var rows = Parse(ScheduleCsv.Write(s)[0].Content);
        Assert.Equal("two\nlines", rows[1][6]);
    }

    [Theory]
    [InlineData(new[] { "LP1", "LP2" }, new[] { "LP1.csv", "LP2.csv" })]
    [InlineData(new[] { "A/B", "A_B", "A?B" }, new[] { "A_B.csv", "A_B-2.csv", "A_B-3.csv" })]
    [InlineData(new[] { "lp", "LP" }, new[] { "lp.csv", "LP-2.csv" })]
    [InlineData(new[] { "a", "A", "A-2" }, new[] { "a.csv", "A-2.csv", "A-2-2.csv" })]
    [InlineData(new[] { "CON", "com1", "..", "Tableau électrique" }, new[] { "_CON.csv", "_com1.csv", "__.csv", "Tableau__lectrique.csv" })]
    public void FileNames_Ids_SafeAndUniqueWhateverTheLetterCase(string[] ids, string[] expected)
    {
        Assert.Equal(expected, ScheduleCsv.FileNames(ids));
    }

    [Fact]
    public void FileNames_LongId_CutTo100Characters()
    {
        var name = ScheduleCsv.FileNames([new string('x', 200)])[0];
        Assert.Equal(new string('x', 100) + ".csv", name);
        Assert.True(Encoding.UTF8.GetByteCount(name) < 255, "a file name's limit on common file systems is 255 bytes");
    }

    [Fact]
    public void Write_Demo_OneFilePerPanelWithEveryCircuit()
    {
        var s = ReportFixtures.Demo;
        var files = ScheduleCsv.Write(s);
        Assert.Equal(s.Panels.Select(p => p.Id), files.Select(f => f.PanelId));
        var circuits = files.Sum(f => Parse(f.Content).Count(r => r[0] == "circuit"));
        Assert.Equal(s.EndPoints.Count, circuits);
    }
}
