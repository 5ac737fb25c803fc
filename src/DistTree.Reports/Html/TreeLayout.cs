using DistTree.Network;

namespace DistTree.Reports.Html;

/// <summary>
/// Places the equipment of a tree (circuits left out) for a left-to-right drawing: depth gives the column,
/// leaves take rows one after another in depth-first order, and each parent sits midway between its first
/// and last child. All passes are loops over the parent-first node array or an explicit stack, never
/// recursion, so a very deep chain cannot overflow the stack.
/// </summary>
internal sealed class TreeLayout
{
    private TreeLayout(int[] order, int[] depth, double[] row, int[] hiddenBelow, int maxDepth, int rows, int equipment, int drawnDepthLimit)
    {
        Order = order;
        Depth = depth;
        Row = row;
        HiddenBelow = hiddenBelow;
        MaxDepth = maxDepth;
        Rows = rows;
        EquipmentCount = equipment;
        DepthLimit = drawnDepthLimit;
    }

    /// <summary>Drawn node indices in depth-first order (a parent before its children).</summary>
    public IReadOnlyList<int> Order { get; }

    /// <summary>Depth by node index (service 0).</summary>
    public IReadOnlyList<int> Depth { get; }

    /// <summary>Row (possibly half-way between rows) by node index; meaningful for drawn nodes only.</summary>
    public IReadOnlyList<double> Row { get; }

    /// <summary>By node index: how many equipment nodes below it are not drawn.</summary>
    public IReadOnlyList<int> HiddenBelow { get; }

    /// <summary>The deepest drawn depth.</summary>
    public int MaxDepth { get; }

    /// <summary>Number of rows used.</summary>
    public int Rows { get; }

    /// <summary>Equipment nodes in the tree (service included).</summary>
    public int EquipmentCount { get; }

    /// <summary>The depth below which nothing is drawn, or int.MaxValue when every depth is.</summary>
    public int DepthLimit { get; }

    /// <summary>Lays out the equipment of <paramref name="nodes"/>, drawing at most <paramref name="cap"/> nodes.</summary>
    public static TreeLayout Compute(IReadOnlyList<NetworkNode> nodes, int cap)
    {
        var n = nodes.Count;
        var depth = Depths(nodes, out var equipmentAtDepth, out var equipment);
        var depthLimit = WholeLevelsUnder(equipmentAtDepth, cap);
        var drawn = new bool[n];
        var order = DepthFirst(nodes, depth, depthLimit, cap, equipment, drawn);
        var row = PlaceRows(nodes, order, out var rows);
        var hidden = new int[n];
        for (var i = n - 1; i > 0; i--)
        {
            if (!drawn[i] && nodes[i].Kind != NodeKind.EndPoint)
            {
                hidden[nodes[i].ParentIndex] += hidden[i] + 1;
            }
        }

        var maxDepth = 0;
        foreach (var i in order)
        {
            maxDepth = Math.Max(maxDepth, depth[i]);
        }

        return new TreeLayout(order.ToArray(), depth, row, hidden, maxDepth, Math.Max(rows, 1), equipment, depthLimit);
    }

    // The depth of every node (service 0), and how many equipment nodes (not end points) each depth holds.
    private static int[] Depths(IReadOnlyList<NetworkNode> nodes, out List<int> equipmentAtDepth, out int equipment)
    {
        var depth = new int[nodes.Count];
        equipmentAtDepth = [];
        equipment = 0;
        for (var i = 0; i < nodes.Count; i++)
        {
            var parent = nodes[i].ParentIndex;
            depth[i] = parent < 0 ? 0 : depth[parent] + 1;
            if (nodes[i].Kind == NodeKind.EndPoint)
            {
                continue;
            }

            equipment++;
            while (equipmentAtDepth.Count <= depth[i])
            {
                equipmentAtDepth.Add(0);
            }

            equipmentAtDepth[depth[i]]++;
        }

        return depth;
    }

    // The deepest depth drawn whole: whole levels are drawn while they fit under the cap (the first level below the
    // root always is); int.MaxValue where every level fits.
    private static int WholeLevelsUnder(List<int> equipmentAtDepth, int cap)
    {
        var cumulative = 0;
        for (var d = 0; d < equipmentAtDepth.Count; d++)
        {
            cumulative += equipmentAtDepth[d];
            if (cumulative > cap && d > 1)
            {
                return d - 1;
            }
        }

        return int.MaxValue;
    }

    // Depth-first order over drawn equipment with an explicit stack; children in file order. Marks each drawn node.
    private static List<int> DepthFirst(IReadOnlyList<NetworkNode> nodes, int[] depth, int depthLimit, int cap, int equipment, bool[] drawn)
    {
        var order = new List<int>(Math.Min(equipment, cap));
        var stack = new Stack<int>();
        if (nodes.Count > 0)
        {
            stack.Push(0);
        }

        while (stack.Count > 0 && order.Count < cap)
        {
            var i = stack.Pop();
            drawn[i] = true;
            order.Add(i);
            if (depth[i] >= depthLimit)
            {
                continue;
            }

            var children = nodes[i].Children;
            for (var c = children.Count - 1; c >= 0; c--)
            {
                if (nodes[children[c]].Kind != NodeKind.EndPoint)
                {
                    stack.Push(children[c]);
                }
            }
        }

        return order;
    }

    // Leaves take the next row; parents (seen after their children in reverse order) sit midway.
    private static double[] PlaceRows(IReadOnlyList<NetworkNode> nodes, List<int> order, out int rows)
    {
        var n = nodes.Count;
        var row = new double[n];
        var first = new double[n];
        var last = new double[n];
        var hasDrawnChild = new bool[n];
        rows = 0;
        foreach (var i in order)
        {
            var parent = nodes[i].ParentIndex;
            if (parent >= 0)
            {
                hasDrawnChild[parent] = true;
            }
        }

        foreach (var i in order)
        {
            if (!hasDrawnChild[i])
            {
                row[i] = rows++;
            }
        }

        Array.Fill(first, double.NaN);
        for (var k = order.Count - 1; k >= 0; k--)
        {
            var i = order[k];
            if (hasDrawnChild[i])
            {
                row[i] = (first[i] + last[i]) / 2;
            }

            var parent = nodes[i].ParentIndex;
            if (parent >= 0)
            {
                // Reverse depth-first order meets a parent's children last-first.
                if (double.IsNaN(first[parent]))
                {
                    last[parent] = row[i];
                }

                first[parent] = row[i];
            }
        }

        return row;
    }
}
