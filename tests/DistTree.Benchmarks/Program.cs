using System.Diagnostics;
using System.Runtime;
using DistTree;
using DistTree.Benchmarks;
using DistTree.Cli;
using DistTree.Comparing;
using DistTree.Generating;
using DistTree.Model;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.ProjectFiles.Yaml;
using DistTree.Reports;
using DistTree.Sizing;
using DistTree.Solving;

// DistTree benchmarks: a plain harness (not BenchmarkDotNet) that prints the median and spread of repeated runs.
// Run: dotnet run -c Release --project tests/DistTree.Benchmarks -- [filters]
// Filters select stages (generate yaml parse validate build solve json analyze upsize compare html panels) and
// sizes (1000 10000 100000); none selects everything. "panels" is one row of its own: 100,000 circuits in one
// panel against the same in 1,000 panels (PanelWidth). The stages parse, build and solve are timed one by one, so
// they call each stage alone; a project wanted whole (a revision, the demo) goes through the library's entry
// point, Analysis.
// Or: builds PROJECT ROUNDS [one-thread] FOLDER FOLDER… to time the solve of several builds in one process (see
// BuildComparison and DEVELOPERS.md, Performance).
// Or: startup COMMAND [ROUNDS] [PROJECT] to time fresh processes of --version and check in turn (StartupBenchmark).
if (args is ["builds", .. var buildArguments])
{
    BuildComparison.Run(buildArguments);
    return;
}

if (args is ["startup", .. var startupArguments])
{
    StartupBenchmark.Run(startupArguments, RepositoryRoot());
    return;
}

var filters = args.Select(a => a.ToLowerInvariant()).ToHashSet();
int[] allSizes = [1_000, 10_000, 100_000];
string[] allStages = ["generate", "yaml", "parse", "validate", "build", "solve", "json", "analyze", "upsize", "compare", "html", "panels"];
var sizes = allSizes.Where(s => filters.Contains(s.ToString(System.Globalization.CultureInfo.InvariantCulture))).DefaultIfEmpty().ToArray();
sizes = sizes is [0] ? allSizes : sizes;
var stages = allStages.Where(filters.Contains).ToArray();
stages = stages.Length == 0 ? allStages : stages;
sizes = stages is ["panels"] ? [] : sizes; // the panel-width row alone needs no generated campus
bool Wanted(string stage) => stages.Contains(stage);

Console.WriteLine($"DistTree benchmarks: .NET {Environment.Version}, {Environment.ProcessorCount} cores, {(GCSettings.IsServerGC ? "server" : "workstation")} GC");
Console.WriteLine("Generated campus projects (disttree generate, seed 7, depth 3); figures are wall-clock seconds.");
Console.WriteLine($"Load average at start (1, 5, 15 min): {LoadAverage()}");
Console.WriteLine();

