using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The reach pass: how long each run could be. Own limit: drop is proportional to length (current and temperature
/// do not depend on it; points scale with the run), so L_max = L·limit/drop. Total: the least slack (limit − total)
/// of the end points whose totals include the run, found bottom-up; L_max = L·(drop + slack)/drop.
/// </summary>
internal static class Reach
{
    /// <summary>Writes every run's reach into its row of <paramref name="runs"/>, from the totals of <paramref name="endPoints"/>.</summary>
    public static void Add(DistributionNetwork network, RunRows runs, EndPointRow[] endPoints)
    {
        var rules = network.Project.Rules;
        var nodes = network.NodeArray;
        var slack = Scratch.RentToFill<double>(nodes.Length);
        slack.AsSpan(0, nodes.Length).Fill(double.PositiveInfinity);
        foreach (var e in endPoints)
        {
            slack[e.Node] = e.LimitPercent - e.TotalDropPercent;
        }

        // Bottom-up, the slack each node's incoming run sees (a new origin hides what is below it from above);
        // then each run's reach from it, run by run.
        var newOrigin = rules.TransformerDrop == TransformerDropMode.NewOrigin;
        var parents = network.ParentIndices;
        for (var i = nodes.Length - 1; i > 0; i--)
        {
            if (newOrigin && nodes[i].Kind == NodeKind.Transformer)
            {
                slack[i] = double.PositiveInfinity;
            }

            slack[parents[i]] = Math.Min(slack[parents[i]], slack[i]);
        }

        var (rows, incomingRow, lengthM, limitPercent) = (runs.Rows, runs.IncomingRow, runs.LengthM, runs.LimitPercent);
        ParallelRanges.For(nodes.Length, (start, end) =>
        {
            for (var i = Math.Max(start, 1); i < end; i++)
            {
                if (incomingRow[i] >= 0)
                {
                    var r = incomingRow[i];
                    ref var row = ref rows[r];
                    var visible = slack[i];
                    row.MaxLengthM = MaxLengthM(lengthM[r], row.DropPercent, limitPercent[r]);
                    row.MaxLengthTotalM = double.IsPositiveInfinity(visible) ? null : MaxLengthM(lengthM[r], row.DropPercent, row.DropPercent + visible);
                }
            }
        });

        Scratch.Return(slack, nodes.Length);
    }

    // L·allowed/drop, never below zero; null for a run that drops nothing.
    private static double? MaxLengthM(double lengthM, double dropPercent, double allowedPercent) =>
        dropPercent <= 0 ? null : Math.Max(0.0, lengthM * allowedPercent / dropPercent);
}
