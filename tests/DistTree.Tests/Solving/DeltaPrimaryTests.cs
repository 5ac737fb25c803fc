using DistTree.Model;
using DistTree.ProjectFiles;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>
/// A transformer's delta primary (<c>primary: 600D</c>) on a wye bus of its line-to-line voltage (issue 19): accepted,
/// its feeder carries three lines and no neutral, and the primary line currents are the windings' (no neutral return).
/// </summary>
public sealed class DeltaPrimaryTests
{
    // A 600Y/347 service; a 75 kVA delta-wye dry type 600D to 208Y/120 and its panel with unbalanced loads.
    private static string Canadian(string method = "percent_sum", int va1 = 9000, int va2 = 3000, int kva3 = 30) => $$"""
        disttree: 1
        project: { name: Delta primary, units: metric }
        rules: { conductor_temperature: rated, method: {{method}} }
        service: { id: SVC, system: 600Y/347 }
        equipment:
          - id: T1
            kind: transformer
            from: SVC
            kva: 75
            primary: 600D
            secondary: 208Y/120
            impedance_percent: 4.5
            x_r: 3
            feeder: { length: 60, size: 4 AWG, ocpd: 90 }
          - id: LP1
            kind: panelboard
            from: T1
            feeder: { length: 5, size: 250 kcmil }
            circuits:
              - { id: "1", poles: 1, phase: A, load: { va: {{va1}}, pf: 0.9 }, run: { length: 20, size: 10 AWG } }
              - { id: "2", poles: 1, phase: B, load: { va: {{va2}}, pf: 1.0 }, run: { length: 30, size: 12 AWG } }
              - { id: "3", poles: 3, load: { kva: {{kva3}}, pf: 0.85 }, run: { length: 40, size: 4 AWG } }
        """;

    [Fact]
    public void Parse_DeltaPrimaryOnItsWye_FeederCarriesTheDelta()
    {
        var project = ProjectLoader.Parse(Canadian(), "t.yaml");
        var transformer = project.Equipment.Single(e => e.Id == "T1");

        Assert.Equal("600D", transformer.System.Name);
        Assert.False(transformer.System.HasNeutral);
        Assert.Equal(new CircuitSupply(600, 3), transformer.System.FeederSupply);
        Assert.Equal("208Y/120", transformer.OutputSystem.Name);
    }

    [Fact]
    public void Solve_DeltaPrimaryFeeder_ThreeLinesNoNeutral()
    {
        var s = SolverHarness.Solve(Canadian());
        var feeder = s.Runs.Single(r => r.To == "T1" && r.Kind == RunResultKind.Feeder);

        Assert.Equal("600D", feeder.System);
        Assert.Equal(3, feeder.LineCurrentsA.Count);
        Assert.Null(feeder.NeutralCurrentA);
        Assert.Null(feeder.NeutralDesignCurrentA);
        Assert.Null(feeder.NeutralAmpacityA);
    }

    // The same tree with 'primary: 600Y/347' stated instead: the Dyn1 winding takes no neutral either way, so the
    // primary line currents and every end point's drop are the same (the primary currents I_A = k·(I_a − I_b) … sum to
    // zero: Kirchhoff's current law on the delta's three nodes).
    [Fact]
    public void Solve_DeltaOrWyeNamedPrimary_SameLineCurrentsAndDrops()
    {
        var delta = SolverHarness.Solve(Canadian());
        var wye = SolverHarness.Solve(Canadian().Replace("primary: 600D", "primary: 600Y/347", StringComparison.Ordinal));
        var onDelta = delta.Runs.Single(r => r.To == "T1" && r.Kind == RunResultKind.Feeder);
        var onWye = wye.Runs.Single(r => r.To == "T1" && r.Kind == RunResultKind.Feeder);

        Assert.Equal(onWye.LineCurrentsA, onDelta.LineCurrentsA);
        Assert.Equal(0, onWye.NeutralCurrentA!.Value, 9);
        Assert.Equal(wye.EndPoints.Select(e => e.TotalDropPercent), delta.EndPoints.Select(e => e.TotalDropPercent));
    }

    // The percent sum is the load flow's linearisation: on a lightly loaded tree (every end point within about 0.5 %)
    // they agree within 3 % or 0.01 points (the property tests' bound, PhaseFramePropertyTests).
    [Fact]
    public void Solve_DeltaPrimary_PercentSumAgreesWithLoadFlow()
    {
        var s = SolverHarness.Solve(Canadian("load_flow", 300, 100, 1));
        Assert.All(s.EndPoints, end => Assert.InRange(end.LoadFlowTotalDropPercent!.Value, 0.05, 0.6));

        foreach (var end in s.EndPoints)
        {
            var flow = end.LoadFlowTotalDropPercent!.Value;
            Assert.InRange(end.PercentSumTotalDropPercent, flow - Math.Max(0.03 * Math.Abs(flow), 0.01), flow + Math.Max(0.03 * Math.Abs(flow), 0.01));
        }
    }

    // A single-phase transformer across lines B and C of a delta primary on 480Y/277: the primary current is the
    // secondary's over the turns ratio, in on B and out on C (an ideal transformer's current ratio), nothing on A.
    [Fact]
    public void Solve_SinglePhaseAcrossTwoLinesOfADeltaPrimary_CurrentOnThoseLinesOnly()
    {
        var s = SolverHarness.Solve("""
            disttree: 1
            project: { name: Delta single, units: metric }
            rules: { conductor_temperature: rated }
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: T1
                kind: transformer
                from: SVC
                kva: 25
                primary: 480D
                phase: BC
                secondary: 120/240
                impedance_percent: 3
                x_r: 2
                feeder: { length: 30, size: 8 AWG }
              - id: LP1
                kind: panelboard
                from: T1
                circuits:
                  - { id: "1", poles: 2, load: { va: 12000, pf: 1.0 }, run: { length: 10, size: 6 AWG } }
            """);
        var feeder = s.Runs.Single(r => r.To == "T1" && r.Kind == RunResultKind.Feeder);
        var branch = s.Branch();

        Assert.Equal("480D", feeder.System);
        Assert.Null(feeder.NeutralCurrentA);
        Assert.Equal(0, feeder.LineCurrentsA[0], 9);
        Assert.Equal(feeder.LineCurrentsA[1], feeder.LineCurrentsA[2], 9);
        Assert.Equal(branch.LineCurrentsA[0] * 240 / 480, feeder.LineCurrentsA[1], 2);
    }
}