var folder = Directory.CreateTempSubdirectory("disttree-bench-");
var results = new List<Measurement>();
var solveRunsPerSecond = new Dictionary<int, double>();
var loadFlow = new Dictionary<int, (double Seconds, int Iterations)>();
var savings = new List<Saving>();
var htmlBytes = new Dictionary<string, long>();
var freshAnalyze = new List<string>();
var panelWidth = new List<string>();
try
{
    // The figure a user sees, measured first, while this harness holds nothing large of its own.
    if (Wanted("analyze") && sizes.Contains(100_000))
    {
        var campus = Path.Combine(folder.FullName, "campus-100000.yaml");
        File.WriteAllText(campus, ProjectGenerator.Generate(100_000, 3, 7));
        freshAnalyze = AnalyzeInFreshProcess(campus);
    }

    if (Wanted("panels"))
    {
        panelWidth = PanelWidth.Run(folder.FullName);
    }

    foreach (var size in sizes)
    {
        var repeats = size >= 100_000 ? 3 : size >= 10_000 ? 5 : 11;
        var text = "";
        results.Add(Measurement.Of("generate", size, repeats, () => text = ProjectGenerator.Generate(size, 3, 7)));
        var path = Path.Combine(folder.FullName, $"campus-{size}.yaml");
        File.WriteAllText(path, text);

        // The whole command first, while the harness holds nothing else of this size: every collection during a
        // run would otherwise also walk the other stages' models and results. At least 7 runs: the 100k/10k ratio
        // is read from these medians.
        if (Wanted("analyze"))
        {
            var output = Path.Combine(folder.FullName, $"campus-{size}.json");
            results.Add(Measurement.Of("analyze", size, Math.Max(repeats, 7), () => Cli(["analyze", path, "--json", output])));
        }

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
        if (Wanted("solve") || Wanted("upsize"))
        {
            // Upsize is read beside solve (same run, same load), so solve is timed whenever upsize is. A solve is
            // short beside the other stages: 11 repeats at least, so that one slow moment of a shared machine does
            // not make the median. The same solve with every pass on this thread alone, in turn with it: what the
            // passes on every core gain, in the same moments and on the same compiled code, warmed up first.
            var (m, single) = Measurement.Alternately(
                "solve", "solve-1t", size, Math.Max(repeats, 11), warmUps: 30,
                () => solution = DropSolver.Standard.Solve(network),
                () =>
                {
                    ParallelRanges.OnOneThread = true;
                    solution = DropSolver.Standard.Solve(network);
                    ParallelRanges.OnOneThread = false;
                });
            results.Add(m);
            results.Add(single);
            solveRunsPerSecond[size] = solution.Runs.Count / m.Median;
        }

        solution ??= DropSolver.Standard.Solve(network);
        if (Wanted("solve"))
        {
            LoadFlowShare.Measure(results, loadFlow, network, size, Math.Max(repeats, 11)); // the load flow alone (issue 17)
        }

        if (Wanted("json"))
        {
            // As analyze writes it: streamed, here to nowhere, so that the figure is the formatting alone.
            results.Add(Measurement.Of("json", size, repeats, () => JsonResults.Write(solution, Stream.Null)));
        }

        if (Wanted("upsize"))
        {
            // 100k: measured once, without a warm-up run (the smaller sizes have warmed the code up when run).
            UpsizePlan plan = null!;
            var big = size >= 100_000;
            results.Add(Measurement.Of("upsize", size, big ? 1 : repeats, () => plan = Upsizer.Standard.Plan(solution), warmUp: !big));
            savings.Add(SavingOf($"generated {size:N0} end points", solution, plan));
            if (!big)
            {
                // The same plan with the step-down's and the pruner's trials solved one at a time (TrialGroups), for the ratio.
                var alone = new Upsizer(DistTree.Conductors.ConductorCatalog.Standard) { SolvesTrialsTogether = false };
                results.Add(Measurement.Of("upsize-alone", size, repeats, () => alone.Plan(solution)));

                // Not timed: the same building with every feeder three times as long, where feeders and branch circuits compete.
                var stressed = Analysis.Parse(RevisionEdit.Stress(text), path).Solution;
                savings.Add(SavingOf($"  same, feeders 3 × as long", stressed, Upsizer.Standard.Plan(stressed)));
            }
        }

        if (Wanted("compare"))
        {
            var (revised, lengthened) = RevisionEdit.Revise(text);
            var pathB = Path.Combine(folder.FullName, $"campus-{size}-rev-b.yaml");
            var solutionB = Analysis.Parse(revised, pathB).Solution;
            Comparison comparison = null!;
            results.Add(Measurement.Of("compare", size, repeats, () => comparison = RevisionComparer.Compare(solution, solutionB)));
            var c = comparison.Summary;
            Console.WriteLine($"compare revision B: {lengthened:N0} feeders 10 % longer, sub-panel {RevisionEdit.SubPanelId} with {RevisionEdit.SubPanelCircuits} circuits added; " +
                $"found {c.EquipmentAdded} equipment and {c.CircuitsAdded} circuits added, {c.EquipmentChanged} equipment changed, {c.EndPointsAffected:N0} of {c.EndPointsCompared:N0} end points affected, {c.EndPointsNewlyFailing} newly failing");
        }

        if (Wanted("html"))
        {
            var html = "";
            results.Add(Measurement.Of("html", size, repeats, () => html = HtmlReport.Render(solution, new HtmlReportOptions())));
            htmlBytes[$"{size:N0} end points"] = System.Text.Encoding.UTF8.GetByteCount(html);
        }

        foreach (var m in results.Where(r => r.Size == size))
        {
            Console.WriteLine(m);
        }

        var gc = GC.GetGCMemoryInfo();
        Console.WriteLine($"peak working set of this harness so far {Environment.WorkingSet / 1048576} MiB now, {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576} MiB peak; GC heap {gc.HeapSizeBytes / 1048576} MiB");
        Console.WriteLine();
    }

    if (Wanted("html") || Wanted("upsize"))
    {
        Demo(results, savings, htmlBytes);
    }

    if (results.Count > 0)
    {
        Summarise(results, solveRunsPerSecond, savings, htmlBytes, loadFlow);
    }

    foreach (var line in freshAnalyze.Concat(panelWidth))
    {
        Console.WriteLine(line);
    }

    Console.WriteLine($"Load average at end (1, 5, 15 min): {LoadAverage()}");
}
finally
{
    folder.Delete(recursive: true);
}

