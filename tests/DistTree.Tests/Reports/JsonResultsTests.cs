using System.Text.Json;
using DistTree.Reports;
using DistTree.Solving;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using Json.Schema;

namespace DistTree.Tests.Reports;

public sealed class JsonResultsTests
{
    /// <summary>The results schema, loaded once (JsonSchema.Net registers a schema by its $id: one instance for every test).</summary>
    internal static readonly JsonSchema Schema =
        JsonSchema.FromText(File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "schema", "results.schema.json")));

    private static Solution SolveProject(string name) =>
        Analysis.Run(Path.Combine(TestPaths.RepoRoot, "projects", name)).Solution;

    public static TheoryData<string> ProjectNames()
    {
        var data = new TheoryData<string>();
        foreach (var file in TestPaths.ProjectFiles())
        {
            data.Add(Path.GetFileName(file));
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(ProjectNames))]
    public void Write_EveryProject_PassesTheResultsSchema(string name)
    {
        using var doc = JsonDocument.Parse(JsonResults.Write(SolveProject(name)));
        var result = Schema.Evaluate(doc.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
        Assert.True(result.IsValid, string.Join("\n", (result.Details ?? []).Where(d => d.Errors is not null)
            .SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Key}: {e.Value}")).Take(20)));
    }

    [Fact]
    public void Write_ToStream_SameBytesAsTheText()
    {
        var solution = SolveProject("quillfeather-medical.yaml");
        using var stream = new MemoryStream();

        JsonResults.Write(solution, stream);

        Assert.Equal(System.Text.Encoding.UTF8.GetBytes(JsonResults.Write(solution)), stream.ToArray());
    }

    [Fact]
    public void Write_TwoRuns_AreByteIdentical()
    {
        var first = JsonResults.Write(SolveProject("quillfeather-medical.yaml"));
        var second = JsonResults.Write(SolveProject("quillfeather-medical.yaml"));
        Assert.Equal(first, second);
    }

    [Fact]
    public void Write_Demo_SummaryMatchesTheSolution()
    {
        var solution = SolveProject("quillfeather-medical.yaml");
        using var doc = JsonDocument.Parse(JsonResults.Write(solution));
        var summary = doc.RootElement.GetProperty("summary");
        Assert.Equal(solution.EndPoints.Count, summary.GetProperty("end_points").GetInt32());
        Assert.Equal(solution.Summary.WorstEndPoint, summary.GetProperty("worst_end_point").GetString());
        Assert.Equal(solution.EndPoints.Count, doc.RootElement.GetProperty("end_points").GetArrayLength());
        Assert.Equal("disttree-results/1", doc.RootElement.GetProperty("format").GetString());
    }

    // Found by the fuzz test: a load so large that figures overflow must still give a document (nulls), not a crash.
    // The loader now refuses such a load (ValueRanges), so the model is given it directly.
    [Fact]
    public void Write_OverflowingLoad_WritesNullsNotAnException()
    {
        var yaml = DistTree.Tests.Solving.SolverHarness.OneCircuit("208Y/120", "metric",
            "{ id: \"1\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }");
        var project = DistTree.ProjectFiles.ProjectLoader.Parse(yaml, "test.yaml");
        var panel = project.Equipment[0];
        var circuit = panel.Circuits[0] with { Load = new DistTree.Model.Load(DistTree.Model.LoadKind.Va, double.MaxValue, 1.0) };
        var huge = project with { Equipment = [panel with { Circuits = [circuit] }] };
        using var doc = JsonDocument.Parse(JsonResults.Write(Analysis.Run(huge).Solution));
        Assert.Equal(JsonValueKind.Null, doc.RootElement.GetProperty("end_points")[0].GetProperty("total_drop_percent_load_flow").ValueKind);
    }

    // The results of a 208Y/120 panel at the service with the circuits given (SolverHarness.OneCircuit's flow mappings).
    private static JsonDocument ResultsOf(string circuits) =>
        JsonDocument.Parse(JsonResults.Write(DistTree.Tests.Solving.SolverHarness.Solve(DistTree.Tests.Solving.SolverHarness.OneCircuit("208Y/120", "metric", circuits))));

    // A neutral size is written on its run only where the project states one, so results of a project without
    // one keep their bytes; the document still passes the results schema.
    [Fact]
    public void Write_NeutralSizeStated_WrittenOnThatRunOnly()
    {
        using var doc = ResultsOf(
            "{ id: \"1\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG, neutral_size: 10 AWG } }\n"
            + "      - { id: \"2\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }");

        var runs = doc.RootElement.GetProperty("runs").EnumerateArray().ToDictionary(r => r.GetProperty("id").GetString()!);
        Assert.Equal("10 AWG", runs["P/1"].GetProperty("neutral_size").GetString());
        Assert.False(runs["P/2"].TryGetProperty("neutral_size", out _));
        AssertValid(doc);
    }

    // Every end point carries its category: the stated word, else motor for a motor load and other for any other
    // (docs/project-file.md, Circuits); the document still passes the results schema.
    [Fact]
    public void Write_Category_EveryEndPointItsStatedOrDefaultWord()
    {
        using var doc = ResultsOf(
            "{ id: \"1\", poles: 1, category: ev_charger, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }\n"
            + "      - { id: \"2\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }\n"
            + "      - { id: \"3\", poles: 3, load: { hp: 3, pf: 0.85 }, run: { length: 10, size: 12 AWG } }\n"
            + "      - { id: \"4\", poles: 3, category: hvac, load: { fla: 10, pf: 0.85 }, run: { length: 10, size: 12 AWG } }");

        var categories = doc.RootElement.GetProperty("end_points").EnumerateArray()
            .ToDictionary(e => e.GetProperty("id").GetString()!, e => e.GetProperty("category").GetString());
        Assert.Equal(new Dictionary<string, string?> { ["P/1"] = "ev_charger", ["P/2"] = "other", ["P/3"] = "motor", ["P/4"] = "hvac" }, categories);
        AssertValid(doc);
    }

    // A stated grounding conductor is written on its run only; the minimum on every run, null without a device (a 20 A
    // device on 12 AWG: Table 250.122's 12 AWG, NEC 2020, memory).
    [Fact]
    public void Write_GroundSizes_StatedOnThatRunOnlyAndTheMinimumOnEvery()
    {
        using var doc = ResultsOf(
            "{ id: \"1\", poles: 1, ocpd: 20, load: { va: 1000 }, run: { length: 10, size: 12 AWG, ground_size: 12 AWG } }\n"
            + "      - { id: \"2\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }");

        var runs = doc.RootElement.GetProperty("runs").EnumerateArray().ToDictionary(r => r.GetProperty("id").GetString()!);
        Assert.Equal("12 AWG", runs["P/1"].GetProperty("ground_size").GetString());
        Assert.Equal("12 AWG", runs["P/1"].GetProperty("ground_min_size").GetString());
        Assert.False(runs["P/2"].TryGetProperty("ground_size", out _));
        Assert.Equal(JsonValueKind.Null, runs["P/2"].GetProperty("ground_min_size").ValueKind);
        AssertValid(doc);
    }

    [Fact]
    public void Write_ServiceSource_WrittenBesideTheFrequencyOnlyWhenStated()
    {
        var yaml = DistTree.Tests.Solving.SolverHarness.OneCircuit("208Y/120", "metric", "{ id: \"1\", poles: 1, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }");
        var stated = yaml.Replace("  frequency_hz: 60\n", "  frequency_hz: 60\n  available_fault_current_ka: 22.5\n  fault_x_r: 6\n", StringComparison.Ordinal);
        Assert.NotEqual(yaml, stated);

        using var without = JsonDocument.Parse(JsonResults.Write(DistTree.Tests.Solving.SolverHarness.Solve(yaml)));
        using var with = JsonDocument.Parse(JsonResults.Write(DistTree.Tests.Solving.SolverHarness.Solve(stated)));

        Assert.False(without.RootElement.GetProperty("rules").TryGetProperty("available_fault_current_ka", out _));
        Assert.False(without.RootElement.GetProperty("rules").TryGetProperty("fault_x_r", out _));
        var rules = with.RootElement.GetProperty("rules");
        Assert.Equal((22.5, 6.0), (rules.GetProperty("available_fault_current_ka").GetDouble(), rules.GetProperty("fault_x_r").GetDouble()));
        AssertValid(with);
    }

    // The fast number text against System.Text.Json's own: the writer's text for the rounded double is the reference.
    [Property(MaxTest = 20_000)]
    public Property TryFormatRounded_MatchesTheWritersText(NormalFloat value, PositiveInt exponent, byte decimals)
    {
        var d = decimals % 7;
        var v = value.Get * Math.Pow(10, (exponent.Get % 24) - 12);
        return (Reference(v, d) == Fast(v, d) || Fast(v, d) is null).ToProperty();
    }

    // Figures of the size the results hold (up to about 3·10^8, with every fraction): the fast text is used and equal.
    [Property(MaxTest = 20_000)]
    public Property TryFormatRounded_TypicalFigures_UseTheFastTextAndMatch(int whole, int fraction, byte decimals)
    {
        var d = decimals % 7;
        var v = (whole / 7.0) + (fraction * 1e-9);
        var fast = Fast(v, d);
        return (fast == Reference(v, d) || (fast is null && Math.Abs(Math.Round(v, d, MidpointRounding.AwayFromZero)) is > 0 and < 1e-4)).ToProperty();
    }

    [Theory]
    [InlineData(0.0, 3, "0")]
    [InlineData(-0.0001, 4, "-0.0001")]
    [InlineData(-0.00004, 4, "0")]
    [InlineData(2968.0044999, 3, "2968.004")]
    [InlineData(0.12345, 4, "0.1235")] // half away from zero, as Math.Round with MidpointRounding.AwayFromZero
    [InlineData(480.0, 3, "480")]
    [InlineData(123456789.125, 2, "123456789.13")]
    public void TryFormatRounded_Examples_MatchTheWriter(double value, int decimals, string expected)
    {
        Assert.Equal(expected, Reference(value, decimals));
        Assert.Equal(expected, Fast(value, decimals));
    }

    [Theory]
    [InlineData(0.00003, 5)] // 3E-05: the writer's exponent form
    [InlineData(1e16, 0)]
    public void TryFormatRounded_OutsideItsRange_LeavesItToTheWriter(double value, int decimals) =>
        Assert.Null(Fast(value, decimals));

    private static void AssertValid(JsonDocument doc)
    {
        var result = Schema.Evaluate(doc.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
        Assert.True(result.IsValid, string.Join("\n", (result.Details ?? []).Where(d => d.Errors is not null)
            .SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Key}: {e.Value}")).Take(20)));
    }

    private static string Reference(double value, int decimals)
    {
        using var buffer = new MemoryStream();
        using (var w = new Utf8JsonWriter(buffer))
        {
            w.WriteNumberValue(Math.Round(value, decimals, MidpointRounding.AwayFromZero) + 0.0);
        }

        return System.Text.Encoding.UTF8.GetString(buffer.ToArray());
    }

    private static string? Fast(double value, int decimals)
    {
        Span<byte> text = stackalloc byte[24];
        return JsonResults.TryFormatRounded(value, decimals, text, out var length) ? System.Text.Encoding.UTF8.GetString(text[..length]) : null;
    }
}
