using DistTree.Model;
using DistTree.Network;
using DistTree.Reports.Html;

namespace DistTree.Tests.Reports;

public sealed class TreeLayoutTests
{
    private static readonly ElectricalSystem System480 = ElectricalSystem.Find("480Y/277")!;

    /// <summary>Nodes from (parent index, kind) pairs; index 0 is the service.</summary>
    private static NetworkNode[] Tree(params (int Parent, NodeKind Kind)[] spec)
    {
        var nodes = new NetworkNode[spec.Length];
        for (var i = 0; i < spec.Length; i++)
        {
            nodes[i] = new NetworkNode(i, $"N{i}", spec[i].Kind, System480, spec[i].Parent);
            if (spec[i].Parent >= 0)
            {
                nodes[spec[i].Parent].MutableChildren.Add(i);
            }
        }

        return nodes;
    }

    [Fact]
    public void Compute_SmallTree_LeavesInOrderAndParentsCentred()
    {
        // 0 ─┬─ 1 ─┬─ 3
        //    │     └─ 4 ── (end point 6)
        //    └─ 2 ── 5
        var nodes = Tree((-1, NodeKind.Service), (0, NodeKind.Switchboard), (0, NodeKind.Panelboard), (1, NodeKind.Panelboard), (1, NodeKind.Panelboard), (2, NodeKind.Panelboard), (4, NodeKind.EndPoint));
        var layout = TreeLayout.Compute(nodes, 100);
        Assert.Equal([0, 1, 3, 4, 2, 5], layout.Order);
        Assert.Equal(0, layout.Row[3]);
        Assert.Equal(1, layout.Row[4]);
        Assert.Equal(2, layout.Row[5]);
        Assert.Equal(0.5, layout.Row[1]);
        Assert.Equal(2, layout.Row[2]);
        Assert.Equal(1.25, layout.Row[0]);
        Assert.Equal(3, layout.Rows);
        Assert.Equal(2, layout.MaxDepth);
        Assert.Equal(6, layout.EquipmentCount);
    }

    [Fact]
    public void Compute_ChainOf100000_DoesNotOverflowTheStack()
    {
        var spec = Enumerable.Range(0, 100_000).Select(i => (i - 1, i == 0 ? NodeKind.Service : NodeKind.Panelboard)).ToArray();
        var layout = TreeLayout.Compute(Tree(spec), 300);
        Assert.Equal(300, layout.Order.Count);
        Assert.Equal(100_000 - 300, layout.HiddenBelow[299]);
        Assert.Equal(0, layout.Row[0]);
    }

    [Fact]
    public void Compute_WideTree_DrawsWholeLevelsUnderTheCapAndCountsTheRest()
    {
        // Service → 3 switchboards → 200 panels each: 604 equipment nodes, cap 300: levels 0 and 1 only.
        var spec = new List<(int, NodeKind)> { (-1, NodeKind.Service), (0, NodeKind.Switchboard), (0, NodeKind.Switchboard), (0, NodeKind.Switchboard) };
        for (var s = 1; s <= 3; s++)
        {
            spec.AddRange(Enumerable.Repeat((s, NodeKind.Panelboard), 200));
        }

        var layout = TreeLayout.Compute(Tree([.. spec]), 300);
        Assert.Equal([0, 1, 2, 3], layout.Order);
        Assert.Equal(1, layout.DepthLimit);
        Assert.Equal(200, layout.HiddenBelow[1]);
        Assert.Equal(0, layout.HiddenBelow[0]);
    }
}