static void Cli(string[] args)
{
    var code = DisttreeApp.Run(args, TextWriter.Null, TextWriter.Null, showProgress: false, rethrowUnexpected: true);
    if (code == ExitCodes.BadInput)
    {
        throw new InvalidOperationException($"disttree {string.Join(' ', args)} exited with code 2");
    }
}

// The demo project: its HTML report and its upsize plan against the greedy fix.
void Demo(List<Measurement> results, List<Saving> savings, Dictionary<string, long> htmlBytes)
{
    var demo = Path.Combine(RepositoryRoot(), "projects", "quillfeather-medical.yaml");
    var solution = Analysis.Run(demo).Solution;
    var endPoints = solution.EndPoints.Count;
    if (Wanted("html"))
    {
        var html = "";
        var m = Measurement.Of("html-demo", endPoints, 11, () => html = HtmlReport.Render(solution, new HtmlReportOptions()));
        results.Add(m);
        htmlBytes["demo quillfeather-medical.yaml"] = System.Text.Encoding.UTF8.GetByteCount(html);
        Console.WriteLine(m);
    }

    if (Wanted("upsize"))
    {
        UpsizePlan plan = null!;
        var m = Measurement.Of("upsize-demo", endPoints, 11, () => plan = Upsizer.Standard.Plan(solution));
        results.Add(m);
        Console.WriteLine(m);
        savings.InsertRange(0, UpsizeSavings.Examples(RepositoryRoot()));
    }

    Console.WriteLine();
}

static Saving SavingOf(string label, Solution solution, UpsizePlan plan) => UpsizeSavings.Of(label, solution, plan);

static string RepositoryRoot()
{
    for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
    {
        if (File.Exists(Path.Combine(dir.FullName, "DistTree.sln")))
        {
            return dir.FullName;
        }
    }

    throw new InvalidOperationException("DistTree.sln not found above the harness");
}

static string LoadAverage() => File.Exists("/proc/loadavg") ? File.ReadAllText("/proc/loadavg").Trim() : "not available";

