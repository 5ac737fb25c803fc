using System.Diagnostics;
using System.Runtime;
using DistTree.Benchmarks;
using DistTree.Cli;
using DistTree.Generating;
using DistTree.Model;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Reports;
using DistTree.Solving;

// DistTree benchmarks: a plain harness (not BenchmarkDotNet) that prints the median and spread of repeated runs.
// Run: dotnet run -c Release --project tests/DistTree.Benchmarks -- [filters]
// Filters select stages (generate parse validate build solve json analyze) and sizes (1000 10000 100000);
// none selects everything.
var filters = args.Select(a => a.ToLowerInvariant()).ToHashSet();
int[] allSizes = [1_000, 10_000, 100_000];
string[] allStages = ["generate", "yaml", "parse", "validate", "build", "solve", "json", "analyze"];
var sizes = allSizes.Where(s => filters.Contains(s.ToString(System.Globalization.CultureInfo.InvariantCulture))).DefaultIfEmpty().ToArray();
sizes = sizes is [0] ? allSizes : sizes;
var stages = allStages.Where(filters.Contains).ToArray();
stages = stages.Length == 0 ? allStages : stages;
bool Wanted(string stage) => stages.Contains(stage);

Console.WriteLine($"DistTree benchmarks: .NET {Environment.Version}, {Environment.ProcessorCount} cores, {(GCSettings.IsServerGC ? "server" : "workstation")} GC");
Console.WriteLine("Generated campus projects (disttree generate, seed 7, depth 3); figures are wall-clock seconds.");
Console.WriteLine("Stages not on this branch yet (HTML report, compare, upsize) are left out.");
Console.WriteLine();

var folder = Directory.CreateTempSubdirectory("disttree-bench-");
var results = new List<Measurement>();
var solveRunsPerSecond = new Dictionary<int, double>();
try
{
    foreach (var size in sizes)
    {
        var repeats = size >= 100_000 ? 3 : size >= 10_000 ? 5 : 11;
        var text = "";
        results.Add(Measurement.Of("generate", size, repeats, () => text = ProjectGenerator.Generate(size, 3, 7)));
        var path = Path.Combine(folder.FullName, $"campus-{size}.yaml");
        File.WriteAllText(path, text);

        if (Wanted("yaml"))
        {
            // The first step of parse alone: YAML events to the loader's own source tree.
            results.Add(Measurement.Of("yaml", size, repeats, () => SourceTreeReader.Read(text, path, new DiagnosticBag())));
        }

        Project project = null!;
        if (Wanted("parse"))
        {
            results.Add(Measurement.Of("parse", size, repeats, () => project = ProjectLoader.Parse(text, path)));
        }

        project ??= ProjectLoader.Parse(text, path);
        if (Wanted("validate"))
        {
            results.Add(Measurement.Of("validate", size, repeats, () => Cli(["validate", path])));
        }

        DistributionNetwork network = null!;
        if (Wanted("build"))
        {
            results.Add(Measurement.Of("build", size, repeats, () => network = NetworkBuilder.Build(project)));
        }

        network ??= NetworkBuilder.Build(project);
        Solution solution = null!;
        if (Wanted("solve"))
        {
            var m = Measurement.Of("solve", size, repeats, () => solution = DropSolver.Standard.Solve(network));
            results.Add(m);
            solveRunsPerSecond[size] = solution.Runs.Count / m.Median;
        }

        solution ??= DropSolver.Standard.Solve(network);
        if (Wanted("json"))
        {
            results.Add(Measurement.Of("json", size, repeats, () => JsonResults.Write(solution)));
        }

        if (Wanted("analyze"))
        {
            var output = Path.Combine(folder.FullName, $"campus-{size}.json");
            results.Add(Measurement.Of("analyze", size, repeats, () => Cli(["analyze", path, "--json", output])));
        }

        foreach (var m in results.Where(r => r.Size == size))
        {
            Console.WriteLine(m);
        }

        var gc = GC.GetGCMemoryInfo();
        Console.WriteLine($"peak working set of this harness so far {Environment.WorkingSet / 1048576} MiB now, {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576} MiB peak; GC heap {gc.HeapSizeBytes / 1048576} MiB");
        Console.WriteLine();
    }

    Summarise(results, solveRunsPerSecond);
    if (Wanted("analyze") && sizes.Contains(100_000))
    {
        AnalyzeInFreshProcess(Path.Combine(folder.FullName, "campus-100000.yaml"));
    }
}
finally
{
    folder.Delete(recursive: true);
}

static void Cli(string[] args)
{
    var code = DisttreeApp.Run(args, TextWriter.Null, TextWriter.Null);
    if (code == ExitCodes.BadInput)
    {
        throw new InvalidOperationException($"disttree {string.Join(' ', args)} exited with code 2");
    }
}

static void Summarise(List<Measurement> results, Dictionary<int, double> runsPerSecond)
{
    Measurement? Find(string name, int size) => results.FirstOrDefault(r => r.Name == name && r.Size == size);
    Console.WriteLine("Targets (issue 9):");
    if (Find("analyze", 100_000) is { } a100 && Find("analyze", 10_000) is { } a10)
    {
        var ratio = a100.Median / a10.Median;
        Console.WriteLine($"  analyze 100k / 10k time ratio      {ratio,8:0.0}   target <= 12   {Verdict(ratio <= 12)}");
    }

    foreach (var (size, rate) in runsPerSecond.OrderBy(p => p.Key))
    {
        Console.WriteLine($"  solver runs per second at {size,7:N0} {rate / 1e6,8:0.00} M  target > 2 M  {Verdict(rate > 2e6)}");
    }

    foreach (var size in results.Select(r => r.Size).Distinct())
    {
        if (Find("solve", size) is { } solve && Find("parse", size) is { } parse)
        {
            Console.WriteLine($"  solve time / parse time at {size,7:N0} {solve.Median / parse.Median,8:0.000}");
        }
    }
}

// The figure a user sees: a fresh 'disttree analyze' process, file to JSON, its wall time and peak memory.
static void AnalyzeInFreshProcess(string path)
{
    var cli = Path.Combine(AppContext.BaseDirectory, "DistTree.Cli.dll");
    var output = Path.ChangeExtension(path, ".fresh.json");
    var times = new List<double>();
    long peak = 0;
    for (var i = 0; i < 3; i++)
    {
        var start = new ProcessStartInfo("dotnet", ["exec", cli, "analyze", path, "--json", output])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
        };
        var clock = Stopwatch.StartNew();
        using var process = Process.Start(start)!;
        process.StandardOutput.ReadToEnd();
        process.StandardError.ReadToEnd();
        long processPeak = 0;
        while (!process.WaitForExit(20))
        {
            processPeak = Math.Max(processPeak, PeakOf(process));
        }

        times.Add(clock.Elapsed.TotalSeconds);
        peak = Math.Max(peak, processPeak);
    }

    times.Sort();
    Console.WriteLine($"  analyze 100,000 end points, file to JSON, fresh process: median {times[1]:0.00} s (spread {times[0]:0.00} .. {times[2]:0.00})  target < 3 s  {Verdict(times[1] < 3)}");
    Console.WriteLine($"  peak memory of that process (peak working set)              {peak / 1048576.0,6:0} MiB  target < 1024 MiB  {Verdict(peak < 1L << 30)}");
}

// The high-water mark of a running process: VmHWM in /proc/PID/status on Linux, else PeakWorkingSet64.
static long PeakOf(Process process)
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

static string Verdict(bool met) => met ? "met" : "MISSED";
