using DistTree.Model;
using DistTree.Network;
using DistTree.Vocabulary;

namespace DistTree.Sizing;

/// <summary>
/// What would clear a path no allowed change clears, of another kind than a conductor: the one run on it whose
/// shortening clears it by the fewest metres (a run's drop at its least-drop allowed choice is proportional to its
/// length), and a transformer above it whose tap, set beyond its <c>tap_range_percent</c> to the nameplate's most
/// raising position, would clear it alone.
/// </summary>
internal static class PathRemedies
{
    /// <summary>The smallest changes of another kind that would bring end point <paramref name="endPoint"/>'s total down by <paramref name="overPercent"/>, in words.</summary>
    public static string Smallest(SizingProblem problem, int endPoint, double overPercent)
    {
        var nodes = problem.Network.Nodes;
        var units = problem.Solution.Project.Units;
        var limitPercent = problem.BudgetSteps * problem.ResolutionPercent;
        var (shortestM, shortestRun, runLengthM) = (double.PositiveInfinity, "", 0.0);
        var taps = new List<string>();
        for (var i = endPoint; i > 0; i = nodes[i].ParentIndex)
        {
            var node = nodes[i];
            if (i != endPoint && node.Kind == NodeKind.Transformer)
            {
                if (problem.NewOrigin)
                {
                    break;
                }

                // The nameplate's most raising tap against the most raising the range allows, priced as the optimiser prices it.
                var data = node.Equipment!.Transformer!;
                var allowed = Math.Min(data.TapPercent, -data.TapRangePercent);
                var gain = (100.0 - limitPercent) * (Share(allowed) - Share(TransformerData.TapSteps[0]));
                if (gain >= overPercent)
                {
                    taps.Add(FormattableString.Invariant($"transformer {node.Id}'s tap set to {TransformerData.TapSteps[0]:0.#} % (beyond its tap_range_percent of {data.TapRangePercent:0.#})"));
                }
            }

            if (problem.Options[i] is { Length: > 0 } options && node.Incoming is { } run && run.Conductors.LengthM > 0)
            {
                var least = options.MinBy(o => o.Steps);
                var perM = least.DropPercent / run.Conductors.LengthM;
                var needM = perM > 0 ? overPercent / perM : double.PositiveInfinity;
                if (needM < run.Conductors.LengthM && needM < shortestM)
                {
                    (shortestM, shortestRun, runLengthM) = (needM, $"{Words.Noun(run.Kind)} {node.Id} at {least.Sets}×{least.Size}", run.Conductors.LengthM);
                }
            }
        }

        var remedies = new List<string>();
        if (shortestRun.Length > 0)
        {
            // Rounded up to the unit the project's tables show (0.1 m, 1 ft), so the figure stays on the safe side.
            var step = units == UnitSystem.Imperial ? 0.3048 : 0.1;
            var shownM = Math.Ceiling((shortestM / step) - 1e-9) * step;
            remedies.Add($"{shortestRun} shortened by about {LengthText.Of(shownM, units)} (of its {LengthText.Of(runLengthM, units)})");
        }

        remedies.AddRange(taps);
        return remedies.Count == 0
            ? "no one run shortened, nor a tap, clears it: it would take the panel fed from nearer the source, a panel nearer the load, or more parallel sets (sizing: max_sets)"
            : $"the smallest change of another kind that clears it: {string.Join(", or ", remedies)}; or the panel fed from nearer the source";
    }

    private static double Share(double tapPercent) => tapPercent / (100.0 + tapPercent);
}
