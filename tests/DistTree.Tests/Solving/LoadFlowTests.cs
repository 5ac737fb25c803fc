using DistTree.Solving;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Solving;

public sealed class LoadFlowTests
{
    private static string OneLoad(string load, string size = "2 AWG", double lengthM = 100, string method = "percent_sum") => $$"""
        disttree: 1
        project: { name: LF, units: metric }
        rules: { conductor_temperature: rated, method: {{method}} }
        service: { id: SVC, system: 480Y/277 }
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            circuits:
              - { id: "1", poles: 3, load: {{load}}, run: { length: {{lengthM}}, size: {{size}} } }
        """;

    // Closed form (circuit theory, common practice): a constant-impedance load Z_L behind a line Z gives
    // V = Z_L / (Z_L + Z) per unit. On the 100 kVA base, a 100 kW unity-power-factor load is Z_L = 1 pu.
    [Fact]
    public void Solve_ConstantImpedance_MatchesTheVoltageDivider()
    {
        var s = SolverHarness.Solve(OneLoad("{ kw: 100, pf: 1.0, model: impedance }"));
        var run = s.Branch();
        var zBase = 480.0 * 480.0 / 100_000;
        var z = new System.Numerics.Complex(run.ResistanceOhmPerKm!.Value * 0.1, run.ReactanceOhmPerKm!.Value * 0.1) / zBase;
        var expected = (1.0 / (1.0 + z)).Magnitude;
        Assert.Equal(expected * 480, s.EndPoints.Single().LoadFlowEndVoltageV!.Value, 3);
    }

    // Closed form: a constant-power resistive load P behind a resistance R (per unit): V² − V + P·R = 0,
    // V = (1 + √(1 − 4PR))/2 (the upper root; common practice). X·sin θ is zero at unity power factor, but
    // the line's reactance still matters, so this case uses the solver's R with X taken into account by
    // comparing only within the small X effect: a 1/0 run, where X/R is about 0.36.
    [Fact]
    public void Solve_ConstantPower_NearTheQuadraticRoot()
    {
        var s = SolverHarness.Solve(OneLoad("{ kw: 150, pf: 1.0 }", "1/0", 150));
        var run = s.Branch();
        var zBase = 480.0 * 480.0 / 100_000;
        var r = run.ResistanceOhmPerKm!.Value * 0.15 / zBase;
        var x = run.ReactanceOhmPerKm!.Value * 0.15 / zBase;
        var p = 1.5;
        // Exact with R and X: |V|⁴ − |V|²(1 − 2PR) + P²(R² + X²) = 0 (Q = 0), upper root.
        var b = 1 - (2 * p * r);
        var v2 = (b + Math.Sqrt((b * b) - (4 * p * p * ((r * r) + (x * x))))) / 2;
        Assert.Equal(Math.Sqrt(v2) * 480, s.EndPoints.Single().LoadFlowEndVoltageV!.Value, 2);
        Assert.True(s.LoadFlow.Converged);
        Assert.InRange(s.LoadFlow.Iterations, 2, LoadFlow.MaxIterations);
    }

    [Fact]
    public void Solve_MethodLoadFlow_FindingsRestOnTheLoadFlow()
    {
        var s = SolverHarness.Solve(OneLoad("{ kw: 150, pf: 0.9 }", "4 AWG", 200, "load_flow"));
        var run = s.Branch();
        Assert.Equal(run.LoadFlowDropPercent!.Value, run.DropPercent, 12);
        Assert.NotEqual(run.PercentSumDropPercent, run.DropPercent);
        Assert.Equal(s.EndPoints.Single().LoadFlowTotalDropPercent!.Value, s.EndPoints.Single().TotalDropPercent, 12);
    }

    [Fact]
    public void Solve_MethodLoadFlow_VoltageCollapseIsAClearError()
    {
        var e = Assert.Throws<DistTree.Diagnostics.ProjectException>(() => SolverHarness.Solve(OneLoad("{ kw: 2000, pf: 0.9 }", "14 AWG", 500, "load_flow")));
        Assert.Contains("did not converge", e.Message, StringComparison.Ordinal);
    }

    // The load flow is balanced (one phase standing for all), so it is compared with balanced trees (3-pole
    // loads). For light loads the exact solution and the percent sum agree within 0.05 percentage points.
    [Property(MaxTest = 40)]
    public Property LightLoads_AgreeWithThePercentSum() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var light = tree with { Panels = tree.Panels.Select(p => p with { Circuits = p.Circuits.Select(c => c with { Va = Math.Min(c.Va, 400), Poles = 3 }).ToArray() }).ToArray() };
        var s = SolverHarness.Solve(light.ToYaml());
        return s.LoadFlow.Converged && s.EndPoints.All(e => Math.Abs(e.LoadFlowTotalDropPercent!.Value - e.PercentSumTotalDropPercent) < 0.05);
    });

    // For heavy constant-power loads the exact drop is larger: the current grows as the voltage sags.
    [Property(MaxTest = 40)]
    public Property HeavyConstantPower_LoadFlowDropsMore() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var heavy = tree with { Panels = tree.Panels.Select(p => p with { Circuits = p.Circuits.Select(c => c with { Va = c.Va + 1500, Length = c.Length + 30, Poles = 3 }).ToArray() }).ToArray() };
        var s = SolverHarness.Solve(heavy.ToYaml());
        return !s.LoadFlow.Converged || s.EndPoints.All(e => e.LoadFlowTotalDropPercent!.Value > e.PercentSumTotalDropPercent);
    });
}
