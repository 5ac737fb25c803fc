namespace DistTree.Tests.Cli.Commands;

public sealed class CheckCommandTests
{
    [Fact]
    public void Check_Demo_FailsWithLocatedFindings()
    {
        var result = CliRunner.Run("check", Path.Combine(TestPaths.RepoRoot, "projects", "quillfeather-medical.yaml"));
        Assert.Equal(1, result.ExitCode);
        Assert.StartsWith("FAIL:", result.Out, StringComparison.Ordinal);
        Assert.Contains("quillfeather-medical.yaml:", result.Out, StringComparison.Ordinal);
        Assert.Contains(": total_drop: ", result.Out, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("small-office.yaml")]
    [InlineData("riverside-clinic-metric.yaml")]
    public void Check_CleanExample_Passes(string name)
    {
        var result = CliRunner.Run("check", Path.Combine(TestPaths.RepoRoot, "projects", name));
        Assert.Equal(0, result.ExitCode);
        Assert.StartsWith("PASS:", result.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_BadInput_ExitsTwoWithLocatedError()
    {
        var result = CliRunner.Run("check", Path.Combine(TestPaths.Cases, "bad", "unknown-size.yaml"));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("unknown-size.yaml:", result.Error, StringComparison.Ordinal);
        Assert.Contains(": error: ", result.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_UnknownOption_ExitsTwo() => Assert.Equal(2, CliRunner.Run("check", "--frobnicate").ExitCode);
}
