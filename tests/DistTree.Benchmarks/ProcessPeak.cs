using System.Diagnostics;

namespace DistTree.Benchmarks;

/// <summary>The high-water mark of a running process: VmHWM in /proc/PID/status on Linux, else PeakWorkingSet64.</summary>
internal static class ProcessPeak
{
    /// <summary>The peak memory of <paramref name="process"/> so far, bytes (0 when it has just ended).</summary>
    public static long Of(Process process)
    {
        try
        {
            var status = $"/proc/{process.Id}/status";
            if (File.Exists(status))
            {
                var line = File.ReadLines(status).FirstOrDefault(l => l.StartsWith("VmHWM:", StringComparison.Ordinal));
                if (line is not null && long.TryParse(line["VmHWM:".Length..].Trim().Split(' ')[0], out var kib))
                {
                    return kib * 1024;
                }
            }

            process.Refresh();
            return process.PeakWorkingSet64;
        }
        catch (Exception e) when (e is IOException or InvalidOperationException or UnauthorizedAccessException)
        {
            return 0; // the process has just ended
        }
    }
}
