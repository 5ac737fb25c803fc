using DistTree.Model;
using DistTree.ProjectFiles;

namespace DistTree.Tests.Cli.Commands;

/// <summary><c>disttree init</c>: the starter project validates and analyzes within limits; no file is replaced unless asked.</summary>
[Collection(WorkingDirectory.Name)]
public sealed class InitCommandTests
{
    // Every system DistTree knows, in both unit systems: the starter must load, and analyze with exit 0.
    public static TheoryData<string, string> SystemsAndUnits()
    {
        var data = new TheoryData<string, string>();
        foreach (var system in ElectricalSystem.Names)
        {
            data.Add(system, "imperial");
            data.Add(system, "metric");
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(SystemsAndUnits))]
    public void Init_EverySystemAndUnits_ValidatesAndAnalyzesWithinLimits(string system, string units)
    {
        using var folder = new TempFolder();
        var path = folder.File("p.yaml");

        var init = CliRunner.Run("init", "--system", system, "--units", units, "--output", path);
        var validate = CliRunner.Run("validate", path);
        var analyze = CliRunner.Run("analyze", path);

        Assert.Equal((0, ""), (init.ExitCode, init.Error));
        Assert.Equal((0, ""), (validate.ExitCode, validate.Error));
        Assert.Equal(0, analyze.ExitCode);
        Assert.Contains("Findings: none", analyze.Out, StringComparison.Ordinal);
        var project = ProjectLoader.Load(path);
        Assert.Equal(system, project.Service.System.Name);
        Assert.Equal(units == "metric" ? UnitSystem.Metric : UnitSystem.Imperial, project.Units);
        Assert.NotEmpty(project.Equipment.SelectMany(e => e.Circuits));
    }

    [Fact]
    public void Init_400Y230Metric_UsesMetricSizesAt50Hz()
    {
        using var folder = new TempFolder();
        var path = folder.File("clinic.yaml");

        Assert.Equal(0, CliRunner.Run("init", "--units", "metric", "--system", "400Y/230", "--output", path).ExitCode);

        var project = ProjectLoader.Load(path);
        var runs = project.Equipment.SelectMany(e => e.Circuits.Select(c => c.Run)).Append(project.Equipment.Single(e => e.Id == "LP1").Feeder!);
        Assert.All(runs, r => Assert.EndsWith("mm2", r.Size.Text, StringComparison.Ordinal));
        Assert.Equal(50, project.Service.FrequencyHz);
        Assert.Equal(30.0, project.Equipment.Single(e => e.Id == "LP1").Feeder!.LengthM, 9);
        Assert.Equal([1, 1, 2, 3], project.Equipment.Single(e => e.Id == "LP1").Circuits.Select(c => c.Poles));
    }

    [Fact]
    public void Init_208Y120Imperial_UsesAwgSizesAndFeet()
    {
        using var folder = new TempFolder();
        var path = folder.File("office.yaml");

        Assert.Equal(0, CliRunner.Run("init", "--output", path).ExitCode);

        var project = ProjectLoader.Load(path);
        var feeder = project.Equipment.Single(e => e.Id == "LP1").Feeder!;
        Assert.Equal(("208Y/120", UnitSystem.Imperial, "4 AWG"), (project.Service.System.Name, project.Units, feeder.Size.Text));
        Assert.Equal(100 * 0.3048, feeder.LengthM, 9); // 1 ft = 0.3048 m exactly (common practice)
    }

    [Theory]
    [InlineData("480D", new[] { 2, 3 })]      // no neutral: no 1-pole circuits
    [InlineData("120/240", new[] { 1, 1, 2 })] // single-phase: no 3-pole circuits
    [InlineData("230", new[] { 1, 1 })]       // two wires, line and neutral
    public void Init_System_OnlyCircuitsTheSystemCanGive(string system, int[] poles)
    {
        using var folder = new TempFolder();
        var path = folder.File("p.yaml");

        Assert.Equal(0, CliRunner.Run("init", "--system", system, "--output", path).ExitCode);

        Assert.Equal(poles, ProjectLoader.Load(path).Equipment.Single(e => e.Id == "LP1").Circuits.Select(c => c.Poles));
    }

