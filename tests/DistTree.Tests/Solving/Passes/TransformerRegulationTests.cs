using DistTree.Solving;

namespace DistTree.Tests.Solving.Passes;

public sealed class TransformerRegulationTests
{
    private static string Project(string rules, double loadKva, double tap = 0, string model = "power") => $$"""
        disttree: 1
        project: { name: T, units: metric }
        rules: { {{rules}} }
        service: { id: SVC, system: 480Y/277, frequency_hz: 60 }
        equipment:
          - id: T1
            kind: transformer
            from: SVC
            kva: 75
            secondary: 208Y/120
            impedance_percent: 5
            x_r: 4
            tap_percent: {{tap}}
          - id: LP
            kind: panelboard
            from: T1
            circuits:
              - { id: "1", poles: 3, ocpd: 250, load: { kva: {{loadKva}}, pf: 0.8, model: {{model}} }, run: { length: 10, size: 250 kcmil } }
        """;

    // Regulation ≈ (%R·cos θ + %X·sin θ)·(S/S_rated) (common practice approximation): %Z 5, X/R 4:
    // %R = 5/√17 = 1.2127, %X = 4.8507; at full load, pf 0.8: 1.2127 × 0.8 + 4.8507 × 0.6 = 3.8806 %.
    [Fact]
    public void Solve_FullLoad_RegulationByPercentImpedance()
    {
        var s = SolverHarness.Solve(Project("transformer_drop: count", 75));
        var t = s.Runs.Single(r => r.Kind == RunResultKind.Transformer);
        Assert.Equal(3.8806, t.DropPercent, 3);
        var e = s.EndPoints.Single();
        Assert.Equal(t.DropPercent + s.Branch().DropPercent, e.TotalDropPercent, 9);
    }

    [Fact]
    public void Solve_NewOrigin_TotalStartsAtTheSecondary()
    {
        var s = SolverHarness.Solve(Project("transformer_drop: new_origin", 75));
        Assert.Equal(s.Branch().DropPercent, s.EndPoints.Single().TotalDropPercent, 9);
    }

    // The nameplate's primary tap: −2.5 % takes 2.5 % of the primary turns off, so the secondary stands 1/0.975 of
    // its rating at rated primary voltage, a rise of 2.5/0.975 = 2.564 %; +2.5 % lowers it by 2.5/1.025 = 2.439 %.
    // A constant-current load draws the same current at either voltage, so the leakage drop stays as it is.
    [Theory]
    [InlineData(-2.5, -2.5 / 0.975)]
    [InlineData(2.5, 2.5 / 1.025)]
    public void Solve_Tap_IsThePrimaryTapOfTheNameplate(double tapPercent, double expectedShift)
    {
        var plain = SolverHarness.Solve(Project("transformer_drop: count", 75, 0, "current")).Runs.Single(r => r.Kind == RunResultKind.Transformer).DropPercent;
        var tapped = SolverHarness.Solve(Project("transformer_drop: count", 75, tapPercent, "current")).Runs.Single(r => r.Kind == RunResultKind.Transformer).DropPercent;
        Assert.Equal(plain + expectedShift, tapped, 9);
    }

    [Fact]
    public void Solve_Overload_IsAFinding()
    {
        var s = SolverHarness.Solve(Project("transformer_drop: count", 90));
        Assert.Contains(s.AllFindings, f => f.Code == "transformer_overload");
    }
}
