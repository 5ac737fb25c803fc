using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Makes a plan clear the far-end fault checks (issue 23): after the optimum on the drop grid, each run whose minimum
/// far-end fault still does not trip its device without delay takes the cheaper of two changes that its own loop needs
/// (see <see cref="ShortBy"/>): where the least fault is the line-to-ground one through a grounding conductor smaller
/// than the lines, that conductor alone raised (never past the lines' size); or a larger size of its lines (its grounding
/// conductor following as the code sizes it: NEC 250.122(B)'s proportion, IEC Table 54.2, or a stated one raised to its
/// minimum). Round by round, each proved by solving the tree again, until none is left or nothing larger helps; never
/// beyond what its device's terminals accept (<see cref="TerminalTable"/>), and not at all where the same fault at the
/// run's source end is already too small. A larger conductor only lowers every loop impedance, so a round never undoes
/// another's work. Greedy, not proven least: the plan is least on the drop grid, and then the step up each failing far
/// end needs. Each repaired run keeps what it drew before the repair, so that the plan can name the other remedy: a
/// device that trips lower.
/// </summary>
internal static class FarEndRepair
{
    /// <summary>What a repaired run's far end drew before the repair against the trip current asked of it, and the run whose device asks it (null: its own).</summary>
    public readonly record struct ShortFall(double MinimumA, double TripA, string? ForRun);

    // A run's far end and what it must draw.
    private readonly record struct Need(FarEndFault Far, ShortFall Fall)
    {
        public double ShortBy => FarEndRepair.ShortBy(Fall.MinimumA, Far.SourceEndA, Fall.TripA);
    }

    // Rounds at most: each takes every failing run at least one size up; the catalogue has about 40 sizes.
    private const int MaxRounds = 40;

    /// <summary>
    /// New picks with every failing far end's run (or its grounding conductor) raised until it clears (or can go no larger),
    /// their proof, and per repaired node what its far end drew before the repair against its trip current. The same choices
    /// and proof where no far end fails. <paramref name="picks"/> is left as it is; <paramref name="solve"/> solves the
    /// project with picks applied.
    /// </summary>
    public static (PlanPicks Picks, Solution After, Dictionary<int, ShortFall> Short) Repair(
        Solution before, PlanPicks picks, Solution after, ConductorCatalog catalog, Func<PlanPicks, Solution> solve)
    {
        picks = picks with { Runs = new Dictionary<int, RunOption>(picks.Runs), Grounds = new Dictionary<int, ConductorSize>(picks.Grounds) };
        var shortOf = new Dictionary<int, ShortFall>();
        var nodes = before.Network.Nodes;
        var terminals = before.Project.Sizing.TerminalTable ?? TerminalTable.Standard;
        for (var round = 0; round < MaxRounds; round++)
        {
            var raised = false;
            foreach (var (node, need) in Needs(after, nodes))
            {
                var r = after.IncomingRun(node)!.Value;
                var run = nodes[node].Incoming!;
                var conductors = run.Conductors;
                var picked = picks.Runs.TryGetValue(node, out var o) ? o : (RunOption?)null;
                var (size, sets) = picked is { } p ? (p.Size, p.Sets) : (conductors.Size, conductors.Sets);
                if (conductors.Fixed)
                {
                    continue; // pinned (fixed: true): left unresolved
                }

                shortOf.TryAdd(node, need.Fall);
                var (far, shortBy) = (need.Far, ShortBy(need.Fall.MinimumA, need.Far.SourceEndA, need.Fall.TripA));
                var sizing = before.Project.Sizing;
                var present = SizingProblem.Cost(conductors, conductors.Size, conductors.Sets, run.Supply, sizing) ?? 0.0;
                bool Buildable(ConductorSize s) => SizingProblem.AcceptsBothEnds(terminals, run, s, sets);
                RunOption? LinesAt(ConductorSize s) => SizingProblem.Cost(conductors, s, sets, run.Supply, sizing) is { } cost
                    ? new RunOption(s, sets, r.DropPercent, 0, cost - present, MeetsRunLimits: true)
                    : null;

                // Line to ground through a grounding conductor smaller than the lines: the cheapest pair of line size and
                // grounding conductor whose loop falls as it must (the grounding conductor alone, the lines alone with the one
                // that follows them, or both). Otherwise, or where no pair is enough, the lines alone, as far as they must go.
                var pair = far.Kind == FaultKind.LineToGround && !far.GroundIsLinesSize
                    ? CheapestPair(size, far.Ground, shortBy, catalog, conductors.Material, Buildable,
                        s => s == size && picked is { } q ? q : LinesAt(s), o => GroundFollowing(before, r, run, o), (from, to) => GroundCost(conductors, from, to, sets, sizing))
                    : null;
                if (pair is ({ } _, _) or (_, { } _))
                {
                    var (lines, ground) = pair.Value;
                    picks.Runs[node] = lines ?? picked ?? new RunOption(size, sets, r.DropPercent, 0, 0.0, MeetsRunLimits: true);
                    if (ground is { } g)
                    {
                        picks.Grounds[node] = g;
                    }
                }
                else if (Next(size, catalog, conductors.Material, shortBy) is { } next && Buildable(next) && LinesAt(next) is { } raise)
                {
                    picks.Runs[node] = raise;
                }
                else
                {
                    continue; // the largest size, beyond its device's terminals, or unpriced: left unresolved
                }

                raised = true;
            }

            if (!raised)
            {
                break;
            }

            after = solve(picks);
        }

        return (picks, after, shortOf);
    }

