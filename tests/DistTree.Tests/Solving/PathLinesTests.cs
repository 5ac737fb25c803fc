using System.Numerics;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>
/// The line and current each row of an end point's path is read on (<see cref="EndPointResult.RunLineCurrents"/>),
/// against hand-worked circuits: loads of stated amperes at unity power factor, so that every line current follows from
/// Kirchhoff's current law at the buses and, through a delta-wye (Dyn1) transformer, from its ampere-turn balance
/// I_A = k·(I_a − I_b), I_C = k·(I_c − I_a) with k = V_LN,sec / V_LL,pri. A load of I amperes on a 1-pole circuit
/// draws S = 120 V·I (its circuit's voltage), so its line carries S / (208 V/√3) at the bus's nominal voltage.
/// </summary>
public sealed class PathLinesTests
{
    // The line current of a 1-pole load of the given amperes on 208Y/120 (see above).
    private static double OnLine(double amps) => amps * 120 / (208 / Math.Sqrt(3));

    // A 1-pole end point on A beside a heavier one on B: the feeder's most loaded line is B (30 A), but the end point's
    // drop is on A, which carries circuit 1's 10 A (Kirchhoff's current law at the panel's bus: only circuit 1 is on A).
    [Fact]
    public void RunLineCurrents_OnePoleOnALighterLine_ShowItsOwnLine()
    {
        var s = SolverHarness.Solve(SolverHarness.PanelOnFeeder(
            "length: 30, size: 4 AWG",
            "{ id: \"1\", poles: 1, phase: A, load: { amps: 10, pf: 1 }, run: { length: 20, size: 12 AWG } }",
            "{ id: \"2\", poles: 1, phase: B, load: { amps: 30, pf: 1 }, run: { length: 20, size: 10 AWG } }"));
        var e = s.EndPointById("P/1")!.Value;

        var lines = e.RunLineCurrents;

        Assert.Equal(OnLine(30), s.Runs[e.RunIndices[0]].CurrentA, 9);
        Assert.Equal(["A", "A"], lines.Select(l => l.Line));
        Assert.Equal(OnLine(10), lines[0].CurrentA, 9);
        Assert.Equal(OnLine(10), lines[1].CurrentA, 9);
    }

    // A 2-pole load of 20 A on A–B (in phase with V_AB, 30° ahead of V_A) and a 1-pole 40 A on A. On the feeder
    // I_A = I₄₀ + 20∠30° and I_B = −20∠30° (the 2-pole load draws 208 V·20 A across V_AB = 208 V; I₄₀ = OnLine(40));
    // with f = (V_A − V_B)/V_AB the parts Re(f_x·Z·I_x) are Re(Z·(I₄₀∠−30° + 20))/208 on A against Re(Z·20)/208 on B:
    // A's is the larger for any R, X ≥ 0.
    [Fact]
    public void RunLineCurrents_TwoPole_ShowTheLineOfItsPairCarryingMoreOfTheDrop()
    {
        var s = SolverHarness.Solve(SolverHarness.PanelOnFeeder(
            "length: 30, size: 4 AWG",
            "{ id: \"1\", poles: 2, load: { amps: 20, pf: 1 }, run: { length: 20, size: 12 AWG } }",
            "{ id: \"2\", poles: 1, phase: A, load: { amps: 40, pf: 1 }, run: { length: 20, size: 8 AWG } }"));
        var e = s.EndPointById("P/1")!.Value;
        Assert.Equal("AB", s.Runs[e.RunIndices[^1]].Lines);

        var feeder = e.RunLineCurrents[0];

        Assert.Equal("A", feeder.Line);
        Assert.Equal((OnLine(40) + Complex.FromPolarCoordinates(20, Math.PI / 6)).Magnitude, feeder.CurrentA, 9);
        Assert.Equal(20, e.RunLineCurrents[1].CurrentA, 9);
    }

    // 480Y/277 service; a distribution panel DP with a 1-pole 50 A load on B and a Dyn1 transformer 480 → 208Y/120
    // (k = (208/√3)/480) whose panel has one 1-pole 40 A load on a, I_a = OnLine(40). Ampere-turn balance:
    // I_A = k·I_a = 40·120/480 = 10 A, I_C = −k·I_a, I_B = 0 on the primary; DP's feeder carries those and the B load's
    // 50·277/(480/√3) A (its most loaded line). The end point reads V_a − V_n = k·(V_A − V_C): on the primary its drop
    // is on A and C, each 10 A, equal parts (A, the first); in the transformer it is on the secondary's line a, I_a
    // (not the balanced 4,800 VA / (√3·208 V) = 13.3 A).
    [Fact]
    public void RunLineCurrents_ThroughADeltaWyeTransformer_ShowThePrimaryLinesOfItsWinding()
    {
        var s = SolverHarness.Solve("""
            disttree: 1
            project: { name: Delta-wye lines, units: metric }
            rules: { conductor_temperature: rated }
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: DP
                kind: panelboard
                from: SVC
                feeder: { length: 20, size: 2 AWG }
                circuits:
                  - { id: "1", poles: 1, phase: B, load: { amps: 50, pf: 1 }, run: { length: 10, size: 6 AWG } }
              - id: T1
                kind: transformer
                from: DP
                kva: 30
                secondary: 208Y/120
                impedance_percent: 4
                x_r: 2
                feeder: { length: 15, size: 8 AWG }
              - id: LP1
                kind: panelboard
                from: T1
                feeder: { length: 5, size: 4 AWG }
                circuits:
                  - { id: "1", poles: 1, phase: A, load: { amps: 40, pf: 1 }, run: { length: 20, size: 8 AWG } }
            """);
        var e = s.EndPointById("LP1/1")!.Value;
        var kinds = e.RunIndices.Select(r => (s.Runs[r].Id, s.Runs[r].Kind)).ToArray();
        Assert.Equal([("DP", RunResultKind.Feeder), ("T1", RunResultKind.Feeder), ("T1", RunResultKind.Transformer), ("LP1", RunResultKind.Feeder), ("LP1/1", RunResultKind.Branch)], kinds);

        var lines = e.RunLineCurrents;

        Assert.Equal(50 * 277 / (480 / Math.Sqrt(3)), s.Runs[e.RunIndices[0]].CurrentA, 9);
        Assert.Equal(["A", "A", "A", "A", "A"], lines.Select(l => l.Line));
        Assert.Equal([10, 10, OnLine(40), OnLine(40), OnLine(40)], lines.Select(l => l.CurrentA), (a, b) => Math.Abs(a - b) < 1e-9);
    }

    // A 3-pole balanced load: its worst pair's lines carry the same current as every line, the run's own figure.
    [Fact]
    public void RunLineCurrents_ThreePoleBalanced_ShowTheLineCurrent()
    {
        var s = SolverHarness.Solve(SolverHarness.PanelOnFeeder(
            "length: 30, size: 4 AWG",
            "{ id: \"1\", poles: 3, load: { amps: 25, pf: 0.9 }, run: { length: 20, size: 10 AWG } }"));
        var e = s.EndPointById("P/1")!.Value;

        Assert.All(e.RunLineCurrents, l => Assert.Equal(25, l.CurrentA, 9));
        Assert.All(e.RunIndices, r => Assert.Equal(25, s.Runs[r].CurrentA, 9));
    }
}
