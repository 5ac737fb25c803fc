using DistTree.Model;
using DistTree.ProjectFiles;
using DistTree.Solving;
using DistTree.Tests.ProjectFiles;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Codes.Iec;

/// <summary>
/// Small metric projects under <c>rules: code: iec</c> (invented data), judged by IEC 60364's clauses (memory: IEC
/// 60364-4-43:2008 433.1, 60364-5-52:2009 Annex B, 60364-5-54:2011 Table 54.2; verify against the editions in force).
/// </summary>
public sealed class IecProjectTests
{
    // A 1-pole 230 V circuit on 1.5 mm² PVC, method B1, two loaded conductors: Iz 17.5 A (Table B.52.2, memory). 18 A
    // under a 20 A breaker breaks IB ≤ Iz and In ≤ Iz (433.1 a)), and its neutral carries the same 18 A (523.1); the
    // findings cite IEC, not the NEC.
    [Fact]
    public void Solve_Overloaded_CitesClause4331()
    {
        var s = SolverHarness.Solve(Project("{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 18 }, run: { length: 5, size: 1.5 mm2 } }"));
        var branch = s.Branch();
        Assert.Equal(17.5, branch.AmpacityA!.Value, 9);
        Assert.Equal(
            [("ampacity", "IEC 60364-4-43 433.1 a)"), ("neutral_ampacity", "IEC 60364-5-52 523.1"), ("ocpd_above_ampacity", "IEC 60364-4-43 433.1")],
            branch.Findings.Select(f => (f.Code, f.Reference)).OrderBy(p => p.Code, StringComparer.Ordinal));
    }

    // A 3-pole circuit has three loaded conductors: 2.5 mm² PVC B1 21 A (Table B.52.4); method C 24 A, E 25 A (Tables
    // B.52.4, B.52.10; memory).
    [Theory]
    [InlineData("", 21.0)]
    [InlineData(", installation_method: c", 24.0)]
    [InlineData(", installation_method: e", 25.0)]
    public void Solve_ThreePole_TakesTheMethodsThreeLoadedColumn(string method, double izA)
    {
        var s = SolverHarness.Solve(Project($"{{ id: \"1\", poles: 3, ocpd: 16, load: {{ amps: 10 }}, run: {{ length: 5, size: 2.5 mm2{method} }} }}"));
        Assert.Equal(izA, s.Branch().AmpacityA!.Value, 9);
    }

    // Grouping counts circuits (Table B.52.17 row 1, memory): three 1-pole circuits in one raceway are 3 circuits, 0.70;
    // 2.5 mm² B1 two loaded, 24 A, gives 16.8 A. A stated count of 2 circuits: 0.80, 19.2 A.
    [Fact]
    public void Solve_SharedRaceway_GroupsByCircuits()
    {
        var s = SolverHarness.Solve(Project([.. Enumerable.Range(1, 3).Select(i =>
            $"{{ id: \"{i}\", poles: 1, ocpd: 16, load: {{ amps: 10 }}, run: {{ length: 5, size: 2.5 mm2, raceway_id: R1 }} }}")]));
        Assert.All(s.Runs.Where(r => r.Kind == RunResultKind.Branch), r =>
        {
            Assert.Equal(3, r.CurrentCarryingConductors);
            Assert.Equal(0.70 * 24, r.AmpacityA!.Value, 9);
        });

        var stated = SolverHarness.Solve(Project("{ id: \"1\", poles: 1, ocpd: 16, load: { amps: 10 }, run: { length: 5, size: 2.5 mm2, current_carrying: 2 } }"));
        Assert.Equal(0.80 * 24, stated.Branch().AmpacityA!.Value, 9);
    }

    // A gG fuse of 32 A on 6 mm² PVC method A1, two loaded (Iz 34 A, Table B.52.2): IB 30 ≤ In 32 ≤ Iz 34 holds, but
    // I2 = 1.6 × 32 = 51.2 A > 1.45 × 34 = 49.3 A (433.1 b), IEC 60269-2; memory). A breaker's I2 (1.45·In) passes.
    [Theory]
    [InlineData("fuse", true)]
    [InlineData("breaker", false)]
    public void Solve_Fuse_ChecksTheConventionalOperatingCurrent(string device, bool finding)
    {
        var s = SolverHarness.Solve(Project($"{{ id: \"1\", poles: 1, ocpd: 32, load: {{ amps: 30 }}, run: {{ length: 5, size: 6 mm2, installation_method: a1, device_type: {device} }} }}"));
        var found = s.Branch().Findings;
        Assert.Equal(finding, found.Count == 1);
        if (finding)
        {
            Assert.Equal((51.2, 1.45 * 34), (found[0].Value, found[0].Limit));
            Assert.Equal("IEC 60364-4-43 433.1", found[0].Reference);
        }
    }

