using DistTree.Tests.Solving;

namespace DistTree.Tests.Codes.Nec;

/// <summary>
/// The conductor and device checks on each line and the neutral (issue 18, item 2), on the cases a review found passing:
/// the current of the most loaded line, not the balanced |S|/(√3·V), decides. Ampacities are NEC Table 310.16's
/// 75 °C copper column (read): 8 AWG 50 A, 4 AWG 85 A, 6 AWG 65 A, 1/0 AWG 150 A. The currents are compared to
/// 0.1 A: a load stated in amperes at 120 V draws them at the phase frame's line-to-neutral voltage, 208/√3 = 120.09 V,
/// 0.07 % less (a known limit of the frame, docs/limits.md).
/// </summary>
public sealed class PerLineChecksTests
{
    // Four 16 A loads all on line A of a 208Y/120 feeder: line A carries 64 A and so does the neutral (the return
    // of one line alone, Kirchhoff's current law). On 8 AWG (50 A) both are over; the balanced current, 64/3 A,
    // would have passed.
    [Fact]
    public void Solve_AllLoadOnOneLine_FindsTheLineAndTheNeutralOverTheirAmpacity()
    {
        var s = SolverHarness.Solve(Feeder("8 AWG", null, Circuits(("A", 16, false), ("A", 16, false), ("A", 16, false), ("A", 16, false))));
        var feeder = s.Runs.Single(r => r.Id == "P");
        Assert.Equal(64, feeder.DesignCurrentA, tolerance: 0.1);
        Assert.Equal("A", feeder.DesignLine);
        Assert.Equal(64, feeder.NeutralDesignCurrentA!.Value, tolerance: 0.1);
        Assert.Equal(50, feeder.NeutralAmpacityA!.Value, 6);
        var codes = feeder.Findings.Select(f => (f.Code, f.Reference)).ToArray();
        Assert.Contains(("ampacity", "NEC 215.2(A)(1)(a)"), codes);
        Assert.Contains(("neutral_ampacity", "NEC 310.14(A)"), codes);
    }

    // The same 64 A spread over three lines is 21.3 A a line, balanced: the neutral carries nothing, and 8 AWG passes.
    [Fact]
    public void Solve_SameLoadBalanced_Passes()
    {
        var s = SolverHarness.Solve(Feeder("8 AWG", null, Circuits(("A", 16, false), ("B", 16, false), ("C", 16, false), ("A", 5.333333333, false), ("B", 5.333333333, false), ("C", 5.333333333, false))));
        var feeder = s.Runs.Single(r => r.Id == "P");
        Assert.Equal(21.33, feeder.DesignCurrentA, tolerance: 0.1);
        Assert.Equal(0, feeder.NeutralDesignCurrentA!.Value, 6);
        Assert.Empty(feeder.Findings);
    }

    // A tenant feeder on 6 AWG (65 A) and a 60 A breaker: line B carries 54.24 A of continuous load, 67.8 A at
    // 125 % (NEC 215.2(A)(1)(a), memory): over the conductors' 65 A and the breaker's 60 A (NEC 215.3, memory).
    // Lines A and C carry 20 A each, so the balanced current (94.24/3 = 31.4 A, 39.3 A at 125 %) would pass.
    [Fact]
    public void Solve_ContinuousLoadHeavyOnOneLine_FindsAmpacityAndDevice()
    {
        var s = SolverHarness.Solve(Feeder("6 AWG", 60, Circuits(("A", 20, false), ("B", 54.24, true), ("C", 20, false))));
        var feeder = s.Runs.Single(r => r.Id == "P");
        Assert.Equal(67.8, feeder.DesignCurrentA, tolerance: 0.1);
        Assert.Equal("B", feeder.DesignLine);
        var codes = feeder.Findings.Select(f => (f.Code, f.Reference)).ToArray();
        Assert.Contains(("ampacity", "NEC 215.2(A)(1)(a)"), codes);
        Assert.Contains(("device_below_load", "NEC 215.3"), codes);
    }

    // 110 A of load on a 100 A breaker is a finding (NEC 215.3, memory), though 1/0 AWG carries it; 100 A is not.
    [Theory]
    [InlineData(110, true)]
    [InlineData(100, false)]
    public void Solve_LoadAgainstTheDevice(double amps, bool found)
    {
        var s = SolverHarness.Solve(Feeder("1/0 AWG", 100, Circuits(("ABC", amps, false))));
        var feeder = s.Runs.Single(r => r.Id == "P");
        Assert.Equal(found, feeder.Findings.Any(f => f.Code == "device_below_load"));
        Assert.DoesNotContain(feeder.Findings, f => f.Code == "ampacity");
    }

    // A neutral stated smaller than the lines is checked at its own size: 24 A of one line's return on a 10 AWG
    // neutral (35 A) passes, 40 A does not. The lines, 4 AWG (85 A), carry either.
    [Theory]
    [InlineData(24, false)]
    [InlineData(40, true)]
    public void Solve_ReducedNeutral_IsCheckedAtItsOwnSize(double amps, bool found)
    {
        var s = SolverHarness.Solve(Feeder("4 AWG", null, Circuits(("A", amps, false)), neutral: "10 AWG"));
        var feeder = s.Runs.Single(r => r.Id == "P");
        Assert.Equal(35, feeder.NeutralAmpacityA!.Value, 6);
        Assert.Equal(found, feeder.Findings.Any(f => f.Code == "neutral_ampacity"));
    }

    // The circuits, 1-pole on the given line, or 3-pole on ABC.
    private static string[] Circuits(params (string Lines, double Amps, bool Continuous)[] circuits) =>
        circuits.Select((c, i) => FormattableString.Invariant(
            $"{{ id: \"{i + 1}\", poles: {c.Lines.Length}, phase: {c.Lines}, continuous: {(c.Continuous ? "true" : "false")}, load: {{ amps: {c.Amps} }}, run: {{ length: 3, size: 1/0 AWG }} }}")).ToArray();

    // A 208Y/120 panel P on a 10 m copper feeder of the given size, device and neutral, with its circuits.
    private static string Feeder(string size, double? ocpdA, string[] circuits, string? neutral = null)
    {
        var ocpd = ocpdA is { } a ? FormattableString.Invariant($", ocpd: {a}") : "";
        var neutralSize = neutral is null ? "" : $", neutral_size: {neutral}";
        return SolverHarness.PanelOnFeeder($"length: 10, size: {size}{ocpd}{neutralSize}", circuits);
    }
}
