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

    public void Dispose() => Directory.Delete(Path, recursive: true);
}
