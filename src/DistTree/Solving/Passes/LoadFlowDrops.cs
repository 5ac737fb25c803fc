using System.Globalization;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The load flow's drops beside the percent sum's: a run's is the fall of the per-unit voltage along it,
/// (V_bus,parent − V_in)·100; a transformer's the fall through it, (V_in − V_bus)·100. With
/// <c>rules: method: load_flow</c> they are the ones that count, and a load flow that did not converge is then a
/// located error.
/// </summary>
internal static class LoadFlowDrops
{
    /// <summary>Records <paramref name="flow"/>'s drops in <paramref name="runs"/>' rows, on every core.</summary>
    public static void Record(DistributionNetwork network, RunRows runs, LoadFlowResult flow)
    {
        var rules = network.Project.Rules;
        if (!flow.Converged)
        {
            if (rules.Method == SolutionMethod.LoadFlow)
            {
                throw ProjectException.At(network.Project.Service.Location, string.Create(
                    CultureInfo.InvariantCulture,
                    $"the load flow did not converge in {flow.Iterations} sweeps: the loads are too heavy for the conductors and transformers (a voltage collapse); fix the worst runs, or use 'method: percent_sum' to see them"));
            }

            return;
        }

        var (parents, rows, incomingRow, transformerRow) = (network.ParentIndices, runs.Rows, runs.IncomingRow, runs.TransformerRow);
        var counts = rules.Method == SolutionMethod.LoadFlow;
        void Record(ref RunRow r, double drop)
        {
            r.LoadFlowDropPercent = drop;
            if (counts)
            {
                r.DropPercent = drop;
            }
        }

        ParallelRanges.For(parents.Length, (start, end) =>
        {
            for (var i = Math.Max(start, 1); i < end; i++)
            {
                if (incomingRow[i] >= 0)
                {
                    Record(ref rows[incomingRow[i]], (flow.BusPu[parents[i]] - flow.InputPu[i]) * 100.0);
                }

                if (transformerRow[i] >= 0)
                {
                    Record(ref rows[transformerRow[i]], (flow.InputPu[i] - flow.BusPu[i]) * 100.0);
                }
            }
        });
    }
}
