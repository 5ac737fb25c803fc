using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Spares the pruner solves that cannot pass: undoing a run's change raises every end point below it, where no
/// transformer lies between, by at least the least rise of its drop over its own voltages (see
/// <see cref="SizingProblem.LeastRise"/>); where that is more than the least slack of those end points in the proof at
/// hand, the undo certainly leaves a finding. Only on the percent sum (the load flow's totals are not linear in the
/// drops); a tap, or a run with a transformer at its end, is always tried.
/// </summary>
internal sealed class UndoScreen(SizingProblem problem, IReadOnlyDictionary<int, RunOption> runs)
{
    private Solution? _slackOf;
    private double[] _slack = [];

    /// <summary>False where undoing the change keyed <paramref name="key"/> certainly leaves a finding in <paramref name="after"/>.</summary>
    public bool MayPass(int key, Solution after)
    {
        if (key < 0 || after.Project.Rules.Method != Model.SolutionMethod.PercentSum || !runs.TryGetValue(PlanPicks.NodeOf(key), out var pick))
        {
            return true;
        }

        var node = PlanPicks.NodeOf(key);
        if (!ReferenceEquals(after, _slackOf))
        {
            _slack = LeastSlack(after);
            _slackOf = after;
        }

        var stated = problem.Network.Nodes[node].Incoming!.Conductors;
        return problem.LeastRise(node, stated.Size, stated.Sets, pick.Size, pick.Sets) <= _slack[node] + 1e-9;
    }

    // Per node, the least slack (limit − total) of the end points below it that no transformer separates from its
    // incoming run; +∞ where there are none. Bottom-up over the parent-first array.
    private double[] LeastSlack(Solution after)
    {
        var nodes = problem.Network.Nodes;
        var slack = new double[nodes.Count];
        Array.Fill(slack, double.PositiveInfinity);
        foreach (var e in after.EndPoints)
        {
            // One already over its limit keeps its finding whatever is undone: it rules nothing out.
            var left = e.LimitPercent - e.TotalDropPercent;
            slack[e.NodeIndex] = left >= -1e-9 ? left : double.PositiveInfinity;
        }

        for (var i = nodes.Count - 1; i > 0; i--)
        {
            if (nodes[i].Kind == NodeKind.Transformer)
            {
                slack[i] = double.PositiveInfinity; // its incoming run is on the primary: the end points below are across it
                continue;
            }

            var parent = nodes[i].ParentIndex;
            slack[parent] = Math.Min(slack[parent], slack[i]);
        }

        return slack;
    }
}
