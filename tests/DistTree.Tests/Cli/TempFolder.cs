namespace DistTree.Tests.Cli;

/// <summary>A fresh folder under the system's temporary folder, deleted on dispose.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder() => Directory.CreateDirectory(Path);

    public string Path { get; } = System.IO.Path.Combine(System.IO.Path.GetTempPath(), $"disttree-test-{Guid.NewGuid():N}");

    public string File(string name) => System.IO.Path.Combine(Path, name);

    /// <summary>Copies a file of projects/ into the folder and returns the copy's path.</summary>
    public string CopyProject(string name)
    {
        var copy = File(name);
        System.IO.File.Copy(System.IO.Path.Combine(TestPaths.RepoRoot, "projects", name), copy);
        return copy;
    }

    /// <summary>
    /// Gives the project file <paramref name="project"/> in the folder a terminal table of its own that limits no device
    /// (its one band is below any device's rating: sizing: terminal_table; docs/project-file.md), so that a test of
    /// --apply's edits sees the plan that conductor sizes alone give.
    /// </summary>
    public static void OpenTerminals(string project)
    {
        var table = System.IO.Path.Combine(System.IO.Path.GetDirectoryName(project)!, "open-terminals.tsv");
        System.IO.File.WriteAllText(table, "# test only: no terminal limit (one band below any device's rating)\ndevice_a\tsets\tawg\tmm2\n0.001\t1\t2000 kcmil\t300 mm2\n");
        var text = System.IO.File.ReadAllText(project);
        Assert.Equal(1, text.Split("\nservice:").Length - 1);
        System.IO.File.WriteAllText(project, text.Replace("\nservice:", "\nsizing: { terminal_table: open-terminals.tsv }\nservice:", StringComparison.Ordinal));
    }

    public void Dispose() => Directory.Delete(Path, recursive: true);
}
