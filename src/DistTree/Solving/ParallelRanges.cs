using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// Runs a loop over the indices 0 … count − 1 in ranges on every core, for the solver's passes whose indices
/// are independent: each index reads what earlier passes wrote and writes its own slots only, so the result does
/// not depend on which core ran which range, or in what order (the output stays byte-identical).
/// </summary>
internal static class ParallelRanges
{
    // Large enough that handing out a range costs little beside its work; small enough to share the load: at
    // most 4096, and at least four ranges a core down to 1024, so a loop of some thousands is split evenly. A
    // loop of 4096 or fewer runs on the calling thread: handing it out costs more than it saves.
    private const int MaxRangeSize = 4096;
    private const int MinRangeSize = 1024;

    /// <summary>When set, every loop runs on the calling thread alone: for tests and benchmarks that compare the two ways.</summary>
    internal static bool OnOneThread { get; set; }

    /// <summary>
    /// Calls <paramref name="body"/>(start, end) for ranges that together cover 0 … count − 1 once. When a range
    /// throws, the loop is run again in order on this thread, so the error is the first one in index order, as a
    /// plain loop would throw it.
    /// </summary>
    public static void For(int count, Action<int, int> body) => For(0, count, body);

    /// <summary>
    /// A pass down a tree (see <see cref="TreeLevels.Steps"/>): calls <paramref name="body"/>(start, end) step by
    /// step from the service's children down, a wide level in ranges on every core. The body must take its nodes
    /// from start up, as a run of narrow levels holds parents before their children.
    /// </summary>
    public static void TopDown(LevelStep[] steps, Action<int, int> body)
    {
        foreach (var step in steps)
        {
            Step(step, body);
        }
    }

    /// <summary>
    /// A pass up a tree (see <see cref="TreeLevels.Steps"/>): calls <paramref name="body"/>(start, end) step by
    /// step from the deepest level up to the service's children, a wide level in ranges on every core. The body
    /// must take its nodes from end − 1 down, as a run of narrow levels holds children after their parents.
    /// </summary>
    public static void BottomUp(LevelStep[] steps, Action<int, int> body)
    {
        for (var s = steps.Length - 1; s >= 0; s--)
        {
            Step(steps[s], body);
        }
    }

    // One step of a pass: the nodes of a wide level are independent of each other; a narrow step runs inline.
    private static void Step(LevelStep step, Action<int, int> body)
    {
        if (step.Wide)
        {
            For(step.Start, step.End, body);
        }
        else
        {
            body(step.Start, step.End);
        }
    }

    // For over start … end − 1.
    private static void For(int start, int end, Action<int, int> body)
    {
        var rangeSize = Math.Clamp((end - start) / (Environment.ProcessorCount * 4), MinRangeSize, MaxRangeSize);
        var ranges = (end - start + rangeSize - 1) / rangeSize;
        if (end - start <= MaxRangeSize || Environment.ProcessorCount < 2 || OnOneThread)
        {
            body(start, end);
            return;
        }

        try
        {
            Parallel.For(0, ranges, r => body(start + (r * rangeSize), Math.Min(end, start + ((r + 1) * rangeSize))));
        }
        catch (AggregateException)
        {
            body(start, end);
        }
    }
}
