using System.Text.Json;
using DistTree.Reports;
using DistTree.Tests.Cli;

namespace DistTree.Tests.Reports;

/// <summary>
/// The SARIF log of <c>analyze --sarif</c> and <c>check --sarif</c>, checked against the parts of SARIF 2.1.0
/// (OASIS Standard, 2020; sections named beside each check) that code-review tools rely on, and against the
/// project file itself: every result points at the line and column where its run or circuit is written.
/// </summary>
[Collection(WorkingDirectory.Name)]
public sealed class SarifResultsTests
{
    private const string Demo = "projects/quillfeather-medical.yaml";

    private static readonly string[] RuleIds = ["feeder_drop", "branch_drop", "total_drop", "ampacity", "ocpd_above_ampacity", "transformer_overload", "motor_start", "neutral_ampacity", "device_below_load", "grounding_conductor", "interrupting_rating", "fault_clearing", "no_load_rise"];

    [Fact]
    public void Analyze_Demo_WritesAValidSarif210Log()
    {
        using var folder = new TempFolder();
        var sarifPath = folder.File("findings.sarif");
        CliResult? result = null;

        WorkingDirectory.In(TestPaths.RepoRoot, () => result = CliRunner.Run("analyze", Demo, "--sarif", sarifPath));

        Assert.Equal(1, result!.ExitCode);
        using var log = JsonDocument.Parse(File.ReadAllText(sarifPath));
        var root = log.RootElement;

        // 3.13.2 and 3.13.3: the log names its version and may name its schema.
        Assert.Equal("2.1.0", root.GetProperty("version").GetString());
        Assert.Equal("https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json", root.GetProperty("$schema").GetString());

        // 3.13.4, 3.14.6, 3.18.2, 3.19.23: one run; its tool's driver has a name and rules with unique ids.
        var run = Assert.Single(root.GetProperty("runs").EnumerateArray());
        var driver = run.GetProperty("tool").GetProperty("driver");
        Assert.Equal("DistTree", driver.GetProperty("name").GetString());
        var rules = driver.GetProperty("rules").EnumerateArray().ToArray();
        Assert.Equal(RuleIds, rules.Select(r => r.GetProperty("id").GetString()));
        Assert.All(rules, r => Assert.False(string.IsNullOrWhiteSpace(r.GetProperty("shortDescription").GetProperty("text").GetString())));

        // 3.27: each result has ruleId (with ruleIndex into the rules), level, message.text and a physical location.
        var lines = File.ReadAllLines(Path.Combine(TestPaths.RepoRoot, Demo));
        var results = run.GetProperty("results").EnumerateArray().ToArray();
        Assert.NotEmpty(results);
        foreach (var r in results)
        {
            var ruleId = r.GetProperty("ruleId").GetString();
            Assert.Contains(ruleId, RuleIds);
            Assert.Equal(ruleId, rules[r.GetProperty("ruleIndex").GetInt32()].GetProperty("id").GetString());
            Assert.Equal("error", r.GetProperty("level").GetString());
            Assert.False(string.IsNullOrWhiteSpace(r.GetProperty("message").GetProperty("text").GetString()));
            var physical = Assert.Single(r.GetProperty("locations").EnumerateArray()).GetProperty("physicalLocation");
            Assert.Equal(Demo, physical.GetProperty("artifactLocation").GetProperty("uri").GetString());

            // 3.30.5 and 3.30.6: 1-based line and column. There the file holds the run's mapping (a feeder's or
            // a circuit's run) or the circuit's or equipment's own; the nearest 'id:' at or above it is the subject's.
            var region = physical.GetProperty("region");
            var line = region.GetProperty("startLine").GetInt32();
            var column = region.GetProperty("startColumn").GetInt32();
            Assert.InRange(line, 1, lines.Length);
            Assert.InRange(column, 1, lines[line - 1].Length);
            var written = lines[line - 1][(column - 1)..];
            Assert.True(written.StartsWith("id:", StringComparison.Ordinal) || written.StartsWith('{'), $"line {line}:{column} is '{lines[line - 1]}'");
            var id = r.GetProperty("properties").GetProperty("subject").GetString()!.Split('/')[^1];
            var owner = lines.Take(line).Last(l => l.Contains("id:", StringComparison.Ordinal)).Trim().TrimStart('-', ' ');
            Assert.True(owner == $"id: {id}" || owner == $"id: \"{id}\"", $"line {line}: the nearest id above is '{owner}', not '{id}'");
        }
    }

