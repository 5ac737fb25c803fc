using DistTree.Reports;
using DistTree.Reports.Html;
using DistTree.Tests.Codes.Iec;

namespace DistTree.Tests.Reports.Html;

/// <summary>The report's text helpers for the rule set's method texts, and the method section under each code.</summary>
public sealed class HtmlTextTests
{
    // Subscripts are marked _{…}; HTML's element-content characters are escaped first (HTML 5 character references).
    [Theory]
    [InlineData("I_{B} ≤ I_{n}", "I<sub>B</sub> ≤ I<sub>n</sub>")]
    [InlineData("a < b_{x & y}", "a &lt; b<sub>x &amp; y</sub>")]
    [InlineData("no subscript", "no subscript")]
    [InlineData("open _{ only", "open _{ only")]
    public void Formula_MarksSubscripts(string text, string expected) => Assert.Equal(expected, HtmlText.Formula(text));

    // Element content keeps quotes as written (they act only in attributes).
    [Fact]
    public void Content_KeepsQuotes_EscapesMarkup() => Assert.Equal("a motor's \"x\" &lt;b&gt;", HtmlText.Content("a motor's \"x\" <b>"));

    // Under code: iec the method section states 433.1's inequalities (IEC 60364-4-43, memory), not the NEC's 125 %.
    [Fact]
    public void Render_IecProject_MethodStatesTheOverloadRule()
    {
        var html = HtmlReport.Render(ReportFixtures.SolveText(IecProjectTests.Sample), HtmlReportOptions.Default);
        Assert.Contains("I<sub>B</sub> ≤ I<sub>n</sub> ≤ I<sub>z</sub>; I<sub>2</sub> ≤ 1.45 · I<sub>z</sub>", html, StringComparison.Ordinal);
        Assert.DoesNotContain("I<sub>design</sub>", html, StringComparison.Ordinal);
        Assert.Contains("Table B.52.17", html, StringComparison.Ordinal);
    }

    // The run's description gives its grouping count in the code's unit: under IEC, circuits (Table B.52.17, memory),
    // shown from two on; under the NEC, current-carrying conductors from four on.
    [Fact]
    public void Render_IecGroupedRun_NamesGroupedCircuits()
    {
        var yaml = IecProjectTests.Sample.Replace("size: 2.5 mm2 }", "size: 2.5 mm2, current_carrying: 3 }", StringComparison.Ordinal);
        var html = HtmlReport.Render(ReportFixtures.SolveText(yaml), HtmlReportOptions.Default);
        Assert.Contains("2.5 mm2 cu, 3 grouped circuits", html, StringComparison.Ordinal);
        Assert.DoesNotContain(", 3 current-carrying", html, StringComparison.Ordinal);
    }
}
