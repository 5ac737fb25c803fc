using DistTree.Diagnostics;
using DistTree.Sizing;
using DistTree.Solving;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Codes.Nec;

/// <summary>
/// Motors and air conditioning (issue 18, item 4), a project per rule that fails it and one that passes it. Full-load
/// currents are NEC Table 430.250's 460 V column (memory): 5 hp 7.6 A, 7.5 hp 11 A, 10 hp 14 A, 25 hp 34 A, 300 hp
/// 361 A. Ampacities are NEC Table 310.16's 75 °C copper column (read): 12 AWG 25 A, 10 AWG 35 A, 8 AWG 50 A, 6 AWG
/// 65 A. The clauses are the 2020 edition's, recalled (memory).
/// </summary>
public sealed class MotorRulesTests
{
    // The review's case. A 25 hp 460 V motor (34 A) needs 125 % of it, 42.5 A (NEC 430.22): 10 AWG (35 A) is too
    // small and is a finding citing 430.22. Its 60 A breaker is within 250 % of 34 A, 85 A (NEC 430.52(C)(1), Table
    // 430.52), so no device finding: the small-conductor and next-size-up rules do not apply (NEC 240.4(G)).
    [Fact]
    public void Solve_25HpOn10Awg_AmpacityCitingMotorBranchRuleAndNoDeviceFinding()
    {
        var branch = SolverHarness.Solve(Panel(Motor("25", "10 AWG", 60))).Runs.Single(r => r.Id == "P/1");
        Assert.Equal(42.5, branch.DesignCurrentA, 9);
        var finding = Assert.Single(branch.Findings);
        Assert.Equal(("ampacity", "NEC 430.22"), (finding.Code, finding.Reference));
        Assert.Equal(35, finding.Limit, 9);
        Assert.Equal("branch circuit P/1: design current 42.5 A (125 % of the motor's full-load current of 34 A) exceeds the 1×10 AWG ampacity of 35 A", finding.Message);
    }

    [Fact]
    public void Solve_25HpOn8Awg_Passes()
    {
        var branch = SolverHarness.Solve(Panel(Motor("25", "8 AWG", 60))).Runs.Single(r => r.Id == "P/1");
        Assert.Empty(branch.Findings);
    }

    // A motor's 'continuous' flag does not count it twice: still 125 % of 34 A.
    [Fact]
    public void Solve_ContinuousMotor_StillAt125Percent()
    {
        var branch = SolverHarness.Solve(Panel(Motor("25", "8 AWG", 60, continuous: true))).Runs.Single(r => r.Id == "P/1");
        Assert.Equal(42.5, branch.DesignCurrentA, 9);
    }

    // The breaker may be 250 % of 34 A, 85 A, or the next standard rating above, 90 A (NEC 430.52(C)(1) Exception No.
    // 1; NEC 240.6(A)); 100 A is a finding citing 430.52(C)(1) with 90 A as its limit.
    [Theory]
    [InlineData(90, false)]
    [InlineData(100, true)]
    public void Solve_MotorBreaker_AtMost250PercentOrTheNextRating(double ocpdA, bool found)
    {
        var branch = SolverHarness.Solve(Panel(Motor("25", "8 AWG", ocpdA))).Runs.Single(r => r.Id == "P/1");
        Assert.Equal(found, branch.Findings.Any());
        if (found)
        {
            var finding = Assert.Single(branch.Findings);
            Assert.Equal(("ocpd_above_ampacity", "NEC 430.52(C)(1)", 100.0, 90.0), (finding.Code, finding.Reference, finding.Value, finding.Limit));
        }
    }

