using System.Text.RegularExpressions;
using DistTree.Reports;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Reports;

/// <summary>
/// The report's print rules, as checked by printing the demo to PDF in headless Chromium and reading the pages
/// (DEVELOPERS.md, Checking the print layout): without them a section's heading and lead text were left at the foot of a
/// page (the tree, the panels, the motor table) and panels ran on from one another.
/// </summary>
public sealed class PrintLayoutTests
{
    private static string PrintRules()
    {
        var html = ReportFixtures.RenderDemo().DocumentElement.OuterHtml;
        var start = html.IndexOf("@media print", StringComparison.Ordinal);
        Assert.True(start >= 0, "the report has print rules");
        return html[start..];
    }

    [Theory]
    [InlineData(@"\.lede, \.legend \{ break-after: avoid;")]
    [InlineData(@"#tree, \.tree-frame \{ break-inside: avoid;")]
    [InlineData(@"#panels, #faults, #motors, #findings, #plan, #method \{ break-before: page;")]
    [InlineData(@"#faults \.fault-source, #faults \.method-line \{ break-after: avoid;")]
    [InlineData(@"section\.panel \+ section\.panel \{ break-before: page;")]
    [InlineData(@"h2 \{ break-after: avoid;")]
    [InlineData(@"#tree\.tree-wide \{ page: wide-tree; \}")]
    public void Render_PrintRules_KeepHeadingsWithTheirContentAndPanelsOneToAPage(string rule) =>
        Assert.Matches(new Regex(rule), PrintRules());

    [Fact]
    public void Render_Demo_EverySectionTheRulesNameExists()
    {
        var doc = ReportFixtures.RenderDemo();
        Assert.All(new[] { "tree", "panels", "faults", "findings", "method" }, id => Assert.NotNull(doc.GetElementById(id)));
        Assert.True(doc.QuerySelectorAll("section.panel").Length > 1);
    }

    // The demo's drawing (1,208 px) is wider than a portrait page's text (720 px): it prints on a landscape page, at
    // about 0.8 of its size instead of 0.6; the small office's fits the portrait page.
    [Fact]
    public void Render_WideTree_PrintsOnALandscapePage()
    {
        Assert.Equal("tree-wide", ReportFixtures.RenderDemo().GetElementById("tree")!.ClassName);
        Assert.Contains("@page wide-tree { size: landscape; }", ReportFixtures.RenderDemo().DocumentElement.OuterHtml, StringComparison.Ordinal);
        var small = ReportFixtures.Parse(HtmlReport.Render(
            SolverHarness.Solve(File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "projects", "small-office.yaml"))), HtmlReportOptions.Default));
        Assert.True(string.IsNullOrEmpty(small.GetElementById("tree")!.ClassName));
    }
}
