using System.Diagnostics;
using System.Reflection;
using System.Runtime.Loader;

namespace DistTree.Benchmarks;

/// <summary>
/// Times the solve of two or more builds of the library in one process, in turn: on a shared machine two
/// processes run one after the other differ by more than a change of a few per cent, two builds in one
/// process far less. Each build's <c>DistTree.dll</c> is loaded from its folder into a context of its own, with
/// a network of its own; each round starts with a different build. Name the same folder twice to see the noise.
/// </summary>
internal static class BuildComparison
{
    /// <summary>
    /// <c>builds PROJECT ROUNDS [one-thread] FOLDER FOLDER…</c>: prints per build the median solve and the median of
    /// its paired ratios to the first build's solve of the same round.
    /// </summary>
    public static void Run(IReadOnlyList<string> args)
    {
        var project = args[0];
        var rounds = int.Parse(args[1], System.Globalization.CultureInfo.InvariantCulture);
        var oneThread = args[2] == "one-thread";
        var folders = args.Skip(oneThread ? 3 : 2).Select(Path.GetFullPath).ToArray();
        var solves = folders.Select(folder => Load(folder, project, oneThread)).ToArray();
        foreach (var solve in solves.Concat(solves).Concat(solves))
        {
            solve();
        }

        var seconds = folders.Select(_ => new List<double>()).ToArray();
        object? kept = null;
        for (var round = 0; round < rounds; round++)
        {
            for (var turn = 0; turn < solves.Length; turn++)
            {
                var build = (turn + round) % solves.Length;
                kept = null;
                GC.Collect();
                GC.WaitForPendingFinalizers();
                var clock = Stopwatch.StartNew();
                kept = solves[build]();
                seconds[build].Add(clock.Elapsed.TotalSeconds);
            }
        }

        GC.KeepAlive(kept);
        Console.WriteLine($"{rounds} solves of {project} per build, in turn{(oneThread ? ", on one thread" : "")}:");
        for (var build = 0; build < folders.Length; build++)
        {
            var ratios = seconds[build].Zip(seconds[0], (a, b) => a / b).Order().ToList();
            var median = seconds[build].Order().ElementAt(rounds / 2);
            Console.WriteLine($"  {Measurement.Format(median),9}  ratio to the first {ratios[rounds / 2]:0.000}  {folders[build]}");
        }
    }

    // The solve of one build on its own network, through reflection (the build's types are not this harness's).
    private static Func<object> Load(string folder, string project, bool oneThread)
    {
        var context = new FolderContext(folder);
        var library = context.LoadFromAssemblyPath(Path.Combine(folder, "DistTree.dll"));
        if (oneThread)
        {
            library.GetType("DistTree.Solving.ParallelRanges")!
                .GetProperty("OnOneThread", BindingFlags.NonPublic | BindingFlags.Static)!.SetValue(null, true);
        }

        var model = library.GetType("DistTree.ProjectFiles.ProjectLoader")!.GetMethod("Load", [typeof(string)])!.Invoke(null, [project]);
        var network = library.GetType("DistTree.Network.NetworkBuilder")!.GetMethod("Build")!.Invoke(null, [model]);
        var solverType = library.GetType("DistTree.Solving.DropSolver")!;
        var solver = solverType.GetProperty("Standard")!.GetValue(null);
        var solve = solverType.GetMethod("Solve")!;
        return () => solve.Invoke(solver, [network])!;
    }

    // Loads a build's own assemblies from its folder; the runtime's from the runtime.
    private sealed class FolderContext(string folder) : AssemblyLoadContext
    {
        protected override Assembly? Load(AssemblyName name)
        {
            var path = Path.Combine(folder, name.Name + ".dll");
            return name.Name!.StartsWith("System.", StringComparison.Ordinal) || !File.Exists(path) ? null : LoadFromAssemblyPath(path);
        }
    }
}
