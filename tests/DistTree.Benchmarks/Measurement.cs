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

    /// <summary>
    /// Times two pieces of work in turn, <paramref name="repeats"/> times each, after <paramref name="warmUps"/> runs of
    /// each in turn: both see the same machine and the same compiled code (a method called once per run is
    /// compiled at its final tier only after some 30 calls).
    /// </summary>
    public static (Measurement First, Measurement Second) Alternately(
        string firstName, string secondName, int size, int repeats, int warmUps, Action first, Action second)
    {
        for (var i = 0; i < warmUps; i++)
        {
            first();
            second();
        }

        var (a, b) = (new List<Measurement>(repeats), new List<Measurement>(repeats));
        for (var i = 0; i < repeats; i++)
        {
            a.Add(Of(firstName, size, 1, first, warmUp: false));
            b.Add(Of(secondName, size, 1, second, warmUp: false));
        }

        return (Merge(a), Merge(b));

        static Measurement Merge(List<Measurement> runs) => new(
            runs[0].Name, runs[0].Size, [.. runs.SelectMany(r => r.Seconds)], [.. runs.SelectMany(r => r.CpuSeconds)], runs[^1].AllocatedBytes);
    }

    public override string ToString() =>
        $"{Name,-9} {Size,8:N0}  median {Format(Median),9}  spread {Format(Min)} .. {Format(Max)}  cpu {Format(CpuMedian),9}  allocated {AllocatedBytes / 1048576.0,7:0.0} MiB";

    public static string Format(double seconds) => seconds < 1 ? $"{seconds * 1000:0.0} ms" : $"{seconds:0.00} s";
}
