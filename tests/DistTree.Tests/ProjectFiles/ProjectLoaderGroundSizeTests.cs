using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>ProjectLoader on a run's <c>ground_size</c> (docs/project-file.md): read as <c>size</c> is, in the same series.</summary>
public sealed class ProjectLoaderGroundSizeTests
{
    [Fact]
    public void Parse_GroundSize_StoredOnTheFeederAndTheBranchRun()
    {
        var text = Project("{ length: 20, size: 2/0 AWG, ground_size: 6 AWG, ocpd: 150 }", "{ length: 20, size: 12 AWG, ground_size: '#12' }");
        var panel = ProjectLoader.Parse(text, "t.yaml").Equipment[0];
        Assert.Equal(ConductorSize.Parse("6 AWG"), panel.Feeder!.GroundSize);
        Assert.Equal(ConductorSize.Parse("12 AWG"), panel.Circuits[0].Run.GroundSize);
    }

    [Fact]
    public void Parse_NoGroundSize_IsNull() =>
        Assert.Null(ProjectLoader.Parse(Project("{ length: 20, size: 2 AWG }", "{ length: 20, size: 12 AWG }"), "t.yaml").Equipment[0].Feeder!.GroundSize);

    [Theory]
    [InlineData("2 AWG", "10 mm2", "'ground_size' of the feeder of 'LP1' is 10 mm2, but its 'size' is 2 AWG: give both in AWG and kcmil, or both in mm2")]
    [InlineData("2 AWG", "7 AWG", "'7 AWG' is not a standard size; nearest: 8 AWG or 6 AWG")]
    public void Parse_GroundSizeWrong_IsAnErrorAtTheValue(string size, string ground, string message)
    {
        var text = Project($"{{ length: 20, size: {size}, ground_size: {ground} }}", "{ length: 20, size: 12 AWG }");
        var error = Assert.Throws<ProjectException>(() => ProjectLoader.Parse(text, "t.yaml"));
        var diagnostic = Assert.Single(error.Diagnostics);
        Assert.Equal((Severity.Error, message), (diagnostic.Severity, diagnostic.Message));
        Assert.StartsWith(ground, text.Split('\n')[diagnostic.Location.Line - 1][(diagnostic.Location.Column - 1)..], StringComparison.Ordinal);
    }

    private static string Project(string feeder, string run) =>
        "disttree: 1\nproject: { name: Keys }\nservice: { id: SVC, system: 208Y/120 }\nequipment:\n"
        + $"  - {{ id: LP1, kind: panelboard, from: SVC, feeder: {feeder}, circuits: [ {{ id: 1, poles: 1, load: {{ va: 1000 }}, run: {run} }} ] }}\n";
}
