using DistTree.Conductors;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Takes a pruned plan's changes down toward their stated choices on the solver's own figures. The optimiser prices a
/// feeder at the worst of its lines for the end points below a sub-panel (in their own voltages only for those on its
/// far bus) and rounds each run's drop up to its grid, so where an
/// end point on a lighter line (or one grid step) is what made a run one size larger, undoing the change whole fails but
/// one step down may pass. Each changed run steps to the most costly of its allowed choices (within its device's
/// terminals, meeting its own limits, parallel sets only where the code allows them) that costs less than its pick, and
/// keeps the step where the tree, solved again by the real solver, has no finding the plan's proof did not have: first all
/// such steps at once, restoring the ones above each new finding; then each step still open alone, the largest saving
/// first; round after round until nothing steps down. A raising tap then steps back one position toward its stated one
/// where that passes. A run the far-end repair raised steps down only while its far end still clears (any new finding
/// rejects a step); a step likely to leave a far end below its trip current is tried after the others. The solves in all
/// are bounded by the tree's size (<see cref="SolveBudget"/>). Trials and rounds are bounded (<see cref="MaxSingleTrials"/>, <see cref="MaxRounds"/>).
/// </summary>
internal static class PlanStepDown
{
    /// <summary>How many steps are tried alone in one round, at most (each a solve of the whole tree): the largest savings.</summary>
    public const int MaxSingleTrials = 12;

    /// <summary>How many rounds of steps are made, at most.</summary>
    public const int MaxRounds = 8;

    /// <summary>How many steps likely to leave a far end below its trip current are tried alone in one round, at most.</summary>
    public const int MaxLikelyFailTrials = 4;

    /// <summary>How many solves the tap steps take, at most (a tap step saves no material); a fifth of the solve budget where less.</summary>
    public const int MaxTapTrials = 4;

    /// <summary>How many solves one round's steps all at once take, at most, before the round goes on to single steps.</summary>
    public const int MaxBatchSolves = 6;

    /// <summary>
    /// How many solves the step-down may take in all on a tree of <paramref name="endPoints"/> end points: 24 up to about
    /// 8,000, 20 at 10,000, then fewer (each solve takes longer), 2 from 100,000. A bound on time, not on quality: on the
    /// generated 100,000 end points four solves saved 1,879 mm²·m (0.06 %) and added about 20 s on a busy 2-core machine.
    /// </summary>
    public static int SolveBudget(int endPoints) => Math.Clamp(200_000 / Math.Max(endPoints, 1), 2, 24);

    /// <summary>
    /// The picks with every change stepped down as far as the design allows, and their proof. <paramref name="repaired"/>
    /// names the nodes whose runs the far-end repair raised; <paramref name="solve"/> solves the project with the picks given.
    /// </summary>
    public static (PlanPicks Picks, Solution After) Refine(
        SizingProblem problem, ConductorCatalog catalog, PlanPicks picks, Solution after, IReadOnlySet<int> repaired, StepScreen screen, Func<PlanPicks, Solution> solve,
        TrialGroups groups)
    {
        var budget = SolveBudget(after.EndPoints.Count);
        var left = new HashSet<string>(after.AllFindings.Select(PlanPruner.Key), StringComparer.Ordinal);
        var rejected = new HashSet<int>();
        List<Finding> Fresh(Solution solved) => [.. solved.AllFindings.Where(f => !left.Contains(PlanPruner.Key(f)))];

        // The runs whose far end does not trip its device in a proof (kept for the last proof asked about).
        (Solution? Of, HashSet<string> Ids) uncleared = (null, []);
        HashSet<string> Uncleared(Solution proof)
        {
            if (!ReferenceEquals(proof, uncleared.Of))
            {
                uncleared = (proof, proof.AllFindings.Where(f => f.Kind == FindingKind.FaultClearing).Select(f => f.Subject).ToHashSet(StringComparer.Ordinal));
            }

            return uncleared.Ids;
        }

        // A run's step from the picks at hand: its next cheaper allowed choice (null where there is none, or the screen rules it out).
        Step? StepOf(int key, Solution proof, PlanPicks at)
        {
            if (key < 0 || rejected.Contains(key) || !at.Runs.TryGetValue(key, out var now) || problem.Options[key] is not { } options)
            {
                return null;
            }

            // A run the far-end repair raised and could not clear keeps its repair (a smaller size only lowers its fault more);
            // one it cleared with its lines alone may step down while its far end still clears (a new finding of any kind rejects
            // a step).
            // One given a grounding conductor of its own keeps the pair the repair priced together.
            if (repaired.Contains(key) && (at.Grounds.ContainsKey(key) || Uncleared(proof).Contains(problem.Network.Nodes[key].Id)))
            {
                return null;
            }

            // A run no allowed choice fits (its own finding stays whatever it takes) may step among all its choices.
            var unfit = options.All(o => !o.MeetsRunLimits);
            var lower = options.Where(o => (o.MeetsRunLimits || unfit) && o.WithinTerminals && o.Cost < now.Cost - 1e-9).OrderByDescending(o => o.Cost).FirstOrDefault();
            if (lower.Sets == 0 || !screen.MayStep(key, now, lower.Size, lower.Sets, proof))
            {
                return null;
            }

            // Likely to leave its far end below its trip current: its fault falling as its lines' resistance rises (the loop's
            // other parts staying) takes it under. Not certain, so such a step is only tried after the others.
            var material = problem.Network.Nodes[key].Incoming!.Conductors.Material;
            double Resistance(RunOption o) => catalog.DcResistance20OhmPerKm(o.Size, material) / o.Sets;
            var likelyFails = proof.Faults.FarEndAt(key) is { TripCurrentA: { } trip } far && far.MinimumCurrentA * Resistance(now) / Resistance(lower) < trip;
            return new Step(key, lower, now.Cost - lower.Cost, likelyFails);
        }

        for (var round = 0; round < MaxRounds; round++)
        {
            var stepped = false;

            // All at once: the findings that come back name the steps above them, which are kept back.
            var batch = picks.Runs.Keys.Select(k => StepOf(k, after, picks)).OfType<Step>().ToDictionary(s => s.Key);
            for (var solves = 0; batch.Count > 0 && solves < MaxBatchSolves && budget-- > 0; solves++)
            {
                var trial = With(problem, picks, batch.Values);
                var solved = solve(trial);
                var fresh = Fresh(solved);
                if (fresh.Count == 0)
                {
                    (picks, after, stepped) = (trial, solved, true);
                    break;
                }

                var implicated = PlanPruner.Implicated(problem.Network.Nodes, fresh, batch.Keys.ToHashSet());
                if (implicated.Count == 0)
                {
                    break; // a finding no step lies above: take none of them at once
                }

                foreach (var k in implicated)
                {
                    batch.Remove(k);
                }
            }

            // Then each step still open alone, the largest saving first; one that fails alone fails with more steps too. Steps
            // on subtrees apart are solved together (see TrialGroups).
            var open = picks.Runs.Keys.Select(k => StepOf(k, after, picks)).OfType<Step>().OrderByDescending(s => s.Saving).ThenBy(s => s.Key).ToArray();
            var singles = open.Where(s => !s.LikelyFails).Take(MaxSingleTrials).Concat(open.Where(s => s.LikelyFails).Take(MaxLikelyFailTrials)).Select(s => s.Key).ToArray();
            var was = picks;
            var spent = false;
            (picks, after) = groups.Run(
                singles, picks, after, (at, p, proof) => StepOf(singles[at], proof, p) is { } step ? With(problem, p, [step]) : null,
                Fresh, solve, () => !(spent = budget-- <= 0), at => rejected.Add(singles[at]));
            stepped |= !ReferenceEquals(was, picks);
            if (spent)
            {
                return (picks, after);
            }

            if (!stepped || budget <= 0)
            {
                break;
            }
        }

        return (picks, after);
    }

