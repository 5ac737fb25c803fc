namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// Runs a piece of work on its own thread with an ordinary 1 MiB stack, and reports what it returned or
/// threw and how many bytes it allocated. The time bound is a guard against a hang, not a speed test.
/// </summary>
internal static class Bounded
{
    /// <summary>The guard against a hang: generous, since CI machines are shared.</summary>
    public static readonly TimeSpan Timeout = TimeSpan.FromSeconds(30);

    public static BoundedResult<T> Run<T>(Func<T> work)
    {
        T? value = default;
        Exception? thrown = null;
        long allocated = 0;
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var thread = new Thread(
            () =>
            {
                var before = GC.GetAllocatedBytesForCurrentThread();
                try
                {
                    value = work();
                }
#pragma warning disable CA1031 // the test inspects whatever was thrown
                catch (Exception e)
#pragma warning restore CA1031
                {
                    thrown = e;
                }

                allocated = GC.GetAllocatedBytesForCurrentThread() - before;
            },
            maxStackSize: 1024 * 1024);
        thread.Start();
        if (!thread.Join(Timeout))
        {
            Assert.Fail($"did not finish within {Timeout.TotalSeconds} s");
        }

        return new BoundedResult<T>(value, thrown, allocated, clock.Elapsed);
    }
}

internal sealed record BoundedResult<T>(T? Value, Exception? Thrown, long AllocatedBytes, TimeSpan Elapsed)
{
    public long AllocatedMiB => AllocatedBytes / (1024 * 1024);
}
