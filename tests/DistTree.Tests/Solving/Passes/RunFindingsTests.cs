using DistTree.Reports;
using DistTree.Solving;
using DistTree.Tests.Reports;

namespace DistTree.Tests.Solving.Passes;

/// <summary>A run's drop finding writes its length in the project's units (the figures and the JSON stay in metres).</summary>
public sealed class RunFindingsTests
{
    // One 120 V circuit of 16 A over 180 ft of 12 AWG (a 1-pole circuit on 208Y/120): far over its 3 % limit. The same
    // run written in metres is 180 × 0.3048 = 54.864 m (1 ft = 0.3048 m exactly, NIST SP 811 Appendix B.8).
    private static string Project(string units, string length) => SolverHarness.OneCircuit(
        "208Y/120", units, $"{{ id: \"1\", poles: 1, ocpd: 20, load: {{ amps: 16, pf: 1.0 }}, run: {{ length: {length}, size: 12 AWG }} }}");

    private static Finding DropFinding(Solution s) => Assert.Single(s.AllFindings, f => f.Kind == FindingKind.BranchDrop);

    [Fact]
    public void Of_ImperialProject_WritesTheRunsLengthInFeet()
    {
        var finding = DropFinding(SolverHarness.Solve(Project("imperial", "180")));

        Assert.Contains("at 16.0 A over 180 ft of 12 AWG)", finding.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(" m of ", finding.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Of_MetricProject_WritesTheSameRunInMetresAndTheRestAlike()
    {
        var imperial = DropFinding(SolverHarness.Solve(Project("imperial", "180")));
        var metric = DropFinding(SolverHarness.Solve(Project("metric", "54.864")));

        Assert.Contains("at 16.0 A over 54.9 m of 12 AWG)", metric.Message, StringComparison.Ordinal);
        Assert.Equal(imperial.Value, metric.Value, 9);
        Assert.Equal(imperial.Message.Replace("180 ft", "54.9 m", StringComparison.Ordinal), metric.Message);
    }

    [Fact]
    public void Of_ImperialProject_OnTheLoadFlowToo_WritesFeet()
    {
        var yaml = Project("imperial", "180").Replace("conductor_temperature: rated", "conductor_temperature: rated\n  method: load_flow", StringComparison.Ordinal);

        Assert.Contains(" over 180 ft of 12 AWG)", DropFinding(SolverHarness.Solve(yaml)).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void JsonAndSarif_ImperialProject_MessageInFeetFiguresInMetres()
    {
        var s = ReportFixtures.SolveText(Project("imperial", "180"));

        var json = JsonResults.Write(s);
        Assert.Contains("over 180 ft of 12 AWG", json, StringComparison.Ordinal);
        Assert.Contains("\"length_m\": 54.864", json, StringComparison.Ordinal);
        Assert.Contains("over 180 ft of 12 AWG", SarifResults.Write(s, "test.yaml"), StringComparison.Ordinal);
    }
}
