using DistTree.Conductors;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Spares the pruner and the step-down solves that cannot pass: taking a run's change back toward its stated choice
/// (undoing it, or one step down) raises every end point below it, where no transformer lies between, by at least the
/// least rise of its drop over its own voltages (see <see cref="SizingProblem.LeastRise"/>); where that is more than the
/// least slack of those end points in the proof at hand, the step certainly leaves a finding. Only on the percent sum
/// (the load flow's totals are not linear in the drops); a tap, or a run with a transformer at its end, is always tried.
/// </summary>
internal sealed class StepScreen(SizingProblem problem)
{
    private Solution? _slackOf;
    private double[] _slack = [];

    /// <summary>
    /// False where undoing the change keyed <paramref name="key"/> (its run back at its stated size and sets) certainly
    /// leaves a finding in <paramref name="after"/>; <paramref name="runs"/> holds the plan's run picks.
    /// </summary>
    public bool MayUndo(int key, IReadOnlyDictionary<int, RunOption> runs, Solution after)
    {
        if (key < 0 || !runs.TryGetValue(PlanPicks.NodeOf(key), out var pick))
        {
            return true;
        }

        var stated = problem.Network.Nodes[PlanPicks.NodeOf(key)].Incoming!.Conductors;
        return MayStep(PlanPicks.NodeOf(key), pick, stated.Size, stated.Sets, after);
    }

    /// <summary>
    /// False where taking node <paramref name="node"/>'s run from <paramref name="now"/> to <paramref name="toSets"/> ×
    /// <paramref name="toSize"/> (a smaller choice) certainly leaves a finding in <paramref name="after"/>.
    /// </summary>
    public bool MayStep(int node, RunOption now, ConductorSize toSize, int toSets, Solution after)
    {
        if (after.Project.Rules.Method != Model.SolutionMethod.PercentSum)
        {
            return true;
        }

        if (!ReferenceEquals(after, _slackOf))
        {
            _slack = LeastSlack(after);
            _slackOf = after;
        }

        return problem.LeastRise(node, toSize, toSets, now.Size, now.Sets) <= _slack[node] + 1e-9;
    }

    /// <summary>
    /// False where setting node <paramref name="node"/>'s transformer from the raising tap <paramref name="now"/> back to
    /// <paramref name="to"/> certainly leaves a finding in <paramref name="after"/>. A tap takes (100 − A)·t/(100 + t)
    /// percent off its secondary, A the shares above it (see SizingProblem.TapChoices); an end point below it, with nothing
    /// raising between (its windings and the runs below dropping, not raising), has a total T of at least
    /// A + (100 − A)·s, s the present share, so A is at most (T − 100·s)/(1 − s), and the step raises it by at least
    /// (100 − that)·(s' − s). Only end points with no other transformer between are judged.
    /// </summary>
    public bool MayStepTap(int node, TapOption now, TapOption to, Solution after)
    {
        if (after.Project.Rules.Method != Model.SolutionMethod.PercentSum)
        {
            return true;
        }

        static double Share(double tapPercent) => tapPercent / (100.0 + tapPercent);
        var (share, shareTo) = (Share(now.TapPercent), Share(to.TapPercent));
        _transformerAbove ??= TransformerAbove();
        foreach (var e in after.EndPoints)
        {
            var slack = e.LimitPercent - e.TotalDropPercent;
            if (_transformerAbove[e.NodeIndex] != node || slack < -1e-9)
            {
                continue;
            }

            var mostAbove = (e.TotalDropPercent - (100.0 * share)) / (1.0 - share);

            if ((100.0 - mostAbove) * (shareTo - share) > slack + 1e-9)
            {
                return false;
            }
        }

        return true;
    }

    private int[]? _transformerAbove;

    // Per node, the nearest transformer at or above it (−1 where there is none). Top-down over the parent-first array.
    private int[] TransformerAbove()
    {
        var nodes = problem.Network.Nodes;
        var above = new int[nodes.Count];
        for (var i = 0; i < nodes.Count; i++)
        {
            above[i] = nodes[i].Kind == NodeKind.Transformer ? i : (nodes[i].ParentIndex < 0 ? -1 : above[nodes[i].ParentIndex]);
        }

        return above;
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
