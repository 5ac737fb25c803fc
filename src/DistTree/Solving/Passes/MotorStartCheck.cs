using System.Buffers;
using System.Numerics;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// A motor's dip while it starts (common practice): the running drop of everything (every row's share to the
/// service, see <see cref="PathShares"/>; a new origin does not stop a physical dip) plus the start, superposed: the
/// extra current ΔI of ΔS = S_locked-rotor − S_running on the motor's own lines (and its neutral, for a 1-pole motor),
/// carried up the path through each transformer's connection, and on each row the linearised drop it makes in the
/// motor's own voltage, Re f(ΔV) (see <see cref="Functional.OfRun"/>, <see cref="TransformerModel.WindingDrop"/>).
/// At the terminals, and at its panel (the same less the motor's own run). A 3-pole motor's worst line pair counts.
/// </summary>
internal sealed class MotorStartCheck(DistributionNetwork network, PhaseFlow phases, RunRows runs, PathShares shares, bool onLoadFlow)
{
    private readonly double _limitPercent = network.Project.Rules.MotorStartLimitPercent;

    /// <summary>The check of the motor at node <paramref name="motor"/> whose voltages are <paramref name="slots"/>, running at <paramref name="running"/> and starting at <paramref name="lockedRotor"/>.</summary>
    public MotorStartResult Of(int motor, int slots, ComplexPower running, ComplexPower lockedRotor)
    {
        var nodes = network.NodeArray;
        var panel = nodes[network.ParentIndices[motor]];
        var count = shares.AllRows(motor);
        // On the stack for a path of up to 32 runs (the pool of doubles is compiled at start: DEVELOPERS.md, Start-up).
        var buffer = count <= 32 ? stackalloc double[3 * 32] : new double[count * 3];
        var rows = ArrayPool<int>.Shared.Rent(count);
        var ps = buffer.Slice(0, count);
        var lf = buffer.Slice(count, count);
        var extra = buffer.Slice(count * 2, count);
        var (terminal, dips) = (double.NegativeInfinity, Array.Empty<BusDip>());
        for (var slot = 0; slot < Slots.Count; slot++)
        {
            if ((slots & (1 << slot)) != 0)
            {
                var f = phases.SlotOn(panel, slot);
                var (percentSum, loadFlow, _, _) = shares.Walk(motor, f, count, ps, lf, rows, true);
                Extra(motor, f, lockedRotor + (running * -1.0), extra);
                var steady = onLoadFlow ? lf : ps;
                var total = (onLoadFlow ? loadFlow : percentSum) + Sum(extra);
                if (total > terminal)
                {
                    (terminal, dips) = (total, Dips(motor, total, steady, extra));
                }
            }
        }

        ArrayPool<int>.Shared.Return(rows);
        return new MotorStartResult(lockedRotor.VoltAmperes, terminal, dips.Length > 0 ? dips[0].DipPercent : terminal, _limitPercent) { PathDips = dips };
    }

    // The dip at each bus of the path, from the motor's panel up: the terminal figure less the rows below the bus
    // (running and start), in the order the walk took them (a node's transformer, then its incoming run).
    private BusDip[] Dips(int motor, double total, ReadOnlySpan<double> steady, ReadOnlySpan<double> extra)
    {
        var (nodes, parents, incomingRow, transformerRow) = (network.NodeArray, network.ParentIndices, runs.IncomingRow, runs.TransformerRow);
        var dips = new List<BusDip>();
        var (k, below) = (0, 0.0);
        for (var i = motor; i > 0; i = parents[i])
        {
            if (i != motor)
            {
                dips.Add(new BusDip(nodes[i].Id, total - below));
            }

            for (var row = 0; row < (transformerRow[i] >= 0 ? 1 : 0) + (incomingRow[i] >= 0 ? 1 : 0); row++, k++)
            {
                below += steady[k] + extra[k];
            }
        }

        return [.. dips];
    }

    private static double Sum(ReadOnlySpan<double> values)
    {
        var sum = 0.0;
        foreach (var v in values)
        {
            sum += v;
        }

        return sum;
    }

    // Into extra, the start's extra drop in f on each row of the whole path, percent, in the walk's order (a node's
    // transformer, then its incoming run); the utility's impedance, where given, on the last.
    private void Extra(int motor, Functional f, ComplexPower delta, Span<double> extra)
    {
        var (nodes, parents) = (network.NodeArray, network.ParentIndices);
        Span<Complex> current = stackalloc Complex[3];
        Span<Complex> secondary = stackalloc Complex[3];
        Span<Complex> m = stackalloc Complex[3];
        var panel = parents[motor];
        PhaseCurrents.LoadCurrents(delta, Model.LoadModel.ConstantPower, phases.Assigned[motor], PhaseFrame.BusSystem(nodes[panel]), phases.Frame.Rotation[panel], phases.Frame.NoLoad[panel], current);
        var k = 0;
        for (var i = motor; i > 0; i = parents[i])
        {
            if (phases.Frame.Models[i] is { } model)
            {
                extra[k++] = model.WindingDrop(f, current).Real * 100.0;
                f = model.MapUp(f);
                current.CopyTo(secondary);
                model.PrimaryCurrents(secondary, current);
            }

            if (nodes[i].Incoming is { } run)
            {
                ref var row = ref runs.Rows[runs.IncomingRow[i]];
                var km = run.Conductors.LengthM / 1000.0 / run.Conductors.Sets;
                for (var x = 0; x < 3; x++)
                {
                    m[x] = current[x] * km;
                }

                extra[k++] = f.DropPercent(m, row.ResistanceOhmPerKm, row.ReactanceOhmPerKm, row.NeutralResistanceOhmPerKm, row.NeutralReactanceOhmPerKm);
            }
        }

        // The utility's impedance ahead of the service, where the project gives it, counted with the last row.
        var source = ((f.A * current[0]) + (f.B * current[1]) + (f.C * current[2])) * phases.Frame.SourceImpedance * 100.0;
        extra[k - 1] += source.Real;
    }
}
