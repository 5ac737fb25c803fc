using DistTree.Conductors;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Makes a plan clear the far-end fault checks (issue 23): after the optimum on the drop grid, each run whose minimum
/// far-end fault still does not trip its device without delay takes a larger size of its lines (its grounding conductor
/// following as the code sizes it: NEC 250.122(B)'s proportion, IEC Table 54.2, or a stated one raised to its minimum):
/// the first whose resistance falls as much as its own loop must (see <see cref="Next"/>). Round by round, each proved by
/// solving the tree again, until none is left or no larger size helps; never beyond what its device's terminals accept
/// (<see cref="TerminalTable"/>), and not at all where the same fault at the run's source end is already too small.
/// A larger conductor only lowers every loop impedance, so a round never undoes another's work. Greedy, not proven least:
/// the plan is least on the drop grid, and then the step up that each failing far end needs.
/// </summary>
internal static class FarEndRepair
{
    // Rounds at most: each takes every failing run at least one size up; the catalogue has about 40 sizes.
    private const int MaxRounds = 40;

    /// <summary>
    /// New picks with every failing far end's run raised until it clears (or can go no larger), and their proof; the same
    /// choices and proof where no far end fails. <paramref name="picks"/> is left as it is; <paramref name="solve"/> solves
    /// the project with picks applied.
    /// </summary>
    public static (PlanPicks Picks, Solution After) Repair(
        Solution before, PlanPicks picks, Solution after, ConductorCatalog catalog, Func<PlanPicks, Solution> solve)
    {
        picks = picks with { Runs = new Dictionary<int, RunOption>(picks.Runs) };
        var nodes = before.Network.Nodes;
        var terminals = before.Project.Sizing.TerminalTable ?? TerminalTable.Standard;
        for (var round = 0; round < MaxRounds; round++)
        {
            var raised = false;
            foreach (var r in after.Runs)
            {
                if (r.Kind == RunResultKind.Transformer || r.Findings.FirstOrDefault(f => f.Kind == FindingKind.FaultClearing) is not { } finding)
                {
                    continue;
                }

                var run = nodes[r.NodeIndex].Incoming!;
                var conductors = run.Conductors;
                var (size, sets) = picks.Runs.TryGetValue(r.NodeIndex, out var o) ? (o.Size, o.Sets) : (conductors.Size, conductors.Sets);

                // No size of this run clears a far end whose source end itself draws less than the trip current; else its own
                // loop must fall from 1/I_min − 1/I_source to 1/I_trip − 1/I_source (in units of the source voltage).
                var source = after.Faults.FarEndAt(r.NodeIndex)?.SourceEndA ?? double.PositiveInfinity;
                var (minimum, trip) = (finding.Value, finding.Limit);
                if (!(source > trip))
                {
                    continue;
                }

                var shortBy = ((1 / minimum) - (1 / source)) / ((1 / trip) - (1 / source));
                if (conductors.Fixed || Next(size, catalog, conductors.Material, shortBy) is not { } next
                    || !SizingProblem.AcceptsBothEnds(terminals, run, next, sets)
                    || SizingProblem.Cost(conductors, next, sets, run.Supply, before.Project.Sizing) is not { } cost)
                {
                    continue; // pinned, the largest size, beyond its device's terminals, or unpriced: left unresolved
                }

                var present = SizingProblem.Cost(conductors, conductors.Size, conductors.Sets, run.Supply, before.Project.Sizing) ?? 0.0;
                picks.Runs[r.NodeIndex] = new RunOption(next, sets, r.DropPercent, 0, cost - present, MeetsRunLimits: true);
                raised = true;
            }

            if (!raised)
            {
                break;
            }

            after = solve(picks);
        }

        return (picks, after);
    }

    // The next larger size of the same series that the catalogue holds whose resistance is at most 1/short of the present
    // one's (short: how many times the fault current falls short of the trip current); the largest held where none is;
    // null at the largest. The run's own resistance must fall at least that much for its loop to (the reactance and the
    // impedance above it fall less or not at all), so the jump never passes the size the far end needs, and a round or
    // two reach it where one size a round would take many.
    private static ConductorSize? Next(ConductorSize size, ConductorCatalog catalog, Material material, double shortBy)
    {
        var target = catalog.DcResistance20OhmPerKm(size, material) / Math.Max(shortBy, 1);
        ConductorSize? last = null;
        for (var s = size.NextLarger; s is { } larger; s = larger.NextLarger)
        {
            if (!catalog.Contains(larger))
            {
                continue;
            }

            last = larger;
            if (catalog.DcResistance20OhmPerKm(larger, material) <= target)
            {
                return larger;
            }
        }

        return last;
    }
}
