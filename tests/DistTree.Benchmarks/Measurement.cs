using System.Diagnostics;

namespace DistTree.Benchmarks;

/// <summary>Times repeated runs of one piece of work and keeps the median and the spread.</summary>
internal sealed record Measurement(string Name, int Size, IReadOnlyList<double> Seconds, IReadOnlyList<double> CpuSeconds, long AllocatedBytes)
{
    public double Median => Sorted[Sorted.Count / 2];

    public double Min => Sorted[0];

    public double Max => Sorted[^1];

    /// <summary>Median processor time (all threads, GC included): steadier than wall time on a shared machine.</summary>
    public double CpuMedian => CpuSeconds.Order().ElementAt(CpuSeconds.Count / 2);

    private List<double> Sorted => [.. Seconds.Order()];

    /// <summary>Runs <paramref name="work"/> once to warm up (unless <paramref name="warmUp"/> is false), then <paramref name="repeats"/> times, timing each.</summary>
    public static Measurement Of(string name, int size, int repeats, Action work, bool warmUp = true)
    {
        if (warmUp)
        {
            work();
        }

        var times = new List<double>(repeats);
        var cpu = new List<double>(repeats);
        using var self = Process.GetCurrentProcess();
        long allocated = 0;
        for (var i = 0; i < repeats; i++)
        {
            GC.Collect();
            GC.WaitForPendingFinalizers();
            var before = GC.GetTotalAllocatedBytes(precise: true);
            self.Refresh();
            var cpuBefore = self.TotalProcessorTime;
            var clock = Stopwatch.StartNew();
            work();
            times.Add(clock.Elapsed.TotalSeconds);
            self.Refresh();
            cpu.Add((self.TotalProcessorTime - cpuBefore).TotalSeconds);
            allocated = GC.GetTotalAllocatedBytes(precise: true) - before;
        }

        return new Measurement(name, size, times, cpu, allocated);
    }

    public override string ToString() =>
        $"{Name,-9} {Size,8:N0}  median {Format(Median),9}  spread {Format(Min)} .. {Format(Max)}  cpu {Format(CpuMedian),9}  allocated {AllocatedBytes / 1048576.0,7:0.0} MiB";

    public static string Format(double seconds) => seconds < 1 ? $"{seconds * 1000:0.0} ms" : $"{seconds:0.00} s";
}
