using DistTree.Solving;
using DistTree.Tests.Sizing;

namespace DistTree.Tests.Solving;

/// <summary>
/// The analysis names a stated raising tap that puts a transformer's secondary over the light-load limit at no load. The
/// figures are closed forms: a tap of t % divides the turns ratio by 1 + t/100 (IEEE C57.12.80's tap, a change of turns),
/// so at no load with the source at nominal a bus stands at Π 100/(100 + t) of nominal; the default limit, +5 %, is ANSI
/// C84.1's Range A upper limit (recalled, not read).
/// </summary>
public sealed class NoLoadRiseFindingTests
{
    // The two transformers in series of the light-load tests (UpsizerLightLoadTests), both taps stated. Invented.
    private static string Series(double t1Tap, double t2Tap, string limit = "5") => UpsizerLightLoadTests.Series(
        FormattableString.Invariant($"tap_percent: {t1Tap}, tap_range_percent: 5"), limit, FormattableString.Invariant($"tap_percent: {t2Tap}, tap_range_percent: 5"));

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
    [InlineData(-2.5, 0, "5")] // 2.564 %
    [InlineData(2.5, -5, "5")] // a lowering tap above: 100/102.5 × 100/95 − 1 = 2.696 %
    [InlineData(-5, 0, "6")] // 5.263 % against 6 %
    public void Analyze_WithinTheLimit_NoFinding(double t1Tap, double t2Tap, string limit) =>
        Assert.Empty(RiseFindings(Series(t1Tap, t2Tap, limit)));
}
