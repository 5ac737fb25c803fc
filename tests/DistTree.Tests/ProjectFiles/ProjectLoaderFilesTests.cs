using System.Security.Cryptography;
using System.Text;
using DistTree.Model;
using DistTree.ProjectFiles;
using DistTree.Tests.Cli;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// <see cref="Project.Files"/>: every file the loader read, in the order read, with what it was (its identity) and
/// what it held (length, SHA-256), so that a command can refuse to write over any of them and check them unchanged.
/// </summary>
public sealed class ProjectLoaderFilesTests
{
    private const string Main = """
        disttree: 1
        project: { name: Files test, units: imperial }
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
              - { id: "1", poles: 1, ocpd: 20, load: { va: 1000 }, run: { length: 40, size: 12 AWG } }
        """;

    private static string Sha256(string path) => Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(path)));

    [Fact]
    public void Load_OneFile_ItsNameIdentityLengthAndHash()
    {
        var path = Path.Combine(TestPaths.RepoRoot, "projects", "small-office.yaml");

        var project = ProjectLoader.Load(path);

        var file = Assert.Single(project.Files);
        Assert.Equal(new SourceFile(path, path, FileIdentity.Of(path).Identity, new FileInfo(path).Length, Sha256(path), "small-office.yaml"), file);
        Assert.NotNull(file.Identity);
        Assert.Equal(project.Sha256, file.Sha256);
    }

    [Fact]
    public void Load_Campus_EveryFileInTheOrderRead()
    {
        var folder = Path.Combine(TestPaths.RepoRoot, "projects", "campus");

        var project = ProjectLoader.Load(Path.Combine(folder, "campus.yaml"));

        Assert.Equal(["campus.yaml", "buildings/north-hall.yaml", "buildings/south-lab.yaml"], project.Files.Select(f => f.PathInProject));
        Assert.All(project.Files, f => Assert.Equal((FileKind.Regular, f.Identity), FileIdentity.Of(Path.Combine(folder, f.PathInProject!))));
        Assert.All(project.Files, f => Assert.Equal(Sha256(f.FullPath), f.Sha256));
        Assert.Equal(3, project.Files.Select(f => f.Identity).Distinct().Count());
    }

    [Fact]
    public void Load_IncludeThroughALinkedFolder_PathInProjectAsWrittenAndIdentityOfTheFileReached()
    {
        using var folder = new TempFolder();
        File.WriteAllText(folder.File("main.yaml"), Main);
        Directory.CreateDirectory(folder.File("real"));
        File.WriteAllText(Path.Combine(folder.Path, "real", "one.yaml"), One);
        Directory.CreateSymbolicLink(folder.File("b"), "real");

        var project = ProjectLoader.Load(folder.File("main.yaml"));

        var one = project.Files[1];
        Assert.Equal("b/one.yaml", one.PathInProject);
        Assert.Equal(Path.Combine(folder.Path, "real", "one.yaml"), one.FullPath);
        Assert.Equal(FileIdentity.Of(Path.Combine(folder.Path, "real", "one.yaml")).Identity, one.Identity);
    }

    [Theory]
    [InlineData("main.yaml", "b/one.yaml", "b/one.yaml")]
    [InlineData("main.yaml", "./b/./one.yaml", "b/one.yaml")]
    [InlineData("b/one.yaml", "../c/two.yaml", "c/two.yaml")]
    [InlineData("b/one.yaml", "two.yaml", "b/two.yaml")]
    [InlineData("main.yaml", "../up.yaml", null)]
    [InlineData("b/one.yaml", "../../up.yaml", null)]
    [InlineData(null, "two.yaml", null)]
    public void InProject_IncludePathFromAFile_JoinedAsWritten(string? from, string path, string? expected) =>
        Assert.Equal(expected, IncludeReader.InProject(from, path));

    [Fact]
    public void Load_FromASource_EveryFileReadFromItAndNamedByIt()
    {
        using var folder = new TempFolder();
        var source = new MemorySource(new()
        {
            [folder.File("main.yaml")] = Main,
            [Path.Combine(folder.Path, "b", "one.yaml")] = One,
        });

        var project = ProjectLoader.Load(folder.File("main.yaml"), source);

        Assert.Equal(["mem:main.yaml", "mem:b/one.yaml"], project.Files.Select(f => f.Name));
        Assert.All(project.Files, f => Assert.Null(f.Identity));
        Assert.Contains(project.Equipment, e => e.Id == "LP1");
        Assert.Equal("mem:b/one.yaml", project.Equipment.Single(e => e.Id == "LP1").Location.File);
        Assert.Empty(Directory.GetFileSystemEntries(folder.Path)); // nothing on disk was needed
    }

    [Fact]
    public void Load_FromASourceWithoutTheIncludedFile_LocatedErrorAtTheInclude()
    {
        using var folder = new TempFolder();
        var source = new MemorySource(new() { [folder.File("main.yaml")] = Main });
        File.WriteAllText(folder.File("main.yaml"), Main);
        Directory.CreateDirectory(folder.File("b"));
        File.WriteAllText(Path.Combine(folder.Path, "b", "one.yaml"), One); // on disk, but not in the source

        var e = Assert.Throws<DistTree.Diagnostics.ProjectException>(() => ProjectLoader.Load(folder.File("main.yaml"), source));

        Assert.Equal("mem:main.yaml:5:5: error: cannot read the included file 'mem:b/one.yaml': no such file", Assert.Single(e.Diagnostics).ToString());
    }

    // Files held in memory, named 'mem:' and their path in the folder of the first.
    private sealed class MemorySource(Dictionary<string, string> files) : IProjectFileSource
    {
        private readonly string _folder = Path.GetDirectoryName(files.Keys.First())!;

        public string NameOf(string fullPath) => "mem:" + Path.GetRelativePath(_folder, fullPath);

        public byte[] Read(string fullPath) =>
            files.TryGetValue(fullPath, out var text) ? Encoding.UTF8.GetBytes(text) : throw new FileNotFoundException("no such file");
    }
}
