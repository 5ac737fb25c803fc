using DistTree.Model;
using DistTree.ProjectFiles;
using DistTree.ProjectFiles.Writing;

namespace DistTree.Tests.ProjectFiles.Writing;

/// <summary>StarterProject: the file 'disttree init' writes (the command's own tests check that it validates and analyzes).</summary>
public sealed class StarterProjectTests
{
    public static TheoryData<string, UnitSystem> SystemsAndUnits()
    {
        var data = new TheoryData<string, UnitSystem>();
        foreach (var name in ElectricalSystem.Names)
        {
            data.Add(name, UnitSystem.Metric);
            data.Add(name, UnitSystem.Imperial);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(SystemsAndUnits))]
    public void Write_AnySystemAndUnits_ReadsBackAsTheDefaultRulesAndConductorDefaults(string name, UnitSystem units)
    {
        var project = ProjectLoader.Parse(StarterProject.Write(units, ElectricalSystem.Find(name)!), "starter.yaml");
        Assert.Equal(Rules.Default, project.Rules);
        Assert.Equal(ConductorDefaults.Standard, project.Defaults);
        Assert.Equal(units, project.Units);
        Assert.Equal(name, project.Service.System.Name);
    }

    public static TheoryData<ElectricalCode> Codes() => [.. Enum.GetValues<ElectricalCode>()];

    // Each code's starter on its usual system (and in its usual units) reads back as that code's defaults and analyzes
    // with no finding: the placeholders are sized within every rule of the code.
    [Theory]
    [MemberData(nameof(Codes))]
    public void Write_EachCodesUsualBuilding_ReadsBackAsItsDefaultsAndHasNoFinding(ElectricalCode code)
    {
        var system = StarterProject.DefaultSystem(code);
        var text = StarterProject.Write(StarterProject.DefaultUnits(code, system), system, code);
        var result = Analysis.Parse(text, "starter.yaml");
        Assert.Equal(DistTree.Codes.CodeRules.DefaultsOf(code), result.Project.Rules);
        Assert.Equal(system.Name, result.Project.Service.System.Name);
        Assert.Empty(result.Solution.AllFindings);
    }

    [Fact]
    public void Write_FirstCircuit_ExplainsEveryKeyAndTheOthersDoNot()
    {
        var lines = StarterProject.Write(UnitSystem.Imperial, ElectricalSystem.Find("208Y/120")!).Split('\n');
        var first = Array.FindIndex(lines, l => l.StartsWith("      - id: \"1\"", StringComparison.Ordinal));
        var second = Array.FindIndex(lines, l => l.StartsWith("      - id: \"2\"", StringComparison.Ordinal));
        Assert.All(lines[first..second], l => Assert.Contains(" # ", l, StringComparison.Ordinal));
        Assert.All(lines[second..(second + 8)], l => Assert.DoesNotContain("#", l, StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("400Y/230", UnitSystem.Metric)]
    [InlineData("230", UnitSystem.Metric)]
    [InlineData("208Y/120", UnitSystem.Imperial)]
    [InlineData("600D", UnitSystem.Imperial)]
    public void DefaultUnits_System_MetricFor230VSystemsOnly(string name, UnitSystem expected)
    {
        Assert.Equal(expected, StarterProject.DefaultUnits(ElectricalSystem.Find(name)!));
    }
}
