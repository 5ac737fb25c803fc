using DistTree.Cli;

namespace DistTree.Tests.Cli.Commands;

/// <summary><c>disttree validate</c>, run in-process: exit code and text.</summary>
public sealed class ValidateCommandTests
{
    private static (int Exit, string Out, string Error) Run(params string[] args)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        var exit = DisttreeApp.Run(args, stdout, stderr, showProgress: false, rethrowUnexpected: true);
        return (exit, stdout.ToString(), stderr.ToString());
    }

    [Fact]
    public void Validate_SmallOffice_PrintsCountsAndExitsZero()
    {
        var (exit, stdout, stderr) = Run("validate", Path.Combine(TestPaths.RepoRoot, "projects", "small-office.yaml"));

        Assert.Equal((0, "ok: 3 equipment, 10 circuits\n", ""), (exit, stdout.ReplaceLineEndings("\n"), stderr));
    }

    [Fact]
    public void Validate_BadFile_PrintsEveryDiagnosticOnStderrAndExitsTwo()
    {
        var path = Path.Combine(TestPaths.Cases, "bad", "many-errors.yaml");
        var expected = File.ReadAllLines(Path.ChangeExtension(path, ".expected"))
            .Select(l => l.Replace("many-errors.yaml:", path + ":", StringComparison.Ordinal));

        var (exit, stdout, stderr) = Run("validate", path);

        Assert.Equal(2, exit);
        Assert.Equal("", stdout);
        Assert.Equal(expected, stderr.ReplaceLineEndings("\n").TrimEnd('\n').Split('\n'));
    }

    [Fact]
    public void Validate_Warnings_GoToStderrAndExitZero()
    {
        var path = Path.Combine(TestPaths.Cases, "warn", "long-branch.yaml");

        var (exit, stdout, stderr) = Run("validate", path);

        Assert.Equal(0, exit);
        Assert.Equal("ok: 1 equipment, 1 circuits\n", stdout.ReplaceLineEndings("\n"));
        Assert.Equal($"{path}:18:24: warning: the run of circuit 'LP1/1' is 700 m long, more than 609.6 m (2000 ft); check the length\n", stderr.ReplaceLineEndings("\n"));
    }

    [Fact]
    public void Validate_MissingFile_UsageErrorExitsTwo()
    {
        var (exit, stdout, stderr) = Run("validate", "no/such/project.yaml");

        Assert.Equal((2, "", "disttree: error: cannot read 'no/such/project.yaml': no such file\n"), (exit, stdout, stderr.ReplaceLineEndings("\n")));
    }

    [Fact]
    public void Validate_Directory_UsageErrorExitsTwo()
    {
        var (exit, _, stderr) = Run("validate", TestPaths.Cases);

        Assert.Equal(2, exit);
        Assert.StartsWith("disttree: error: ", stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_NoFileArgument_ExitsTwo()
    {
        var (exit, _, stderr) = Run("validate");

        Assert.Equal(2, exit);
        Assert.Contains("disttree: error:", stderr, StringComparison.Ordinal);
    }
}
