namespace DistTree.Network;

/// <summary>
/// The depths of a tree whose nodes are numbered breadth first (see <see cref="NetworkBuilder"/>): the nodes of
/// one depth form one range of indices, and so do the children of one node. A pass along the tree can then take
/// one level at a time, top-down or bottom-up, with the nodes of a level independent of each other.
/// </summary>
internal sealed class TreeLevels
{
    /// <summary>The fewest nodes a level needs before a pass splits it over the cores; a narrower level is run inline.</summary>
    public const int WideLevelNodes = 8192;

    private TreeLevels(int[] levelStarts, int[] childStarts, LevelStep[] steps)
    {
        LevelStarts = levelStarts;
        ChildStarts = childStarts;
        Steps = steps;
    }

    /// <summary>The first node of each depth (0: the service), then the node count: depth d is LevelStarts[d] … LevelStarts[d + 1] − 1.</summary>
    public int[] LevelStarts { get; }

    /// <summary>The first child of each node, then the node count: node i's children are ChildStarts[i] … ChildStarts[i + 1] − 1.</summary>
    public int[] ChildStarts { get; }

    /// <summary>
    /// The levels below the service in the steps a pass takes, top-down: a level of at least
    /// <see cref="WideLevelNodes"/> nodes on its own, and each run of narrower levels together in one step, so
    /// that a deep narrow tree (a chain has a level per node) costs no more than a plain loop.
    /// </summary>
    public LevelStep[] Steps { get; }

    /// <summary>
    /// The levels of the tree of <paramref name="parentIndices"/> (−1 for the service, node 0), in which every
    /// node's parent index is at most the next node's, as breadth-first numbering makes it.
    /// </summary>
    /// <exception cref="ArgumentException">The nodes are not numbered breadth first.</exception>
    public static TreeLevels Of(int[] parentIndices)
    {
        var n = parentIndices.Length;

        // Children of a node follow one another, and the children of node i come before those of node i + 1, so
        // each node's first child is where the children of the nodes before it end.
        var childStarts = new int[n + 1];
        var levelStarts = new List<int> { 0 };
        var levelEnd = Math.Min(n, 1);
        for (var i = 1; i < n; i++)
        {
            var parent = parentIndices[i];
            if (parent < 0 || parent >= i || parent < parentIndices[i - 1])
            {
                throw new ArgumentException($"node {i} is not numbered breadth first", nameof(parentIndices));
            }

            childStarts[parent + 1]++;
        }

        childStarts[0] = Math.Min(n, 1);
        for (var i = 0; i < n; i++)
        {
            childStarts[i + 1] += childStarts[i];
        }

        // A level ends where the children of its last node end.
        while (levelEnd < n)
        {
            levelStarts.Add(levelEnd);
            levelEnd = childStarts[levelEnd];
        }

        levelStarts.Add(n);
        return new TreeLevels([.. levelStarts], childStarts, StepsOf(levelStarts));
    }

    private static LevelStep[] StepsOf(List<int> levelStarts)
    {
        // An array and a count, not a list: a list of these steps (a value type) is compiled at start (DEVELOPERS.md,
        // Start-up). Each level adds at most two steps, a run of narrow levels before it and itself.
        var steps = new LevelStep[2 * levelStarts.Count];
        var count = 0;
        var narrowFrom = -1;
        for (var d = 1; d + 1 < levelStarts.Count; d++)
        {
            var (start, end) = (levelStarts[d], levelStarts[d + 1]);
            if (end - start < WideLevelNodes)
            {
                narrowFrom = narrowFrom < 0 ? start : narrowFrom;
                continue;
            }

            if (narrowFrom >= 0)
            {
                steps[count++] = new LevelStep(narrowFrom, start, false);
                narrowFrom = -1;
            }

            steps[count++] = new LevelStep(start, end, true);
        }

        if (narrowFrom >= 0)
        {
            steps[count++] = new LevelStep(narrowFrom, levelStarts[^1], false);
        }

        var exact = new LevelStep[count];
        for (var i = 0; i < count; i++)
        {
            exact[i] = steps[i];
        }

        return exact;
    }
}

/// <summary>The nodes Start … End − 1 that a pass takes in one step: one wide level (<paramref name="Wide"/>), or a run of narrow levels.</summary>
/// <param name="Start">The first node.</param>
/// <param name="End">One past the last node.</param>
/// <param name="Wide">True for a single level wide enough to split over the cores.</param>
internal readonly record struct LevelStep(int Start, int End, bool Wide);
