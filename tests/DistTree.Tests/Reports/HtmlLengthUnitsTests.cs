using DistTree.Reports;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Reports;

/// <summary>The report's tree and notes write a run's length in the project's units.</summary>
public sealed class HtmlLengthUnitsTests
{
    // A panel on a 60 ft feeder (60 × 0.3048 = 18.288 m, NIST SP 811 Appendix B.8) with one circuit of 150 ft (45.72 m).
    private static string Project(string units, string feeder, string farthest) =>
        SolverHarness.PanelOnFeeder(
            $"length: {feeder}, size: 4 AWG",
            $"{{ id: \"1\", poles: 1, ocpd: 20, load: {{ va: 600, pf: 1 }}, run: {{ length: {farthest}, size: 12 AWG }} }}")
        .Replace("units: metric", "units: " + units, StringComparison.Ordinal);

    private static string FeederLine(string html) =>
        ReportFixtures.Parse(html).QuerySelectorAll("g.node text.n-feed").Select(t => t.TextContent).Single(t => t.StartsWith("4 AWG", StringComparison.Ordinal));

    [Fact]
    public void Render_ImperialProject_TreeShowsTheFeederInFeet() =>
        Assert.Equal("4 AWG cu · 60 ft · ", FeederLine(HtmlReport.Render(ReportFixtures.SolveText(Project("imperial", "60", "150")), new HtmlReportOptions()))[..19]);

    [Fact]
    public void Render_MetricProject_TreeShowsTheSameFeederInMetres() =>
        Assert.Equal("4 AWG cu · 18.3 m · ", FeederLine(HtmlReport.Render(ReportFixtures.SolveText(Project("metric", "18.288", "45.72")), new HtmlReportOptions()))[..20]);
}