    // A feeder with motors of 10, 25 and 5 hp (14, 34 and 7.6 A, all at pf 0.85, so their currents add as numbers):
    // 125 % of the largest plus the rest (NEC 430.24) is 1.25 × 34 + 14 + 7.6 = 64.1 A, which 6 AWG (65 A) carries.
    // With 7.5 hp (11 A) in place of 5 hp it is 1.25 × 34 + 14 + 11 = 67.5 A: over 65 A, citing 430.24, though the
    // plain sum, 59 A, is not.
    [Theory]
    [InlineData("5", 64.1, false)]
    [InlineData("7.5", 67.5, true)]
    public void Solve_FeederWithMotors_125PercentOfTheLargestPlusTheRest(string third, double designA, bool found)
    {
        var s = SolverHarness.Solve(Panel(Motor("10", "12 AWG", 35) + "\n" + Motor("25", "8 AWG", 60, id: 2) + "\n" + Motor(third, "12 AWG", 20, id: 3), feeder: "6 AWG"));
        var feeder = s.Runs.Single(r => r.Id == "P");
        Assert.Equal(designA, feeder.DesignCurrentA, 6);
        Assert.Equal(found ? [("ampacity", "NEC 430.24")] : [], feeder.Findings.Select(f => (f.Code, f.Reference)));
        Assert.All(s.Runs.Where(r => r.Id != "P"), r => Assert.Empty(r.Findings));
    }

    // A feeder's device is rated for its load (NEC 215.3, memory), not for the largest motor's extra 25 %, which sizes
    // conductors (430.24): a 25 hp motor (34 A) alone on a feeder of 8 AWG (50 A) makes a design current of 42.5 A; a
    // 40 A feeder breaker carries its 34 A load, a 30 A one does not. (The feeder device's own motor rule, 430.62, is
    // not checked: docs/limits.md.)
    [Theory]
    [InlineData(40, false)]
    [InlineData(30, true)]
    public void Solve_FeederDevice_AgainstTheLoadWithoutTheMotorShare(double ocpdA, bool found)
    {
        var yaml = Panel(Motor("25", "8 AWG", 60), feeder: FormattableString.Invariant($"8 AWG, ocpd: {ocpdA}"));
        var feeder = SolverHarness.Solve(yaml).Runs.Single(r => r.Id == "P");
        Assert.Equal(42.5, feeder.DesignCurrentA, 6);
        Assert.Equal(found ? ["device_below_load"] : [], feeder.Findings.Select(f => f.Code));
        if (found)
        {
            Assert.Equal(34, feeder.Findings[0].Value, 6);
            Assert.Equal(30, feeder.Findings[0].Limit, 9);
        }
    }

    // Motors below a transformer are on another system: the transformer's primary feeder counts their current as the
    // transformer draws it, with no motor share (docs/limits.md). A 25 hp 208 V motor (74.8 A) on the secondary of a
    // 45 kVA 480-208Y/120 transformer: the primary feeder's design current is its line current.
    [Fact]
    public void Solve_MotorBelowATransformer_NoMotorShareOnThePrimary()
    {
        var yaml = """
            disttree: 1
            project: { name: Motors, units: imperial }
            rules: { conductor_temperature: rated }
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: T
                kind: transformer
                from: SVC
                kva: 45
                primary: 480Y/277
                secondary: 208Y/120
                impedance_percent: 5
                x_r: 4
                feeder: { length: 20, size: 4 AWG }
              - id: P
                kind: panelboard
                from: T
                feeder: { length: 10, size: 1/0 AWG }
                circuits:
                  - { id: "1", poles: 3, ocpd: 150, load: { hp: 25, pf: 0.85 }, run: { length: 10, size: 3 AWG } }
            """;
        var s = SolverHarness.Solve(yaml);
        var primary = s.Runs.Single(r => r.Id == "T" && r.Kind == RunResultKind.Feeder);
        Assert.Equal(primary.LineCurrentsA.Max(), primary.DesignCurrentA, 9);
        var secondary = s.Runs.Single(r => r.Id == "P");
        Assert.Equal(secondary.LineCurrentsA.Max() + (0.25 * 74.8), secondary.DesignCurrentA, 6);
    }

