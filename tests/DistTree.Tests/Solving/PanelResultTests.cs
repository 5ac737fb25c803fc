using DistTree.Tests.Reports;

namespace DistTree.Tests.Solving;

/// <summary>
/// A panel's connected load and a branch circuit's load per line. The expected figures are closed forms: on 208Y/120 a
/// 1-pole load of S VA at unity power factor draws S / 120 A on its line, a 3-pole balanced load S / (√3 · 208) A on
/// each (S / 3 per line times line-to-neutral voltage), and at one power factor apparent powers add arithmetically.
/// </summary>
public sealed class PanelResultTests
{
    private static readonly string[] Circuits =
    [
        "{ id: '1', name: Heater, poles: 1, phase: A, ocpd: 20, load: { va: 1200 }, run: { length: 10, size: 12 AWG } }",
        "{ id: '2', name: Motor, poles: 3, ocpd: 30, load: { va: 9000 }, run: { length: 10, size: 10 AWG } }",
    ];

    [Fact]
    public void LineVa_OnePoleCircuit_IsItsLoadOnItsLineOnly()
    {
        var s = ReportFixtures.SolveText(ReportFixtures.OnePanel("Lines", Circuits));
        var run = s.IncomingRun(s.EndPointById("P/1")!.Value.NodeIndex)!.Value;

        Assert.Equal(3, run.LineVa.Count);
        Assert.Equal(1200, run.LineVa[0], 6);
        Assert.Equal(0, run.LineVa[1]);
        Assert.Equal(0, run.LineVa[2]);
    }

    [Fact]
    public void LineVa_ThreePoleBalancedCircuit_IsAThirdOnEachLine()
    {
        var s = ReportFixtures.SolveText(ReportFixtures.OnePanel("Lines", Circuits));
        var run = s.IncomingRun(s.EndPointById("P/2")!.Value.NodeIndex)!.Value;

        Assert.All(run.LineVa, va => Assert.Equal(3000, va, 6));
        Assert.Equal(run.ApparentPowerVa, run.LineVa.Sum(), 6);
    }

    [Fact]
    public void ConnectedVa_UnityPowerFactorLoads_IsTheirSumBeforeTheDemandFactor()
    {
        var yaml = ReportFixtures.OnePanel("Connected", Circuits).Replace("    from: SVC\n", "    from: SVC\n    demand_factor: 0.5\n", StringComparison.Ordinal);
        var s = ReportFixtures.SolveText(yaml);
        var panel = Assert.Single(s.Panels);

        Assert.Equal(10200, panel.ConnectedVa, 6);
        // The line loads are after the demand factor: line A carries half of 1200 + 3000.
        Assert.Equal(0.5 * 4200, panel.LineVa[0], 6);
        Assert.Equal(0.5 * 3000, panel.LineVa[1], 6);
    }
}
