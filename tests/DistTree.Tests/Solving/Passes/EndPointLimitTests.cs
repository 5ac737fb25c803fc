using DistTree.Model;
using DistTree.ProjectFiles;
using DistTree.Sizing;
using DistTree.Solving;
using DistTree.Tests.ProjectFiles;

namespace DistTree.Tests.Solving.Passes;

/// <summary>
/// Each end point's own total limit: a lighting limit apart from the total (<c>lighting_limit_percent</c>), and a
/// long-path allowance (IEC 60364-5-52 Annex G: + 0.005 % per metre of wiring beyond 100 m, at most + 0.5 %; memory),
/// judged by the end-point pass, the reach, the upsizer and the outputs alike.
/// </summary>
public sealed class EndPointLimitTests
{
    // Two circuits alike but for their category, on the same line (1 and 2 face each other on line A), so their totals
    // are equal.
    private static string Twins(string rules) =>
        "disttree: 1\nproject: { name: Twins, units: metric }\n" + $"rules: {{ conductor_temperature: rated{rules} }}\n"
        + "service: { id: SVC, system: 208Y/120 }\nequipment:\n  - id: P\n    kind: panelboard\n    from: SVC\n"
        + "    feeder: { length: 60, size: 2 AWG }\n    circuits:\n"
        + "      - { id: \"1\", name: Lights, category: lighting, poles: 1, ocpd: 20, load: { amps: 12 }, run: { length: 15, size: 12 AWG } }\n"
        + "      - { id: \"2\", name: Heater, category: other, poles: 1, ocpd: 20, load: { amps: 12 }, run: { length: 15, size: 12 AWG } }\n";

    private static EndPointResult At(Solution s, string id) => s.EndPointById(id) ?? throw new InvalidOperationException(id);

    private static double TwinTotal()
    {
        var s = SolverHarness.Solve(Twins(""));
        var (lights, heater) = (At(s, "P/1"), At(s, "P/2"));
        Assert.Equal(lights.TotalDropPercent, heater.TotalDropPercent, 12);
        return lights.TotalDropPercent;
    }

    [Fact]
    public void Solve_LightingLimitBelowTheTotal_JudgesOnlyTheLightingEndPointByIt()
    {
        var total = TwinTotal();
        var lighting = Math.Round(total * 0.8, 2);
        var s = SolverHarness.Solve(Twins($", total_limit_percent: {Math.Round(total * 1.2, 2)}, lighting_limit_percent: {lighting}"));

        var lights = At(s, "P/1");
        Assert.Equal(lighting, lights.LimitPercent);
        var finding = Assert.Single(s.AllFindings, f => f.Kind == FindingKind.TotalDrop);
        Assert.Equal("P/1", finding.Subject);
        Assert.Equal(lighting, finding.Limit);
        Assert.Equal(Math.Round(total * 1.2, 2), At(s, "P/2").LimitPercent);
    }

    [Fact]
    public void Solve_LightingLimit_TheReachToTheTotalUsesTheEndPointsOwnLimit()
    {
        // The branch circuit's reach to the total: L · (drop + slack) / drop with the end point's own slack
        // (limit − total); the closed form of the reach pass, checked on each twin.
        var total = TwinTotal();
        var s = SolverHarness.Solve(Twins($", total_limit_percent: 6, lighting_limit_percent: 2"));
        foreach (var (id, limit) in new[] { ("P/1", 2.0), ("P/2", 6.0) })
        {
            var branch = s.Runs.Single(r => r.Id == id);
            var expected = branch.LengthM * (branch.DropPercent + limit - total) / branch.DropPercent;
            Assert.Equal(Math.Max(0, expected), branch.MaxLengthTotalM!.Value, 6);
        }
    }

    [Theory]
    // IEC 60364-5-52 Annex G (memory): + 0.005 % per metre beyond 100 m, at most + 0.5 %.
    [InlineData(40, 0)]
    [InlineData(100, 0)]
    [InlineData(150, 0.25)]
    [InlineData(200, 0.5)]
    [InlineData(600, 0.5)]
    public void PercentAt_AnnexGAllowance_GrowsPastOneHundredMetresUpToItsCap(double pathM, double expected)
    {
        var allowance = new LengthAllowance(100, 0.005, 0.5);
        Assert.Equal(expected, allowance.PercentAt(pathM), 12);
    }

    [Fact]
    public void Solve_LongPathAllowance_AddsByTheWiringLengthFromTheService()
    {
        // The path: a 60 m feeder and a 15 m branch circuit, 75 m: no allowance; the feeder made 90 m: 105 m, + 0.025 %.
        foreach (var (feederM, allowance) in new[] { (60, 0.0), (90, 0.025) })
        {
            var project = ProjectLoader.Parse(Twins("").Replace("length: 60", $"length: {feederM}", StringComparison.Ordinal), "twins.yaml");
            project = project with { Rules = project.Rules with { LongPathAllowance = new LengthAllowance(100, 0.005, 0.5), LightingLimitPercent = 3 } };
            var s = Analysis.Run(project, new AnalysisOptions()).Solution;
            Assert.Equal(3 + allowance, At(s, "P/1").LimitPercent, 12);
            Assert.Equal(5 + allowance, At(s, "P/2").LimitPercent, 12);
        }
    }

    [Fact]
    public void Plan_LightingLimit_BringsTheLightingEndPointWithinItsOwnLimit()
    {
        var total = TwinTotal();
        var lighting = Math.Round(total * 0.8, 2);
        var before = SolverHarness.Solve(Twins($", lighting_limit_percent: {lighting}"));
        Assert.Contains(before.AllFindings, f => f.Kind == FindingKind.TotalDrop && f.Subject == "P/1");

        var plan = Upsizer.Standard.Plan(before);

        Assert.Empty(plan.Unresolvable);
        Assert.False(plan.After.HasFindings);
        Assert.True(At(plan.After, "P/1").TotalDropPercent <= lighting + 1e-9);
        Assert.DoesNotContain(plan.Changes, c => c.RunId == "P/2");
    }

    [Fact]
    public void Parse_SupplyUnderACodeWithoutIt_IsALocatedError() =>
        ProjectText.AssertOneError(
            "disttree: 1\nproject: { name: S }\nrules:\n  code: nec\n  supply: private\nservice: { id: SVC, system: 208Y/120 }\nequipment:\n  - { id: P, kind: panelboard, from: SVC }\n",
            "private", "'supply' chooses the limits of a code that sets them by the kind of supply; code 'nec' does not: remove it, or state the limits", line: 5);
}
