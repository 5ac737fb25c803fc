using System.Security.Cryptography;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// The tables a project brings (<c>rules: conductor_catalog</c>, <c>rules: grounding_table</c>), read by the loader:
/// held on the rules as loaded objects, listed among the project's files, and every error located, at the key for a
/// path that cannot be read, at the line and column in the file for a bad line.
/// </summary>
public sealed class TableFileReaderTests : IDisposable
{
    private const string Both = ", conductor_catalog: tables/own.tsv, grounding_table: tables/ground.tsv";

    private readonly OwnTablesFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Load_BothTables_HeldOnTheRules()
    {
        var project = ProjectLoader.Load(_folder.Write("p.yaml", OwnTablesFolder.Project(Both)));

        var catalog = project.Rules.ConductorCatalog!;
        Assert.EndsWith("tables/own.tsv", catalog.SourceName, StringComparison.Ordinal);
        Assert.Equal(OwnTablesFolder.CatalogueSource, catalog.Header[0]);
        Assert.Equal(80, catalog.TableAmpacityA(ConductorSize.Parse("3 AWG"), Material.Copper, 75));
        Assert.Equal(100, ConductorCatalog.Standard.TableAmpacityA(ConductorSize.Parse("3 AWG"), Material.Copper, 75)); // NEC Table 310.16 (read)
        var table = project.Rules.GroundingTable!;
        Assert.EndsWith("tables/ground.tsv", table.SourceName, StringComparison.Ordinal);
        Assert.Equal("6 AWG", table.SizeFor(100, Material.Copper)!.Value.Text);
    }

    // The tables join the files read, after the main file: their hashes count in the project's SHA-256 and --apply to a
    // folder copies them to the same place.
    [Fact]
    public void Load_BothTables_AmongTheFilesAndInTheHash()
    {
        var main = _folder.Write("p.yaml", OwnTablesFolder.Project(Both));
        var project = ProjectLoader.Load(main);

        Assert.Equal(["p.yaml", "tables/own.tsv", "tables/ground.tsv"], project.Files.Select(f => f.PathInProject));
        var digests = new[] { main, Path.Combine(_folder.FullName, "tables", "own.tsv"), Path.Combine(_folder.FullName, "tables", "ground.tsv") }
            .SelectMany(f => SHA256.HashData(File.ReadAllBytes(f))).ToArray();
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(digests)), project.Sha256);
    }

    [Fact]
    public void Load_NoTables_NoneOnTheRules()
    {
        var project = ProjectLoader.Load(_folder.Write("p.yaml", OwnTablesFolder.Project()));
        Assert.Null(project.Rules.ConductorCatalog);
        Assert.Null(project.Rules.GroundingTable);
        Assert.Single(project.Files);
    }

    // A path that cannot be read is an error at its key in the project file (line 3: the rules line; the keys are in a
    // flow mapping, so at the key's own column).
    [Theory]
    [InlineData("conductor_catalog", "tables/none.tsv", "cannot read the file 'conductor_catalog' names, '")]
    [InlineData("conductor_catalog", "../outside.tsv", "'../outside.tsv' is outside the project's folder")]
    [InlineData("grounding_table", "/etc/hostname", "'grounding_table' is a path relative to the project file")]
    [InlineData("grounding_table", "tables", "cannot read the file 'grounding_table' names, '")]
    public void Load_PathNotRead_ErrorAtTheKey(string key, string path, string message)
    {
        var text = OwnTablesFolder.Project($", {key}: {path}");
        var main = _folder.Write("sub/p.yaml", text);
        _folder.Write("outside.tsv", OwnTablesFolder.GroundingTable);
        _folder.Write("sub/tables/x.tsv", OwnTablesFolder.GroundingTable);

        var error = Assert.Single(Errors(main));

        Assert.StartsWith(message, error.Message, StringComparison.Ordinal);
        var line = text.Split('\n')[2];
        Assert.Equal((main, 3, line.IndexOf(key, StringComparison.Ordinal) + 1), (error.Location.File, error.Location.Line, error.Location.Column));
    }

    // A bad cell of the catalogue: line 57 of the file (the embedded file's line 56, below the added header line), at the
    // x_pvc cell's column ("3 AWG", tab, "kft", tab: column 11).
    [Fact]
    public void Load_BadCatalogueCell_LocatedInTheCatalogue()
    {
        var own = Path.Combine(_folder.FullName, "tables", "own.tsv");
        File.WriteAllText(own, File.ReadAllText(own).Replace("3 AWG\tkft\t0.047", "3 AWG\tkft\tx0.047", StringComparison.Ordinal));

        var error = Assert.Single(Errors(_folder.Write("p.yaml", OwnTablesFolder.Project(Both))));

        Assert.Equal((own, 57, 11), (error.Location.File, error.Location.Line, error.Location.Column));
        Assert.Equal("column x_pvc: 'x0.047' is not a positive number", error.Message);
    }

    [Fact]
    public void Load_BadGroundingTableLine_LocatedInTheTable()
    {
        var ground = _folder.Write("tables/ground.tsv", OwnTablesFolder.GroundingTable.Replace("60\t10 AWG", "10\t10 AWG", StringComparison.Ordinal));

        var error = Assert.Single(Errors(_folder.Write("p.yaml", OwnTablesFolder.Project(Both))));

        Assert.Equal((ground, 4, 1), (error.Location.File, error.Location.Line, error.Location.Column));
        Assert.Equal("column device_a: 10 A is not above the row before it (15 A); the rows ascend by rating", error.Message);
    }

    // Errors in the project file and in a table are reported together, each in its own file.
    [Fact]
    public void Load_ErrorsInBothFiles_EachInItsFile()
    {
        _folder.Write("tables/ground.tsv", "device_a\tcu\tal\n15\t14 AWG\t12 AWG\n");
        var main = _folder.Write("p.yaml", OwnTablesFolder.Project(Both).Replace("size: 3 AWG", "size: 3 furlongs", StringComparison.Ordinal));

        var errors = Errors(main);

        Assert.Equal(2, errors.Length);
        Assert.Equal(main, errors[0].Location.File);
        Assert.EndsWith("tables/ground.tsv", errors[1].Location.File, StringComparison.Ordinal);
        Assert.StartsWith("the table states no source", errors[1].Message, StringComparison.Ordinal);
    }

    private static Diagnostic[] Errors(string main)
    {
        var e = Assert.Throws<ProjectException>(() => ProjectLoader.Load(main));
        return e.Diagnostics.Where(d => d.Severity == Severity.Error).ToArray();
    }
}
