using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Tries a plan's changes one at a time, in a given order, each kept where the tree solved again has no new finding, with
/// fewer solves than one a trial. By the percent sum, a load's current is its nominal one whatever the conductors, so a
/// run's (or a transformer's tap's) choice moves the drops and the fault currents of its own subtree only: trials whose
/// subtrees do not overlap (neither node above the other) cannot change each other's findings, and are solved together.
/// A group passes whole in one solve; where a new finding comes back, the trial above it (one at most in a group) fails
/// and the others are solved again together. The outcome is the one the trials taken singly in order would give; every
/// state kept is one the solver solved. Under the load flow (a drop moves every current above it) or where a finding
/// names no trial of its group, the trials are solved one at a time.
/// </summary>
internal sealed class TrialGroups
{
    private readonly IReadOnlyList<NetworkNode> _nodes;
    private readonly int[] _preorder;
    private readonly int[] _subtreeSize;
    private readonly Dictionary<string, int> _indexOf;
    private readonly bool _independent;

    /// <summary>The groups of <paramref name="network"/>'s tree; <paramref name="independent"/> false solves every trial alone.</summary>
    public TrialGroups(DistributionNetwork network, bool independent)
    {
        _nodes = network.Nodes;
        _independent = independent;
        var count = _nodes.Count;
        _subtreeSize = new int[count];
        for (var i = count - 1; i >= 0; i--)
        {
            _subtreeSize[i]++;
            if (_nodes[i].ParentIndex >= 0)
            {
                _subtreeSize[_nodes[i].ParentIndex] += _subtreeSize[i];
            }
        }

        // Preorder numbers, parents first (every parent precedes its children in the node array): a subtree is a range.
        _preorder = new int[count];
        var next = new int[count];
        for (var i = 0; i < count; i++)
        {
            var parent = _nodes[i].ParentIndex;
            if (parent >= 0)
            {
                _preorder[i] = next[parent];
                next[parent] += _subtreeSize[i];
            }

            next[i] = _preorder[i] + 1;
        }

        _indexOf = new Dictionary<string, int>(count, StringComparer.Ordinal);
        for (var i = 0; i < count; i++)
        {
            _indexOf.TryAdd(_nodes[i].Id, i);
        }
    }

    /// <summary>True where node <paramref name="above"/> is node <paramref name="node"/> or lies on its path to the service.</summary>
    public bool Contains(int above, int node) => _preorder[above] <= _preorder[node] && _preorder[node] < _preorder[above] + _subtreeSize[above];

    /// <summary>
    /// Tries <paramref name="trials"/> (each a node) in order from <paramref name="picks"/> and its proof
    /// <paramref name="after"/>. <paramref name="take"/> gives the picks with one trial taken (null where it is not to be
    /// tried, judged on the proof at hand); <paramref name="fresh"/> the findings of a solution the trials must not add;
    /// <paramref name="spend"/> is asked before each solve (false: stop); <paramref name="failed"/> hears each trial that
    /// failed (its position in <paramref name="trials"/>). Returns the picks with every passing trial taken, and their proof.
    /// </summary>
    public (PlanPicks Picks, Solution After) Run(
        IReadOnlyList<int> trials, PlanPicks picks, Solution after, Func<int, PlanPicks, Solution, PlanPicks?> take,
        Func<Solution, List<Finding>> fresh, Func<PlanPicks, Solution> solve, Func<bool> spend, Action<int> failed)
    {
        foreach (var group in Groups(trials))
        {
            // Each trial judged on the proof before its group: the others in the group do not touch its subtree.
            var members = new List<int>();
            var trial = picks;
            foreach (var at in group)
            {
                if (take(at, trial, after) is { } taken)
                {
                    (trial, members) = (taken, [.. members, at]);
                }
            }

            if (members.Count == 0)
            {
                continue;
            }

            if (!spend())
            {
                return (picks, after);
            }

            var solved = solve(trial);
            var found = fresh(solved);
            if (found.Count == 0)
            {
                (picks, after) = (trial, solved);
                continue;
            }

            if (members.Count == 1)
            {
                failed(members[0]);
                continue;
            }

            // The trial above each new finding fails (one at most: none of a group lies above another), and the rest are
            // solved again together; where a finding lies below none of them, or the rest do not pass, they go singly.
            var singly = members;
            var failing = members.Where(m => found.Any(f => Below(trials[m], f))).ToList();
            if (found.All(f => failing.Any(m => Below(trials[m], f))))
            {
                failing.ForEach(failed);
                singly = [.. members.Except(failing)];
                if (singly.Count == 0)
                {
                    continue;
                }

                var again = singly.Aggregate(picks, (p, m) => take(m, p, after) ?? p);
                if (!spend())
                {
                    return (picks, after);
                }

                var solvedAgain = solve(again);
                if (fresh(solvedAgain).Count == 0)
                {
                    (picks, after) = (again, solvedAgain);
                    continue;
                }
            }

            foreach (var m in singly)
            {
                if (take(m, picks, after) is not { } alone)
                {
                    continue;
                }

                if (!spend())
                {
                    return (picks, after);
                }

                var single = solve(alone);
                if (fresh(single).Count == 0)
                {
                    (picks, after) = (alone, single);
                }
                else
                {
                    failed(m);
                }
            }
        }

        return (picks, after);
    }

    // True where the finding's subject is node above or lies below it.
    private bool Below(int above, Finding finding) => _indexOf.TryGetValue(finding.Subject, out var node) && Contains(above, node);

    // The trials' positions in groups, in order: each trial joins the group after the last one holding a trial whose subtree
    // overlaps its own, so that trials above or below each other keep their order and the rest are solved together.
    private List<List<int>> Groups(IReadOnlyList<int> trials)
    {
        var groups = new List<List<int>>();
        var groupOf = new int[trials.Count];
        for (var t = 0; t < trials.Count; t++)
        {
            var g = 0;
            for (var u = 0; u < t && _independent; u++)
            {
                if (Contains(trials[u], trials[t]) || Contains(trials[t], trials[u]))
                {
                    g = Math.Max(g, groupOf[u] + 1);
                }
            }

            g = _independent ? g : t;
            groupOf[t] = g;
            if (g == groups.Count)
            {
                groups.Add([]);
            }

            groups[g].Add(t);
        }

        return groups;
    }
}
