using DistTree.Tests.Solving;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// A temporary folder holding a project that brings its own tables (invented test data): <c>tables/own.tsv</c>, the
/// embedded catalogue with one figure changed (3 AWG copper at 75 °C: 80 A, where NEC Table 310.16 gives 100 A), and
/// <c>tables/ground.tsv</c>, a grounding table giving 6 AWG copper up to 100 A (where NEC Table 250.122 gives 8 AWG).
/// </summary>
internal sealed class OwnTablesFolder : IDisposable
{
    /// <summary>The first header line of the changed catalogue.</summary>
    public const string CatalogueSource = "Invented test catalogue: the embedded one with 3 AWG copper at 75 °C lowered to 80 A.";

    /// <summary>The grounding table's text.</summary>
    public const string GroundingTable = "# Invented test table, not a code's.\ndevice_a\tcu\tal\n15\t14 AWG\t12 AWG\n60\t10 AWG\t8 AWG\n100\t6 AWG\t4 AWG\n";

    private readonly DirectoryInfo _folder = Directory.CreateTempSubdirectory("disttree-tables-");

    public OwnTablesFolder()
    {
        var embedded = File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "src", "DistTree", "Conductors", "Data", "conductors.tsv"));
        const string Row = "3 AWG\tkft\t0.047\t0.059\t\t\t\t\t\t\t\t\t85\t100\t115";
        Assert.Contains(Row, embedded, StringComparison.Ordinal);
        Write("tables/own.tsv", $"# {CatalogueSource}\n" + embedded.Replace(Row, "3 AWG\tkft\t0.047\t0.059\t\t\t\t\t\t\t\t\t85\t80\t115", StringComparison.Ordinal));
        Write("tables/ground.tsv", GroundingTable);
    }

    /// <summary>The folder's full path.</summary>
    public string FullName => _folder.FullName;

    /// <summary>
    /// A 208Y/120 panel P on 10 m of 3 AWG copper under a 100 A device with a stated 8 AWG grounding conductor, feeding an
    /// 80 A three-phase load (its design current, not continuous), with <paramref name="rules"/> added to the rules.
    /// </summary>
    public static string Project(string rules = "") =>
        SolverHarness.PanelOnFeeder(
            "length: 10, size: 3 AWG, ocpd: 100, ground_size: 8 AWG",
            "{ id: \"1\", poles: 3, ocpd: 100, load: { amps: 80 }, run: { length: 3, size: 1/0 AWG } }")
        .Replace("rules: { conductor_temperature: rated }", $"rules: {{ conductor_temperature: rated{rules} }}", StringComparison.Ordinal);

    /// <summary>Writes <paramref name="text"/> at <paramref name="relative"/> in the folder; gives its full path.</summary>
    public string Write(string relative, string text)
    {
        var path = Path.Combine(_folder.FullName, relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text);
        return path;
    }

    public void Dispose() => _folder.Delete(recursive: true);
}
