using System.Globalization;
using DistTree.Generating;
using DistTree.ProjectFiles;
using DistTree.ProjectFiles.Yaml;
using FsCheck;
using FsCheck.Fluent;
using Xunit.Abstractions;

namespace DistTree.Tests.ProjectFiles.Yaml;

/// <summary>
/// The fast YAML path against YamlDotNet: for every project and case file, generated projects and
/// fuzzed variants of them, the fast path either declines or builds the very tree YamlDotNet gives,
/// node for node (values, plain flags, line and column of every node).
/// </summary>
public sealed class FastYamlReaderTests(ITestOutputHelper output)
{
    private const int MutatedCases = 3000;

    public static TheoryData<string> AllFiles()
    {
        var data = new TheoryData<string>();
        var files = Directory.EnumerateFiles(Path.Combine(TestPaths.RepoRoot, "projects"), "*.yaml", SearchOption.AllDirectories)
            .Concat(Directory.EnumerateFiles(TestPaths.Cases, "*.yaml", SearchOption.AllDirectories));
        foreach (var file in files.Order(StringComparer.Ordinal))
        {
            data.Add(Path.GetRelativePath(TestPaths.RepoRoot, file));
        }

        return data;
    }

    public static TheoryData<string> DemoFiles()
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.EnumerateFiles(Path.Combine(TestPaths.RepoRoot, "projects"), "*.yaml", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
        {
            data.Add(Path.GetRelativePath(TestPaths.RepoRoot, file));
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(AllFiles))]
    public void TryRead_ProjectAndCaseFiles_DeclinesOrMatchesYamlDotNet(string file)
    {
        AssertDeclinesOrMatches(File.ReadAllText(Path.Combine(TestPaths.RepoRoot, file)), file);
    }

    [Theory]
    [MemberData(nameof(DemoFiles))]
    public void TryRead_DemoProjects_TakesFastPath(string file)
    {
        var text = File.ReadAllText(Path.Combine(TestPaths.RepoRoot, file));
        Assert.NotNull(FastYamlReader.TryRead(text, file));
        AssertDeclinesOrMatches(text, file);
    }

    [Theory]
    [InlineData(10, 1, 1UL)]
    [InlineData(300, 2, 7UL)]
    [InlineData(2000, 3, 42UL)]
    [InlineData(5000, 4, 99UL)]
    public void TryRead_GeneratedProjects_TakesFastPathAndMatches(int endPoints, int depth, ulong seed)
    {
        var text = ProjectGenerator.Generate(endPoints, depth, seed);
        Assert.NotNull(FastYamlReader.TryRead(text, "generated.yaml"));
        AssertDeclinesOrMatches(text, "generated.yaml");
    }

    [Theory]
    [InlineData("a: 1\n", true)]
    [InlineData("a:\n- x\n-\n- 'q'\nb:\n", true)]
    [InlineData("- - a\n  - b: c\n    d:\n-\n", true)]
    [InlineData("a: { b: [1, 2, ], c: \"x\\ty\\u00e9\", d: 'it''s' }\n", true)]
    [InlineData("a: [\n  1,\n  { b: c }\n  ]\n", true)]
    [InlineData("---\na: 1 # note\n", true)]
    [InlineData("a: &x 1\n", false)]
    [InlineData("a: *x\n", false)]
    [InlineData("a: !!str 1\n", false)]
    [InlineData("a: |\n  text\n", false)]
    [InlineData("a: one\n  two\n", false)]
    [InlineData("? a\n: b\n", false)]
    [InlineData("a:\n\tb: 1\n", false)]
    [InlineData("%YAML 1.2\n---\na: 1\n", false)]
    [InlineData("a: 1\n---\nb: 2\n", false)]
    [InlineData("a: [1, 2\n", false)]
    [InlineData("\"a\": 1\n", false)]
    public void TryRead_Snippet_TakesOrDeclinesFastPath(string text, bool fast)
    {
        Assert.Equal(fast, FastYamlReader.TryRead(text, "snippet.yaml") is not null);
        AssertDeclinesOrMatches(text, "snippet.yaml");
    }

    [Fact]
    public void TryRead_TooDeep_Declines()
    {
        var text = string.Concat(Enumerable.Range(0, ProjectLimits.MaxDepth + 1).Select(i => new string(' ', i * 2) + "a:\n")) + "b: 1\n";
        Assert.Null(FastYamlReader.TryRead(text, "deep.yaml"));
    }

    [Fact]
    public void TryRead_MutatedProjects_DeclinesOrMatchesYamlDotNet()
    {
        var seeds = ProjectLoaderFuzzTests.Seeds.Append(ProjectGenerator.Generate(200, 3, 5).Split('\n')).ToArray();
        var taken = 0;
        var property = Prop.ForAll(Arb.From(ProjectLoaderFuzzTests.CaseGen), fuzz =>
        {
            if (AssertDeclinesOrMatches(fuzz.Apply(seeds[fuzz.Seed % seeds.Length]), "fuzz.yaml"))
            {
                taken++;
            }
        });

        Check.One(Config.QuickThrowOnFailure.WithMaxTest(MutatedCases).WithQuietOnSuccess(true), property);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"fast path took {taken} of {MutatedCases} mutated files"));
        Assert.True(taken > MutatedCases / 10, $"the fast path took only {taken} of {MutatedCases} mutated files");
    }

    /// <summary>Asserts the fast path declines or equals YamlDotNet's tree; true when it did not decline.</summary>
    private static bool AssertDeclinesOrMatches(string text, string file)
    {
        var fast = FastYamlReader.TryRead(text, file);
        if (fast is null)
        {
            return false;
        }

        var bag = new DiagnosticBag();
        var reference = SourceTreeReader.Read(text, file, bag, YamlPath.YamlDotNet, out _);
        Assert.False(bag.HasErrors, $"the fast path read text YamlDotNet refuses:\n{string.Join('\n', bag.Sorted())}\n--- input ---\n{text}");
        Assert.NotNull(reference);
        if (SourceTreeComparer.Difference(reference!, fast) is { } difference)
        {
            Assert.Fail($"{difference}\n--- input ---\n{text}");
        }

        return true;
    }
}