    [Fact]
    public void Init_NoOutput_WritesProjectYamlInTheWorkingFolder()
    {
        using var folder = new TempFolder();
        CliResult? result = null;

        WorkingDirectory.In(folder.Path, () => result = CliRunner.Run("init"));

        Assert.Equal(0, result!.ExitCode);
        Assert.StartsWith("wrote project.yaml: a starter project under NEC 2020 on 208Y/120, lengths in feet", result.Out, StringComparison.Ordinal);
        Assert.Equal(["project.yaml"], Directory.GetFileSystemEntries(folder.Path).Select(Path.GetFileName));
    }

    [Fact]
    public void Init_FileExists_RefusedWithExitTwoAndFileUnchanged()
    {
        using var folder = new TempFolder();
        var path = folder.File("project.yaml");
        File.WriteAllText(path, "mine\n");

        var result = CliRunner.Run("init", "--output", path);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("already exists", result.Error, StringComparison.Ordinal);
        Assert.Equal("mine\n", File.ReadAllText(path));
        Assert.Single(Directory.GetFileSystemEntries(folder.Path));
    }

    [Fact]
    public void Init_FileExistsWithForce_Replaced()
    {
        using var folder = new TempFolder();
        var path = folder.File("project.yaml");
        File.WriteAllText(path, "mine\n");

        var result = CliRunner.Run("init", "--output", path, "--force");

        Assert.Equal(0, result.ExitCode);
        Assert.StartsWith("# A starter project written by 'disttree init'", File.ReadAllText(path), StringComparison.Ordinal);
    }

    [Fact]
    public void Init_UnknownSystem_ExitTwoNamingTheSystems()
    {
        using var folder = new TempFolder();

        var result = CliRunner.Run("init", "--system", "415Y/240", "--output", folder.File("p.yaml"));

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("unknown system '415Y/240'", result.Error, StringComparison.Ordinal);
        Assert.Empty(Directory.GetFileSystemEntries(folder.Path));
    }

    // Each code's starter: its usual service system and units, its rule set, and (CEC) the 120 V circuits through a 600 V
    // delta to 208Y/120 V dry-type transformer; each analyzes with no finding (exit 0).
    [Theory]
    [InlineData("nec", "208Y/120", UnitSystem.Imperial, "208Y/120")]
    [InlineData("cec", "600Y/347", UnitSystem.Metric, "208Y/120")]
    [InlineData("iec", "400Y/230", UnitSystem.Metric, "400Y/230")]
    public void Init_Code_WritesTheCodesUsualBuildingWithinLimits(string code, string service, UnitSystem units, string panelSystem)
    {
        using var folder = new TempFolder();
        var path = folder.File("starter.yaml");

        var written = CliRunner.Run("init", "--code", code, "--output", path);

        Assert.Equal(0, written.ExitCode);
        var project = ProjectLoader.Load(path);
        Assert.Contains($"under {DistTree.Codes.CodeRules.Describe(project.Rules.Code)} on {service}", written.Out, StringComparison.Ordinal);
        Assert.Equal((code, service, units), (DistTree.Vocabulary.Words.Code.Of(project.Rules.Code), project.Service.System.Name, project.Units));
        Assert.Equal(panelSystem, project.Equipment.Single(e => e.Id == "LP1").System.Name);
        Assert.Equal(0, CliRunner.Run("check", path).ExitCode);
    }

    [Fact]
    public void Init_StandardOutput_WritesTheProjectOnly()
    {
        var result = CliRunner.Run("init", "--output", "-", "--units", "metric");

        Assert.Equal(0, result.ExitCode);
        Assert.Equal("New building", ProjectLoader.Parse(result.Out, "stdout.yaml").Name);
    }
}
