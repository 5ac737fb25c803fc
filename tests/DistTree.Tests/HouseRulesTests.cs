namespace DistTree.Tests;

/// <summary>
/// The house rules of DEVELOPERS.md that a tool can check: short source files (no file over 400 lines), so that
/// a change lands in a room that fits it. Common practice of the codebases in STYLE.md, no outside source.
/// </summary>
public sealed class HouseRulesTests
{
    private const int MaxLines = 400;

    [Fact]
    public void SourceFiles_AreAtMost400Lines()
    {
        var tooLong = new[] { "src", "tests" }
            .SelectMany(folder => Directory.EnumerateFiles(Path.Combine(TestPaths.RepoRoot, folder), "*.cs", SearchOption.AllDirectories))
            .Where(path => !IsBuildOutput(path))
            .Select(path => (Path: Path.GetRelativePath(TestPaths.RepoRoot, path), Lines: File.ReadLines(path).Count()))
            .Where(file => file.Lines > MaxLines)
            .Select(file => $"{file.Path}: {file.Lines} lines")
            .Order(StringComparer.Ordinal)
            .ToArray();

        Assert.True(tooLong.Length == 0, "over " + MaxLines + " lines:\n" + string.Join("\n", tooLong));
    }

    private static bool IsBuildOutput(string path)
    {
        var parts = path.Split(Path.DirectorySeparatorChar);
        return parts.Contains("bin") || parts.Contains("obj");
    }
}
