using DistTree.Reports;
using DistTree.Reports.Schedules;

namespace DistTree.Tests.Reports;

/// <summary>
/// The panel schedules in the HTML report, parsed with AngleSharp (an HTML5 parser): the facing rows, the marks of
/// multi-pole circuits, the foot's figures against the solution's, and the same bytes on every render.
/// </summary>
public sealed class HtmlScheduleTests
{
    private static readonly Lazy<DistTree.Solving.Solution> Small = new(() =>
        ReportFixtures.SolveText(ReportFixtures.OnePanel("Schedule", Schedules.PanelSchedulesTests.Circuits)));

    private static AngleSharp.Html.Dom.IHtmlDocument Render() => ReportFixtures.Parse(HtmlReport.Render(Small.Value, HtmlReportOptions.Default));

    [Fact]
    public void Render_Schedule_OddSpacesLeftEvenRightInOrder()
    {
        var rows = Render().QuerySelectorAll("section.panel table.schedule tbody tr:not(.gap)").ToArray();
        Assert.Equal(["1", "3", "5", "7", "9", "11", "13", "31"], rows.Select(r => r.QuerySelector("td.sp-l")!.TextContent));
        Assert.Equal(["2", "4", "6", "8", "10", "12", "14", "32"], rows.Select(r => r.QuerySelector("td.sp-r")!.TextContent));
        Assert.Equal(["1", "11", "31"], rows.Select(r => r.QuerySelector("td.ckt-l.id")?.TextContent).OfType<string>());
        Assert.Equal(["2", "10"], rows.Select(r => r.QuerySelector("td.ckt-r.id")?.TextContent).OfType<string>());
    }

    [Fact]
    public void Render_MultiPoleCircuit_MarksTheFurtherSpacesItTakes()
    {
        var rows = Render().QuerySelectorAll("table.schedule tbody tr:not(.gap)").ToArray();
        Assert.Equal("taken by circuit 1", rows[1].QuerySelector("td.ckt-l")!.TextContent);
        Assert.Equal("taken by circuit 1", rows[2].QuerySelector("td.ckt-l")!.TextContent);
        Assert.Equal("taken by circuit 11", rows[6].QuerySelector("td.ckt-l")!.TextContent);
        Assert.Equal("", rows[3].QuerySelector("td.ckt-l")!.TextContent);
        Assert.Equal("Spaces 15–30: none used", Render().QuerySelector("table.schedule tr.gap")!.TextContent);
        var first = rows[0].QuerySelectorAll("td").ToArray();
        Assert.Equal(["1", "1", "Three-pole", "3", "30", "10 AWG cu"], first[..6].Select(td => td.TextContent));
        Assert.Equal("A: 3\u2009000<br>B: 3\u2009000<br>C: 3\u2009000", first[6].InnerHtml);
    }

    [Fact]
    public void Render_Foot_IsThePanelsFiguresFromTheSolution()
    {
        var doc = Render();
        var panel = Assert.Single(Small.Value.Panels);
        string Total(string key) => doc.QuerySelector($".schedule-foot [data-total='{key}']")!.TextContent.Replace("\u2009", "", StringComparison.Ordinal);

        Assert.Equal(Math.Round(panel.LineVa[0]).ToString(System.Globalization.CultureInfo.InvariantCulture), Total("line-A"));
        Assert.Equal(Math.Round(panel.LineVa[2]).ToString(System.Globalization.CultureInfo.InvariantCulture), Total("line-C"));
        Assert.Equal(Math.Round(panel.ConnectedVa).ToString(System.Globalization.CultureInfo.InvariantCulture), Total("connected"));
        Assert.Equal(panel.NeutralCurrentA!.Value.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture), Total("neutral"));
        Assert.Equal(["EV"], doc.QuerySelectorAll("table.schedule-others td.id").Select(td => td.TextContent));
    }

    [Fact]
    public void Render_Schedule_SameFiguresAsTheCsv()
    {
        var csv = ScheduleCsv.Write(Small.Value)[0].Content;
        var doc = Render();
        var cells = doc.QuerySelectorAll("table.schedule td.va").Where(td => td.TextContent.Length > 0).ToArray();
        Assert.NotEmpty(cells);
        foreach (var td in cells)
        {
            foreach (var part in td.InnerHtml.Split("<br>"))
            {
                Assert.Contains("," + part[3..].Replace("\u2009", "", StringComparison.Ordinal) + ",", csv, StringComparison.Ordinal);
            }
        }
    }

    [Fact]
    public void Render_Demo_EveryCircuitOnceInTheSchedules_AndTheBytesTheSameEachTime()
    {
        var s = ReportFixtures.Demo;
        var html = HtmlReport.Render(s, HtmlReportOptions.Default);
        Assert.Equal(html, HtmlReport.Render(s, HtmlReportOptions.Default));
        var doc = ReportFixtures.Parse(html);
        var shown = 0;
        foreach (var panel in doc.QuerySelectorAll("section.panel"))
        {
            shown += panel.QuerySelectorAll("table.schedule td.id, table.schedule-others td.id").Length;
        }

        Assert.Equal(s.EndPoints.Count, shown);
    }

    [Fact]
    public void Render_PrintStyles_KeepASchedulesBlockWholeAndItsHeadingsWithIt()
    {
        var html = HtmlReport.Render(Small.Value, HtmlReportOptions.Default);
        Assert.Contains(".schedule-block { break-inside: avoid;", html, StringComparison.Ordinal);
        Assert.Contains("h3, h4 { break-after: avoid;", html, StringComparison.Ordinal);
        Assert.NotNull(ReportFixtures.Parse(html).QuerySelector("section.panel div.schedule-block h4 + table.schedule"));
    }
}