    [Fact]
    public void Analyze_Demo_SarifResultsAreTheJsonFindingsInOrder()
    {
        using var folder = new TempFolder();
        var sarifPath = folder.File("findings.sarif");
        var jsonPath = folder.File("results.json");
        var demo = Path.Combine(TestPaths.RepoRoot, Demo);

        Assert.Equal(1, CliRunner.Run("analyze", demo, "--sarif", sarifPath, "--json", jsonPath).ExitCode);

        using var sarif = JsonDocument.Parse(File.ReadAllText(sarifPath));
        using var json = JsonDocument.Parse(File.ReadAllText(jsonPath));
        var fromSarif = sarif.RootElement.GetProperty("runs")[0].GetProperty("results").EnumerateArray().Select(r =>
        {
            var region = r.GetProperty("locations")[0].GetProperty("physicalLocation").GetProperty("region");
            return (r.GetProperty("ruleId").GetString(), r.GetProperty("message").GetProperty("text").GetString(),
                region.GetProperty("startLine").GetInt32(), region.GetProperty("startColumn").GetInt32());
        }).ToArray();
        var fromJson = json.RootElement.GetProperty("runs").EnumerateArray().Concat(json.RootElement.GetProperty("end_points").EnumerateArray())
            .SelectMany(x => x.GetProperty("findings").EnumerateArray())
            .Select(f => (f.GetProperty("kind").GetString(), f.GetProperty("message").GetString(), f.GetProperty("line").GetInt32(), f.GetProperty("column").GetInt32()))
            .ToArray();
        Assert.Equal(fromJson, fromSarif);
        Assert.Equal(json.RootElement.GetProperty("summary").GetProperty("findings").GetInt32(), fromSarif.Length);
    }

    [Fact]
    public void Check_WithinLimits_WritesALogWithNoResults()
    {
        using var folder = new TempFolder();
        var sarifPath = folder.File("findings.sarif");

        var result = CliRunner.Run("check", Path.Combine(TestPaths.RepoRoot, "projects", "small-office.yaml"), "--sarif", sarifPath);

        Assert.Equal(0, result.ExitCode);
        Assert.StartsWith("PASS", result.Out, StringComparison.Ordinal);
        using var log = JsonDocument.Parse(File.ReadAllText(sarifPath));
        Assert.Equal(0, log.RootElement.GetProperty("runs")[0].GetProperty("results").GetArrayLength());
    }

    [Fact]
    public void Check_SarifToStandardOutput_PrintsOnlyTheLog()
    {
        var result = CliRunner.Run("check", Path.Combine(TestPaths.RepoRoot, Demo), "--sarif", "-");

        Assert.Equal(1, result.ExitCode);
        using var log = JsonDocument.Parse(result.Out);
        Assert.True(log.RootElement.GetProperty("runs")[0].GetProperty("results").GetArrayLength() > 0);
    }

    [Fact]
    public void Check_AbsolutePathInsideTheWorkingFolder_UriIsRelativeWithForwardSlashes()
    {
        CliResult? result = null;

        WorkingDirectory.In(TestPaths.RepoRoot, () => result = CliRunner.Run("check", Path.Combine(TestPaths.RepoRoot, "projects", "quillfeather-medical.yaml"), "--sarif", "-"));

        using var log = JsonDocument.Parse(result!.Out);
        Assert.Equal(Demo, log.RootElement.GetProperty("runs")[0].GetProperty("artifacts")[0].GetProperty("location").GetProperty("uri").GetString());
    }

    [Fact]
    public void Check_PathWithASpace_UriSegmentsAreEscaped()
    {
        using var folder = new TempFolder();
        Directory.CreateDirectory(folder.File("design rev 2"));
        File.Copy(Path.Combine(TestPaths.RepoRoot, Demo), folder.File(Path.Combine("design rev 2", "demo.yaml")));
        CliResult? result = null;

        WorkingDirectory.In(folder.Path, () => result = CliRunner.Run("check", Path.Combine("design rev 2", "demo.yaml"), "--sarif", "-"));

        using var log = JsonDocument.Parse(result!.Out);
        var uri = log.RootElement.GetProperty("runs")[0].GetProperty("results")[0].GetProperty("locations")[0]
            .GetProperty("physicalLocation").GetProperty("artifactLocation").GetProperty("uri").GetString();
        Assert.Equal("design%20rev%202/demo.yaml", uri);
    }

    [Fact]
    public void Check_MotorStartFinding_HasItsRule()
    {
        // A generated campus has motors whose start dips past the limit: before the registry of finding kinds, the
        // SARIF writer listed six of the seven kinds and ended here in an unhandled exception.
        using var folder = new TempFolder();
        var project = folder.File("campus.yaml");
        File.WriteAllText(project, DistTree.Generating.ProjectGenerator.Generate(1000, 3, 7));

        var result = CliRunner.Run("check", project, "--sarif", "-");

        Assert.Equal(1, result.ExitCode);
        using var log = JsonDocument.Parse(result.Out);
        var run = log.RootElement.GetProperty("runs")[0];
        var rules = run.GetProperty("tool").GetProperty("driver").GetProperty("rules").EnumerateArray().ToArray();
        var results = run.GetProperty("results").EnumerateArray().ToArray();
        Assert.Contains(results, r => r.GetProperty("ruleId").GetString() == "motor_start");
        Assert.All(results, r => Assert.Equal(r.GetProperty("ruleId").GetString(), rules[r.GetProperty("ruleIndex").GetInt32()].GetProperty("id").GetString()));
    }

    [Fact]
    public void Write_SameSolution_SameBytes()
    {
        var first = CliRunner.Run("check", Path.Combine(TestPaths.RepoRoot, Demo), "--sarif", "-").Out;
        var second = CliRunner.Run("check", Path.Combine(TestPaths.RepoRoot, Demo), "--sarif", "-").Out;

        Assert.Equal(first, second);
        Assert.Contains(Caution.For(DistTree.Model.ElectricalCode.Nec), first, StringComparison.Ordinal);
    }
}
