using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The currents pass, bottom-up a level at a time (see <see cref="TreeLevels"/>): each end point's load becomes line
/// currents at the no-load voltages of the phase frame (nominal, less a tap's part below a tapped transformer) (see <see cref="PhaseLoads"/>, <see cref="PhaseFrame"/>); a
/// node's currents are the phasor sums of its children's times its demand factor; a transformer draws on its primary
/// what its connection makes of its secondary's (see <see cref="TransformerModel.PrimaryCurrents"/>). The neutral of
/// a run carries the return of its lines, −(I_A + I_B + I_C). Conductor temperatures, ampacity and the percent sum
/// all read these currents.
/// </summary>
internal sealed class PhaseCurrents
{
    private readonly DistributionNetwork _network;
    private readonly PhaseFrame _frame;
    private readonly ComplexPower[] _power;
    private readonly Phases[] _assigned;
    private readonly Complex[] _currents;

    // Per node × 3, the continuous loads' part of _currents (null where no load is continuous).
    private readonly Complex[]? _continuous;

    // Per transformer node, the secondary's line currents (A) on its bus.
    private readonly Dictionary<int, Complex[]> _secondary = [];

    private PhaseCurrents(DistributionNetwork network, PhaseFrame frame, ComplexPower[] power, Phases[] assigned, bool anyContinuous)
    {
        _continuous = anyContinuous ? Scratch.Uninitialized<Complex>(network.NodeArray.Length * 3) : null;
        _network = network;
        _frame = frame;
        _power = power;
        _assigned = assigned;
        _currents = Scratch.Uninitialized<Complex>(network.NodeArray.Length * 3);
    }

    /// <summary>
    /// The line currents of <paramref name="network"/> in <paramref name="frame"/>, whose loads are
    /// <paramref name="power"/> on the lines <paramref name="assigned"/> (see <see cref="PhaseAssignment"/>); with
    /// <paramref name="anyContinuous"/>, the continuous loads' part of them as well, summed the same way.
    /// </summary>
    public static PhaseFlow Solve(DistributionNetwork network, PhaseFrame frame, ComplexPower[] power, Phases[] assigned, bool anyContinuous = false)
    {
        var pass = new PhaseCurrents(network, frame, power, assigned, anyContinuous);
        pass.Accumulate();
        return new PhaseFlow(frame, assigned, pass._currents, pass._secondary) { ContinuousCurrents = pass._continuous };
    }

    /// <summary>
    /// Adds into <paramref name="into"/> (three lines) the currents of a load of <paramref name="s"/> (at nominal
    /// voltage, of <paramref name="model"/>) on the lines <paramref name="phases"/> of a bus of
    /// <paramref name="system"/> turned by <paramref name="rotation"/>, at its no-load voltage
    /// <paramref name="noLoad"/> per unit of nominal.
    /// </summary>
    public static void LoadCurrents(ComplexPower s, LoadModel model, Phases phases, ElectricalSystem system, Complex rotation, double noLoad, Span<Complex> into)
    {
        Span<Complex> voltage = stackalloc Complex[4];
        PhaseFrame.Nominal(system, rotation * noLoad, voltage);
        var (single, pair) = PhaseFrame.LoadBases(system);
        var on = (int)phases & ((1 << PhaseRules.Lines(system)) - 1);
        PhaseLoads.Add(new Complex(s.Watts, s.Vars), model, on, voltage, single, pair, into);
    }

    // Each node works out its own currents; a node that is not an end point pulls its children's (a level below,
    // so already worked out). The service, above the levels the pass takes, draws the sum of its children's.
    private void Accumulate()
    {
        ParallelRanges.BottomUp(_network.Levels.Steps, Accumulate);
        _currents.AsSpan(0, 3).Clear();
        AddChildren(_currents, 0, _currents.AsSpan(0, 3));
        if (_continuous is { } continuous)
        {
            continuous.AsSpan(0, 3).Clear();
            AddChildren(continuous, 0, continuous.AsSpan(0, 3));
        }
    }

    // Accumulate for the nodes end − 1 down to start.
    private void Accumulate(int start, int end)
    {
        var nodes = _network.NodeArray;
        var rotation = _frame.Rotation;
        Span<Complex> bus = stackalloc Complex[3];
        for (var i = end - 1; i >= start; i--)
        {
            var node = nodes[i];
            var mine = _currents.AsSpan(i * 3, 3);
            mine.Clear();
            if (node.Circuit is not null)
            {
                var parent = node.ParentIndex;
                var circuit = node.Circuit;
                if (circuit.Points.Count == 0)
                {
                    LoadCurrents(_power[i], circuit.Load.Model, _assigned[i], PhaseFrame.BusSystem(nodes[parent]), rotation[parent], _frame.NoLoad[parent], mine);
                }
                else
                {
                    foreach (var point in circuit.Points)
                    {
                        LoadCurrents(LoadPower.Of(point.Load, circuit.Supply), point.Load.Model, _assigned[i], PhaseFrame.BusSystem(nodes[parent]), rotation[parent], _frame.NoLoad[parent], mine);
                    }
                }

                if (_continuous is { } continuousOut)
                {
                    // A continuous load's currents are all continuous; another's, none. A motor's 125 % comes from the
                    // motor rules instead, so its currents are never counted continuous.
                    var part = continuousOut.AsSpan(i * 3, 3);
                    if (circuit.Continuous && !circuit.Load.IsMotor)
                    {
                        mine.CopyTo(part);
                    }
                    else
                    {
                        part.Clear();
                    }
                }

                continue;
            }

            AddChildren(_currents, i, mine);
            var factor = node.Equipment?.DemandFactor ?? 1.0;
            for (var x = 0; x < 3; x++)
            {
                mine[x] *= factor;
            }

            var continuous = _continuous is null ? default : _continuous.AsSpan(i * 3, 3);
            if (!continuous.IsEmpty)
            {
                continuous.Clear();
                AddChildren(_continuous!, i, continuous);
                for (var x = 0; x < 3; x++)
                {
                    continuous[x] *= factor;
                }
            }

            if (_frame.Models[i] is { } model)
            {
                // Few nodes are transformers; the lock keeps the dictionary whole when two write at once.
                lock (_secondary)
                {
                    _secondary[i] = mine.ToArray();
                }

                mine.CopyTo(bus);
                model.PrimaryCurrents(bus, mine);
                if (!continuous.IsEmpty)
                {
                    // The connection maps currents linearly: the continuous part maps as the whole does.
                    continuous.CopyTo(bus);
                    model.PrimaryCurrents(bus, continuous);
                }
            }
        }
    }

    // Adds the currents of node's children to into, from the last child to the first: the order in which they
    // were first added up, so that the sums are the same to the bit.
    private void AddChildren(Complex[] currents, int node, Span<Complex> into)
    {
        var childStarts = _network.Levels.ChildStarts;
        for (var child = childStarts[node + 1] - 1; child >= childStarts[node]; child--)
        {
            for (var x = 0; x < 3; x++)
            {
                into[x] += currents[(child * 3) + x];
            }
        }
    }
}
