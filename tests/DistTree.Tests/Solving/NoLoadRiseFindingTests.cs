using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>
/// The analysis names a stated raising tap that puts a transformer's secondary over the light-load limit at no load. The
/// figures are closed forms: a tap of t % divides the turns ratio by 1 + t/100 (IEEE C57.12.80's tap, a change of turns),
/// so at no load with the source at nominal a bus stands at Π 100/(100 + t) of nominal; the default limit, +5 %, is ANSI
/// C84.1's Range A upper limit (recalled, not read).
/// </summary>
public sealed class NoLoadRiseFindingTests
{
    // T1 (480Y/277 → 208Y/120) feeding T2 (208Y/120 → 120/240) feeding a small panel, both taps stated. Invented.
    private static string Series(double t1Tap, double t2Tap, string sizing = "") => FormattableString.Invariant($$"""
        disttree: 1
        project: { name: Series, units: imperial }
        {{sizing}}
        service: { id: SVC, system: 480Y/277 }
        equipment:
          - { id: T1, kind: transformer, from: SVC, kva: 75, secondary: 208Y/120, impedance_percent: 4, x_r: 2, tap_percent: {{t1Tap}}, tap_range_percent: 5, feeder: { length: 20, size: 1 AWG, ocpd: 100 } }
          - { id: T2, kind: transformer, from: T1, kva: 25, secondary: 120/240, impedance_percent: 4, x_r: 2, tap_percent: {{t2Tap}}, tap_range_percent: 5, feeder: { length: 20, size: 2 AWG, ocpd: 100 } }
          - id: P
            kind: panelboard
            from: T2
            feeder: { length: 10, size: 1/0 AWG, ocpd: 100 }
            circuits:
              - { id: "1", poles: 1, ocpd: 20, load: { amps: 12 }, run: { length: 50, size: 12 AWG } }
        """);

    private static List<Finding> RiseFindings(string yaml) => [.. SolverHarness.Solve(yaml).AllFindings.Where(f => f.Kind == FindingKind.NoLoadRise)];

    [Fact]
    public void Analyze_MinusFivePercentTap_OverTheLimitByTheClosedForm()
    {
        var finding = Assert.Single(RiseFindings(Series(-5, 0)));
        Assert.Equal("T1", finding.Subject);
        Assert.Equal((100.0 / 95.0 - 1.0) * 100.0, finding.Value, 9); // 5.263 %
        Assert.Equal(5.0, finding.Limit, 9);
        Assert.Equal("ANSI C84.1 Range A (recalled; no NEC clause)", finding.Reference);
        Assert.Contains("at its stated tap_percent -5, its secondary stands 5.26 % above nominal at no load", finding.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Analyze_TwoRaisingTapsInSeries_NamesTheLowerWithTheTapsAbove()
    {
        // (100/97.5)² − 1 = 5.194 %: each −2.5 % alone is within (2.564 %), the two together are not.
        var finding = Assert.Single(RiseFindings(Series(-2.5, -2.5)));
        Assert.Equal("T2", finding.Subject);
        Assert.Equal((Math.Pow(100.0 / 97.5, 2) - 1.0) * 100.0, finding.Value, 9);
        Assert.Contains("and the taps above it", finding.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(-2.5, 0, "")] // 2.564 %
    [InlineData(2.5, -5, "")] // a lowering tap above: 100/102.5 × 100/95 − 1 = 2.696 %
    [InlineData(-5, 0, "sizing: { light_load_rise_percent: 6 }")] // 5.263 % against 6 %
    public void Analyze_WithinTheLimit_NoFinding(double t1Tap, double t2Tap, string sizing) =>
        Assert.Empty(RiseFindings(Series(t1Tap, t2Tap, sizing)));
}
