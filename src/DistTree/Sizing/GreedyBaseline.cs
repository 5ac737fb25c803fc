using DistTree.Conductors;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// The naive fix, kept to measure what the optimiser saves: first every run that fails its own limits takes
/// its cheapest choice that meets them; then each end point still over the total, worst first, upsizes its
/// own branch circuit one choice at a time, then the feeders on its path, nearest first. Every transformer whose tap is
/// a choice is first set to its most raising allowed tap (at its cost). Not optimal.
/// </summary>
public static class GreedyBaseline
{

    /// <summary>The material (or price) the greedy fix adds, in the plan's unit; +∞ where it cannot fix every fixable limit.</summary>
    public static double CostAdded(Solution before, ConductorCatalog catalog) => Fix(before, catalog).Cost;

    /// <summary>
    /// The greedy fix's choices (runs and taps, where they differ from the project) and what they add; the cost +∞ and
    /// the choices null where it cannot fix every fixable limit. Applied with <see cref="PlanPicks.Apply"/>, they can be
    /// solved again to see whether the fix holds.
    /// </summary>
    internal static (double Cost, PlanPicks? Picks) Fix(Solution before, ConductorCatalog catalog)
    {
        var problem = SizingProblem.Build(before, catalog);
        var nodes = problem.Network.Nodes;
        var pick = new int[nodes.Count];
        for (var i = 0; i < nodes.Count; i++)
        {
            // Options are ordered by cost; the present choice costs nothing and comes first.
            pick[i] = problem.Options[i] is { } options ? Math.Max(0, Array.FindIndex(options, o => o.MeetsRunLimits)) : -1;
        }

        var transformerDrop = new double[nodes.Count];
        var tapCost = 0.0;
        foreach (var t in before.Runs.Where(r => r.Kind == RunResultKind.Transformer))
        {
            // Its regulation as the optimiser prices it (a raising tap at the safe end of what the drops above it may be).
            transformerDrop[t.NodeIndex] = problem.NewOrigin ? double.NaN : problem.TransformerSteps[t.NodeIndex] * problem.ResolutionPercent;
            if (!problem.NewOrigin && problem.Taps[t.NodeIndex] is { } taps)
            {
                var most = taps.MinBy(o => o.Steps);
                transformerDrop[t.NodeIndex] = most.Steps * problem.ResolutionPercent;
                tapCost += most.Cost;
            }
        }

        foreach (var e in before.EndPoints.Where(e => !problem.Excluded[e.NodeIndex]).OrderByDescending(e => e.TotalDropPercent).ThenBy(e => e.Id, StringComparer.Ordinal))
        {
            var path = Path(problem, e.NodeIndex);
            foreach (var node in path)
            {
                var options = problem.Options[node]!;
                while (Total(problem, path, pick, transformerDrop, e.NodeIndex) > e.LimitPercent + 1e-9 && pick[node] + 1 < options.Length)
                {
                    pick[node]++;
                }
            }

            if (Total(problem, path, pick, transformerDrop, e.NodeIndex) > e.LimitPercent + 1e-9)
            {
                return (double.PositiveInfinity, null);
            }
        }

        var runs = new Dictionary<int, RunOption>();
        for (var i = 0; i < nodes.Count; i++)
        {
            if (pick[i] >= 0 && problem.Options[i]![pick[i]] is var o && (o.Size != nodes[i].Incoming!.Conductors.Size || o.Sets != nodes[i].Incoming!.Conductors.Sets))
            {
                runs[i] = o;
            }
        }

        var tapPicks = new Dictionary<int, TapOption>();
        foreach (var t in before.Runs.Where(r => r.Kind == RunResultKind.Transformer))
        {
            if (!problem.NewOrigin && problem.Taps[t.NodeIndex] is { } tapOptions)
            {
                tapPicks[t.NodeIndex] = tapOptions.MinBy(o => o.Steps);
            }
        }

        return (tapCost + Enumerable.Range(0, nodes.Count).Where(i => pick[i] >= 0).Sum(i => problem.Options[i]![pick[i]].Cost), new PlanPicks(runs, tapPicks));
    }

    // The runs whose drops count in the end point's total, end point first, then upstream (nearest first).
    private static List<int> Path(SizingProblem problem, int endPoint)
    {
        var nodes = problem.Network.Nodes;
        var path = new List<int>();
        for (var i = endPoint; i > 0; i = nodes[i].ParentIndex)
        {
            if (i != endPoint && problem.NewOrigin && nodes[i].Kind == Network.NodeKind.Transformer)
            {
                break;
            }

            if (problem.Options[i] is not null)
            {
                path.Add(i);
            }
        }

        return path;
    }

    private static double Total(SizingProblem problem, List<int> path, int[] pick, double[] transformerDrop, int endPoint)
    {
        var nodes = problem.Network.Nodes;
        var total = path.Sum(i => problem.Options[i]![pick[i]].DropPercent);
        for (var i = nodes[endPoint].ParentIndex; i > 0; i = nodes[i].ParentIndex)
        {
            if (double.IsNaN(transformerDrop[i]))
            {
                break;
            }

            total += transformerDrop[i];
        }

        return total;
    }
}
