using System.Globalization;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The load flow's drops beside the percent sum's: a run's is the fall of each of its own voltages along it (see
/// <see cref="RunDrops.OwnSlots"/>), |f(V_from)| − |f(V_to)| in percent of nominal, the worst of them; a
/// transformer's the fall from its primary terminals, read through its connection at the principal tap, to its
/// secondary, the worst of its secondary's voltages. With <c>rules: method: load_flow</c> they are the ones that
/// count, and a load flow that did not converge is then a located error.
/// </summary>
internal static class LoadFlowDrops
{
    /// <summary>Records the drops of the load flow <paramref name="flow"/>, whose voltages are <paramref name="voltages"/>, in <paramref name="runs"/>' rows, on every core.</summary>
    public static void Record(DistributionNetwork network, PhaseFlow phases, RunRows runs, LoadFlowResult flow, PhaseVoltages voltages)
    {
        var rules = network.Project.Rules;
        if (!flow.Converged)
        {
            if (rules.Method == SolutionMethod.LoadFlow)
            {
                var weakest = network.NodeArray.First(n => n.Id == flow.WeakestId);
                throw ProjectException.At(weakest.Circuit?.Location ?? weakest.Equipment?.Location ?? network.Project.Service.Location, string.Create(
                    CultureInfo.InvariantCulture,
                    $"the load flow did not converge in {flow.Iterations} sweeps: the voltage collapses at {weakest.Id} (the loads are too heavy for the conductors and transformers that feed it); fix the worst runs, or use 'method: percent_sum' to see them"));
            }

            return;
        }

        var (nodes, rows, incomingRow, transformerRow) = (network.NodeArray, runs.Rows, runs.IncomingRow, runs.TransformerRow);
        var counts = rules.Method == SolutionMethod.LoadFlow;
        void Record(ref RunRow r, double drop)
        {
            r.LoadFlowDropPercent = drop;
            if (counts)
            {
                r.DropPercent = drop;
            }
        }

        ParallelRanges.For(nodes.Length, (start, end) =>
        {
            for (var i = Math.Max(start, 1); i < end; i++)
            {
                var node = nodes[i];
                if (node.Incoming is { } run)
                {
                    var from = voltages.Bus(run.Source.Index);
                    var to = voltages.Input(i);
                    var own = RunDrops.OwnSlots(run, phases);
                    var worst = double.NegativeInfinity;
                    for (var slot = 0; slot < Slots.Count; slot++)
                    {
                        if ((own & (1 << slot)) != 0)
                        {
                            var f = phases.SlotOn(run.Source, slot);
                            worst = Math.Max(worst, (f.Of(from).Magnitude - f.Of(to).Magnitude) * 100.0);
                        }
                    }

                    Record(ref rows[incomingRow[i]], worst);
                }

                if (phases.Frame.Models[i] is { } model)
                {
                    var secondary = PhaseFrame.BusSystem(node);
                    var slots = Slots.Of(PhaseRules.Lines(secondary), secondary.HasNeutral);
                    var worst = double.NegativeInfinity;
                    for (var slot = 0; slot < Slots.Count; slot++)
                    {
                        if ((slots & (1 << slot)) != 0)
                        {
                            var f = phases.SlotOn(node, slot);
                            worst = Math.Max(worst, (model.MapUp(f).Of(voltages.Input(i)).Magnitude - f.Of(voltages.Bus(i)).Magnitude) * 100.0);
                        }
                    }

                    Record(ref rows[transformerRow[i]], worst);
                }
            }
        });
    }
}