    /// <summary>
    /// Each raising tap one position back toward its stated one where the tree, solved again, has no finding the proof
    /// <paramref name="after"/> did not have; again while one steps (bounded). It saves no material, so it comes last.
    /// Taps on subtrees apart are solved together (see <see cref="TrialGroups"/>).
    /// </summary>
    public static (PlanPicks Picks, Solution After) StepTapsBack(
        SizingProblem problem, PlanPicks picks, Solution after, StepScreen screen, Func<PlanPicks, Solution> solve, TrialGroups groups)
    {
        var left = new HashSet<string>(after.AllFindings.Select(PlanPruner.Key), StringComparer.Ordinal);
        var rejected = new HashSet<int>();
        var solves = Math.Min(MaxTapTrials, SolveBudget(after.EndPoints.Count) / 5);

        // A transformer's tap one position back from the picks at hand (null where it is at its stated one, or the screen rules it out).
        PlanPicks? Back(int node, PlanPicks at, Solution proof)
        {
            var taps = problem.Taps[node]!;
            var now = Array.FindIndex(taps, t => t.TapPercent == at.Taps[node].TapPercent);
            if (now < 1 || !screen.MayStepTap(node, taps[now], taps[now - 1], proof))
            {
                return null;
            }

            var trial = at with { Taps = new Dictionary<int, TapOption>(at.Taps) };
            if (now == 1)
            {
                trial.Taps.Remove(node);
            }
            else
            {
                trial.Taps[node] = taps[now - 1];
            }

            return trial;
        }

        for (var round = 0; round < MaxRounds && solves > 0; round++)
        {
            var nodes = picks.Taps.Keys.Order().Where(n => !rejected.Contains(n)).ToArray();
            var was = picks;
            (picks, after) = groups.Run(
                nodes, picks, after, (at, p, proof) => Back(nodes[at], p, proof),
                s => [.. s.AllFindings.Where(f => !left.Contains(PlanPruner.Key(f)))], solve, () => solves-- > 0, at => rejected.Add(nodes[at]));
            if (ReferenceEquals(was, picks))
            {
                break;
            }
        }

        return (picks, after);
    }

    // The picks with the steps taken: a step to the stated choice leaves the run as it was.
    private static PlanPicks With(SizingProblem problem, PlanPicks picks, IEnumerable<Step> steps)
    {
        var runs = new Dictionary<int, RunOption>(picks.Runs);
        foreach (var s in steps)
        {
            var stated = problem.Network.Nodes[s.Key].Incoming!.Conductors;
            if (s.To.Size == stated.Size && s.To.Sets == stated.Sets)
            {
                runs.Remove(s.Key);
            }
            else
            {
                runs[s.Key] = s.To;
            }
        }

        return picks with { Runs = runs };
    }

    // One run's step down: its node, the choice it steps to, and what that saves.
    private sealed record Step(int Key, RunOption To, double Saving, bool LikelyFails);
}
