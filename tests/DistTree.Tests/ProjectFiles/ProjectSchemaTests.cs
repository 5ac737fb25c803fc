using System.Text.Json;
using System.Text.Json.Nodes;
using DistTree.ProjectFiles;
using Json.Schema;

namespace DistTree.Tests.ProjectFiles;

/// <summary>schema/project.schema.json: every project file passes it, and it lists the keys the loader reads.</summary>
public sealed class ProjectSchemaTests
{
    private const string SchemaComment = "# yaml-language-server: $schema=../schema/project.schema.json";

    private static readonly JsonSchema Schema =
        JsonSchema.FromText(File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "schema", "project.schema.json")));

    public static TheoryData<string> ProjectFileNames()
    {
        var data = new TheoryData<string>();
        foreach (var file in TestPaths.ProjectFiles())
        {
            data.Add(Path.GetFileName(file));
        }

        return data;
    }

    [Fact]
    public void ProjectsFolder_HasAtLeastOneFile()
    {
        Assert.NotEmpty(TestPaths.ProjectFiles());
    }

    [Theory]
    [MemberData(nameof(ProjectFileNames))]
    public void Evaluate_EveryProjectFile_IsValid(string name)
    {
        var text = File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "projects", name));
        var results = Evaluate(text);
        Assert.True(results.IsValid, Describe(results));
    }

    [Theory]
    [MemberData(nameof(ProjectFileNames))]
    public void ProjectFile_FirstLine_NamesTheSchema(string name)
    {
        var first = File.ReadLines(Path.Combine(TestPaths.RepoRoot, "projects", name)).First();
        Assert.Equal(SchemaComment, first);
    }

    [Theory]
    [InlineData("  units: metric\n", "  units: metric\n  colour: red\n")]
    [InlineData("poles: 1", "poles: 4")]
    [InlineData("load: { va: 1000 }", "load: { va: 1000, kw: 1 }")]
    [InlineData("size: 12 AWG }", "size: 12 AWG, sets: 0 }")]
    [InlineData("length: 20, size: 12 AWG", "length: 12 kg, size: 12 AWG")]
    [InlineData("kind: panelboard", "kind: transformer")]
    [InlineData("- id: LP1", "- id: \"LP\\e[2J1\"")] // an escape sequence in an id
    [InlineData("- id: LP1", "- id: \"LP\\u202E1\"")] // a direction mark in an id
    public void Evaluate_BrokenFile_IsInvalid(string original, string replacement)
    {
        var good = File.ReadAllText(Path.Combine(TestPaths.Cases, "good", "minimal.yaml"));
        Assert.True(Evaluate(good).IsValid);
        Assert.Contains(original, good, StringComparison.Ordinal);
        Assert.False(Evaluate(good.Replace(original, replacement, StringComparison.Ordinal)).IsValid);
    }

    // The keys of the phase-frame model: valid where the loader reads them, invalid where the schema can tell.
    [Theory]
    [InlineData("  system: 208Y/120\n", "  system: 208Y/120\n  available_fault_current_ka: 25\n  fault_x_r: 6\n", true)]
    [InlineData("  system: 208Y/120\n", "  system: 208Y/120\n  available_fault_current_ka: 25\n", false)]
    [InlineData("  system: 208Y/120\n", "  system: 208Y/120\n  fault_x_r: 6\n", false)]
    [InlineData("  system: 208Y/120\n", "  system: 208Y/120\n  available_fault_current_ka: 301\n  fault_x_r: 6\n", false)]
    [InlineData("  system: 208Y/120\n", "  system: 208Y/120\n  available_fault_current_ka: 25\n  fault_x_r: 0\n", false)]
    [InlineData("size: 12 AWG }", "size: 12 AWG, neutral_size: 10 AWG }", true)]
    [InlineData("size: 12 AWG }", "size: 12 AWG, neutral_size: 10 kg }", false)]
    [InlineData("size: 12 AWG }", "size: 12 AWG, ground_size: 12 AWG }", true)]
    [InlineData("size: 12 AWG }", "size: 12 AWG, ground_size: 12 kg }", false)]
    [InlineData("    kind: panelboard\n", "    kind: panelboard\n    phase: AB\n", false)]
    public void Evaluate_ElectricalKeys_ValidWhereTheLoaderReadsThem(string original, string replacement, bool valid)
    {
        var good = File.ReadAllText(Path.Combine(TestPaths.Cases, "good", "minimal.yaml"));
        Assert.Contains(original, good, StringComparison.Ordinal);
        var text = good.Replace(original, replacement, StringComparison.Ordinal);

        Assert.Equal(valid, Evaluate(text).IsValid);
        if (valid)
        {
            ProjectLoader.Parse(text, "minimal.yaml");
        }
    }

    [Fact]
    public void Evaluate_SinglePhaseTransformerWithPhase_IsValid()
    {
        var text = "disttree: 1\nproject: { name: T }\nservice: { id: SVC, system: 480Y/277 }\nequipment:\n"
            + "  - { id: T1, kind: transformer, from: SVC, kva: 25, secondary: 120/240, impedance_percent: 3, x_r: 2, phase: CA, tap_percent: -2.5 }\n";

        Assert.True(Evaluate(text).IsValid);
        Assert.Equal(DistTree.Model.Phases.CA, ProjectLoader.Parse(text, "t.yaml").Equipment[0].Transformer!.PrimaryPhases);
        Assert.False(Evaluate(text.Replace("phase: CA", "phase: ABC", StringComparison.Ordinal)).IsValid);
    }

    [Fact]
    public void Schema_Keys_MatchTheLoader()
    {
        var schema = JsonNode.Parse(File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "schema", "project.schema.json")))!;
        var defs = schema["$defs"]!;
        AssertKeys(ProjectKeys.Top, schema["properties"]);
        AssertKeys(ProjectKeys.Project, schema["properties"]!["project"]!["properties"]);
        AssertKeys(ProjectKeys.Rules, schema["properties"]!["rules"]!["properties"]);
        AssertKeys(ProjectKeys.Defaults, schema["properties"]!["defaults"]!["properties"]);
        AssertKeys(ProjectKeys.Sizing, schema["properties"]!["sizing"]!["properties"]);
        AssertKeys(ProjectKeys.Service, schema["properties"]!["service"]!["properties"]);
        AssertKeys(ProjectKeys.Equipment, defs["equipment"]!["properties"]);
        AssertKeys(ProjectKeys.Circuit, defs["circuit"]!["properties"]);
        AssertKeys(ProjectKeys.Run, defs["run"]!["properties"]);
        AssertKeys(ProjectKeys.Load, defs["load"]!["properties"]);
        AssertKeys(ProjectKeys.Point, defs["point"]!["properties"]);
    }

    [Fact]
    public void Docs_EveryKey_IsDescribed()
    {
        var doc = File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "docs", "project-file.md"));
        string[][] all = [ProjectKeys.Top, ProjectKeys.Project, ProjectKeys.Rules, ProjectKeys.Defaults, ProjectKeys.Sizing, ProjectKeys.Service, ProjectKeys.Equipment, ProjectKeys.Circuit, ProjectKeys.Run, ProjectKeys.Load, ProjectKeys.Point];
        var missing = all.SelectMany(k => k).Distinct().Where(k => !doc.Contains($"`{k}`", StringComparison.Ordinal)).ToArray();
        Assert.Empty(missing);
    }

    private static void AssertKeys(string[] expected, JsonNode? properties)
    {
        var actual = properties!.AsObject().Select(p => p.Key).Order(StringComparer.Ordinal).ToArray();
        Assert.Equal(expected.Order(StringComparer.Ordinal).ToArray(), actual);
    }

    private static EvaluationResults Evaluate(string yaml)
    {
        var json = YamlToJson.Convert(yaml)!.ToJsonString();
        using var document = JsonDocument.Parse(json);
        return Schema.Evaluate(document.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
    }

    private static string Describe(EvaluationResults results) =>
        string.Join(Environment.NewLine, (results.Details ?? []).Where(d => d.Errors is not null)
            .SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Key}: {e.Value}")));
}
