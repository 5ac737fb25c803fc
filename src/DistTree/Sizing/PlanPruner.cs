using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Makes a proved plan minimal on the solver's own figures. The optimiser prices a feeder at the worst of its lines for
/// the end points below a sub-panel (and in their own voltages only for those on its far bus) and rounds each drop up
/// to its grid, both on the safe side, so its plan may hold a change the
/// design does not need. Each change whose run meets its own limits at its stated size is undone where the tree, solved
/// again by the real solver (per line, with the neutral and the transformer connections), has no finding the plan's proof
/// did not have. First all such changes at once, restoring the ones above each new finding until none is left; then each
/// change still kept alone, most costly first. Undoing a change only ever raises drops below it, so a change that cannot be
/// undone alone cannot be undone with another either. It follows <see cref="PlanStepDown"/>, which takes changes one
/// choice down first (where undoing them whole fails); together they make the plan minimal on the solver's figures, the
/// optimum having been least only on its own grid.
/// </summary>
internal static class PlanPruner
{
    /// <summary>How many changes are tried alone, at most (each a solve of the whole tree): the most costly ones.</summary>
    public const int MaxSingleTrials = 48;

    /// <summary>
    /// The picks with every change the design does not need undone, and their proof. <paramref name="undoable"/> says
    /// which run changes' runs meet their own limits at their stated size (a tap may always be tried at its stated
    /// position); <paramref name="mayPass"/>, given a change's key and the proof at hand, is false only where undoing
    /// it certainly leaves a finding (so it is not solved again); <paramref name="solve"/> solves the project with the
    /// picks given; <paramref name="groups"/> solves the single trials of changes on subtrees apart together.
    /// </summary>
    public static (PlanPicks Picks, Solution After) Prune(
        Solution before, PlanPicks picks, Solution after, Func<int, bool> undoable, Func<int, Solution, bool> mayPass, Func<PlanPicks, Solution> solve, TrialGroups groups)
    {
        var left = new HashSet<string>(after.AllFindings.Select(Key), StringComparer.Ordinal);
        var nodes = before.Network.Nodes;

        bool Candidate(int key) => key < 0 || undoable(key);

        // All at once: the findings that come back name the changes above them, which are kept.
        var proof = after;
        var undone = picks.Keys.Select(k => k.Key).Where(k => Candidate(k) && mayPass(k, proof)).ToHashSet();
        while (undone.Count > 0)
        {
            var trial = picks.Without(undone);
            var solved = solve(trial);
            var fresh = solved.AllFindings.Where(f => !left.Contains(Key(f))).ToList();
            if (fresh.Count == 0)
            {
                (picks, after) = (trial, solved);
                break;
            }

            var implicated = Implicated(nodes, fresh, undone);
            if (implicated.Count == 0)
            {
                undone.Clear(); // a finding no undone change lies above: keep them all
            }

            undone.ExceptWith(implicated);
        }

        // Then each change still kept alone, most costly first (those on subtrees apart solved together, see TrialGroups).
        var single = picks.Keys.Where(k => Candidate(k.Key)).OrderByDescending(k => k.Cost).ThenBy(k => k.Key).Select(k => k.Key).Take(MaxSingleTrials).ToArray();
        (picks, after) = groups.Run(
            [.. single.Select(PlanPicks.NodeOf)], picks, after, (at, p, proof) => mayPass(single[at], proof) ? p.Without([single[at]]) : null,
            s => [.. s.AllFindings.Where(f => !left.Contains(Key(f)))], solve, () => true, _ => { });

        return (picks, after);
    }

    /// <summary>A finding's key: its code and subject (a finding the proof has keeps its key whatever its figures).</summary>
    public static string Key(Finding f) => $"{f.Code} {f.Subject}";

    /// <summary>The change keys of <paramref name="keys"/> (runs and taps) on the path from each finding's subject up to the service.</summary>
    public static HashSet<int> Implicated(IReadOnlyList<Network.NetworkNode> nodes, List<Finding> fresh, HashSet<int> keys)
    {
        var nodeOf = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < nodes.Count; i++)
        {
            nodeOf.TryAdd(nodes[i].Id, i);
        }

        var implicated = new HashSet<int>();
        foreach (var f in fresh)
        {
            for (var i = nodeOf.GetValueOrDefault(f.Subject, -1); i >= 0; i = nodes[i].ParentIndex)
            {
                implicated.UnionWith(new[] { PlanPicks.KeyOfRun(i), PlanPicks.KeyOfTap(i) }.Where(keys.Contains));
            }
        }

        return implicated;
    }
}
