using DistTree.Cli.Commands;
using DistTree.Tests.Comparing;
using DistTree.Tests.Reports;

namespace DistTree.Tests.Cli.Commands;

/// <summary><c>disttree compare OLD NEW --html</c> and <c>disttree upsize FILE --html</c>, run in-process.</summary>
public sealed class CompareHtmlTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("disttree-compare-html-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private string Write(string name, string text)
    {
        var path = Path.Combine(_dir, name);
        File.WriteAllText(path, text);
        return path;
    }

    [Fact]
    public void Compare_HtmlPath_WritesTheNewRevisionsReportWithTheComparison()
    {
        var old = Write("old.yaml", ComparisonProjects.Shared());
        var @new = Write("new.yaml", ComparisonProjects.Shared(ComparisonProjects.SubPanel));
        var output = Path.Combine(_dir, "out", "review.html");

        var r = CliRunner.Run("compare", old, @new, "--html", output, "--date", "2031-04-05");

        Assert.Equal(0, r.ExitCode);
        Assert.Contains("DistTree comparison", r.Out, StringComparison.Ordinal);
        var doc = ReportFixtures.Parse(File.ReadAllText(output));
        Assert.Contains(@new, doc.QuerySelector(".meta")!.TextContent, StringComparison.Ordinal);
        Assert.Contains(doc.QuerySelectorAll("#comparison table.elements tbody tr"), tr => tr.QuerySelector("td")!.TextContent == "SUB/1");
        Assert.Contains(doc.QuerySelectorAll(".meta dd"), dd => dd.TextContent == "2031-04-05");
    }

    [Fact]
    public void Compare_HtmlDash_WritesOnlyTheReport()
    {
        var old = Write("old.yaml", ComparisonProjects.Shared());
        var @new = Write("new.yaml", ComparisonProjects.Shared(ComparisonProjects.SubPanel));

        var r = CliRunner.Run("compare", old, @new, "--html", "-");

        Assert.Equal(0, r.ExitCode);
        Assert.StartsWith("<!DOCTYPE html>", r.Out, StringComparison.Ordinal);
        Assert.NotNull(ReportFixtures.Parse(r.Out).QuerySelector("#comparison"));
    }

    [Fact]
    public void Compare_HtmlAndJsonBothToStandardOutput_IsAUsageError()
    {
        var old = Write("old.yaml", ComparisonProjects.Shared());
        Assert.Equal(2, CliRunner.Run("compare", old, old, "--html", "-", "--json", "-").ExitCode);
    }

    [Fact]
    public void Upsize_HtmlPath_WritesTheReportWithThePlan()
    {
        var output = Path.Combine(_dir, "upsize.html");

        var r = CliRunner.Run("upsize", ReportFixtures.DemoPath, "--html", output);

        Assert.Equal(1, r.ExitCode); // two runs' least fitting sizes are beyond their devices' terminals
        Assert.Contains("The plan was proved", r.Out, StringComparison.Ordinal);
        var doc = ReportFixtures.Parse(File.ReadAllText(output));
        Assert.NotEmpty(doc.QuerySelectorAll("#plan table.plan tr.plan-change"));
        Assert.NotNull(doc.QuerySelector("#plan .after-plan"));
        // The report is of the design before the plan: its findings are still listed.
        Assert.NotEmpty(doc.QuerySelectorAll("#findings table.finding-list tbody tr"));
    }

    [Fact]
    public void Upsize_HtmlDashAndJsonDash_IsAUsageError() =>
        Assert.Equal(2, CliRunner.Run("upsize", ReportFixtures.DemoPath, "--html", "-", "--json", "-").ExitCode);

    [Theory]
    [InlineData("projects/quillfeather-medical.yaml", "reports/quillfeather-medical-upsize.html")]
    [InlineData("/abs/dir/clinic.v2.yaml", "reports/clinic.v2-upsize.html")]
    public void UpsizeDefaultHtmlPath_ProjectFile_IsReportsSlashNameDashUpsize(string project, string expected) =>
        Assert.Equal(expected, UpsizeCommand.DefaultHtmlPath(project));

    [Theory]
    [InlineData("projects/clinic-rev-b.yaml", "reports/clinic-rev-b-compare.html")]
    [InlineData("/abs/new.yaml", "reports/new-compare.html")]
    public void CompareDefaultHtmlPath_NewFile_IsReportsSlashNameDashCompare(string project, string expected) =>
        Assert.Equal(expected, CompareCommand.DefaultHtmlPath(project));
}
