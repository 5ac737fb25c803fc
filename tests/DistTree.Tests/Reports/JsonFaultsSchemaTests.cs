using System.Text.Json;
using System.Text.Json.Nodes;
using DistTree.Reports;
using DistTree.Tests.Solving;
using Json.Schema;

namespace DistTree.Tests.Reports;

/// <summary>The results schema's short-circuit parts: <c>faults</c>, <c>equipment</c>, each run's far end and the rules' source keys.</summary>
public sealed class JsonFaultsSchemaTests
{
    private static string Project(string service) => SolverHarness.PanelOnFeeder(
            "length: 5, size: 1/0 AWG, ocpd: 150",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 4 }, run: { length: 30, size: 12 AWG } }")
        .Replace("service: { id: SVC, system: 208Y/120 }", $"service: {{ id: SVC, system: 208Y/120{service} }}", StringComparison.Ordinal)
        .Replace("    from: SVC\n", "    from: SVC\n    interrupting_ka: 10\n", StringComparison.Ordinal);

    private static JsonNode Results(string service) => JsonNode.Parse(JsonResults.Write(SolverHarness.Solve(Project(service))))!;

    private static EvaluationResults Evaluate(JsonNode doc)
    {
        using var parsed = JsonDocument.Parse(doc.ToJsonString());
        return JsonResultsTests.Schema.Evaluate(parsed.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
    }

    [Theory]
    [InlineData("", "infinite_bus")]
    [InlineData(", available_fault_current_ka: 20, fault_x_r: 4", "utility")]
    [InlineData(", utility_transformer_kva: 500, utility_transformer_impedance_percent: 5, fault_x_r: 5", "utility_transformer")]
    public void Write_EachSource_PassesTheSchemaWithItsFaultParts(string service, string source)
    {
        var doc = Results(service);

        var result = Evaluate(doc);
        Assert.True(result.IsValid, string.Join("\n", (result.Details ?? []).Where(d => d.Errors is not null).SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Value}"))));
        Assert.Equal(source, (string?)doc["faults"]!["source"]);
        var panel = doc["equipment"]!.AsArray().Single(e => (string?)e!["id"] == "P")!;
        Assert.Equal(10, (double)panel["interrupting_ka"]!);
        var branch = doc["runs"]!.AsArray().Single(r => (string?)r!["id"] == "P/1")!;
        Assert.True((double)branch["fault_min_a"]! > 0);
        Assert.Equal(200, (double)branch["trip_a"]!); // the default 10 × the 20 A breaker
        Assert.Equal(1.05, (double)doc["rules"]!["fault_voltage_factor_max"]!);
    }

    // The schema holds what the writer keeps: a source's X/R never stands alone, a far end carries all its keys.
    [Fact]
    public void Schema_XOverRWithoutSourceOrFarEndMissingAKey_Invalid()
    {
        var lone = Results(", available_fault_current_ka: 20, fault_x_r: 4");
        lone["rules"]!.AsObject().Remove("available_fault_current_ka");
        Assert.False(Evaluate(lone).IsValid);

        var partial = Results("");
        partial["runs"]!.AsArray().First(r => r!["fault_min_a"] is not null)!.AsObject().Remove("trip_a");
        Assert.False(Evaluate(partial).IsValid);

        var source = Results("");
        source["faults"]!["source"] = "generator";
        Assert.False(Evaluate(source).IsValid);
    }
}
