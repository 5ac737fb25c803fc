using System.Net.Sockets;
using DistTree.ProjectFiles;

namespace DistTree.Tests.Cli;

/// <summary>
/// Every command that writes a file writes it through OutputFile: checked first (not empty, not a file the project
/// read, nothing but a regular file or a new name), then written beside the target and renamed; nothing is left
/// behind. The commands are run in-process; each row of <see cref="WritingOptions"/> is one option that writes a file.
/// </summary>
public sealed class OutputFileTests
{
    public static TheoryData<string, string> WritingOptions() => new()
    {
        { "analyze", "--json" },
        { "analyze", "--html" },
        { "analyze", "--sarif" },
        { "check", "--sarif" },
        { "upsize", "--json" },
        { "upsize", "--html" },
        { "upsize", "--apply" },
        { "compare", "--json" },
        { "compare", "--markdown" },
        { "compare", "--html" },
        { "generate", "--output" },
        { "init", "--output" },
    };

    public static TheoryData<string, string> OptionsReadingAProject()
    {
        var rows = new TheoryData<string, string>();
        foreach (var row in WritingOptions().Where(r => (string)r[0] is not ("generate" or "init")))
        {
            rows.Add((string)row[0], (string)row[1]);
        }

        return rows;
    }

    // Every option but upsize --apply, which writes a copy of the project into a folder it is given (AppliedProjectTests).
    public static TheoryData<string, string> OptionsWritingOneFile()
    {
        var rows = new TheoryData<string, string>();
        foreach (var row in WritingOptions().Where(r => ((string)r[0], (string)r[1]) != ("upsize", "--apply")))
        {
            rows.Add((string)row[0], (string)row[1]);
        }

        return rows;
    }

    // The command line that writes with option to output, reading input where the command reads a project.
    private static string[] Arguments(string command, string option, string input, string output) => command switch
    {
        "compare" => [command, input, input, option, output],
        "generate" => [command, "--end-points", "3", option, output],
        "init" => [command, "--force", option, output],
        _ => [command, input, option, output],
    };

    [Theory]
    [MemberData(nameof(WritingOptions))]
    public void Write_EmptyPath_RefusedBeforeAnyWork(string command, string option)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");

        var result = CliRunner.Run(Arguments(command, option, input, ""));

