using DistTree.Reports;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Reports;

/// <summary>ConsoleReport: the worst paths name what each path fails, not a bare "over" or "ok".</summary>
public sealed class ConsoleReportTests
{
    private static string Analysis(string yaml)
    {
        using var o = new StringWriter();
        ConsoleReport.WriteAnalysis(o, SolverHarness.Solve(yaml), 5);
        return o.ToString();
    }

    private static string PathLine(string text, string id) =>
        text.Split('\n').Single(l => l.Contains($". {id} ", StringComparison.Ordinal));

    // A short circuit whose total is well within its limit but whose conductors cannot carry its load: the label names
    // the ampacity check (a path labelled "ok" with an ampacity finding misled a reader); a long one names the drops.
    [Fact]
    public void WriteAnalysis_WorstPaths_NameTheChecksEachPathFails()
    {
        var text = Analysis(SolverHarness.PanelOnFeeder(
            "length: 5, size: 1/0 AWG",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 28 }, run: { length: 3, size: 12 AWG } }",
            "{ id: \"3\", poles: 1, ocpd: 20, load: { amps: 10 }, run: { length: 90, size: 12 AWG } }",
            "{ id: \"5\", poles: 1, ocpd: 20, load: { amps: 4 }, run: { length: 5, size: 12 AWG } }"));

        Assert.EndsWith("fails: ampacity, neutral_ampacity, device_below_load", PathLine(text, "P/1").TrimEnd(), StringComparison.Ordinal);
        Assert.EndsWith("fails: total_drop, branch_drop, fault_clearing", PathLine(text, "P/3").TrimEnd(), StringComparison.Ordinal);
        Assert.EndsWith("ok", PathLine(text, "P/5").TrimEnd(), StringComparison.Ordinal);
        Assert.Contains("% of 5 %", PathLine(text, "P/5"), StringComparison.Ordinal);
    }
}