static void Summarise(List<Measurement> results, Dictionary<int, double> runsPerSecond, List<Saving> savings, Dictionary<string, long> htmlBytes, Dictionary<int, (double Seconds, int Iterations)> loadFlow)
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
        var oneThread = Find("solve-1t", size) is { } single && Find("solve", size) is { } all
            ? $"  (on one thread {rate * all.Median / single.Median / 1e6:0.00} M; every core {single.Median / all.Median:0.00}× that)"
            : "";
        Console.WriteLine($"  solver runs per second at {size,7:N0} {rate / 1e6,8:0.00} M  target > 2 M  {Verdict(rate > 2e6)}{oneThread}");
    }

    foreach (var size in results.Select(r => r.Size).Distinct())
    {
        if (Find("solve", size) is { } solve && Find("parse", size) is { } parse)
        {
            Console.WriteLine($"  solve time / parse time at {size,7:N0} {solve.Median / parse.Median,8:0.000}");
        }
    }

    LoadFlowShare.Summarise(results, loadFlow);
    Console.WriteLine();
    Console.WriteLine("Targets (issues 5, 6, 7):");
    foreach (var size in results.Select(r => r.Size).Distinct().Order())
    {
        if (Find("upsize", size) is { } upsize && Find("solve", size) is { } solve)
        {
            var target = size switch
            {
                10_000 => $"  target < 1 s  {Verdict(upsize.Median < 1)}",
                100_000 => $"  target < 10 s  {Verdict(upsize.Median < 10)}",
                _ => "",
            };
            var once = upsize.Seconds.Count == 1 ? " (measured once)" : "";
            Console.WriteLine($"  upsize {size,7:N0}: {Measurement.Format(upsize.Median),9}{once}, solve {Measurement.Format(solve.Median),9}, upsize / solve {upsize.Median / solve.Median,7:0.0}{target}");
            if (Find("upsize-alone", size) is { } alone)
            {
                Console.WriteLine($"  upsize {size,7:N0} with every trial solved alone: {Measurement.Format(alone.Median),9}; together / alone {upsize.Median / alone.Median:0.00}");
            }
        }
    }

    if (Find("compare", 100_000) is { } compare)
    {
        Console.WriteLine($"  compare two 100,000-end-point revisions {Measurement.Format(compare.Median),9}  target < 3 s  {Verdict(compare.Median < 3)}");
    }

    if (Find("html", 100_000) is { } html)
    {
        Console.WriteLine($"  HTML of 100,000 end points              {Measurement.Format(html.Median),9}  {htmlBytes["100,000 end points"],12:N0} bytes  target < 10 s  {Verdict(html.Median < 10)}");
    }

    if (results.FirstOrDefault(r => r.Name == "html-demo") is { } demo)
    {
        Console.WriteLine($"  HTML of the demo (quillfeather-medical)  {Measurement.Format(demo.Median),9}  {htmlBytes["demo quillfeather-medical.yaml"],12:N0} bytes  target < 1 s  {Verdict(demo.Median < 1)}");
    }

    foreach (var (label, bytes) in htmlBytes.Where(p => p.Key.EndsWith("end points", StringComparison.Ordinal)))
    {
        Console.WriteLine($"  HTML size, {label,-30} {bytes,12:N0} bytes");
    }

    if (savings.Count > 0)
    {
        Console.WriteLine();
        UpsizeSavings.Print(savings);
    }
}

// The figure a user sees: a fresh 'disttree analyze' process, file to JSON, its wall time and peak memory.
static List<string> AnalyzeInFreshProcess(string path)
{
    var cli = Path.Combine(AppContext.BaseDirectory, "DistTree.Cli.dll");
    var output = Path.ChangeExtension(path, ".fresh.json");
    var times = new List<double>();
    long peak = 0;
    for (var i = 0; i < 5; i++)
    {
        var start = new ProcessStartInfo("dotnet", ["exec", cli, "analyze", path, "--json", output])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
        };
        var clock = Stopwatch.StartNew();
        using var process = Process.Start(start)!;
        // Read the output without blocking, so that the peak is sampled while the process runs.
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        long processPeak = 0;
        while (!process.WaitForExit(20))
        {
            processPeak = Math.Max(processPeak, ProcessPeak.Of(process));
        }

        Task.WaitAll(stdout, stderr);

        times.Add(clock.Elapsed.TotalSeconds);
        peak = Math.Max(peak, processPeak);
    }

    times.Sort();
    var median = times[times.Count / 2];
    return
    [
        $"  analyze 100,000 end points, file to JSON, fresh process: median {median:0.00} s of {times.Count} (spread {times[0]:0.00} .. {times[^1]:0.00})  target < 3 s  {Verdict(median < 3)}",
        $"  peak memory of that process (peak working set)              {peak / 1048576.0,6:0} MiB  target < 1024 MiB  {(peak == 0 ? "not measured" : Verdict(peak < 1L << 30))}",
    ];
}

static string Verdict(bool met) => met ? "met" : "MISSED";

