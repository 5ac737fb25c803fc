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
}
