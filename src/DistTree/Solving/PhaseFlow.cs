using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// Per-phase currents and drops (common practice for unbalanced radial feeders): each end point's load becomes
/// phasor currents on its lines (a 1-pole load returns through the neutral, a 2-pole load flows line to line,
/// a 3-pole load is balanced); a node's currents are the phasor sums of its children's times its demand factor;
/// the neutral carries Ia + Ib + Ic (a neutral the size of the phase conductors). A line's drop is
/// ΔV = (I_line + I_neutral)·Z, and its percent is the part of ΔV in phase with the line's voltage (the
/// effective-impedance approximation, line by line). Through a transformer, the secondary's phase currents pass
/// phase for phase at the turns ratio without their zero-sequence part (a delta winding traps it); a
/// single-phase secondary draws line to line (A-B) on a three-phase primary. The 30° shift of a delta-wye
/// transformer is left out: it turns every phase alike and changes no magnitude.
/// </summary>
internal sealed class PhaseFlow
{
    private static readonly Complex[] ThreeLines = [Complex.FromPolarCoordinates(1, 0), Complex.FromPolarCoordinates(1, -2 * Math.PI / 3), Complex.FromPolarCoordinates(1, 2 * Math.PI / 3)];
    private static readonly Complex[] TwoLines = [Complex.One, -Complex.One];

    private readonly DistributionNetwork _network;

    public PhaseFlow(DistributionNetwork network, ComplexPower[] power)
    {
        _network = network;
        var n = network.Nodes.Count;
        Assigned = new Phases[n];
        Currents = new Complex[n * 3];
        Assign(power);
        Accumulate(power);
    }

    /// <summary>Per node, the lines its circuit is on (end points only).</summary>
    public Phases[] Assigned { get; }

    /// <summary>Per node × 3, the line currents (A) it draws from its parent, at its incoming run's voltage.</summary>
    public Complex[] Currents { get; }

    /// <summary>Per transformer node × 3, the secondary's line currents (A) on its bus.</summary>
    public Complex[] SecondaryCurrents { get; private set; } = [];

    /// <summary>ΔV (volts, line to neutral) on each line of the run into <paramref name="node"/>: (I_line + I_neutral)·Z.</summary>
    public void RunDeltaV(int node, Complex impedanceOhm, bool hasNeutral, double scale, Span<Complex> into)
    {
        var i = Currents.AsSpan(node * 3, 3);
        var neutral = hasNeutral ? i[0] + i[1] + i[2] : Complex.Zero;
        for (var x = 0; x < 3; x++)
        {
            into[x] = (i[x] + neutral) * impedanceOhm * scale;
        }
    }

    /// <summary>The phase loads of a panel (a node with circuits): VA per line, the neutral, and the imbalance.</summary>
    public PanelResult Panel(NetworkNode node)
    {
        var lines = PhaseRules.Lines(node.System);
        var v = LineToNeutralV(node.System);
        var i = Currents.AsSpan(node.Index * 3, 3);
        var va = new double[lines];
        for (var x = 0; x < lines; x++)
        {
            va[x] = v * i[x].Magnitude;
        }

        var average = va.Average();
        var imbalance = lines < 2 || average <= 0 ? 0.0 : va.Max(s => Math.Abs(s - average)) / average * 100.0;
        return new PanelResult(node.Id, node.System.Name, va, node.System.HasNeutral ? (i[0] + i[1] + i[2]).Magnitude : null, imbalance);
    }

    /// <summary>The largest line current magnitude of the run into <paramref name="node"/>, amperes.</summary>
    public double MaxLineCurrentA(int node)
    {
        var i = Currents.AsSpan(node * 3, 3);
        return Math.Max(i[0].Magnitude, Math.Max(i[1].Magnitude, i[2].Magnitude));
    }

    /// <summary>The line current magnitudes of the run into <paramref name="node"/> on a system of <paramref name="lines"/> lines, amperes.</summary>
    public double[] LineCurrentsA(int node, int lines)
    {
        var result = new double[lines];
        for (var x = 0; x < lines; x++)
        {
            result[x] = Currents[(node * 3) + x].Magnitude;
        }

        return result;
    }

    /// <summary>The neutral current of the run into <paramref name="node"/>, amperes.</summary>
    public double NeutralCurrentA(int node)
    {
        var i = Currents.AsSpan(node * 3, 3);
        return (i[0] + i[1] + i[2]).Magnitude;
    }

