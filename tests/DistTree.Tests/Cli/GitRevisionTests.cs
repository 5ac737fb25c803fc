using System.Text.Json;
using DistTree.Tests.Comparing;

namespace DistTree.Tests.Cli;

/// <summary>
/// <c>compare FILE --against REV</c> reads the project as it was at the revision: the project file and every file it
/// includes from the revision's tree (git cat-file), none from the working tree. Each test makes a git repository of
/// its own in a temporary folder.
/// </summary>
public sealed class GitRevisionTests : IDisposable
{
    private const string Include = "include:\n  - feeders/extra.yaml\n";
    private readonly TempFolder _folder = new();

    public void Dispose()
    {
        foreach (var file in Directory.EnumerateFiles(_folder.Path, "*", SearchOption.AllDirectories))
        {
            File.SetAttributes(file, FileAttributes.Normal); // git makes its objects read-only
        }

        _folder.Dispose();
    }

    private string Write(string name, string text)
    {
        var path = Path.Combine(_folder.Path, name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text);
        return path;
    }

    private void Commit()
    {
        Tool.RunIn(_folder.Path, "git", "init", "--quiet");
        Tool.RunIn(_folder.Path, "git", "add", ".");
        Tool.RunIn(_folder.Path, "git", "-c", "user.name=Test", "-c", "user.email=test@example.invalid", "-c", "commit.gpgsign=false", "commit", "--quiet", "-m", "first");
    }

    private static string Feeder(string length) => "equipment:\n" + ComparisonProjects.SubPanel.Replace("length: 15,", $"length: {length},", StringComparison.Ordinal);

    [Fact]
    public void Compare_OnlyAnIncludedFileChanged_ReportsTheChange()
    {
        var main = Write(Path.Combine("designs", "site.yaml"), ComparisonProjects.Shared() + Include);
        var feeder = Write(Path.Combine("designs", "feeders", "extra.yaml"), Feeder("15"));
        Commit();
        File.WriteAllText(feeder, Feeder("60"));

        var result = CliRunner.Run("compare", main, "--against", "HEAD", "--json", "-");

        Assert.True(result.ExitCode is 0 or 1, result.Error);
        using var json = JsonDocument.Parse(result.Out);
        var changed = json.RootElement.GetProperty("equipment").EnumerateArray().Where(e => e.GetProperty("change").GetString() == "changed").ToArray();
        var sub = Assert.Single(changed);
        Assert.Equal("SUB", sub.GetProperty("id").GetString());
        Assert.Contains(sub.GetProperty("fields").EnumerateArray(), f => f.GetProperty("field").GetString() == "feeder.length_m");
    }

    [Fact]
    public void Compare_IncludedFileGoneFromTheWorkingTree_ReadFromTheRevision()
    {
        var main = Write(Path.Combine("designs", "site.yaml"), ComparisonProjects.Shared() + Include);
        var feeder = Write(Path.Combine("designs", "feeders", "extra.yaml"), Feeder("15"));
        Commit();
        File.Delete(feeder);
        File.WriteAllText(main, ComparisonProjects.Shared());

        var result = CliRunner.Run("compare", main, "--against", "HEAD");

        Assert.True(result.ExitCode is 0 or 1, result.Error);
        Assert.Contains("equipment 0 added, 1 removed", result.Out, StringComparison.Ordinal);
        Assert.Contains("- SUB", result.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_IncludedFileWrongAtTheRevision_ErrorNamesItAtTheRevision()
    {
        var main = Write(Path.Combine("designs", "site.yaml"), ComparisonProjects.Shared() + Include);
        var feeder = Write(Path.Combine("designs", "feeders", "extra.yaml"), Feeder("15").Replace("kind: panelboard", "kind: panelbored", StringComparison.Ordinal));
        Commit();
        File.WriteAllText(feeder, Feeder("15"));

        var result = CliRunner.Run("compare", main, "--against", "HEAD");

        Assert.Equal(2, result.ExitCode);
        Assert.StartsWith("HEAD:designs/feeders/extra.yaml:3:11: error: ", result.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_IncludedFileALinkAtTheRevision_NotReadThrough()
    {
        var main = Write(Path.Combine("designs", "site.yaml"), ComparisonProjects.Shared() + Include);
        Write(Path.Combine("designs", "real.yaml"), Feeder("15"));
        Directory.CreateDirectory(Path.Combine(_folder.Path, "designs", "feeders"));
        File.CreateSymbolicLink(Path.Combine(_folder.Path, "designs", "feeders", "extra.yaml"), "../real.yaml");
        Commit();

        var result = CliRunner.Run("compare", main, "--against", "HEAD");

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(
            "error: cannot read the included file 'HEAD:designs/feeders/extra.yaml': it is a symbolic link at revision 'HEAD'",
            result.Error,
            StringComparison.Ordinal);
    }
}
