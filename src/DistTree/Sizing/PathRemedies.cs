using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Sizing;

/// <summary>
/// What would clear a path no allowed change clears, of another kind than a conductor: the one run on it whose
/// shortening clears it by the fewest metres (a run's drop at its least-drop allowed choice is proportional to its
/// length), and a transformer above it whose tap, set beyond its <c>tap_range_percent</c> to the least raising of the
/// nameplate's positions that does, would clear it alone (or would but for the light-load limit, <see cref="LightLoadRise"/>: said apart).
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
        var (taps, butForLightLoad) = (new List<string>(), new List<string>());
        for (var i = endPoint; i > 0; i = nodes[i].ParentIndex)
        {
            var node = nodes[i];
            if (i != endPoint && node.Kind == NodeKind.Transformer)
            {
                if (problem.NewOrigin)
                {
                    break;
                }

                TapBeyondTheAllowed(problem, node, overPercent, limitPercent, taps, butForLightLoad);
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
        var text = remedies.Count == 0
            ? "no one run shortened, nor a tap, clears it: it would take the panel fed from nearer the source, a panel nearer the load, or more parallel sets (sizing: max_sets)"
            : $"the smallest change of another kind that clears it: {string.Join(", or ", remedies)}; or the panel fed from nearer the source";
        return butForLightLoad.Count == 0 ? text : $"{text}; a tap would do but for the light-load limit: {string.Join(", or ", butForLightLoad)}";
    }

    // The least raising of the nameplate's taps beyond the most raising allowed one that clears the path alone, priced as
    // the optimiser prices it: a tap beyond the transformer's tap_range_percent (a remedy), or one the light-load limit
    // refuses (said apart: it would do but for that limit), with its no-load rise at the most raising allowed taps above.
    private static void TapBeyondTheAllowed(SizingProblem problem, NetworkNode node, double overPercent, double limitPercent, List<string> taps, List<string> butForLightLoad)
    {
        var data = node.Equipment!.Transformer!;
        var allowed = problem.Taps[node.Index] is { } choices ? choices.Min(t => t.TapPercent) : data.TapPercent;
        var above = problem.NoLoadMost[node.ParentIndex];
        var riseLimit = problem.Solution.Project.Sizing.LightLoadRisePercent;
        foreach (var tap in TransformerData.TapSteps.Where(t => t < allowed).OrderByDescending(t => t))
        {
            if ((100.0 - limitPercent) * (Share(allowed) - Share(tap)) < overPercent)
            {
                continue;
            }

            var factor = above * NoLoadRise.Factor(tap);
            var range = Math.Abs(tap) > data.TapRangePercent + 1e-9 ? FormattableString.Invariant($"beyond its tap_range_percent of {data.TapRangePercent:0.#}") : "";
            if (NoLoadRise.Within(factor, riseLimit))
            {
                taps.Add(FormattableString.Invariant($"transformer {node.Id}'s tap set to {tap:0.#} % ({range})"));
            }
            else
            {
                var withAbove = Math.Abs(above - 1.0) > 1e-12 ? " with the taps above it at their most raising allowed" : "";
                butForLightLoad.Add(FormattableString.Invariant(
                    $"transformer {node.Id}'s tap set to {tap:0.#} %{(range.Length > 0 ? $" ({range})" : "")} would clear it, but its secondary would stand {NoLoadRise.RisePercent(factor):0.00} % above nominal at no load{withAbove}, over the {riseLimit:0.##} % of sizing: light_load_rise_percent"));
            }

            return;
        }
    }

    private static double Share(double tapPercent) => tapPercent / (100.0 + tapPercent);
}