    // Per run to raise, what its far end must draw: a run whose far-end fault does not trip its own device, where the same
    // fault at its source end does; else the nearest run above it (no transformer between) whose far end, the bus that
    // source end is on, can be raised to the trip current: the most any run's device asks of it. In node order.
    private static SortedDictionary<int, Need> Needs(Solution after, IReadOnlyList<NetworkNode> nodes)
    {
        var needs = new SortedDictionary<int, Need>();
        void Add(int node, Need need)
        {
            if (!needs.TryGetValue(node, out var had) || need.ShortBy > had.ShortBy)
            {
                needs[node] = need;
            }
        }

        foreach (var r in after.Runs)
        {
            if (r.Kind == RunResultKind.Transformer || r.Findings.FirstOrDefault(f => f.Kind == FindingKind.FaultClearing) is not { } finding
                || after.Faults.FarEndAt(r.NodeIndex) is not { } far)
            {
                continue;
            }

            var trip = finding.Limit;
            if (far.SourceEndA > trip)
            {
                Add(r.NodeIndex, new Need(far, new ShortFall(finding.Value, trip, null)));
                continue;
            }

            // The source end is the far end of the run above: that run must bring its bus up to the trip current. Directly
            // above, the same fault's current there is known exactly (this run's source end); further up, the least fault.
            var minimum = far.SourceEndA;
            for (var n = nodes[r.NodeIndex].ParentIndex; n > 0 && nodes[n].Kind != NodeKind.Transformer && after.Faults.FarEndAt(n) is { } above; n = nodes[n].ParentIndex)
            {
                if (above.SourceEndA > trip)
                {
                    Add(n, new Need(above, new ShortFall(Math.Min(minimum, above.MinimumCurrentA), trip, r.Id)));
                    break;
                }

                minimum = above.SourceEndA;
            }
        }

        return needs;
    }

    // The grounding conductor the code makes follow the lines at a new size (a stated one raised to it), or null.
    private static ConductorSize? GroundFollowing(Solution before, RunResult row, NetworkRun run, RunOption lines)
    {
        var least = before.Code.MinimumGroundSize(run.Conductors, lines.Size, lines.Sets, row.DesignCurrentA, before.Project.Rules, row.CurrentCarryingConductors ?? 3, CircuitDuty.Of(run));
        return PlanPicks.RaisedToMinimum(run.Conductors.GroundSize, least) ?? least;
    }

    /// <summary>
    /// What a grounding conductor raised from <paramref name="from"/> to <paramref name="to"/> adds (one conductor in each of
    /// <paramref name="sets"/> sets), priced as the lines are (material in mm²·m, or the price table); null where a size is unpriced.
    /// </summary>
    internal static double? GroundCost(Run conductors, ConductorSize from, ConductorSize to, int sets, SizingOptions sizing)
    {
        if (sizing.Prices.Count == 0)
        {
            return (to.AreaMm2 - from.AreaMm2) * conductors.LengthM * sets;
        }

        return sizing.Prices.TryGetValue(to, out var after) && sizing.Prices.TryGetValue(from, out var was) ? (after - was) * conductors.LengthM * sets : null;
    }

    // How many times the run's own loop impedance must fall for its far end to draw the trip current: from
    // 1/I_min − 1/I_source to 1/I_trip − 1/I_source (loop impedances in units of the source voltage; the run's own part is
    // the far end's loop less the source end's).
    private static double ShortBy(double minimumA, double sourceEndA, double tripA) =>
        ((1 / minimumA) - (1 / sourceEndA)) / ((1 / tripA) - (1 / sourceEndA));

    // The cheapest line size (the present one or larger, within the terminals) and grounding conductor (at least the present
    // one and the one the code makes follow that size, at most that size) whose resistances let the run's line-to-ground
    // loop (line + grounding conductor, each set alike) fall as it must: R_line + R_ground ≤ (R_line + R_ground now) / short.
    // The lines' pick is null where they stay as picked; the grounding conductor's where the code's own follows. Null where
    // no pair is enough. Cost: the lines' added material and the grounding conductor's beyond the one that follows them.
    private static (RunOption? Lines, ConductorSize? Ground)? CheapestPair(
        ConductorSize size, ConductorSize ground, double shortBy, ConductorCatalog catalog, Material material, Func<ConductorSize, bool> buildable,
        Func<ConductorSize, RunOption?> linesAt, Func<RunOption, ConductorSize?> follows, Func<ConductorSize, ConductorSize, double?> groundCost)
    {
        double R(ConductorSize s) => catalog.DcResistance20OhmPerKm(s, material);
        var loop = (R(size) + R(ground)) / Math.Max(shortBy, 1);
        var present = linesAt(size)?.Cost ?? 0.0;
        (RunOption? Lines, ConductorSize? Ground)? best = null;
        var bestCost = double.PositiveInfinity;
        for (ConductorSize? l = size; l is { } line; l = line.NextLarger)
        {
            if (!catalog.Contains(line) || (line != size && !buildable(line)) || linesAt(line) is not { } option)
            {
                continue;
            }

            var least = follows(option) is { } f && f > ground ? f : ground;
            for (ConductorSize? g = least; g is { } candidate && candidate <= line; g = candidate.NextLarger)
            {
                if (!catalog.Contains(candidate) || R(line) + R(candidate) > loop || groundCost(least, candidate) is not { } extra)
                {
                    continue;
                }

                var cost = option.Cost - present + extra;
                if (cost < bestCost - 1e-9)
                {
                    (best, bestCost) = ((line == size ? null : option, candidate == least && least == follows(option) ? null : candidate), cost);
                }

                break; // a larger grounding conductor with this line size costs more
            }
        }

        return best;
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
