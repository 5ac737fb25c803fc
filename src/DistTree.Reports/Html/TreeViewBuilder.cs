using DistTree.Diagnostics;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// The equipment tree, left to right: depth is the column, leaves take rows in depth-first order
/// (<see cref="TreeLayout"/>). Each box shows what is below it (<see cref="NodeRollup"/>) and its incoming run's
/// figures as the solver gave them.
/// </summary>
internal static class TreeViewBuilder
{
    /// <summary>Equipment nodes drawn in the tree at most.</summary>
    public const int TreeNodeCap = 300;

    /// <summary>Trees this deep or less are scaled to the page width; deeper ones scroll sideways (and scale when printed).</summary>
    public const int FitDepth = 8;

    private const double Margin = 12, NodeW = 174, NodeH = 54, ColW = 202, RowH = 64;

    /// <summary>The drawing of <paramref name="s"/>'s equipment.</summary>
    public static TreeView Build(Solution s, NodeRollup below)
    {
        var nodes = s.Network.Nodes;
        var layout = TreeLayout.Compute(nodes, TreeNodeCap);
        var views = new List<TreeNodeView>(layout.Order.Count);
        var edges = new List<TreeEdge>(layout.Order.Count);
        foreach (var i in layout.Order)
        {
            var node = nodes[i];
            var x = Margin + (layout.Depth[i] * ColW);
            var y = Margin + (layout.Row[i] * RowH);
            if (node.ParentIndex >= 0)
            {
                var parent = node.ParentIndex;
                var px = Margin + (layout.Depth[parent] * ColW) + NodeW;
                var py = Margin + (layout.Row[parent] * RowH) + (NodeH / 2);
                var bus = px + ((ColW - NodeW) / 2);
                edges.Add(new TreeEdge($"M{Coordinate(px)} {Coordinate(py)}H{Coordinate(bus)}V{Coordinate(y + (NodeH / 2))}H{Coordinate(x)}", Bands.Class(below.BandBelow[i])));
            }

            views.Add(NodeView(s, below, node, x, y, layout.HiddenBelow[i]));
        }

        var width = (Margin * 2) + (layout.MaxDepth * ColW) + NodeW;
        var height = (Margin * 2) + ((layout.Rows - 1) * RowH) + NodeH;
        return new TreeView(
            layout.MaxDepth <= FitDepth ? "fit" : "scroll", Coordinate(width), Coordinate(height), Coordinate(NodeW), Coordinate(NodeH), Coordinate(NodeW - 10), views, edges, Note(layout),
            width > PortraitPrintWidthPx);
    }

    // The width of a Letter or A4 portrait page's text, in CSS pixels (7.5 in at 96 px/in): a wider drawing is printed on
    // a landscape page of its own, so that it is scaled down less and its text stays legible.
    private const double PortraitPrintWidthPx = 720;

    private static string Note(TreeLayout layout)
    {
        var drawn = layout.Order.Count;
        var fit = layout.MaxDepth <= FitDepth ? " The drawing is scaled to the page width." : " The drawing scrolls sideways on screen and is scaled to the page when printed.";
        return (drawn == layout.EquipmentCount
            ? $"All {Count(layout.EquipmentCount)} nodes of equipment are drawn (the service included); circuits are summarised per panel as a count and their worst total."
            : $"{Count(drawn)} of {Count(layout.EquipmentCount)} nodes of equipment are drawn: whole levels while at most {TreeNodeCap} fit{(layout.DepthLimit == int.MaxValue ? "" : $" (down to depth {layout.DepthLimit})")}, then depth-first order; a node marked \u201c+N\u201d has N more below it, listed in the panel tables. Circuits are summarised per panel.") + fit;
    }

    private static TreeNodeView NodeView(Solution s, NodeRollup below, NetworkNode node, double x, double y, int hidden)
    {
        var i = node.Index;
        var worst = double.IsNegativeInfinity(below.WorstBelow[i]) ? null : Percent(below.WorstBelow[i]) + " %";
        var line2 = node.Kind == NodeKind.Panelboard && below.OwnCircuits[i] > 0
            ? $"{Count(below.OwnCircuits[i])} ccts · worst {worst}"
            : worst is null ? "no circuits below" : $"worst below {worst}";
        var id = node.Id.Length > 16 ? DisplayText.Prefix(node.Id, 15) + "…" : node.Id;
        var band = below.BandBelow[i];
        var findings = below.FindingsBelow[i];
        return new TreeNodeView
        {
            X = Coordinate(x),
            Y = Coordinate(y),
            Kind = KindWord(node.Kind),
            Id = Escape(id),
            Line2 = line2,
            Line3 = Line3(s, node, hidden),
            Band = Bands.Class(band),
            Title = Escape($"{node.Id} ({node.Kind.ToString().ToLowerInvariant()}): {Bands.Text(band)}") +
                (worst is null ? "" : $", worst total below {worst}") +
                (findings > 0 ? $", {Count(findings)} findings at or below it" : ""),
            Anchor = below.OwnCircuits[i] > 0 ? $"#panel-{Count(i)}" : null,
            Flags = findings > 0 ? Count(findings) : null,
        };
    }

    // The box's third line: what is not drawn below it, else the transformer's rating and regulation, else how it is fed.
    private static string Line3(Solution s, NetworkNode node, int hidden)
    {
        if (hidden > 0)
        {
            return $"+{Count(hidden)} below, not drawn";
        }

        if (node.Kind == NodeKind.Transformer && node.Equipment?.Transformer is { } t)
        {
            var reg = s.TransformerRun(node.Index) is { } regulation ? $" · reg {Percent(regulation.DropPercent)} %" : "";
            return Escape($"{Limit(t.Kva)} kVA → {t.Secondary.Name}") + reg;
        }

        if (node.Kind == NodeKind.Service)
        {
            return Escape($"service · {node.System.Name}");
        }

        return s.IncomingRun(node.Index) is { } r
            ? $"{RunText.Conductor(r)} · {LengthText.Of(r.LengthM, s.Project.Units)} · {Percent(r.DropPercent)} %"
            : "at its source";
    }

    private static string KindWord(NodeKind kind) => kind switch
    {
        NodeKind.Service => "svc",
        NodeKind.Switchboard => "swbd",
        NodeKind.Transformer => "xfmr",
        NodeKind.Splitter => "split",
        _ => "panel",
    };
}
