namespace DistTree.Tests.Cli;

/// <summary>
/// Every command that writes a file writes it through OutputFile: beside the target, then renamed; and never
/// over an input file. The commands are run in-process.
/// </summary>
public sealed class OutputFileTests
{
    public static TheoryData<string, string> WritingOptions() => new()
    {
        { "analyze", "--json" },
        { "analyze", "--sarif" },
        { "check", "--sarif" },
    };

    [Theory]
    [MemberData(nameof(WritingOptions))]
    public void Write_OntoTheInputFile_RefusedWithExitTwoAndInputUnchanged(string command, string option)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var before = File.ReadAllBytes(input);

        var result = CliRunner.Run(command, input, option, input);

        Assert.Equal(2, result.ExitCode);
        Assert.Equal($"disttree: error: '{input}' is an input file; DistTree never overwrites its input\n", result.Error.ReplaceLineEndings("\n"));
        Assert.Equal(before, File.ReadAllBytes(input));
        Assert.Single(Directory.GetFileSystemEntries(folder.Path));
    }

    [Fact]
    public void Write_JsonStreamedToAFile_SameTextAsStandardOutput()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("quillfeather-medical.yaml");
        var output = Path.Combine(folder.Path, "results.json");

        var toFile = CliRunner.Run("analyze", input, "--json", output);
        var toOut = CliRunner.Run("analyze", input, "--json", "-");

        Assert.Equal(toOut.ExitCode, toFile.ExitCode);
        Assert.Equal(toOut.Out, File.ReadAllText(output));
        Assert.Equal(2, Directory.GetFileSystemEntries(folder.Path).Length); // no temporary file left
    }

    [Fact]
    public void Write_OntoTheInputThroughAnotherSpelling_Refused()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var before = File.ReadAllBytes(input);
        var other = Path.Combine(folder.Path, ".", "sub", "..", "small-office.yaml");

        var result = CliRunner.Run("analyze", input, "--json", other);

        Assert.Equal(2, result.ExitCode);
        Assert.Equal(before, File.ReadAllBytes(input));
    }

    [Theory]
    [MemberData(nameof(WritingOptions))]
    public void Write_NewPath_WritesTheFileAndLeavesNoTemporary(string command, string option)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var output = Path.Combine(folder.Path, "out", "result.txt");

        var result = CliRunner.Run(command, input, option, output);

        Assert.Equal(0, result.ExitCode);
        Assert.True(File.Exists(output));
        Assert.Equal(["result.txt"], Directory.GetFileSystemEntries(Path.GetDirectoryName(output)!).Select(Path.GetFileName));
    }

    [Fact]
    public void Write_OverAnExistingOutput_ReplacesItWhole()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var output = folder.File("results.json");
        File.WriteAllText(output, new string('x', 1_000_000));

        var result = CliRunner.Run("analyze", input, "--json", output);

        Assert.Equal(0, result.ExitCode);
        Assert.StartsWith("{", File.ReadAllText(output), StringComparison.Ordinal);
        Assert.EndsWith("}\n", File.ReadAllText(output), StringComparison.Ordinal);
    }

    [Fact]
    public void Write_IntoAFolderThatCannotBeMade_ExitTwoWithoutAStackTrace()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var blocker = folder.File("blocker");
        File.WriteAllText(blocker, "a file where a folder would go\n");

        var result = CliRunner.Run("analyze", input, "--json", Path.Combine(blocker, "results.json"));

        Assert.Equal(2, result.ExitCode);
        Assert.StartsWith("disttree: error: ", result.Error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", result.Error, StringComparison.Ordinal);
    }
}
