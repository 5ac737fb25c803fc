using DistTree.Solving;

namespace DistTree.Reports.Html;

/// <summary>
/// What each node has at or below it, for the tree and the panel tables: the worst end-point total and band,
/// the findings, and for a panel its own circuits. It selects and counts the solver's figures; it computes
/// none. One pass over the runs and end points, one backwards over the parent-first node array.
/// </summary>
internal sealed class NodeRollup
{
    private NodeRollup(int n)
    {
        WorstBelow = new double[n];
        BandBelow = new Band[n];
        FindingsBelow = new int[n];
        OwnCircuits = new int[n];
        WorstOwn = new double[n];
        BandOwn = new Band[n];
        Array.Fill(WorstBelow, double.NegativeInfinity);
        Array.Fill(WorstOwn, double.NegativeInfinity);
        Array.Fill(BandBelow, Band.None);
        Array.Fill(BandOwn, Band.None);
    }

    /// <summary>By node: the largest end-point total at or below it, percent; negative infinity where none is.</summary>
    public double[] WorstBelow { get; }

    /// <summary>By node: the worst band at or below it.</summary>
    public Band[] BandBelow { get; }

    /// <summary>By node: the findings on its runs, its end points and everything below it.</summary>
    public int[] FindingsBelow { get; }

    /// <summary>By node: the end points it feeds directly (a panel's own circuits).</summary>
    public int[] OwnCircuits { get; }

    /// <summary>By node: the largest total of its own circuits, percent; negative infinity where it has none.</summary>
    public double[] WorstOwn { get; }

    /// <summary>By node: the worst band of its own circuits.</summary>
    public Band[] BandOwn { get; }

    /// <summary>Gathers the figures of <paramref name="s"/> up its tree.</summary>
    public static NodeRollup Of(Solution s)
    {
        var nodes = s.Network.Nodes;
        var rollup = new NodeRollup(nodes.Count);
        foreach (var run in s.Runs)
        {
            rollup.FindingsBelow[run.NodeIndex] += run.Findings.Count;
        }

        foreach (var e in s.EndPoints)
        {
            rollup.AddEndPoint(e, nodes[e.NodeIndex].ParentIndex);
        }

        for (var i = nodes.Count - 1; i > 0; i--)
        {
            rollup.AddToParent(i, nodes[i].ParentIndex);
        }

        return rollup;
    }

    private void AddEndPoint(EndPointResult e, int panel)
    {
        var i = e.NodeIndex;
        var band = Bands.Of(e);
        WorstBelow[i] = e.TotalDropPercent;
        BandBelow[i] = band;
        FindingsBelow[i] += e.Findings.Count;
        OwnCircuits[panel]++;
        WorstOwn[panel] = Math.Max(WorstOwn[panel], e.TotalDropPercent);
        BandOwn[panel] = Bands.Worse(BandOwn[panel], band);
    }

    private void AddToParent(int i, int parent)
    {
        WorstBelow[parent] = Math.Max(WorstBelow[parent], WorstBelow[i]);
        BandBelow[parent] = Bands.Worse(BandBelow[parent], BandBelow[i]);
        FindingsBelow[parent] += FindingsBelow[i];
    }
}