        Assert.Equal((2, ""), (result.ExitCode, result.Out));
        Assert.Equal($"disttree: error: {option} was given an empty path; give a file name, or '-' for standard output\n", result.Error.ReplaceLineEndings("\n"));
        Assert.Single(Directory.GetFileSystemEntries(folder.Path));
    }

    [Theory]
    [MemberData(nameof(OptionsReadingAProject))]
    public void Write_OntoTheInputFile_RefusedWithExitTwoAndInputUnchanged(string command, string option)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var before = File.ReadAllBytes(input);

        var result = CliRunner.Run(Arguments(command, option, input, input));

        Assert.Equal(2, result.ExitCode);
        Assert.Equal($"disttree: error: '{input}' is an input file; DistTree never overwrites its input\n", result.Error.ReplaceLineEndings("\n"));
        Assert.Equal(before, File.ReadAllBytes(input));
        Assert.Single(Directory.GetFileSystemEntries(folder.Path));
    }

    [Theory]
    [MemberData(nameof(WritingOptions))]
    public void Write_NewPath_WritesTheFileAndLeavesNoTemporary(string command, string option)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var output = Path.Combine(folder.Path, "out", "result.txt");

        var result = CliRunner.Run(Arguments(command, option, input, output));

        Assert.True(result.ExitCode is 0 or 1, result.Error);
        Assert.True(File.Exists(output));
        Assert.Equal(["result.txt"], Directory.GetFileSystemEntries(Path.GetDirectoryName(output)!).Select(Path.GetFileName));
    }

    [Theory]
    [MemberData(nameof(WritingOptions))]
    public void Write_OntoAPipe_RefusedAndThePipeNeverOpened(string command, string option)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var pipe = folder.File("pipe");
        Tool.Run("mkfifo", pipe);

        // Opening the pipe to write would wait for a reader for ever: the test would hang, not pass.
        var result = CliRunner.Run(Arguments(command, option, input, pipe));

        Assert.Equal(2, result.ExitCode);
        Assert.Equal($"disttree: error: '{pipe}' is a pipe (FIFO), not a regular file; DistTree replaces only regular files (give '-' to write to standard output)\n", result.Error.ReplaceLineEndings("\n"));
        Assert.Equal(FileKind.Pipe, FileIdentity.Of(pipe).Kind);
        Assert.Equal(2, Directory.GetFileSystemEntries(folder.Path).Length);
    }

    [Theory]
    [MemberData(nameof(OptionsWritingOneFile))]
    public void Write_OntoAFolder_Refused(string command, string option)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var target = Directory.CreateDirectory(folder.File("reports")).FullName;

        var result = CliRunner.Run(Arguments(command, option, input, target));

        Assert.Equal(2, result.ExitCode);
        Assert.Contains($"'{target}' is a folder", result.Error, StringComparison.Ordinal);
        Assert.Empty(Directory.GetFileSystemEntries(target));
    }

    [Theory]
    [InlineData("hard link")]
    [InlineData("symbolic link")]
    [InlineData("linked folder")]
    public void Write_OntoTheInputByAnotherName_Refused(string how)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var before = File.ReadAllBytes(input);
        var other = how switch
        {
            "hard link" => folder.File("same.yaml"),
            "symbolic link" => File.CreateSymbolicLink(folder.File("same.yaml"), input).FullName,
            _ => Path.Combine(Directory.CreateSymbolicLink(folder.File("linked"), folder.Path).FullName, "small-office.yaml"),
        };
        if (how == "hard link")
        {
            Tool.Run("ln", input, other);
        }

        var result = CliRunner.Run("analyze", input, "--json", other);

        Assert.Equal(2, result.ExitCode);
        Assert.Equal($"disttree: error: '{other}' is an input file; DistTree never overwrites its input\n", result.Error.ReplaceLineEndings("\n"));
        Assert.Equal(before, File.ReadAllBytes(input));
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
    [InlineData("analyze", "--json")]
    [InlineData("upsize", "--apply")]
    [InlineData("check", "--sarif")]
    public void Write_OntoAnIncludedFileOrAHardLinkToIt_RefusedBeforeAnythingIsWritten(string command, string option)
    {
        using var folder = new TempFolder();
        var main = CampusCopy(folder);
        var included = Path.Combine(folder.Path, "buildings", "north-hall.yaml");
        var link = folder.File("north-hall-link.yaml");
        Tool.Run("ln", included, link);
        var before = File.ReadAllBytes(included);

        foreach (var target in new[] { included, link })
        {
            // Another output named first (check has no other) must not be written either.
            var result = command == "check"
                ? CliRunner.Run(command, main, option, target)
                : CliRunner.Run(command, main, "--html", folder.File("report.html"), option, target);

            Assert.Equal(2, result.ExitCode);
            Assert.Equal($"disttree: error: '{target}' is an input file; DistTree never overwrites its input\n", result.Error.ReplaceLineEndings("\n"));
            Assert.Equal(before, File.ReadAllBytes(included));
            Assert.False(File.Exists(folder.File("report.html")));
        }
    }

    [Fact]
    public void Write_OntoADevice_RefusedAndTheDeviceLeftAlone()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");

        // As root the rename would replace /dev/null itself: it must be refused before.
        var result = CliRunner.Run("analyze", input, "--json", "/dev/null");

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("'/dev/null' is a device, not a regular file", result.Error, StringComparison.Ordinal);
        Assert.Equal(FileKind.Device, FileIdentity.Of("/dev/null").Kind);
    }

    [Theory]
    [InlineData("/dev/stdout")]
    [InlineData("/proc/self/fd/1")]
    public void Write_OntoANameOfAnOpenFile_RefusedWhateverItLeadsTo(string path)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var kind = FileIdentity.Of(path).Kind;

        // Standard output of the test host: a pipe, a terminal or a log file; none is replaced.
        var result = CliRunner.Run("analyze", input, "--json", path);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains($"'{path}' ", result.Error, StringComparison.Ordinal);
        Assert.Equal(kind, FileIdentity.Of(path).Kind);
        Assert.NotNull(new FileInfo(path).LinkTarget);
    }

    [Fact]
    public void Write_OntoASocket_Refused()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var path = folder.File("s.sock");
        using var socket = new Socket(AddressFamily.Unix, SocketType.Stream, ProtocolType.Unspecified);
        socket.Bind(new UnixDomainSocketEndPoint(path));

        var result = CliRunner.Run("analyze", input, "--json", path);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains($"'{path}' is a socket, not a regular file", result.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Write_TwoOutputsOntoOneFile_RefusedBeforeEither()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var output = folder.File("out.txt");

        var result = CliRunner.Run("analyze", input, "--json", output, "--sarif", Path.Combine(folder.Path, ".", "out.txt"));

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--json and --sarif name the same file", result.Error, StringComparison.Ordinal);
        Assert.False(File.Exists(output));
    }

    [Fact]
    public void Write_ThroughASymbolicLinkToARegularFile_ReplacesTheFileAndKeepsTheLink()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var real = folder.File("results.json");
        File.WriteAllText(real, "old");
        var link = File.CreateSymbolicLink(folder.File("latest.json"), real).FullName;

        var result = CliRunner.Run("analyze", input, "--json", link);

        Assert.Equal(0, result.ExitCode);
        Assert.Equal(real, new FileInfo(link).ResolveLinkTarget(false)!.FullName);
        Assert.StartsWith("{", File.ReadAllText(real), StringComparison.Ordinal);
    }

    [Fact]
    public void Write_ThroughASymbolicLinkToNothing_Refused()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("small-office.yaml");
        var link = File.CreateSymbolicLink(folder.File("latest.json"), folder.File("missing.json")).FullName;

        var result = CliRunner.Run("analyze", input, "--json", link);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("is a symbolic link to nothing", result.Error, StringComparison.Ordinal);
        Assert.False(File.Exists(folder.File("missing.json")));
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

    /// <summary>projects/campus (a main file and two included ones) copied into the folder; the main file's path.</summary>
    internal static string CampusCopy(TempFolder folder)
    {
        var from = Path.Combine(TestPaths.RepoRoot, "projects", "campus");
        foreach (var file in Directory.EnumerateFiles(from, "*.yaml", SearchOption.AllDirectories))
        {
            var copy = Path.Combine(folder.Path, Path.GetRelativePath(from, file));
            Directory.CreateDirectory(Path.GetDirectoryName(copy)!);
            File.Copy(file, copy);
        }

        return folder.File("campus.yaml");
    }
}
