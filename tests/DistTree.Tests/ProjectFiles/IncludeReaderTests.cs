using System.Security.Cryptography;
using DistTree.Diagnostics;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>Multi-file projects: 'include' read through ProjectLoader.Load, on files in a temporary folder.</summary>
public sealed class IncludeReaderTests : IDisposable
{
    private const string Main = """
        disttree: 1
        project: { name: Include test, units: imperial }
        service: { id: SVC, system: 208Y/120 }
        include:
          - b/one.yaml
        equipment:
          - id: MSB
            kind: switchboard
            from: SVC
        """;

    private const string One = """
        equipment:
          - id: LP1
            kind: panelboard
            from: MSB
            feeder: { length: 50, size: 2 AWG, ocpd: 100 }
            circuits:
              - id: "1"
                poles: 1
                ocpd: 20
                load: { va: 1000 }
                run: { length: 40, size: 12 AWG }
        """;

    private readonly DirectoryInfo _folder = Directory.CreateTempSubdirectory("disttree-include-");

    public void Dispose() => _folder.Delete(recursive: true);

    [Fact]
    public void Load_Campus_ReadsEveryBuildingFile()
    {
        var project = ProjectLoader.Load(Path.Combine(TestPaths.RepoRoot, "projects", "campus", "campus.yaml"));

        Assert.Contains(project.Equipment, e => e.Id == "NH-L1");
        Assert.Contains(project.Equipment, e => e.Id == "SL-H1");
        Assert.Equal(["MSB", "CP", "NH-DS", "NH-H1", "NH-T1", "NH-L1", "SL-H1"], project.Equipment.Select(e => e.Id));
    }

    [Fact]
    public void Load_WithIncludes_Sha256CoversEveryFileInOrder()
    {
        var main = Write("main.yaml", Main);
        var one = Write("b/one.yaml", One);
        var expected = Convert.ToHexStringLower(SHA256.HashData(
            SHA256.HashData(File.ReadAllBytes(main)).Concat(SHA256.HashData(File.ReadAllBytes(one))).ToArray()));

        var project = ProjectLoader.Load(main);

        Assert.Equal(expected, project.Sha256);
        Assert.Equal(["MSB", "LP1"], project.Equipment.Select(e => e.Id));
    }

    [Fact]
    public void Load_IncludedFileChanged_Sha256Changes()
    {
        var main = Write("main.yaml", Main);
        Write("b/one.yaml", One);
        var before = ProjectLoader.Load(main).Sha256;
        Write("b/one.yaml", One.Replace("length: 40", "length: 41", StringComparison.Ordinal));

        Assert.NotEqual(before, ProjectLoader.Load(main).Sha256);
    }

    [Fact]
    public void Load_ErrorInIncludedFile_NamesThatFileAndLine()
    {
        var main = Write("main.yaml", Main);
        Write("b/one.yaml", One.Replace("size: 12 AWG", "size: 13 AWG", StringComparison.Ordinal));

        var error = Assert.Single(Errors(main));

        Assert.Equal((Path.Combine(_folder.FullName, "b", "one.yaml"), 11), (error.Location.File, error.Location.Line));
    }

    [Fact]
    public void Load_IncludeCycle_IsAnErrorAtTheInclude()
    {
        var main = Write("main.yaml", Main);
        Write("b/one.yaml", "include:\n  - two.yaml\n" + One);
        Write("b/two.yaml", "include:\n  - one.yaml\nequipment:\n  - { id: S2, kind: splitter, from: MSB }\n");

        var error = Assert.Single(Errors(main));

        Assert.Contains("include cycle:", error.Message, StringComparison.Ordinal);
        Assert.EndsWith("b/two.yaml", error.Location.File, StringComparison.Ordinal);
        Assert.Equal(2, error.Location.Line);
    }

    [Fact]
    public void Load_IncludedTwice_IsAnError()
    {
        var main = Write("main.yaml", Main.Replace("  - b/one.yaml", "  - b/one.yaml\n  - b/../b/one.yaml", StringComparison.Ordinal));
        Write("b/one.yaml", One);

        var error = Assert.Single(Errors(main));

        Assert.Contains("is included twice", error.Message, StringComparison.Ordinal);
        Assert.Equal((main, 6), (error.Location.File, error.Location.Line));
    }

