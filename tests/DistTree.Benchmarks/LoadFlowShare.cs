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
        RunDrops.Solve(ConductorCatalog.Standard, new ProtectionRules(ConductorCatalog.Standard), network, sums, phases, runs);
        var iterations = 0;
        var time = Measurement.Of("loadflow", size, repeats, () =>
        {
            var (result, voltages) = LoadFlow.Solve(network, phases, sums.Power, runs);
            voltages.Dispose();
            iterations = result.Iterations;
        });
        return (time, iterations);
    }
}