    // No 125 % for a motor (433.1: IB is its full-load current): 20 A on 2.5 mm² B1 three-pole (21 A) passes under a
    // 20 A breaker, where the NEC's 430.22 would ask 25 A.
    [Fact]
    public void Solve_Motor_DesignCurrentIsItsFullLoadCurrent()
    {
        var branch = SolverHarness.Solve(Project("{ id: \"1\", poles: 3, ocpd: 20, load: { fla: 20, pf: 0.85 }, run: { length: 5, size: 2.5 mm2 } }")).Branch();
        Assert.Equal(20, branch.DesignCurrentA, 9);
        Assert.Empty(branch.Findings);
    }

    // Table 54.2 (memory): 50 mm² lines need a 25 mm² protective conductor; a stated 16 mm² is a finding.
    [Fact]
    public void Solve_SmallProtectiveConductor_CitesTable542()
    {
        var s = SolverHarness.Solve(OnFeeder("length: 10, size: 50 mm2, ground_size: 16 mm2, ocpd: 100"));
        var finding = Assert.Single(s.Runs.Single(r => r.Id == "P").Findings);
        Assert.Equal("IEC 60364-5-54 543.1.2, Table 54.2", finding.Reference);
        Assert.Contains("16 mm2 protective conductor is smaller than the 25 mm2", finding.Message, StringComparison.Ordinal);
    }

    // IEC 60364-5-52's tables are by mm²: an AWG size is refused where it is written.
    [Fact]
    public void Parse_AwgUnderIec_IsALocatedError() =>
        ProjectText.AssertOneError(
            Project("{ id: \"1\", poles: 1, ocpd: 16, load: { amps: 10 }, run: { length: 5, size: 12 AWG } }"),
            "12 AWG",
            "'size' of the run of circuit 'P/1' is 12 AWG, but IEC 60364-5-52's current-carrying capacity tables are by mm2 ('rules: code: iec'): give a metric size (e.g. 2.5 mm2)");

    // 'installation_method' is IEC's: under the NEC it is refused; 'device_type' is read under every code.
    [Fact]
    public void Parse_InstallationMethodUnderNec_IsRefused_DeviceTypeIsRead()
    {
        var nec = ProjectText.Minimal(circuit: "poles: 1\n        ocpd: 20\n        load: { va: 1000 }\n        run: { length: 20, size: 12 AWG, installation_method: c }");
        ProjectText.AssertOneError(nec, "installation_method", "'installation_method' of the run of circuit 'LP1/1' chooses a column of IEC 60364-5-52's tables, which 'rules: code: nec' does not read: remove it, or use 'rules: code: iec'");
        var fuse = ProjectText.Minimal(circuit: "poles: 1\n        ocpd: 20\n        load: { va: 1000 }\n        run: { length: 20, size: 12 AWG, device_type: fuse }");
        Assert.Equal(DeviceType.Fuse, ProjectLoader.Parse(fuse, "t.yaml").Equipment[0].Circuits[0].Run.DeviceType);
    }

    /// <summary>A valid project under code: iec with one 2.5 mm² circuit (invented data).</summary>
    internal static string Sample => Project();

    // A 400Y/230 50 Hz panel P under code: iec on a 16 mm² feeder with a 63 A breaker, with the given circuits.
    private static string Project(params string[] circuits) => OnFeeder("length: 10, size: 16 mm2, ocpd: 63", circuits);

    // The same panel on a feeder of the given keys.
    private static string OnFeeder(string feeder, params string[] circuits) =>
        "disttree: 1\nproject: { name: IEC panel, units: metric }\nrules: { code: iec, conductor_temperature: rated }\n"
        + "service: { id: SVC, system: 400Y/230, frequency_hz: 50 }\nequipment:\n  - id: P\n    kind: panelboard\n    from: SVC\n"
        + $"    feeder: {{ {feeder} }}\n    circuits:\n"
        + string.Concat((circuits.Length == 0 ? ["{ id: \"1\", poles: 1, ocpd: 16, load: { amps: 10 }, run: { length: 5, size: 2.5 mm2 } }"] : circuits).Select(c => $"      - {c}\n"));
}