    /// <summary>
    /// The drop in percent that a circuit on <paramref name="phases"/> sees from per-line ΔV on a run of
    /// <paramref name="system"/>: one line, its line-to-neutral drop; two, their line-to-line drop; three, the worst line.
    /// </summary>
    public static double DropPercent(ReadOnlySpan<Complex> deltaV, Phases phases, ElectricalSystem system)
    {
        var lines = PhaseRules.Lines(system);
        var on = LinesOf(phases, lines);
        var v = SetV(on.Count, system);
        if (on.Count == 2)
        {
            var u = Unit(on[0], lines) - Unit(on[1], lines);
            return ((deltaV[on[0]] - deltaV[on[1]]) * Complex.Conjugate(u)).Real / u.Magnitude / v * 100.0;
        }

        var worst = double.NegativeInfinity;
        foreach (var x in on.Count == 0 ? LinesOf(Phases.ABC, 1) : on)
        {
            worst = Math.Max(worst, (deltaV[x] * Complex.Conjugate(Unit(x, lines))).Real / v * 100.0);
        }

        return worst;
    }

    /// <summary>The worst line-to-neutral drop in percent (a feeder's own figure).</summary>
    public static double WorstLinePercent(ReadOnlySpan<Complex> deltaV, ElectricalSystem system)
    {
        var lines = PhaseRules.Lines(system);
        var vln = LineToNeutralV(system);
        var worst = double.NegativeInfinity;
        for (var x = 0; x < lines; x++)
        {
            worst = Math.Max(worst, (deltaV[x] * Complex.Conjugate(Unit(x, lines))).Real / vln * 100.0);
        }

        return worst;
    }

    /// <summary>A transformer's regulation per secondary line, percent: (%R·P_x + %X·Q_x)/(S_rated/lines) − tap.</summary>
    public void TransformerRegulation(int node, TransformerData data, double percentR, double percentX, Span<double> into)
    {
        var lines = PhaseRules.Lines(data.Secondary);
        var vln = LineToNeutralV(data.Secondary);
        var perLine = data.Kva * 1000.0 / lines;
        for (var x = 0; x < 3; x++)
        {
            var s = x < lines ? vln * Unit(x, lines) * Complex.Conjugate(SecondaryCurrents[(node * 3) + x]) : Complex.Zero;
            into[x] = x < lines ? (((percentR * s.Real) + (percentX * s.Imaginary)) / perLine) - data.TapPercent : double.NegativeInfinity;
        }
    }

    /// <summary>The unit phasor of line <paramref name="line"/>'s voltage to neutral on a system of <paramref name="lines"/> lines.</summary>
    public static Complex Unit(int line, int lines) => lines == 3 ? ThreeLines[line] : (lines == 2 ? TwoLines[line] : Complex.One);

    /// <summary>The voltage of one line to the (virtual) neutral in a balanced set: V_LL/√3 for 3 lines, V_LL/2 for 2, else the nominal.</summary>
    public static double LineToNeutralV(ElectricalSystem system) => PhaseRules.Lines(system) switch
    {
        3 => system.LineToLineV!.Value / Math.Sqrt(3),
        2 => system.LineToLineV!.Value / 2,
        _ => system.NominalV,
    };

    // The nominal voltage a circuit on a set of lines is rated at: one line, the system's line-to-neutral
    // voltage (277 on 480Y/277); two lines, its line-to-line voltage; three, line-to-line over √3 per line.
    private static double SetV(int count, ElectricalSystem system) => count switch
    {
        1 => system.LineToNeutralV ?? LineToNeutralV(system),
        2 => system.LineToLineV ?? system.NominalV,
        _ => LineToNeutralV(system),
    };

    /// <summary>The line currents of a circuit's load on its lines, at the circuit's nominal voltage.</summary>
    public static void LoadCurrents(ComplexPower s, Phases phases, ElectricalSystem system, Span<Complex> into)
    {
        var lines = PhaseRules.Lines(system);
        var power = new Complex(s.Watts, s.Vars);
        var on = LinesOf(phases, lines);
        var v = SetV(on.Count, system);
        if (on.Count == 1)
        {
            into[on[0]] += Complex.Conjugate(power / (v * Unit(on[0], lines)));
        }
        else if (on.Count == 2)
        {
            var (x, y) = (on[0], on[1]);
            var u = Unit(x, lines) - Unit(y, lines);
            var i = Complex.Conjugate(power / (v * u / u.Magnitude));
            into[x] += i;
            into[y] -= i;
        }
        else
        {
            foreach (var x in on)
            {
                into[x] += Complex.Conjugate(power / on.Count / (v * Unit(x, lines)));
            }
        }
    }

    /// <summary>The indices (0 = A) of the lines in a set, limited to the system's lines.</summary>
    public static List<int> LinesOf(Phases phases, int lines)
    {
        var list = new List<int>(3);
        for (var x = 0; x < lines; x++)
        {
            if (((int)phases & (1 << x)) != 0)
            {
                list.Add(x);
            }
        }

        return list;
    }

