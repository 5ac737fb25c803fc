using DistTree.Solving;

namespace DistTree.Tests.Solving.Passes;

public sealed class MotorStartCheckTests
{
    private static string Motor(string load, double lengthM = 60, string rules = "conductor_temperature: rated") => SolverHarness.OneCircuit("480Y/277", "metric",
        $"{{ id: \"1\", poles: 3, ocpd: 40, load: {load}, run: {{ length: {lengthM}, size: 8 AWG }} }}", rules);

    // Superposition (common practice): the dip at the terminals is the steady drop plus the drop of the extra
    // power S_LR − S_run: 100·(ΔP·R + ΔQ·X)/V² on a three-phase run, computed here by hand from the figures.
    [Fact]
    public void Solve_MotorOnOneRun_DipIsSteadyPlusExtra()
    {
        var s = SolverHarness.Solve(Motor("{ hp: 10, pf: 0.85, lrc_multiple: 6, starting_pf: 0.3 }"));
        var run = s.Branch();
        var running = ComplexPower.FromApparent(run.ApparentPowerVa, 0.85);
        var lockedRotor = ComplexPower.FromApparent(6 * run.ApparentPowerVa, 0.3);
        var r = run.ResistanceOhmPerKm!.Value * 0.06;
        var x = run.ReactanceOhmPerKm!.Value * 0.06;
        var extra = 100 * (((lockedRotor.Watts - running.Watts) * r) + ((lockedRotor.Vars - running.Vars) * x)) / (480.0 * 480.0);
        var start = s.EndPoints.Single().MotorStart!;
        Assert.Equal(run.DropPercent + extra, start.TerminalDipPercent, 9);
        Assert.Equal(0, start.PanelDipPercent, 9);
    }

    [Fact]
    public void Solve_LongMotorRun_IsAStartingFinding()
    {
        var s = SolverHarness.Solve(Motor("{ hp: 20, pf: 0.85, code_letter: J }", 400, "motor_start_limit_percent: 10"));
        Assert.Contains(s.AllFindings, f => f.Code == "motor_start");
    }

    [Fact]
    public void Solve_NonMotor_HasNoStartingCheck() =>
        Assert.Null(SolverHarness.Solve(Motor("{ kva: 10, pf: 0.9 }")).EndPoints.Single().MotorStart);

    // The dip at every bus of the path (issue 17): each is the terminal dip less the running and starting drops of the
    // rows below that bus, so the figures fall going up, and the panel's is the panel dip.
    [Fact]
    public void Solve_MotorBelowTwoPanels_DipsAtEveryBusOfItsPath()
    {
        var s = SolverHarness.Solve("""
            disttree: 1
            project: { name: Dips, units: metric }
            rules: { conductor_temperature: rated }
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - { id: MDP, kind: switchboard, from: SVC, feeder: { length: 30, size: 2 AWG } }
              - id: LP
                kind: panelboard
                from: MDP
                feeder: { length: 40, size: 6 AWG }
                circuits:
                  - { id: "1", poles: 1, load: { hp: 1, pf: 0.8, lrc_multiple: 6, starting_pf: 0.4 }, run: { length: 20, size: 12 AWG } }
            """);
        var start = s.EndPoints.Single().MotorStart!;

        Assert.Equal(["LP", "MDP"], start.PathDips.Select(d => d.Id));
        Assert.Equal(start.PanelDipPercent, start.PathDips[0].DipPercent, 12);
        Assert.True(start.TerminalDipPercent > start.PathDips[0].DipPercent && start.PathDips[0].DipPercent > start.PathDips[1].DipPercent);
        Assert.True(start.PathDips[1].DipPercent > 0);
    }
}
