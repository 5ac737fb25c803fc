using System.Text.Json;

namespace DistTree.Tests.Cli.Commands;

public sealed class AnalyzeCommandTests
{
    private static string Demo => Path.Combine(TestPaths.RepoRoot, "projects", "quillfeather-medical.yaml");

    private static string Clean => Path.Combine(TestPaths.RepoRoot, "projects", "small-office.yaml");

    [Fact]
    public void Analyze_Demo_ShowsWorstPathsAndFindingsAndExitsOne()
    {
        var result = CliRunner.Run("analyze", Demo);
        Assert.Equal(1, result.ExitCode);
        Assert.Contains("Worst paths", result.Out, StringComparison.Ordinal);
        Assert.Contains("Findings (", result.Out, StringComparison.Ordinal);
        Assert.Contains("authority having jurisdiction", result.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Analyze_Clean_ExitsZero()
    {
        var result = CliRunner.Run("analyze", Clean);
        Assert.Equal(0, result.ExitCode);
        Assert.Contains("Findings: none", result.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Analyze_JsonToStandardOutput_IsOnlyTheDocument()
    {
        var result = CliRunner.Run("analyze", Demo, "--json", "-");
        using var doc = JsonDocument.Parse(result.Out);
        Assert.Equal("disttree-results/1", doc.RootElement.GetProperty("format").GetString());
    }

    [Fact]
    public void Analyze_JsonToFile_WritesTheDocument()
    {
        var path = Path.Combine(Path.GetTempPath(), $"disttree-{Guid.NewGuid():N}.json");
        try
        {
            var result = CliRunner.Run("analyze", Clean, "--json", path);
            Assert.Equal(0, result.ExitCode);
            Assert.Equal(CliRunner.Run("analyze", Clean, "--json", "-").Out, File.ReadAllText(path));
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Analyze_JsonOntoTheInput_IsRefusedAndTheInputKept()
    {
        var path = Path.Combine(Path.GetTempPath(), $"disttree-{Guid.NewGuid():N}.yaml");
        File.Copy(Clean, path);
        try
        {
            var before = File.ReadAllBytes(path);
            var result = CliRunner.Run("analyze", path, "--json", path);
            Assert.Equal(2, result.ExitCode);
            Assert.Contains("never overwrites its input", result.Error, StringComparison.Ordinal);
            Assert.Equal(before, File.ReadAllBytes(path));
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Analyze_MissingFile_ExitsTwo()
    {
        var result = CliRunner.Run("analyze", "no-such-file.yaml");
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("no-such-file.yaml", result.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Analyze_BadWorst_ExitsTwo() => Assert.Equal(2, CliRunner.Run("analyze", Clean, "--worst", "0").ExitCode);

    // All 100,000 worst paths of a large project took 35 s and 2.4 GB for a 400 MB page (docs/limits.md).
    [Fact]
    public void Analyze_WorstAboveTheMost_ExitsTwoNamingTheBound()
    {
        var result = CliRunner.Run("analyze", Clean, "--worst", "2147483647");
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--worst takes a whole number from 1 to 1,000", result.Error, StringComparison.Ordinal);
    }
}
