using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The currents pass, bottom-up a level at a time (see <see cref="TreeLevels"/>): each end point's load becomes
/// phasor currents on its lines, I = conj(S/V) (a 1-pole load returns through the neutral, a 2-pole load flows
/// line to line, a 3-pole load is balanced); a node's currents are the phasor sums of its children's times its
/// demand factor. Through a transformer, the secondary's phase currents pass phase for phase at the turns ratio
/// without their zero-sequence part (a delta winding traps it); a single-phase secondary draws line to line (A-B)
/// on a three-phase primary. The 30° shift of a delta-wye transformer is left out: it turns every phase alike and
/// changes no magnitude (common practice).
/// </summary>
internal sealed class PhaseCurrents
{
    private readonly DistributionNetwork _network;
    private readonly ComplexPower[] _power;
    private readonly Phases[] _assigned;
    private readonly Complex[] _currents;

    // Per transformer node, the secondary's line currents (A) on its bus.
    private readonly Dictionary<int, Complex[]> _secondary = [];

    private PhaseCurrents(DistributionNetwork network, ComplexPower[] power, Phases[] assigned)
    {
        _network = network;
        _power = power;
        _assigned = assigned;
        _currents = GC.AllocateUninitializedArray<Complex>(network.NodeArray.Length * 3);
    }

    /// <summary>
    /// The line currents of <paramref name="network"/>, whose loads are <paramref name="power"/> on the lines
    /// <paramref name="assigned"/> (see <see cref="PhaseAssignment"/>).
    /// </summary>
    public static PhaseFlow Solve(DistributionNetwork network, ComplexPower[] power, Phases[] assigned)
    {
        var pass = new PhaseCurrents(network, power, assigned);
        pass.Accumulate();
        return new PhaseFlow(assigned, pass._currents, pass._secondary);
    }

    /// <summary>Adds to <paramref name="into"/> the line currents (A) of a load <paramref name="s"/> on the lines <paramref name="phases"/> of <paramref name="system"/>, at the circuit's nominal voltage.</summary>
    public static void LoadCurrents(ComplexPower s, Phases phases, SystemVoltages system, Span<Complex> into)
    {
        var lines = system.Lines;
        var power = new Complex(s.Watts, s.Vars);
        var on = (int)phases & ((1 << lines) - 1);
        var count = BitOperations.PopCount((uint)on);
        var v = count switch
        {
            1 => system.SingleV,
            2 => system.PairV,
            _ => system.PerLineV,
        };
        if (count == 1)
        {
            var x = BitOperations.TrailingZeroCount(on);
            into[x] += Complex.Conjugate(power / (v * LineVoltages.Unit(x, lines)));
        }
        else if (count == 2)
        {
            var (x, y) = (BitOperations.TrailingZeroCount(on), 31 - BitOperations.LeadingZeroCount((uint)on));
            var u = LineVoltages.Unit(x, lines) - LineVoltages.Unit(y, lines);
            var i = Complex.Conjugate(power / (v * u / LineVoltages.PairMagnitude[(lines * 8) + on]));
            into[x] += i;
            into[y] -= i;
        }
        else
        {
            for (var x = 0; x < lines; x++)
            {
                if ((on & (1 << x)) != 0)
                {
                    into[x] += Complex.Conjugate(power / count / (v * LineVoltages.Unit(x, lines)));
                }
            }
        }
    }

    // Each node works out its own currents; a node that is not an end point pulls its children's (a level below,
    // so already worked out). The service, above the levels the pass takes, draws the sum of its children's.
    private void Accumulate()
    {
        ParallelRanges.BottomUp(_network.Levels.Steps, Accumulate);
        _currents.AsSpan(0, 3).Clear();
        AddChildren(0, _currents.AsSpan(0, 3));
    }

    // Accumulate for the nodes end − 1 down to start.
    private void Accumulate(int start, int end)
    {
        var nodes = _network.NodeArray;
        Span<Complex> bus = stackalloc Complex[3];
        for (var i = end - 1; i >= start; i--)
        {
            var node = nodes[i];
            var mine = _currents.AsSpan(i * 3, 3);
            mine.Clear();
            if (node.Circuit is not null)
            {
                LoadCurrents(_power[i], _assigned[i], LineVoltages.Of(nodes[node.ParentIndex].System), mine);
                continue;
            }

            AddChildren(i, mine);
            var factor = node.Equipment?.DemandFactor ?? 1.0;
            for (var x = 0; x < 3; x++)
            {
                mine[x] *= factor;
            }

            if (node.Equipment?.Transformer is { } t)
            {
                // Few nodes are transformers; the lock keeps the dictionary whole when two write at once.
                lock (_secondary)
                {
                    _secondary[i] = mine.ToArray();
                }

                mine.CopyTo(bus);
                ToPrimary(bus, t.Secondary, node.Equipment.System, mine);
            }
        }
    }

    // Adds the currents of node's children to into, from the last child to the first: the order in which they
    // were first added up, so that the sums are the same to the bit.
    private void AddChildren(int node, Span<Complex> into)
    {
        var (childStarts, currents) = (_network.Levels.ChildStarts, _currents);
        for (var child = childStarts[node + 1] - 1; child >= childStarts[node]; child--)
        {
            for (var x = 0; x < 3; x++)
            {
                into[x] += currents[(child * 3) + x];
            }
        }
    }

    // A transformer's primary currents from its secondary's.
    private static void ToPrimary(ReadOnlySpan<Complex> secondary, ElectricalSystem from, ElectricalSystem to, Span<Complex> primary)
    {
        var sLines = PhaseRules.Lines(from);
        var pLines = PhaseRules.Lines(to);
        primary.Clear();
        if (sLines == 3 && pLines == 3)
        {
            var ratio = LineVoltages.LineToNeutralV(from) / LineVoltages.LineToNeutralV(to);
            var zero = (secondary[0] + secondary[1] + secondary[2]) / 3;
            for (var x = 0; x < 3; x++)
            {
                primary[x] = (secondary[x] - zero) * ratio;
            }

            return;
        }

        // Any other pairing: the secondary's total power, drawn line to line on the primary (or on its one line).
        var s = Complex.Zero;
        var vs = LineVoltages.LineToNeutralV(from);
        for (var x = 0; x < sLines; x++)
        {
            s += vs * LineVoltages.Unit(x, sLines) * Complex.Conjugate(secondary[x]);
        }

        LoadCurrents(new ComplexPower(s.Real, s.Imaginary), pLines == 1 ? Phases.A : Phases.AB, LineVoltages.Voltages(to), primary);
    }
}
