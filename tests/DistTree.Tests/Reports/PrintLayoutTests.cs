using System.Text.RegularExpressions;

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
    [InlineData(@"#panels, #motors, #findings, #plan, #method \{ break-before: page;")]
    [InlineData(@"section\.panel \+ section\.panel \{ break-before: page;")]
    [InlineData(@"h2 \{ break-after: avoid;")]
    public void Render_PrintRules_KeepHeadingsWithTheirContentAndPanelsOneToAPage(string rule) =>
        Assert.Matches(new Regex(rule), PrintRules());

    [Fact]
    public void Render_Demo_EverySectionTheRulesNameExists()
    {
        var doc = ReportFixtures.RenderDemo();
        Assert.All(new[] { "tree", "panels", "findings", "method" }, id => Assert.NotNull(doc.GetElementById(id)));
        Assert.True(doc.QuerySelectorAll("section.panel").Length > 1);
    }
}
