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
        // 90 m of 12 AWG on a 20 A breaker also fails the far-end check: about 120 V over a loop of 2 × 90 m at some
        // 6.5 mΩ/m hot (NEC Chapter 9 Table 8, 12 AWG copper 2.0 Ω/km at 75 °C, times about 1.2 at 90 °C) is near
        // 100 A, below the default 10 × 20 A instantaneous trip.
        Assert.EndsWith("fails: total_drop, branch_drop, fault_clearing", PathLine(text, "P/3").TrimEnd(), StringComparison.Ordinal);
        Assert.EndsWith("ok", PathLine(text, "P/5").TrimEnd(), StringComparison.Ordinal);
        Assert.Contains("% of 5 %", PathLine(text, "P/5"), StringComparison.Ordinal);
    }

    private static string Line(string text, string start) =>
        text.Split('\n').Single(l => l.StartsWith(start, StringComparison.Ordinal));

    private static readonly string Rated = SolverHarness.PanelOnFeeder(
            "length: 5, size: 1/0 AWG",
            "{ id: \"3\", poles: 1, ocpd: 20, load: { amps: 10 }, run: { length: 90, size: 12 AWG } }",
            "{ id: \"5\", poles: 1, ocpd: 20, load: { amps: 4 }, run: { length: 5, size: 12 AWG } }")
        .Replace("service: { id: SVC, system: 208Y/120 }", "service: { id: SVC, system: 208Y/120, available_fault_current_ka: 20, fault_x_r: 4 }", StringComparison.Ordinal)
        .Replace("    from: SVC\n", "    from: SVC\n    interrupting_ka: 10\n", StringComparison.Ordinal);

    // The figures are the study's, as it gives them, rounded to 0.01 kA; the rating stated below them is flagged.
    [Fact]
    public void WriteAnalysis_FaultCurrents_OneLinePerEquipmentWithTheStudysFiguresAndRating()
    {
        var s = SolverHarness.Solve(Rated);
        using var o = new StringWriter();
        ConsoleReport.WriteAnalysis(o, s, 5);
        var text = o.ToString();

        var p = s.Faults!.Equipment.Single(e => e.Id == "P");
        Assert.True(p.LargestKa > 10, "a 20 kA source through 5 m of 1/0 AWG leaves more than 10 kA at the panel");
        var line = Line(text, "  P          panelboard");
        Assert.Equal(
            FormattableString.Invariant($"  P          panelboard  208Y/120  {p.AvailableFaultCurrentKa,9:0.00} {p.AvailableFaultCurrentLgKa,8:0.00}  X/R {p.XOverR,5:0.00}  rating 10 kA  OVER"),
            line);
        Assert.Equal($"  source  {FaultText.Source(s.Faults, s.Project.Service)}", Line(text, "  source  "));
        Assert.StartsWith($"  method  {FaultText.Method}; c_max ", Line(text, "  method  "), StringComparison.Ordinal);
    }

    [Fact]
    public void WriteAnalysis_InfiniteBus_SourceLineSaysSo()
    {
        var text = Analysis(SolverHarness.PanelOnFeeder("length: 5, size: 1/0 AWG", "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 4 }, run: { length: 5, size: 12 AWG } }"));

        Assert.Contains("infinite bus", Line(text, "  source  "), StringComparison.Ordinal);
        Assert.EndsWith("no rating stated", Line(text, "  P          panelboard").TrimEnd(), StringComparison.Ordinal);
    }

    // The far end that fails shows its minimum current against the trip current under its path; one that clears does not.
    [Fact]
    public void WriteAnalysis_FarEndFails_ShownUnderItsPath()
    {
        var s = SolverHarness.Solve(Rated);
        using var o = new StringWriter();
        ConsoleReport.WriteAnalysis(o, s, 5);
        var lines = o.ToString().Split('\n');

        var far = s.Faults!.FarEndAt(s.Runs.Single(r => r.Id == "P/3").NodeIndex)!.Value;
        Assert.False(far.Clears);
        var at = Array.FindIndex(lines, l => l.Contains(". P/3 ", StringComparison.Ordinal));
        Assert.Equal(FormattableString.Invariant($"        far-end fault  P/3 {far.MinimumCurrentA:0} A {FaultText.KindShort(far.Kind)} < trip {far.TripCurrentA:0} A"), lines[at + 3]);
        var short5 = Array.FindIndex(lines, l => l.Contains(". P/5 ", StringComparison.Ordinal));
        Assert.True(s.Faults.FarEndAt(s.Runs.Single(r => r.Id == "P/5").NodeIndex)!.Value.Clears);
        Assert.DoesNotContain("far-end", lines[short5 + 3], StringComparison.Ordinal);
    }
}
