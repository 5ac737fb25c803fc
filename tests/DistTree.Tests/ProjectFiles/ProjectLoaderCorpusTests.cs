using DistTree.Diagnostics;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// The bad-file corpus: Cases/bad/NAME.yaml holds one mistake each, NAME.expected every diagnostic
/// the loader must give for it, exactly, as <c>file:line:col: error: message</c>.
/// </summary>
public sealed class ProjectLoaderCorpusTests
{
    private static string BadFolder => Path.Combine(TestPaths.Cases, "bad");

    public static TheoryData<string> BadCases()
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.EnumerateFiles(BadFolder, "*.yaml").Order(StringComparer.Ordinal))
        {
            data.Add(Path.GetFileName(file));
        }

        return data;
    }

    [Fact]
    public void Corpus_HasAtLeast25Cases_EachWithExpectedFile()
    {
        var cases = Directory.GetFiles(BadFolder, "*.yaml");
        Assert.True(cases.Length >= 25, $"only {cases.Length} bad cases");
        Assert.All(cases, c => Assert.True(File.Exists(Path.ChangeExtension(c, ".expected")), $"{c} has no .expected file"));
    }

    [Theory]
    [MemberData(nameof(BadCases))]
    public void Parse_BadFile_ReportsExactlyTheExpectedDiagnostics(string name)
    {
        var text = File.ReadAllText(Path.Combine(BadFolder, name));
        var expected = File.ReadAllLines(Path.ChangeExtension(Path.Combine(BadFolder, name), ".expected"))
            .Where(l => l.Length > 0).ToArray();

        var error = Assert.Throws<ProjectException>(() => ProjectLoader.Parse(text, name));

        Assert.Equal(expected, error.Diagnostics.Select(d => d.ToString()).ToArray());
    }
}
