using System.Text.Json;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Reports;
using DistTree.Solving;
using Json.Schema;

namespace DistTree.Tests.Reports;

public sealed class JsonResultsTests
{
    private static readonly JsonSchema Schema =
        JsonSchema.FromText(File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "schema", "results.schema.json")));

    private static Solution SolveProject(string name) =>
        DropSolver.Standard.Solve(NetworkBuilder.Build(ProjectLoader.Load(Path.Combine(TestPaths.RepoRoot, "projects", name))));

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
    [Fact]
    public void Write_OverflowingLoad_WritesNullsNotAnException()
    {
        var yaml = DistTree.Tests.Solving.SolverHarness.OneCircuit("208Y/120", "metric",
            "{ id: \"1\", poles: 1, load: { va: 1.7976931348623157e308 }, run: { length: 10, size: 12 AWG } }");
        using var doc = JsonDocument.Parse(JsonResults.Write(DistTree.Tests.Solving.SolverHarness.Solve(yaml)));
        Assert.Equal(JsonValueKind.Null, doc.RootElement.GetProperty("panels")[0].GetProperty("line_va")[0].ValueKind);
    }
}
