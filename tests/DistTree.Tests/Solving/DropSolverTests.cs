using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

public sealed class DropSolverTests
{
    // K-factor method, single-phase: VD = 2·K·I·L/CM, K = 12.9 ohm·cmil/ft copper at 75 °C (common practice
    // handbook form; K quoted in REFERENCES.md). 12 AWG (6,530 cmil), 100 ft, 16 A, unity power factor:
    // VD = 2 × 12.9 × 16 × 100 / 6530 = 6.322 V. Tolerance 2 %.
    [Fact]
    public void Solve_SinglePhaseResistive_MatchesKFactor()
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 16, pf: 1.0 }, run: { length: 100, size: 12 AWG } }"));
        var expected = 2 * 12.9 * 16 * 100 / 6530.0;
        Assert.InRange(s.Branch().DropV / expected, 0.98, 1.02);
        Assert.Equal(s.Branch().DropV / 120 * 100, s.Branch().DropPercent, 9);
    }

    // K-factor method, three-phase: VD = 1.732·K·I·L/CM (common practice). 1 AWG (83,690 cmil), 200 ft,
    // 100 A at unity power factor, 480 V: VD = 1.732 × 12.9 × 100 × 200 / 83690 = 5.340 V. Tolerance 2 %.
    [Fact]
    public void Solve_ThreePhaseResistive_MatchesKFactor()
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("480Y/277", "imperial",
            "{ id: \"1\", poles: 3, ocpd: 125, load: { amps: 100, pf: 1.0 }, run: { length: 200, size: 1 AWG } }"));
        var expected = 1.732 * 12.9 * 100 * 200 / 83690.0;
        Assert.InRange(s.Branch().DropV / expected, 0.98, 1.02);
        Assert.Equal(100, s.Branch().CurrentA, 6);
    }

    // NEC Chapter 9 Table 9, note 2 (read): effective Z = R·cos θ + X·sin θ; I × Z × L is the line-to-neutral
    // drop, × √3 line-to-line. 250 kcmil copper in PVC: R 0.052, X 0.041 ohm/kft (REFERENCES.md, read);
    // 300 ft, 200 A, pf 0.85: Ze = 0.052 × 0.85 + 0.041 × 0.5268 = 0.06580 ohm/kft, ΔV(L-L) = √3 × 200 × 0.3 × 0.06580
    // = 6.838 V. 500 kcmil copper in steel: R 0.029, X 0.048: ΔV = √3 × 200 × 0.3 × (0.02465 + 0.02529) = 5.190 V.
    // Tolerance 3 %.
    [Theory]
    [InlineData("250 kcmil", "pvc", 0.052, 0.041)]
    [InlineData("500 kcmil", "steel", 0.029, 0.048)]
    public void Solve_ThreePhaseLagging_MatchesTable9EffectiveImpedance(string size, string raceway, double rTable, double xTable)
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("480Y/277", "imperial",
            $"{{ id: \"1\", poles: 3, ocpd: 400, load: {{ amps: 200, pf: 0.85 }}, run: {{ length: 300, size: {size}, raceway: {raceway} }} }}"));
        var sin = Math.Sqrt(1 - (0.85 * 0.85));
        var expected = Math.Sqrt(3) * 200 * 0.3 * ((rTable * 0.85) + (xTable * sin));
        Assert.InRange(s.Branch().DropV / expected, 0.97, 1.03);
    }

    // IEEE Std 141 exact, sending-end based formula (REFERENCES.md, memory):
    // ΔV = Es + I·R·cos θ + I·X·sin θ − √(Es² − (I·X·cos θ − I·R·sin θ)²), Es line-to-neutral. With the solver's
    // own R and X, its effective-impedance drop must be within 1 % of the exact one, even for a long
    // low-power-factor run.
    [Theory]
    [InlineData(300, 200, 0.85, "250 kcmil")]
    [InlineData(900, 120, 0.70, "2/0")]
    public void Solve_EffectiveImpedance_Within1PercentOfIeee141Exact(double lengthFt, double amps, double pf, string size)
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("480Y/277", "imperial",
            $"{{ id: \"1\", poles: 3, ocpd: 400, load: {{ amps: {amps}, pf: {pf} }}, run: {{ length: {lengthFt}, size: {size} }} }}"));
        var run = s.Branch();
        var km = lengthFt * 0.3048 / 1000;
        var r = run.ResistanceOhmPerKm!.Value * km;
        var x = run.ReactanceOhmPerKm!.Value * km;
        var sin = Math.Sqrt(1 - (pf * pf));
        const double es = 277.128;
        var exact = es + (amps * r * pf) + (amps * x * sin) - Math.Sqrt((es * es) - Math.Pow((amps * x * pf) - (amps * r * sin), 2));
        Assert.InRange(run.DropV / Math.Sqrt(3) / exact, 0.99, 1.01);
    }

    // IEC 60364-5-52 Annex G (REFERENCES.md, read; constants quoted): u = b·(ρ1·L/S·cos φ + λ·L·sin φ)·IB,
    // ρ1 = 1.25 × ρ20 = 0.0225 ohm·mm²/m for copper, λ = 0.08 mohm/m; b = 2 single-phase, 1 three-phase
    // (line-to-neutral). DistTree uses IEC 60228 maxima rather than ρ/S, at 70 °C here; tolerance 3 %.
    //   2.5 mm², 30 m, 16 A, cos φ 1, 230 V: u = 2 × 0.0225 × 30 / 2.5 × 16 = 8.64 V.
    //   95 mm², 100 m, 150 A, cos φ 0.8, 400 V: u = (0.0225 × 100 / 95 × 0.8 + 0.00008 × 100 × 0.6) × 150 = 3.562 V (L-N).
    [Fact]
    public void Solve_Metric_MatchesIecAnnexG()
    {
        var single = SolverHarness.Solve(SolverHarness.OneCircuit("400Y/230", "metric",
            "{ id: \"1\", poles: 1, ocpd: 16, load: { amps: 16, pf: 1.0 }, run: { length: 30, size: 2.5 mm2 } }", "conductor_temperature: 70", 50));
        Assert.InRange(single.Branch().DropV / 8.64, 0.97, 1.03);

        var three = SolverHarness.Solve(SolverHarness.OneCircuit("400Y/230", "metric",
            "{ id: \"1\", poles: 3, ocpd: 160, load: { amps: 150, pf: 0.8 }, run: { length: 100, size: 95 mm2 } }", "conductor_temperature: 70", 50));
        var uLineToNeutral = ((0.0225 * 100 / 95 * 0.8) + (0.00008 * 100 * 0.6)) * 150;
        Assert.InRange(three.Branch().DropV / Math.Sqrt(3) / uLineToNeutral, 0.97, 1.03);
    }

    [Fact]
    public void Solve_LongBranch_FindsBranchAndTotal()
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 16 }, run: { length: 200, size: 12 AWG } }"));
        var codes = s.AllFindings.Select(f => f.Code).ToArray();
        Assert.Contains("branch_drop", codes);
        Assert.Contains("total_drop", codes);
        Assert.True(s.HasFindings);
    }

    // A continuous load's design current is 125 % of it (NEC 210.19(A)(1)(a), memory), and the device must be rated
    // for it (NEC 210.20(A), memory): 16 A continuous is 20 A, within a 20 A breaker and 12 AWG's 25 A; 18 A
    // continuous is 22.5 A, still within 12 AWG but above the breaker.
    [Fact]
    public void Solve_ContinuousLoad_DesignCurrentIs125Percent()
    {
        var within = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, continuous: true, load: { amps: 16 }, run: { length: 10, size: 12 AWG } }"));
        Assert.Equal(20, within.Branch().DesignCurrentA, 6);
        Assert.Empty(within.AllFindings);
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, continuous: true, load: { amps: 18 }, run: { length: 10, size: 12 AWG } }"));
        Assert.Equal(22.5, s.Branch().DesignCurrentA, 6);
        var device = Assert.Single(s.AllFindings);
        Assert.Equal(("device_below_load", "NEC 210.20(A)"), (device.Code, device.Reference));
        var over = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, continuous: true, load: { amps: 21 }, run: { length: 10, size: 12 AWG } }"));
        Assert.Contains(over.AllFindings, f => f.Code == "ampacity");
    }

    // NEC 240.4(D) (read): 12 AWG copper may be protected at 20 A at most.
    [Fact]
    public void Solve_SmallConductorOnLargeBreaker_FindsOcpd()
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 30, load: { amps: 10 }, run: { length: 10, size: 12 AWG } }"));
        Assert.Contains(s.AllFindings, f => f.Code == "ocpd_above_ampacity");
    }

    [Fact]
    public void Solve_Motor_TakesFullLoadCurrentFromTable()
    {
        // NEC Table 430.250 (memory): 10 hp, 460 V three-phase: 14 A; a motor on a 480 V system takes the
        // 460 V column's current as it stands (common practice: the table current is the design current).
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("480Y/277", "imperial",
            "{ id: \"1\", poles: 3, ocpd: 25, load: { hp: 10, pf: 0.85 }, run: { length: 50, size: 12 AWG } }"));
        Assert.Equal(14, s.Branch().CurrentA, 6);
    }

    [Fact]
    public void Solve_Chain100000Levels_NoStackOverflowAndTheLoadFlowConverges()
    {
        // A level per panel: the level-by-level passes meet 100,000 narrow levels.
        const int levels = 100_000;
        var network = NetworkBuilder.Build(ProjectLoader.Parse(DeepChain.Text(levels), "chain.yaml"));

        var solution = DeepChain.OnSmallStack(() => DropSolver.Standard.Solve(network));

        // The panels' feeders and the one branch circuit (END stands at its source, without a feeder).
        Assert.Equal(levels + 1, solution.Runs.Count);
        Assert.True(solution.LoadFlow.Converged);
        Assert.InRange(solution.EndPoints.Single().LoadFlowEndVoltageV!.Value, 180, 208); // its worst line-to-line voltage
    }
}