    // Motors to 500 hp (Table 430.250, memory): a 300 hp 460 V motor (361 A) is accepted, 451.25 A at 125 %.
    [Fact]
    public void Solve_300HpMotor_Accepted()
    {
        var branch = SolverHarness.Solve(Panel(Motor("300", "500 kcmil", 800, sets: 2))).Runs.Single(r => r.Id == "P/1");
        Assert.Equal(451.25, branch.DesignCurrentA, 9);
    }

    // Table 430.250's 208 V column stops at 200 hp: a 250 hp motor on 208 V is refused at its circuit, asking for 'fla'.
    [Fact]
    public void Solve_250HpOn208V_LocatedErrorAskingForFla()
    {
        var yaml = SolverHarness.OneCircuit("208Y/120", "imperial", """{ id: "1", poles: 3, load: { hp: 250, pf: 0.9 }, run: { length: 10, size: 500 kcmil, sets: 2 } }""");
        var e = Assert.Throws<ProjectException>(() => SolverHarness.Solve(yaml));
        var d = Assert.Single(e.Diagnostics);
        Assert.Contains("no full-load current is listed for a 250 hp motor on 3-phase 208 V; give the motor's nameplate current as 'fla' instead", d.Message, StringComparison.Ordinal);
        Assert.NotEqual(0, d.Location.Line);
    }

    // Air conditioning by its nameplate: conductors at least the minimum circuit ampacity (NEC 440.35), the device at
    // most the maximum overcurrent device (NEC 440.22(C)). mca 28 A, mocp 45 A: 10 AWG (35 A) with 45 A passes (under
    // the small-conductor rule 10 AWG would stop at 30 A); 12 AWG (25 A) fails the ampacity; a 50 A breaker the mocp.
    [Theory]
    [InlineData("10 AWG", 45, new string[0])]
    [InlineData("12 AWG", 45, new[] { "NEC 440.35" })]
    [InlineData("10 AWG", 50, new[] { "NEC 440.22(C)" })]
    public void Solve_AirConditioning_ByItsNameplate(string size, double ocpdA, string[] references)
    {
        var circuit = FormattableString.Invariant(
            $$"""      - { id: "1", poles: 2, ocpd: {{ocpdA}}, load: { amps: 22, pf: 0.9, mca: 28, mocp: 45 }, run: { length: 10, size: {{size}} } }""");
        var branch = SolverHarness.Solve(Panel(circuit, system: "208Y/120")).Runs.Single(r => r.Id == "P/1");
        Assert.Equal(28, branch.DesignCurrentA, 9);
        Assert.Equal(references, branch.Findings.Select(f => f.Reference));
    }

    // The sizer judges a motor circuit by the same rules: the review's circuit is upsized to 8 AWG, which the findings
    // accept, keeping its 60 A breaker (a 6 AWG under the small-conductor view would not be asked for).
    [Fact]
    public void Plan_25HpOn10Awg_UpsizesTo8Awg()
    {
        var plan = Upsizer.Standard.Plan(SolverHarness.Solve(Panel(Motor("25", "10 AWG", 60))));
        var change = Assert.Single(plan.Changes);
        Assert.Equal(("P/1", "10 AWG", "8 AWG"), (change.RunId, change.SizeBefore, change.SizeAfter));
    }

    // A 3-pole motor circuit at 460 V.
    private static string Motor(string hp, string size, double ocpdA, bool continuous = false, int id = 1, int sets = 1) => FormattableString.Invariant(
        $$"""      - { id: "{{id}}", poles: 3, ocpd: {{ocpdA}}, continuous: {{(continuous ? "true" : "false")}}, load: { hp: {{hp}}, pf: 0.85 }, run: { length: 10, size: {{size}}, sets: {{sets}} } }""");

    // A panel P on a short copper feeder (no device) of the given size from a service of the given system.
    private static string Panel(string circuits, string feeder = "500 kcmil", string system = "480Y/277") => $"""
        disttree: 1
        project:
          name: Motors
          units: imperial
        rules:
          conductor_temperature: rated
        service:
          id: SVC
          system: {system}
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            feeder: {"{"} length: 10, size: {feeder} {"}"}
            circuits:
        {circuits}
        """;
}
