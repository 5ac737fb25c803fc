using DistTree.Reports;

namespace DistTree.Tests.Reports.Html;

/// <summary>
/// The worst-path table's line and current: each row's are the ones the end point's own share in it is made of
/// (see <c>PathLinesTests</c> for the figures against hand-worked circuits).
/// </summary>
public sealed class WorstPathLinesTests
{
    // A 1-pole end point on A (10 A at 120 V) beside a heavier one on B (30 A): by Kirchhoff's current law at the panel's
    // bus the feeder carries 10·120/(208/√3) = 9.99 A on A and 29.98 A on B, its most loaded line.
    private const string TwoLines = """
        disttree: 1
        project: { name: Two lines, units: metric }
        rules: { conductor_temperature: rated }
        service: { id: SVC, system: 208Y/120 }
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            feeder: { length: 30, size: 4 AWG }
            circuits:
              - { id: "1", poles: 1, phase: A, load: { amps: 10, pf: 1 }, run: { length: 60, size: 14 AWG } }
              - { id: "2", poles: 1, phase: B, load: { amps: 30, pf: 1 }, run: { length: 5, size: 10 AWG } }
        """;

    [Fact]
    public void Render_OnePoleOnTheLighterLine_FeederRowShowsItsOwnLineAndCurrent()
    {
        var s = ReportFixtures.SolveText(TwoLines);
        Assert.Equal("P/1", s.WorstEndPoints(1)[0].Id);
        var doc = ReportFixtures.Parse(HtmlReport.Render(s, HtmlReportOptions.Default));

        var feeder = doc.QuerySelector("#worst article.path table.runs tbody tr")!.QuerySelectorAll("td").Select(td => td.TextContent).ToArray();

        Assert.Equal("P", feeder[1]);
        Assert.Equal(["A", "10.0"], feeder[5..7]);
    }

    [Fact]
    public void Render_WorstPaths_StateTheBasisOfTheLineAndCurrentBesideTheTable()
    {
        var doc = ReportFixtures.RenderDemo();

        var lede = doc.QuerySelectorAll("#worst p.lede").Select(p => p.TextContent).ToArray();

        Assert.Contains(lede, t => t.Contains("the one whose conductor takes the largest part of the row's drop", StringComparison.Ordinal));
        Assert.Contains("Line", doc.QuerySelector("#worst table.runs thead")!.TextContent, StringComparison.Ordinal);
    }
}
