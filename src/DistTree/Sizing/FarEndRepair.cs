using DistTree.Conductors;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Makes a plan clear the far-end fault checks (issue 23): after the optimum on the drop grid, each run whose minimum
/// far-end fault still does not trip its device without delay takes the next larger size of its lines (its grounding
/// conductor following as the code sizes it: NEC 250.122(B)'s proportion, IEC Table 54.2, or a stated one raised to its
/// minimum), round by round, each round proved by solving the tree again, until none is left or no larger size helps; never
/// beyond what its device's terminals accept (<see cref="TerminalTable"/>).
/// A larger conductor only lowers every loop impedance, so a round never undoes another's work. Greedy, not proven least:
/// the plan is least on the drop grid, and then the smallest step up that each failing far end needs.
/// </summary>
internal static class FarEndRepair
{
    // Rounds at most: each takes every failing run one size up; the catalogue has about 40 sizes.
    private const int MaxRounds = 40;

    /// <summary>
    /// The picks with every failing far end's run raised until it clears (or can go no larger), and their proof; the
    /// picks and proof unchanged where no far end fails. <paramref name="solve"/> solves the project with picks applied.
    /// </summary>
    public static (PlanPicks Picks, Solution After) Repair(
        Solution before, PlanPicks picks, Solution after, ConductorCatalog catalog, Func<PlanPicks, Solution> solve)
    {
        var nodes = before.Network.Nodes;
        var terminals = before.Project.Sizing.TerminalTable ?? TerminalTable.Standard;
        for (var round = 0; round < MaxRounds; round++)
        {
            var raised = false;
            foreach (var r in after.Runs)
            {
                if (r.Kind == RunResultKind.Transformer || !r.Findings.Any(f => f.Kind == FindingKind.FaultClearing))
                {
                    continue;
                }

                var run = nodes[r.NodeIndex].Incoming!;
                var conductors = run.Conductors;
                var (size, sets) = picks.Runs.TryGetValue(r.NodeIndex, out var o) ? (o.Size, o.Sets) : (conductors.Size, conductors.Sets);
                if (conductors.Fixed || Next(size, catalog) is not { } next
                    || (conductors.OcpdA is { } ocpd && !terminals.Accepts(ocpd, next, sets))
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

    // The next larger size of the same series that the catalogue holds, or null.
    private static ConductorSize? Next(ConductorSize size, ConductorCatalog catalog)
    {
        for (var s = size.NextLarger; s is { } larger; s = larger.NextLarger)
        {
            if (catalog.Contains(larger))
            {
                return larger;
            }
        }

        return null;
    }
}
