using DistTree.Reports.Schedules;

namespace DistTree.Tests.Cli;

/// <summary>
/// <c>--schedules DIR</c>: a CSV file per panel, written through OutputFile and checked with the command's other
/// outputs (OutputFileTests checks the one-file options the same way).
/// </summary>
public sealed class ScheduleOutputTests
{
    public static TheoryData<string> Commands() => ["analyze", "upsize", "compare"];

    private static string[] Arguments(string command, string input, params string[] rest) => command == "compare"
        ? [command, input, input, .. rest]
        : [command, input, .. rest];

    [Theory]
    [MemberData(nameof(Commands))]
    public void Schedules_NewFolder_OneFilePerPanelAndNoTemporary(string command)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var output = Path.Combine(folder.Path, "out", "schedules");

        var result = CliRunner.Run(Arguments(command, input, "--schedules", output));

        Assert.True(result.ExitCode is 0 or 1, result.Error);
        var solution = Tests.Reports.ReportFixtures.SolveFile(input);
        var expected = ScheduleCsv.Write(solution);
        Assert.Equal(expected.Select(f => f.FileName).Order(StringComparer.Ordinal), Directory.GetFileSystemEntries(output).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        foreach (var file in expected)
        {
            Assert.Equal(System.Text.Encoding.UTF8.GetBytes(file.Content), File.ReadAllBytes(Path.Combine(output, file.FileName)));
        }
    }

    [Fact]
    public void Schedules_Analyze_ConsoleAndOtherOutputsUnchanged()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");

        var without = CliRunner.Run("analyze", input, "--json", folder.File("a.json"));
        var with = CliRunner.Run("analyze", input, "--json", folder.File("b.json"), "--schedules", folder.File("s"));

        Assert.Equal(without.Out, with.Out);
        Assert.Equal(File.ReadAllBytes(folder.File("a.json")), File.ReadAllBytes(folder.File("b.json")));
    }

    [Theory]
    [InlineData("", "--schedules was given an empty path; give a folder")]
    [InlineData("-", "--schedules writes a file per panel into a folder, not to standard output; give a folder")]
    public void Schedules_EmptyOrStandardOutput_RefusedBeforeAnyWork(string path, string message)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");

        var result = CliRunner.Run("analyze", input, "--schedules", path);

        Assert.Equal((2, ""), (result.ExitCode, result.Out));
        Assert.Equal($"disttree: error: {message}\n", result.Error.ReplaceLineEndings("\n"));
        Assert.Single(Directory.GetFileSystemEntries(folder.Path));
    }

    [Fact]
    public void Schedules_OntoTheInputFile_RefusedAndInputUnchanged()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var before = File.ReadAllBytes(input);

        var result = CliRunner.Run("analyze", input, "--schedules", input);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("is not a folder", result.Error, StringComparison.Ordinal);
        Assert.Equal(before, File.ReadAllBytes(input));
        Assert.Single(Directory.GetFileSystemEntries(folder.Path));
    }

    [Fact]
    public void Schedules_AFileTheHtmlAlsoNames_RefusedBeforeEither()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var name = ScheduleCsv.Write(Tests.Reports.ReportFixtures.SolveFile(input))[0].FileName;
        var out_ = Path.Combine(folder.Path, "out");

        var result = CliRunner.Run("analyze", input, "--html", Path.Combine(out_, name), "--schedules", out_);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--html and --schedules name the same file", result.Error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(out_));
    }

    [Fact]
    public void Schedules_ASchedulesNameIsAFolder_RefusedAndNothingWritten()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var files = ScheduleCsv.Write(Tests.Reports.ReportFixtures.SolveFile(input));
        var out_ = Path.Combine(folder.Path, "out");
        Directory.CreateDirectory(Path.Combine(out_, files[0].FileName));

        var result = CliRunner.Run("analyze", input, "--json", folder.File("r.json"), "--schedules", out_);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("is a folder; give the output a file name", result.Error, StringComparison.Ordinal);
        Assert.False(File.Exists(folder.File("r.json")));
    }

    [Fact]
    public void Schedules_TwoRuns_SameBytes()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");

        CliRunner.Run("analyze", input, "--schedules", folder.File("one"));
        CliRunner.Run("analyze", input, "--schedules", folder.File("two"));

        foreach (var file in Directory.GetFiles(folder.File("one")))
        {
            Assert.Equal(File.ReadAllBytes(file), File.ReadAllBytes(Path.Combine(folder.File("two"), Path.GetFileName(file))));
        }
    }
}
