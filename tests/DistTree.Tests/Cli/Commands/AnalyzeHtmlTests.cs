using DistTree.Cli.Commands;
using DistTree.Tests.Reports;

namespace DistTree.Tests.Cli.Commands;

public sealed class AnalyzeHtmlTests
{
    [Fact]
    public void Analyze_HtmlPathAndDate_WritesTheReportWithTheDate()
    {
        var dir = Directory.CreateTempSubdirectory("disttree-html-");
        try
        {
            var out1 = Path.Combine(dir.FullName, "sub", "review.html");
            var result = CliRunner.Run("analyze", ReportFixtures.DemoPath, "--html", out1, "--date", "2031-04-05", "--worst", "3");
            Assert.Equal(1, result.ExitCode); // the demo exceeds limits
            Assert.Contains("Worst paths", result.Out, StringComparison.Ordinal);
            var doc = ReportFixtures.Parse(File.ReadAllText(out1));
            Assert.Equal(3, doc.QuerySelectorAll("#worst article.path").Length);
            Assert.Contains(doc.QuerySelectorAll(".meta dd"), dd => dd.TextContent == "2031-04-05");
            Assert.Empty(Directory.GetFiles(Path.GetDirectoryName(out1)!, "*.tmp"));
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    [Fact]
    public void Analyze_HtmlDash_WritesOnlyTheReportToStandardOutput()
    {
        var result = CliRunner.Run("analyze", ReportFixtures.DemoPath, "--html", "-");
        Assert.StartsWith("<!DOCTYPE html>", result.Out, StringComparison.Ordinal);
        Assert.DoesNotContain("DistTree analysis:", result.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Analyze_HtmlOverTheInput_IsRefused()
    {
        var dir = Directory.CreateTempSubdirectory("disttree-html-");
        try
        {
            var input = Path.Combine(dir.FullName, "p.yaml");
            File.Copy(ReportFixtures.DemoPath, input);
            var before = File.ReadAllBytes(input);
            var result = CliRunner.Run("analyze", input, "--html", input);
            Assert.Equal(2, result.ExitCode);
            Assert.Equal(before, File.ReadAllBytes(input));
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    [Fact]
    public void Analyze_HtmlWithoutValue_WritesToReportsUnderTheWorkingDirectory()
    {
        // The test process's working directory; the file is removed afterwards.
        var expected = Path.GetFullPath(Path.Combine("reports", "quillfeather-medical.html"));
        try
        {
            var result = CliRunner.Run("analyze", ReportFixtures.DemoPath, "--html", "--json", "-");
            Assert.Equal(1, result.ExitCode);
            Assert.StartsWith("{", result.Out, StringComparison.Ordinal);
            Assert.StartsWith("<!DOCTYPE html>", File.ReadAllText(expected), StringComparison.Ordinal);
        }
        finally
        {
            File.Delete(expected);
        }
    }

    [Theory]
    [InlineData("projects/quillfeather-medical.yaml", "reports/quillfeather-medical.html")]
    [InlineData("/abs/dir/clinic.v2.yaml", "reports/clinic.v2.html")]
    [InlineData("plain", "reports/plain.html")]
    public void DefaultHtmlPath_ProjectFile_IsReportsSlashNameDotHtml(string project, string expected) =>
        Assert.Equal(expected, AnalyzeCommand.DefaultHtmlPath(project));
}
