using DistTree.Generating;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Solving;

namespace DistTree.Tests.Generating;

/// <summary>ProjectGenerator: deterministic, valid, invented projects of the size asked for.</summary>
public sealed class ProjectGeneratorTests
{
    [Fact]
    public void Generate_SameSeed_SameText()
    {
        Assert.Equal(ProjectGenerator.Generate(3000, 3, 42), ProjectGenerator.Generate(3000, 3, 42));
    }

    [Fact]
    public void Generate_OtherSeed_OtherText()
    {
        Assert.NotEqual(ProjectGenerator.Generate(500, 3, 1), ProjectGenerator.Generate(500, 3, 2));
    }

    [Theory]
    [InlineData(1, 1, 1UL)]
    [InlineData(7, 2, 3UL)]
    [InlineData(100, 3, 7UL)]
    [InlineData(2500, 4, 11UL)]
    [InlineData(20000, 3, 12345UL)]
    [InlineData(5000, 8, ulong.MaxValue)]
    public void Generate_AnySizeAndSeed_ValidatesWithExactlyThatManyEndPoints(int endPoints, int depth, ulong seed)
    {
        var project = ProjectLoader.Parse(ProjectGenerator.Generate(endPoints, depth, seed), "generated.yaml");
        var network = NetworkBuilder.Build(project);

        Assert.Equal(endPoints, network.Nodes.Count(n => n.Kind == NodeKind.EndPoint));
        Assert.Empty(project.Warnings);
    }

    [Fact]
    public void Generate_Solved_AFewPercentOfBranchCircuitsFail()
    {
        var solution = Analysis.Parse(ProjectGenerator.Generate(20000, 3, 5), "g.yaml").Solution;
        var branches = solution.Runs.Where(r => r.Kind == RunResultKind.Branch).ToArray();
        var failing = branches.Count(r => r.Findings.Count > 0) / (double)branches.Length;
        var feedersFailing = solution.Runs.Count(r => r.Kind != RunResultKind.Branch && r.Findings.Count > 0);

        Assert.InRange(failing, 0.02, 0.05);
        Assert.Equal(0, feedersFailing);
    }

    [Fact]
    public void Generate_Text_SaysItIsInvented()
    {
        var text = ProjectGenerator.Generate(10);

        Assert.Contains("Invented", text, StringComparison.Ordinal);
        Assert.Contains("describes no real site", text, StringComparison.Ordinal);
    }

    // tap_percent is the nameplate's primary tap: a boosted transformer has a negative one, and none a positive one.
    [Fact]
    public void Generate_BoostedTransformers_HaveNegativeTaps()
    {
        var text = ProjectGenerator.Generate(3000, 3, 7);

        Assert.Contains("tap_percent: -2.5\n", text, StringComparison.Ordinal);
        Assert.DoesNotContain("tap_percent: 2.5", text, StringComparison.Ordinal);
        Assert.DoesNotContain("tap_percent: 5", text, StringComparison.Ordinal);
    }

    // An ideal transformer: V2 = V1·N2/N1. A primary tap t adds t % to N1, so V2 is 1/(1 + t/100) of its rating:
    // -2.5 % gives 1/0.975 = 1.025641…, +2.5 % gives 1/1.025 = 0.975609….
    [Theory]
    [InlineData(-2.5, 2.564102564102564)]
    [InlineData(-5, 5.263157894736842)]
    [InlineData(0, 0)]
    [InlineData(2.5, -2.439024390243902)]
    public void TapBoostPercent_PrimaryTap_RaisesTheSecondaryByTheTurnsRatio(double tapPercent, double expectedPercent)
    {
        Assert.Equal(expectedPercent, ProjectGenerator.TapBoostPercent(tapPercent), 12);
    }

    [Theory]
    [InlineData(0, 3)]
    [InlineData(ProjectGenerator.MaxEndPoints + 1, 3)]
    [InlineData(10, 0)]
    [InlineData(10, ProjectGenerator.MaxDepth + 1)]
    public void Generate_OutOfRange_Throws(int endPoints, int depth)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => ProjectGenerator.Generate(endPoints, depth));
    }
}
