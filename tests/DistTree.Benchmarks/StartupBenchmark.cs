using System.Diagnostics;
using System.Globalization;

namespace DistTree.Benchmarks;

/// <summary>
/// The start-up a user sees: fresh processes of the command, <c>--version</c> and <c>check</c> of the demo in
/// turn, so that both meet the machine's load alike. Prints each one's median and the gap between them, in
/// milliseconds and as a ratio (target: <c>check</c> at most 100 ms slower than <c>--version</c>).
/// </summary>
internal static class StartupBenchmark
{
    /// <summary>The largest gap between the two medians that meets the target, in milliseconds.</summary>
    private const double TargetGapMs = 100;

    /// <summary>
    /// <c>startup COMMAND [ROUNDS] [PROJECT]</c>: COMMAND is a built <c>DistTree.Cli.dll</c> (run as
    /// <c>dotnet DLL</c>) or an installed command (<c>disttree</c>, a tool path); ROUNDS pairs of runs (default 21);
    /// PROJECT the project to check (default the demo, <c>projects/quillfeather-medical.yaml</c>).
    /// </summary>
    public static void Run(IReadOnlyList<string> args, string repositoryRoot)
    {
        var command = args[0];
        var rounds = args.Count > 1 ? int.Parse(args[1], CultureInfo.InvariantCulture) : 21;
        var project = args.Count > 2 ? Path.GetFullPath(args[2]) : Path.Combine(repositoryRoot, "projects", "quillfeather-medical.yaml");
        string[] version = ["--version"];
        string[] check = ["check", project];

        // One of each first, not counted: the first start after a build reads the files from disk.
        Time(command, version);
        Time(command, check);
        var versionMs = new List<double>();
        var checkMs = new List<double>();
        for (var round = 0; round < rounds; round++)
        {
            // Each round starts with the other one, so neither always follows the same.
            if (round % 2 == 0)
            {
                versionMs.Add(Time(command, version));
                checkMs.Add(Time(command, check));
            }
            else
            {
                checkMs.Add(Time(command, check));
                versionMs.Add(Time(command, version));
            }
        }

        var v = Median(versionMs);
        var c = Median(checkMs);
        Console.WriteLine($"Start-up of {command}, fresh processes, {rounds} of each in turn; wall-clock milliseconds.");
        Console.WriteLine($"  --version                          median {v,7:0.0} ms  (spread {versionMs.Min(),6:0.0} .. {versionMs.Max(),6:0.0})");
        Console.WriteLine($"  check {Path.GetFileName(project),-28} median {c,7:0.0} ms  (spread {checkMs.Min(),6:0.0} .. {checkMs.Max(),6:0.0})");
        var verdict = c - v <= TargetGapMs ? "met" : "MISSED";
        Console.WriteLine($"  gap check - version                {c - v,7:0.0} ms  ratio {c / v:0.00}  target gap <= {TargetGapMs:0} ms  {verdict}");
    }

    /// <summary>Runs the command once to its end, its output read and dropped; returns the wall time in milliseconds.</summary>
    private static double Time(string command, string[] arguments)
    {
        var start = command.EndsWith(".dll", StringComparison.OrdinalIgnoreCase)
            ? new ProcessStartInfo("dotnet", [command, .. arguments])
            : new ProcessStartInfo(command, arguments);
        start.RedirectStandardOutput = true;
        start.RedirectStandardError = true;
        var clock = Stopwatch.StartNew();
        using var process = Process.Start(start)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        process.WaitForExit();
        Task.WaitAll(stdout, stderr);
        var elapsed = clock.Elapsed.TotalMilliseconds;
        if (process.ExitCode is not (0 or 1))
        {
            throw new InvalidOperationException($"{command} {string.Join(' ', arguments)} exited with code {process.ExitCode}: {stderr.Result}");
        }

        return elapsed;
    }

    private static double Median(List<double> values)
    {
        var sorted = values.Order().ToList();
        return sorted.Count % 2 == 1 ? sorted[sorted.Count / 2] : (sorted[(sorted.Count / 2) - 1] + sorted[sorted.Count / 2]) / 2;
    }
}
