using DistTree.Conductors;
using DistTree.Sizing;
using DistTree.Solving;

namespace DistTree.Benchmarks;

/// <summary>What the greedy fix and the optimum add on one project, in the plan's cost unit, and what the plan holds.</summary>
/// <param name="Label">The project.</param>
/// <param name="Greedy">The greedy fix's cost (∞ where it cannot fix every fixable limit).</param>
/// <param name="Optimum">The plan's cost.</param>
/// <param name="Unit">The cost unit.</param>
/// <param name="Changes">Runs the plan changes.</param>
/// <param name="Taps">Taps the plan sets.</param>
/// <param name="Unresolvable">Limits no allowed change meets.</param>
internal sealed record Saving(string Label, double Greedy, double Optimum, string Unit, int Changes, int Taps, int Unresolvable)
{
    /// <summary>What the greedy fix leaves, solved again: limits the plan fixes that the greedy fix does not (−1: not solved).</summary>
    public int GreedyLeft { get; init; } = -1;
}

/// <summary>The plan's saving against the greedy fix (issues 5 and 21), for every example project and the generated ones.</summary>
internal static class UpsizeSavings
{
    /// <summary>The saving on one solved project and its plan.</summary>
    public static Saving Of(string label, Solution solution, UpsizePlan plan)
    {
        var (greedy, picks) = GreedyBaseline.Fix(solution, ConductorCatalog.Standard);
        var left = -1;
        if (picks is not null)
        {
            // The greedy fix solved again: the drop, ampacity and device limits it leaves that the plan does not leave
            // (the far-end fault checks aside: neither side's cost counts their repair).
            var fixedByPlan = new HashSet<string>(plan.After.AllFindings.Select(f => f.Subject), StringComparer.Ordinal);
            var after = Analysis.Run(PlanPicks.Apply(solution, picks)).Solution;
            left = after.AllFindings.Count(f => f.Kind is not (FindingKind.FaultClearing or FindingKind.InterruptingRating) && !fixedByPlan.Contains(f.Subject));
        }

        return new(label, greedy, plan.TotalCostAdded - plan.FarEndRepairCostAdded, plan.CostUnit, plan.Changes.Count, plan.TapChanges.Count, plan.Unresolvable.Count) { GreedyLeft = left };
    }

    /// <summary>Every example of projects/ (each top-level file, and the campus), planned.</summary>
    public static IEnumerable<Saving> Examples(string root)
    {
        var folder = Path.Combine(root, "projects");
        var files = Directory.GetFiles(folder, "*.yaml").Append(Path.Combine(folder, "campus", "campus.yaml")).Order(StringComparer.Ordinal);
        foreach (var file in files)
        {
            var solution = Analysis.Run(file).Solution;
            yield return Of($"example {Path.GetRelativePath(folder, file)}", solution, Upsizer.Standard.Plan(solution));
        }
    }

    /// <summary>Prints each saving, one a line.</summary>
    public static void Print(IEnumerable<Saving> savings)
    {
        Console.WriteLine("Material (or price) the optimum saves against the greedy fix (issues 5 and 21; the greedy fix takes no taps, and neither");
        Console.WriteLine("side counts the far-end fault repair; where runs are unresolvable the two fix different sets of limits):");
        foreach (var s in savings)
        {
            var saved = s.Greedy > 0 && double.IsFinite(s.Greedy) ? $"{100 * (s.Greedy - s.Optimum) / s.Greedy,6:0.0} %" : "   n/a";
            var holds = s.GreedyLeft switch { < 0 => "", 0 => ", greedy fix holds", _ => $", greedy fix leaves {s.GreedyLeft:N0} limits over" };
            Console.WriteLine($"  {s.Label,-40} greedy {s.Greedy,14:N0}  optimum {s.Optimum,14:N0} {s.Unit}  saving {saved}  ({s.Changes:N0} runs changed, {s.Taps:N0} taps set, {s.Unresolvable:N0} unresolvable{holds})");
        }
    }
}
