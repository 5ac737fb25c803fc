using System.Globalization;
using DistTree.Reports;
using DistTree.Solving;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Reports;

/// <summary>The report's Available fault current section and each panel's heading: the study's figures, as it gives them.</summary>
public sealed class HtmlFaultsTests
{
    private static string Ka(double? ka) => ka is { } k ? k.ToString("0.00", CultureInfo.InvariantCulture) : "unbounded";

    // A 20 kA utility source through 5 m of 1/0 AWG leaves more than the 10 kA the panel is rated for.
    private static readonly string Rated = SolverHarness.PanelOnFeeder(
            "length: 5, size: 1/0 AWG",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 4 }, run: { length: 5, size: 12 AWG } }")
        .Replace("service: { id: SVC, system: 208Y/120 }", "service: { id: SVC, system: 208Y/120, available_fault_current_ka: 20, fault_x_r: 4 }", StringComparison.Ordinal)
        .Replace("    from: SVC\n", "    from: SVC\n    interrupting_ka: 10\n", StringComparison.Ordinal);

    [Fact]
    public void Render_Demo_FaultTableHasEveryEquipmentWithTheStudysFigures()
    {
        var s = ReportFixtures.Demo;
        var doc = ReportFixtures.RenderDemo();
        var rows = doc.QuerySelectorAll("#faults table.faults tbody tr").Select(r => r.QuerySelectorAll("td").Select(td => td.TextContent).ToArray()).ToArray();

        Assert.Equal(s.Faults!.Equipment.Select(e => e.Id), rows.Select(r => r[0]));
        foreach (var (e, cells) in s.Faults.Equipment.Zip(rows))
        {
            Assert.Equal(Ka(e.AvailableFaultCurrentKa), cells[3]);
            Assert.Equal(e.AvailableFaultCurrentLgKa is { } lg ? Ka(lg) : "–", cells[4]);
            Assert.Equal(e.XOverR is { } x ? x.ToString("0.00", CultureInfo.InvariantCulture) : "–", cells[5]);
        }

        Assert.NotNull(doc.QuerySelector("nav.toc a[href='#faults']"));
        Assert.Contains(FaultText.Method, doc.GetElementById("faults")!.TextContent, StringComparison.Ordinal);
    }

    // The demo states no source: its infinite bus is shown as a caution, not a plain line.
    [Fact]
    public void Render_InfiniteBus_SourceIsACaution()
    {
        Assert.Equal(FaultSourceKind.InfiniteBus, ReportFixtures.Demo.Faults!.Source);
        var caution = ReportFixtures.RenderDemo().QuerySelector("#faults aside.caution.fault-source");

        Assert.NotNull(caution);
        Assert.Contains("infinite bus", caution.TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_UtilitySourceAndRatingBelowTheCurrent_PlainSourceLineAndOver()
    {
        var s = ReportFixtures.SolveText(Rated);
        var doc = ReportFixtures.Parse(HtmlReport.Render(s, new HtmlReportOptions()));

        Assert.Null(doc.QuerySelector("#faults aside.caution"));
        Assert.Equal($"Source: {FaultText.Source(s.Faults!, s.Project.Service)}.", doc.QuerySelector("#faults p.fault-source")!.TextContent);
        var cells = doc.QuerySelectorAll("#faults table.faults tbody tr td").Select(td => td.TextContent).ToArray();
        Assert.Equal(["P", "panelboard", "208Y/120"], cells[..3]);
        Assert.Equal("10", cells[6]);
        Assert.Equal("over", cells[7]);
        Assert.NotNull(doc.QuerySelector("#faults table.faults .result-fail"));
    }

    [Fact]
    public void Render_Demo_EachPanelHeadingShowsItsFaultCurrents()
    {
        var s = ReportFixtures.Demo;
        var doc = ReportFixtures.RenderDemo();
        var panels = doc.QuerySelectorAll("section.panel").ToArray();
        Assert.NotEmpty(panels);

        foreach (var panel in panels)
        {
            var id = panel.QuerySelector("h3 .id")!.TextContent;
            var e = s.Faults!.Equipment.Single(f => f.Id == id);
            Assert.EndsWith($" · available fault current {Ka(e.AvailableFaultCurrentKa)} kA, L-G {Ka(e.AvailableFaultCurrentLgKa)} kA", panel.QuerySelector("h3 .muted")!.TextContent, StringComparison.Ordinal);
        }
    }
}
