using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Solving.Passes;

namespace DistTree.Benchmarks;

/// <summary>
/// The phase-frame load flow alone (issue 17: it runs beside the percent sum on every analyze): the passes before
/// it are run once, then <see cref="LoadFlow.Solve"/> is timed on their result, with its iteration count.
/// </summary>
internal static class LoadFlowShare
{
    /// <summary>Times the load flow of <paramref name="network"/>; gives the measurement and the sweeps it made.</summary>
    public static (Measurement Time, int Iterations) Of(DistributionNetwork network, int size, int repeats)
    {
        var n = network.NodeArray.Length;
        using var sums = new PowerSums(network);
        var assigned = new Phases[n];
        PhaseAssignment.Assign(network, sums.Power, assigned);
        var phases = PhaseCurrents.Solve(network, PhaseFrame.Of(network), sums.Power, assigned);
        using var runs = new RunRows(sums.Has, n);
        RunDrops.Solve(ConductorCatalog.Standard, Codes.CodeRules.For(ElectricalCode.Nec, ConductorCatalog.Standard), network, sums, phases, null, runs);
        var iterations = 0;
        var time = Measurement.Of("loadflow", size, repeats, () =>
        {
            var (result, voltages) = LoadFlow.Solve(network, phases, sums.Power, runs);
            voltages.Dispose();
            iterations = result.Iterations;
        });
        return (time, iterations);
    }

    /// <summary>Times the load flow of <paramref name="network"/> into <paramref name="results"/>, its median and sweeps into <paramref name="loadFlow"/>.</summary>
    public static void Measure(List<Measurement> results, Dictionary<int, (double Seconds, int Iterations)> loadFlow, DistributionNetwork network, int size, int repeats)
    {
        var (time, iterations) = Of(network, size, repeats);
        results.Add(time);
        loadFlow[size] = (time.Median, iterations);
    }

    /// <summary>Prints each size's load flow: its time, sweeps and share of the solve timed in the same run.</summary>
    public static void Summarise(List<Measurement> results, Dictionary<int, (double Seconds, int Iterations)> loadFlow)
    {
        foreach (var (size, (seconds, iterations)) in loadFlow.OrderBy(p => p.Key))
        {
            var solve = results.Single(r => r.Name == "solve" && r.Size == size);
            Console.WriteLine($"  load flow at {size,7:N0}: {Measurement.Format(seconds),9} in {iterations} sweeps, {seconds / solve.Median:0.00} of the solve (issue 17)");
        }
    }
}