    [Theory]
    [InlineData("../outside.yaml", "outside the project's folder")]
    [InlineData("/etc/hostname", "relative to the including file")]
    [InlineData("b/missing.yaml", "no such file")]
    public void Load_BadIncludePath_IsAnErrorAtTheEntry(string path, string expected)
    {
        var main = Write("sub/main.yaml", Main.Replace("b/one.yaml", path, StringComparison.Ordinal));
        Write("outside.yaml", One);

        var error = Assert.Single(Errors(main));

        Assert.Contains(expected, error.Message, StringComparison.Ordinal);
        Assert.Equal((main, 5, 5), (error.Location.File, error.Location.Line, error.Location.Column));
    }

    [Fact]
    public void Load_IncludedFileWithAService_IsAnUnknownKey()
    {
        var main = Write("main.yaml", Main);
        Write("b/one.yaml", "service: { id: X, system: 120 }\n" + One);

        var error = Assert.Single(Errors(main));

        Assert.Contains("unknown key 'service' in the included file", error.Message, StringComparison.Ordinal);
        Assert.Equal(1, error.Location.Line);
    }

    [Fact]
    public void Load_DuplicateIdAcrossFiles_NamesTheOtherFile()
    {
        var main = Write("main.yaml", Main);
        Write("b/one.yaml", One.Replace("id: LP1", "id: MSB", StringComparison.Ordinal));

        var error = Assert.Single(Errors(main));

        Assert.Contains($"first given at {main}:7", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Load_IncludeLinkedToDevZero_RefusedWithoutReadingIt()
    {
        var main = Write("main.yaml", Main);
        Directory.CreateDirectory(Path.Combine(_folder.FullName, "b"));
        File.CreateSymbolicLink(Path.Combine(_folder.FullName, "b", "one.yaml"), "/dev/zero");

        var error = Assert.Single(Errors(main));

        Assert.Equal((main, 5, 5), (error.Location.File, error.Location.Line, error.Location.Column));
        Assert.Equal(ProjectMessages.IncludeLinksOutside("b/one.yaml"), error.Message);
    }

    [Theory]
    [InlineData("file")]
    [InlineData("folder")]
    [InlineData("relative")]
    public void Load_IncludeLinkLeavingTheFolder_LocatedErrorShowingNothingOfTheTarget(string how)
    {
        var outside = Directory.CreateTempSubdirectory("disttree-outside-");
        try
        {
            var secret = Path.Combine(outside.FullName, "one.yaml");
            File.WriteAllText(secret, "root:x:0:0:root:/root:/bin/bash\nsecond secret line\n");
            var main = Write("p/main.yaml", Main);
            var link = Path.Combine(_folder.FullName, "p", "b");
            switch (how)
            {
                case "file":
                    Directory.CreateDirectory(link);
                    File.CreateSymbolicLink(Path.Combine(link, "one.yaml"), secret);
                    break;
                case "folder":
                    Directory.CreateSymbolicLink(link, outside.FullName);
                    break;
                default:
                    Directory.CreateDirectory(link);
                    File.CreateSymbolicLink(Path.Combine(link, "one.yaml"), Path.GetRelativePath(link, secret));
                    break;
            }

            var error = Assert.Single(Errors(main));

            Assert.Equal((main, 5, 5), (error.Location.File, error.Location.Line, error.Location.Column));
            Assert.Equal(ProjectMessages.IncludeLinksOutside("b/one.yaml"), error.Message);
        }
        finally
        {
            outside.Delete(recursive: true);
        }
    }

    [Fact]
    public void Load_IncludeLinkInsideTheFolder_Read()
    {
        var main = Write("main.yaml", Main.Replace("b/one.yaml", "c/link.yaml", StringComparison.Ordinal));
        Write("b/one.yaml", One);
        Directory.CreateDirectory(Path.Combine(_folder.FullName, "c"));
        File.CreateSymbolicLink(Path.Combine(_folder.FullName, "c", "link.yaml"), "../b/one.yaml");

        var project = ProjectLoader.Load(main);

        Assert.Contains(project.Equipment, e => e.Id == "LP1");
    }

    [Fact]
    public void Load_IncludedFileOfPlainText_ErrorShowsItsFirstLineCut()
    {
        var main = Write("main.yaml", Main);
        Write("b/one.yaml", "root:x:0:0:root:/root:/bin/bash:with:a:long:first:line\nsecond secret line\nthird\n");

        var error = Assert.Single(Errors(main));

        Assert.Equal("an included file is a mapping holding 'equipment:' (and 'include:'); found 'root:x:0:0:root:/root:/bin/bash:with:a:l...'", error.Message);
    }

    [Fact]
    public void Load_MainFileDevZero_IOExceptionNotARegularFile()
    {
        var e = Assert.Throws<IOException>(() => ProjectLoader.Load("/dev/zero"));

        Assert.StartsWith("it is not a regular file", e.Message, StringComparison.Ordinal);
    }

    // Opening a pipe for reading waits for a writer (POSIX open(2)): a pipe given as the project, or included, is
    // refused before it is opened, so nothing waits. Run on a task that must end within 30 s (else a TimeoutException).
    [Fact]
    public async Task Load_MainFileOrIncludeIsAPipe_RefusedWithoutWaiting()
    {
        var pipe = Path.Combine(_folder.FullName, "pipe.yaml");
        DistTree.Tests.Cli.Tool.Run("mkfifo", pipe);
        var main = Write("main.yaml", Main);
        Directory.CreateDirectory(Path.Combine(_folder.FullName, "b"));
        File.CreateSymbolicLink(Path.Combine(_folder.FullName, "b", "one.yaml"), pipe);

        var (mainMessage, includeMessage) = await Task.Run(() => (Assert.Throws<IOException>(() => ProjectLoader.Load(pipe)).Message, Assert.Single(Errors(main)).Message))
            .WaitAsync(TimeSpan.FromSeconds(30));

        Assert.StartsWith("it is not a regular file", mainMessage, StringComparison.Ordinal);
        Assert.Contains("not a regular file", includeMessage, StringComparison.Ordinal);
    }

    [Fact]
    public void Load_IncludeIsAFolder_SaysItIsAFolder()
    {
        var main = Write("main.yaml", Main);
        Directory.CreateDirectory(Path.Combine(_folder.FullName, "b", "one.yaml"));

        var error = Assert.Single(Errors(main));

        Assert.Equal("cannot read the included file 'b/one.yaml': it is a folder, not a file", error.Message.Replace(_folder.FullName + "/", "", StringComparison.Ordinal));
    }

    [Fact]
    public void Load_IncludedFileOfShortLines_ErrorShowsTheFirstLineOnly()
    {
        var main = Write("main.yaml", Main);
        Write("b/one.yaml", "short\nsecond secret line\n");

        var error = Assert.Single(Errors(main));

        Assert.EndsWith("found 'short...'", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("")]
    [InlineData("\n\n")]
    [InlineData("# only a comment\n  # and another\n")]
    [InlineData("---\n# nothing\n...\n")]
    public void Load_IncludedFileEmptyOrCommentsOnly_ErrorInThatFile(string text)
    {
        var main = Write("main.yaml", Main);
        Write("b/one.yaml", text);

        var error = Assert.Single(Errors(main));

        Assert.Equal(ProjectMessages.IncludedHoldsNothing(), error.Message);
        Assert.Equal((1, 1), (error.Location.Line, error.Location.Column));
        Assert.EndsWith("b/one.yaml", error.Location.File, StringComparison.Ordinal);
    }

    [Fact]
    public void Load_IncludedFileNotUtf8_LocatedAtTheByteWithItsOffset()
    {
        var main = Write("main.yaml", Main);
        Write("b/one.yaml", One);
        var one = Path.Combine(_folder.FullName, "b", "one.yaml");
        File.WriteAllBytes(one, [.. "equipment:\n  - id: L\u00e9"u8, 0xFF, .. "\n"u8]);

        var error = Assert.Single(Errors(main));

        Assert.Equal((2, 11), (error.Location.Line, error.Location.Column));
        Assert.Equal("the file is not UTF-8 text: the byte 0xFF at offset 22 does not decode; save the file as UTF-8", error.Message);
    }

    private string Write(string relative, string text)
    {
        var path = Path.Combine(_folder.FullName, relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text);
        return path;
    }

    private static Diagnostic[] Errors(string main)
    {
        var e = Assert.Throws<ProjectException>(() => ProjectLoader.Load(main));
        return e.Diagnostics.Where(d => d.Severity == Severity.Error).ToArray();
    }
}
