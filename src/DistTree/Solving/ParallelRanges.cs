namespace DistTree.Solving;

/// <summary>
/// Runs a loop over the indices 0 … count − 1 in ranges on every core, for the solver's passes whose indices
/// are independent: each index reads what earlier passes wrote and writes its own slots only, so the result does
/// not depend on which core ran which range, or in what order (the output stays byte-identical).
/// </summary>
internal static class ParallelRanges
{
    // Large enough that handing out a range costs little beside its work; small enough to share the load.
    private const int RangeSize = 4096;

    /// <summary>When set, every loop runs on the calling thread alone: for tests and benchmarks that compare the two ways.</summary>
    internal static bool OnOneThread { get; set; }

    /// <summary>
    /// Calls <paramref name="body"/>(start, end) for ranges that together cover 0 … count − 1 once. When a range
    /// throws, the loop is run again in order on this thread, so the error is the first one in index order, as a
    /// plain loop would throw it.
    /// </summary>
    public static void For(int count, Action<int, int> body)
    {
        var ranges = (count + RangeSize - 1) / RangeSize;
        if (ranges < 2 || Environment.ProcessorCount < 2 || OnOneThread)
        {
            body(0, count);
            return;
        }

        try
        {
            Parallel.For(0, ranges, r => body(r * RangeSize, Math.Min(count, (r + 1) * RangeSize)));
        }
        catch (AggregateException)
        {
            body(0, count);
        }
    }
}
