using DistTree.Network;
using DistTree.Reports.Html;

namespace DistTree.Tests.Reports;

/// <summary>What the report gathers up the tree, checked against walks over the demo building's nodes.</summary>
public sealed class NodeRollupTests
{
    [Fact]
    public void Of_Service_HoldsTheWorstTotalAndEveryFinding()
    {
        var s = ReportFixtures.Demo;

        var rollup = NodeRollup.Of(s);

        Assert.Equal(s.Summary.WorstTotalDropPercent, rollup.WorstBelow[0]);
        Assert.Equal(s.Summary.Findings, rollup.FindingsBelow[0]);
        Assert.Equal(s.EndPoints.Any(e => Bands.Of(e) == Band.Over) ? Band.Over : Band.Near, Bands.Worse(rollup.BandBelow[0], Band.Near));
    }

    [Fact]
    public void Of_EveryNode_HoldsTheLargestTotalAndTheFindingsOfItsSubtree()
    {
        var s = ReportFixtures.Demo;
        var nodes = s.Network.Nodes;
        var worst = Enumerable.Repeat(double.NegativeInfinity, nodes.Count).ToArray();
        var findings = new int[nodes.Count];
        foreach (var e in s.EndPoints)
        {
            for (var i = e.NodeIndex; i >= 0; i = nodes[i].ParentIndex)
            {
                worst[i] = Math.Max(worst[i], e.TotalDropPercent);
                findings[i] += e.Findings.Count;
            }
        }

        foreach (var r in s.Runs)
        {
            for (var i = r.NodeIndex; i >= 0; i = nodes[i].ParentIndex)
            {
                findings[i] += r.Findings.Count;
            }
        }

        var rollup = NodeRollup.Of(s);

        Assert.Equal(worst, rollup.WorstBelow);
        Assert.Equal(findings, rollup.FindingsBelow);
    }

    [Fact]
    public void Of_EachPanel_CountsItsOwnCircuitsAndTheirWorst()
    {
        var s = ReportFixtures.Demo;
        var nodes = s.Network.Nodes;

        var rollup = NodeRollup.Of(s);

        Assert.Contains(rollup.OwnCircuits, count => count > 0);
        for (var i = 0; i < nodes.Count; i++)
        {
            var own = nodes[i].Children.Where(c => nodes[c].Kind == NodeKind.EndPoint).Select(c => s.EndPointAt(c)!.Value).ToArray();
            Assert.Equal(own.Length, rollup.OwnCircuits[i]);
            Assert.Equal(own.Length == 0 ? double.NegativeInfinity : own.Max(e => e.TotalDropPercent), rollup.WorstOwn[i]);
            Assert.Equal(own.Length == 0 ? Band.None : own.Max(Bands.Of), rollup.BandOwn[i]);
        }
    }
}
