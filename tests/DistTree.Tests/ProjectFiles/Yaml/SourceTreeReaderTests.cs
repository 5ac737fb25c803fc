using DistTree.Diagnostics;
using DistTree.ProjectFiles;
using DistTree.ProjectFiles.Yaml;

namespace DistTree.Tests.ProjectFiles.Yaml;

/// <summary>SourceTreeReader: the one entry point of the YAML readers, and the switch that forces YamlDotNet.</summary>
public sealed class SourceTreeReaderTests
{
    private const string Subset = "disttree: 1\nproject: { name: A }\nequipment:\n  - id: MDP\n    kind: switchboard\n";

    [Theory]
    [InlineData("yamldotnet")]
    [InlineData("YamlDotNet")]
    [InlineData(" yamldotnet ")]
    public void PathFrom_Yamldotnet_ForcesYamlDotNet(string value)
    {
        Assert.Equal(YamlPath.YamlDotNet, SourceTreeReader.PathFrom(value));
    }

    [Theory]
    [InlineData(null)]
    [InlineData("")]
    [InlineData("fast")]
    [InlineData("yamldotnet2")]
    public void PathFrom_OtherValueOrNone_Fast(string? value)
    {
        Assert.Equal(YamlPath.Fast, SourceTreeReader.PathFrom(value));
    }

    [Fact]
    public void DefaultPath_ThisProcess_FollowsTheVariable()
    {
        Assert.Equal(SourceTreeReader.PathFrom(Environment.GetEnvironmentVariable(SourceTreeReader.SwitchVariable)), SourceTreeReader.DefaultPath);
    }

    [Fact]
    public void Read_FastPathOnSubsetText_ReadByTheFastReader()
    {
        var root = SourceTreeReader.Read(Subset, "a.yaml", new DiagnosticBag(), YamlPath.Fast, out var readBy);
        Assert.NotNull(root);
        Assert.Equal(YamlPath.Fast, readBy);
    }

    [Fact]
    public void Read_FastPathOutsideTheSubset_HandedToYamlDotNet()
    {
        var root = SourceTreeReader.Read("a: |\n  text\n", "a.yaml", new DiagnosticBag(), YamlPath.Fast, out var readBy);
        Assert.NotNull(root);
        Assert.Equal(YamlPath.YamlDotNet, readBy);
    }

    [Fact]
    public void Read_YamlDotNetForcedOnSubsetText_ReadByYamlDotNetToTheSameTree()
    {
        var bag = new DiagnosticBag();
        var forced = SourceTreeReader.Read(Subset, "a.yaml", bag, YamlPath.YamlDotNet, out var readBy);
        var fast = SourceTreeReader.Read(Subset, "a.yaml", bag, YamlPath.Fast, out _);
        Assert.Equal(YamlPath.YamlDotNet, readBy);
        Assert.False(bag.HasErrors);
        Assert.Null(SourceTreeComparer.Difference(forced!, fast!));
    }

    [Fact]
    public void Read_YamlDotNetForcedOnBadText_ReportsTheError()
    {
        var bag = new DiagnosticBag();
        var root = SourceTreeReader.Read("a: *x\n", "a.yaml", bag, YamlPath.YamlDotNet, out _);
        Assert.NotNull(root);
        Assert.Contains(bag.Sorted(), d => d.Message.StartsWith("aliases ('*x') are not supported", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData(false, "\\U80000000")]
    [InlineData(false, "\\UFFFFFFFF")]
    [InlineData(false, "\\U00110000")]
    [InlineData(false, "\\uD800")]
    [InlineData(false, "\\uDFFF")]
    [InlineData(true, "\\U80000000")]
    [InlineData(true, "\\UFFFFFFFF")]
    [InlineData(true, "\\U00110000")]
    [InlineData(true, "\\uD800")]
    [InlineData(true, "\\uDFFF")]
    public void Read_EscapeNotAUnicodeScalar_LocatedErrorAtTheQuote(bool yamlDotNet, string escape)
    {
        var bag = new DiagnosticBag();

        var root = SourceTreeReader.Read("a: 1\nname: \"x \\\\U80000000 " + escape + "\"\n", "a.yaml", bag, yamlDotNet ? YamlPath.YamlDotNet : YamlPath.Fast, out _);

        Assert.Null(root);
        var error = Assert.Single(bag.Sorted());
        Assert.Equal(new SourceLocation("a.yaml", 2, 7), error.Location);
        Assert.StartsWith("invalid YAML: while scanning a quoted scalar, found invalid Unicode", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("\\U0010FFFF", "\U0010FFFF")]
    [InlineData("\\x41", "A")]
    [InlineData("\\uE000", "\uE000")]
    public void Read_EscapeAtTheEdgeOfUnicode_SameValueOnBothPaths(string escape, string value)
    {
        var text = "name: \"" + escape + "\"\n";
        var fast = SourceTreeReader.Read(text, "a.yaml", new DiagnosticBag(), YamlPath.Fast, out var readBy);
        var forced = SourceTreeReader.Read(text, "a.yaml", new DiagnosticBag(), YamlPath.YamlDotNet, out _);

        Assert.Equal(YamlPath.Fast, readBy);
        Assert.Null(SourceTreeComparer.Difference(forced!, fast!));
        Assert.Equal(value, ((SourceScalar)((SourceMapping)fast!).Entries[0].Value).Value);
    }

    [Theory]
    [InlineData(false, '\u2028')]
    [InlineData(false, '\u2029')]
    [InlineData(false, '\u0085')]
    [InlineData(true, '\u2028')]
    [InlineData(true, '\u2029')]
    [InlineData(true, '\u0085')]
    public void Read_UnicodeLineSeparators_NoLineBreakAndKeptInValues(bool yamlDotNet, char separator)
    {
        var text = $"# a comment {separator} with it\nname: A {separator} B\nquoted: \"C {separator} D\"\nlast: *x\n";
        var bag = new DiagnosticBag();

        var root = (SourceMapping)SourceTreeReader.Read(text, "a.yaml", bag, yamlDotNet ? YamlPath.YamlDotNet : YamlPath.Fast, out _)!;

        Assert.Equal($"A {separator} B", ((SourceScalar)root.Entries[0].Value).Value);
        Assert.Equal($"C {separator} D", ((SourceScalar)root.Entries[1].Value).Value);
        Assert.Equal(new SourceLocation("a.yaml", 4, 7), Assert.Single(bag.Sorted()).Location);
    }

    [Theory]
    [InlineData('\u2028')]
    [InlineData('\u0085')]
    public void Read_UnicodeLineSeparatorsNextToPrivateUseEscapes_SameTreeOnBothPaths(char separator)
    {
        var text = $"name: \"{separator} \\uE000 \\U0000E001 \\uE002 \uE003\"\nother: x{separator}y\n";
        var fast = SourceTreeReader.Read(text, "a.yaml", new DiagnosticBag(), YamlPath.Fast, out var readBy);
        var forced = SourceTreeReader.Read(text, "a.yaml", new DiagnosticBag(), YamlPath.YamlDotNet, out _);

        Assert.Equal(YamlPath.Fast, readBy);
        Assert.Null(SourceTreeComparer.Difference(forced!, fast!));
        Assert.Equal($"{separator} \uE000 \uE001 \uE002 \uE003", ((SourceScalar)((SourceMapping)forced!).Entries[0].Value).Value);
    }
}