    // Circuits without stated or numbered phases, largest first, each onto the least-loaded line (1 pole) or
    // pair of lines (2 poles); 3 poles take all lines. Ties go to the earlier line (A before B before C).
    private void Assign(ComplexPower[] power)
    {
        var nodes = _network.Nodes;
        foreach (var panel in nodes)
        {
            if (panel.Circuit is not null || panel.Children.Count == 0)
            {
                continue;
            }

            var lines = PhaseRules.Lines(panel.System);
            var load = new double[3];
            var automatic = new List<int>();
            foreach (var child in panel.Children)
            {
                if (nodes[child].Circuit is not { } circuit)
                {
                    continue;
                }

                if (circuit.Phases is { } phases)
                {
                    Assigned[child] = phases;
                    var on = LinesOf(phases, lines);
                    foreach (var x in on)
                    {
                        load[x] += power[child].VoltAmperes / on.Count;
                    }
                }
                else
                {
                    automatic.Add(child);
                }
            }

            foreach (var child in automatic.OrderByDescending(c => power[c].VoltAmperes).ThenBy(c => nodes[c].Id, StringComparer.Ordinal))
            {
                var poles = Math.Min(nodes[child].Circuit!.Poles, lines);
                var best = Phases.None;
                var bestLoad = double.PositiveInfinity;
                foreach (var candidate in Candidates(poles, lines))
                {
                    var on = LinesOf(candidate, lines);
                    var sum = on.Sum(x => load[x]);
                    if (sum < bestLoad - 1e-9)
                    {
                        best = candidate;
                        bestLoad = sum;
                    }
                }

                Assigned[child] = best;
                var chosen = LinesOf(best, lines);
                foreach (var x in chosen)
                {
                    load[x] += power[child].VoltAmperes / chosen.Count;
                }
            }
        }
    }

    private static Phases[] Candidates(int poles, int lines) => (poles, lines) switch
    {
        (1, 3) => [Phases.A, Phases.B, Phases.C],
        (1, 2) => [Phases.A, Phases.B],
        (2, 3) => [Phases.AB, Phases.BC, Phases.CA],
        (_, 3) => [Phases.ABC],
        (_, 2) => [Phases.AB],
        _ => [Phases.A],
    };

    private void Accumulate(ComplexPower[] power)
    {
        var nodes = _network.Nodes;
        Span<Complex> bus = stackalloc Complex[3];
        for (var i = nodes.Count - 1; i > 0; i--)
        {
            var node = nodes[i];
            var mine = Currents.AsSpan(i * 3, 3);
            if (node.Circuit is not null)
            {
                LoadCurrents(power[i], Assigned[i], nodes[node.ParentIndex].System, mine);
            }
            else
            {
                var factor = node.Equipment?.DemandFactor ?? 1.0;
                for (var x = 0; x < 3; x++)
                {
                    mine[x] *= factor;
                }

                if (node.Equipment?.Transformer is { } t)
                {
                    if (SecondaryCurrents.Length == 0)
                    {
                        SecondaryCurrents = new Complex[Currents.Length];
                    }

                    mine.CopyTo(SecondaryCurrents.AsSpan(i * 3, 3));
                    mine.CopyTo(bus);
                    ToPrimary(bus, t.Secondary, node.Equipment.System, mine);
                }
            }

            var parent = Currents.AsSpan(node.ParentIndex * 3, 3);
            for (var x = 0; x < 3; x++)
            {
                parent[x] += mine[x];
            }
        }
    }

    private static void ToPrimary(ReadOnlySpan<Complex> secondary, ElectricalSystem from, ElectricalSystem to, Span<Complex> primary)
    {
        var sLines = PhaseRules.Lines(from);
        var pLines = PhaseRules.Lines(to);
        primary.Clear();
        if (sLines == 3 && pLines == 3)
        {
            var ratio = LineToNeutralV(from) / LineToNeutralV(to);
            var zero = (secondary[0] + secondary[1] + secondary[2]) / 3;
            for (var x = 0; x < 3; x++)
            {
                primary[x] = (secondary[x] - zero) * ratio;
            }

            return;
        }

        // Any other pairing: the secondary's total power, drawn line to line on the primary (or on its one line).
        var s = Complex.Zero;
        var vs = LineToNeutralV(from);
        for (var x = 0; x < sLines; x++)
        {
            s += vs * Unit(x, sLines) * Complex.Conjugate(secondary[x]);
        }

        LoadCurrents(new ComplexPower(s.Real, s.Imaginary), pLines == 1 ? Phases.A : Phases.AB, to, primary);
    }
}
