using System.Globalization;
using System.Text.Json;
using DistTree.Comparing;
using DistTree.Reports;
using DistTree.Solving;
using DistTree.Tests.Comparing;
using Markdig;
using Markdig.Extensions.Tables;
using Markdig.Syntax;
using Markdig.Syntax.Inlines;

namespace DistTree.Tests.Reports;

/// <summary>
/// The comparison's fault currents in every output: each shows the figures of the revisions' own studies (rounded as
/// written), the change, and the direction. The case: LP1's feeder shortened from 40 m to 10 m, which raises the
/// current at LP1 and at the sub-panel below it (IEC 60909-0, 2016, 6.1: the smaller series impedance) and leaves MSB
/// and LP2 as they were.
/// </summary>
public sealed class ComparisonFaultsTests
{
    private static (Solution Before, Solution After, Comparison Comparison) Shortened()
    {
        var old = ComparisonProjects.Shared(ComparisonProjects.SubPanel);
        var shorter = old.Replace("feeder: { length: 40, size: 1/0 AWG, ocpd: 150 }", "feeder: { length: 10, size: 1/0 AWG, ocpd: 150 }", StringComparison.Ordinal);
        var before = ReportFixtures.SolveText(old, "old.yaml");
        var after = ReportFixtures.SolveText(shorter, "new.yaml");
        return (before, after, RevisionComparer.Compare(before, after));
    }

    private static string Ka(double? ka) => ka!.Value.ToString("0.00", CultureInfo.InvariantCulture);

    private static EquipmentFault Of(Solution s, string id) => s.Faults!.Equipment.Single(e => e.Id == id);

    [Fact]
    public void Write_ShortenedFeeder_JsonListsEveryEquipmentWithEachStudysFigures()
    {
        var (before, after, c) = Shortened();
        using var doc = JsonDocument.Parse(ComparisonJson.Write(c));
        var faults = doc.RootElement.GetProperty("faults").EnumerateArray().ToDictionary(f => f.GetProperty("id").GetString()!);

        Assert.Equal(["LP1", "LP2", "MSB", "SUB"], faults.Keys.Order(StringComparer.Ordinal));
        var lp1 = faults["LP1"];
        Assert.Equal(Math.Round(Of(before, "LP1").AvailableFaultCurrentKa!.Value, 3), lp1.GetProperty("available_fault_current_ka_before").GetDouble());
        Assert.Equal(Math.Round(Of(after, "LP1").AvailableFaultCurrentKa!.Value, 3), lp1.GetProperty("available_fault_current_ka_after").GetDouble());
        Assert.Equal(Math.Round(Of(after, "LP1").AvailableFaultCurrentLgKa!.Value, 3), lp1.GetProperty("available_fault_current_lg_ka_after").GetDouble());
        Assert.True(lp1.GetProperty("change_ka").GetDouble() > 0);
        Assert.True(lp1.GetProperty("rose").GetBoolean());
        Assert.Equal(JsonValueKind.Null, lp1.GetProperty("change").ValueKind);
        Assert.False(faults["LP2"].GetProperty("moved").GetBoolean());
        Assert.Equal(4, doc.RootElement.GetProperty("summary").GetProperty("faults_compared").GetInt32());
        Assert.Equal(2, doc.RootElement.GetProperty("summary").GetProperty("faults_rose").GetInt32());
    }

    [Fact]
    public void Write_ShortenedFeeder_ConsoleListsTheRiseAndCountsTheUnchanged()
    {
        var (before, after, c) = Shortened();
        var o = new StringWriter();
        ComparisonConsole.Write(o, c, 20);
        var lines = o.ToString().Split('\n');

        var lp1 = Assert.Single(lines, l => l.StartsWith("  LP1 ", StringComparison.Ordinal) && l.Contains(" 3ph ", StringComparison.Ordinal));
        Assert.Contains("rose", lp1, StringComparison.Ordinal);
        Assert.Contains($"3ph {Ka(Of(before, "LP1").AvailableFaultCurrentKa)} -> {Ka(Of(after, "LP1").AvailableFaultCurrentKa)} (+", lp1, StringComparison.Ordinal);
        Assert.Contains($"L-G {Ka(Of(before, "LP1").AvailableFaultCurrentLgKa)} -> {Ka(Of(after, "LP1").AvailableFaultCurrentLgKa)} (+", lp1, StringComparison.Ordinal);
        Assert.DoesNotContain(lines, l => l.StartsWith("  LP2 ", StringComparison.Ordinal) && l.Contains(" 3ph ", StringComparison.Ordinal));
        Assert.Contains("  2 others unchanged", lines);
    }

    // Rendered by a CommonMark parser with GitHub's pipe-table extension: a row per moved equipment, as many cells as the header.
    [Fact]
    public void Write_ShortenedFeeder_MarkdownTableOfTheMovedEquipment()
    {
        var (_, after, c) = Shortened();
        var text = ComparisonMarkdown.Write(c, 20);
        var table = Markdown.Parse(text, new MarkdownPipelineBuilder().UsePipeTables().Build()).Descendants<Table>()
            .Single(t => ((TableRow)t[0]).Descendants<LiteralInline>().Any(l => l.Content.ToString() == "Equipment"));

        Assert.Equal(3, table.Count); // header, LP1, SUB
        Assert.All(table.Cast<TableRow>(), row => Assert.Equal(10, row.Count));
        Assert.Contains($"| **rose** | ", text, StringComparison.Ordinal);
        Assert.Contains(Ka(Of(after, "SUB").AvailableFaultCurrentKa), text, StringComparison.Ordinal);
        Assert.Contains("Available fault current unchanged at 2 other pieces of equipment.", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_ShortenedFeeder_HtmlComparisonHasTheFaultTable()
    {
        var (before, after, c) = Shortened();
        var doc = ReportFixtures.Parse(HtmlReport.Render(after, new HtmlReportOptions { Comparison = c }));
        var rows = doc.QuerySelectorAll("#comparison #cmp-faults tbody tr")
            .ToDictionary(r => r.QuerySelector("td")!.TextContent, r => r.QuerySelectorAll("td").Select(td => td.TextContent).ToArray());

        Assert.Equal(["LP1", "SUB"], rows.Keys.Order(StringComparer.Ordinal));
        Assert.Equal("rose", rows["SUB"][2]);
        Assert.Equal($"{Ka(Of(before, "SUB").AvailableFaultCurrentKa)} → {Ka(Of(after, "SUB").AvailableFaultCurrentKa)}", rows["SUB"][3]);
        Assert.StartsWith("+", rows["SUB"][4], StringComparison.Ordinal);
        Assert.Equal($"{Ka(Of(before, "SUB").AvailableFaultCurrentLgKa)} → {Ka(Of(after, "SUB").AvailableFaultCurrentLgKa)}", rows["SUB"][5]);
    }
}
