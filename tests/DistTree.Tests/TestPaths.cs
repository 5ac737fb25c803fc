namespace DistTree.Tests;

/// <summary>Paths of the repository and of the test cases copied beside the test assembly.</summary>
internal static class TestPaths
{
    /// <summary>The repository root (the folder holding DistTree.sln).</summary>
    public static string RepoRoot { get; } = FindRoot();

    /// <summary>The test cases folder copied to the output (Cases/**).</summary>
    public static string Cases => Path.Combine(AppContext.BaseDirectory, "Cases");

    /// <summary>Every project file in projects/.</summary>
    public static IEnumerable<string> ProjectFiles() =>
        Directory.EnumerateFiles(Path.Combine(RepoRoot, "projects"), "*.yaml").Order(StringComparer.Ordinal);

    private static string FindRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "DistTree.sln")))
            {
                return dir.FullName;
            }
        }

        throw new InvalidOperationException("DistTree.sln not found above the test assembly");
    }
}
