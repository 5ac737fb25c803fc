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

    // The sets of lines a balanced circuit may take, by poles and the panel's lines (see Candidates).
    private static readonly Phases[] OneOfThree = [Phases.A, Phases.B, Phases.C];
    private static readonly Phases[] OneOfTwo = [Phases.A, Phases.B];
    private static readonly Phases[] PairOfThree = [Phases.AB, Phases.BC, Phases.CA];
    private static readonly Phases[] AllThree = [Phases.ABC];
    private static readonly Phases[] BothOfTwo = [Phases.AB];
    private static readonly Phases[] TheOne = [Phases.A];

    // Per (lines × 8 + set of two lines): conj(u) and |u| of u = Unit(a) − Unit(b), a and b the set's lines.
    private static readonly Complex[] PairConjugate = new Complex[32];
    private static readonly double[] PairMagnitude = new double[32];

    // Per (lines × 3 + line): conj(Unit(line, lines)).
    private static readonly Complex[] UnitConjugate = new Complex[12];

    private readonly DistributionNetwork _network;

    // The voltages of the system this thread last asked for (see VoltagesOf): runs of one panel share its system,
    // and the solver asks from several threads at once. A system's voltages follow from the system alone.
    [ThreadStatic]
    private static KnownVoltages? t_last;

    static PhaseFlow()
    {
        for (var lines = 1; lines <= 3; lines++)
        {
            for (var line = 0; line < lines; line++)
            {
                UnitConjugate[(lines * 3) + line] = Complex.Conjugate(Unit(line, lines));
            }
        }

        for (var lines = 2; lines <= 3; lines++)
        {
            for (var on = 0; on < 8; on++)
            {
                if (BitOperations.PopCount((uint)on) == 2 && on < (1 << lines))
                {
                    var (a, b) = (BitOperations.TrailingZeroCount(on), 31 - BitOperations.LeadingZeroCount((uint)on));
                    var u = Unit(a, lines) - Unit(b, lines);
                    PairConjugate[(lines * 8) + on] = Complex.Conjugate(u);
                    PairMagnitude[(lines * 8) + on] = u.Magnitude;
                }
            }
        }
    }

    /// <summary>
    /// Works out the lines and currents of <paramref name="network"/> into <paramref name="currents"/> (3 per node, of
    /// any content: each node's are cleared where they are worked out) and <paramref name="assigned"/> (1 per node, zero).
    /// </summary>
    public PhaseFlow(DistributionNetwork network, ComplexPower[] power, Complex[] currents, Phases[] assigned)
    {
        _network = network;
        Assigned = assigned;
        Currents = currents;
        Assign(power);
        Accumulate(power);
    }

    /// <summary>Per node, the lines its circuit is on (end points only).</summary>
    public Phases[] Assigned { get; }

    /// <summary>Per node × 3, the line currents (A) it draws from its parent, at its incoming run's voltage.</summary>
    public Complex[] Currents { get; }

    // Per transformer node, the secondary's line currents (A) on its bus.
    private readonly Dictionary<int, Complex[]> _secondaryCurrents = [];

    /// <summary>
    /// The unit drops of the run into <paramref name="node"/> on <paramref name="system"/>: into
    /// <paramref name="unitR"/>[set] and <paramref name="unitX"/>[set], for each set of lines 1 … 7, the figures of
    /// <see cref="UnitDropsOn"/>; [0] is left as it is.
    /// </summary>
    public void UnitDrops(int node, double km, ElectricalSystem system, double scale, Span<double> unitR, Span<double> unitX)
    {
        for (var set = 1; set < 8; set++)
        {
            (unitR[set], unitX[set]) = UnitDropsOn(node, km, system, scale, set);
        }
    }

    /// <summary>
    /// The drop in percent that a circuit on the set of lines <paramref name="set"/> ((int)<see cref="Phases"/>, 1 = A …
    /// 7 = ABC) sees on the run into <paramref name="node"/> on <paramref name="system"/>, per ohm/km of resistance
    /// (from ΔV = (I_line + I_neutral)·(km + j0)·scale on each line) and of reactance (from ΔV = (I_line +
    /// I_neutral)·(0 + j·km)·scale): on one line, the part of its ΔV in phase with its voltage to neutral; on two,
    /// their line-to-line drop; on three, the worst line; a set with none of the system's lines takes line A's.
    /// </summary>
    public (double UnitR, double UnitX) UnitDropsOn(int node, double km, ElectricalSystem system, double scale, int set)
    {
        var voltages = VoltagesOf(system);
        var lines = voltages.Lines;
        var on = set & ((1 << lines) - 1);
        var i = Currents.AsSpan(node * 3, 3);
        var neutral = voltages.HasNeutral ? i[0] + i[1] + i[2] : Complex.Zero;
        var (resistive, reactive) = (new Complex(km, 0), new Complex(0, km));
        switch (BitOperations.PopCount((uint)on))
        {
            case 0:
            case 1:
                {
                    // One line; a set with none of the system's lines takes line A's, to the neutral.
                    var (x, v) = on == 0 ? (0, voltages.PerLineV) : (BitOperations.TrailingZeroCount(on), voltages.SingleV);
                    var flowing = i[x] + neutral;
                    var unit = UnitConjugate[(lines * 3) + x];
                    return ((flowing * resistive * scale * unit).Real / v * 100.0, (flowing * reactive * scale * unit).Real / v * 100.0);
                }

            case 2:
                {
                    var (a, b) = (BitOperations.TrailingZeroCount(on), 31 - BitOperations.LeadingZeroCount((uint)on));
                    var (flowingA, flowingB) = (i[a] + neutral, i[b] + neutral);
                    var (pair, magnitude) = (PairConjugate[(lines * 8) + on], PairMagnitude[(lines * 8) + on]);
                    return (
                        (((flowingA * resistive * scale) - (flowingB * resistive * scale)) * pair).Real / magnitude / voltages.PairV * 100.0,
                        (((flowingA * reactive * scale) - (flowingB * reactive * scale)) * pair).Real / magnitude / voltages.PairV * 100.0);
                }

            default:
                {
                    var (worstR, worstX) = (double.NegativeInfinity, double.NegativeInfinity);
                    for (var x = 0; x < 3; x++)
                    {
                        var flowing = i[x] + neutral;
                        var unit = UnitConjugate[(lines * 3) + x];
                        worstR = Math.Max(worstR, (flowing * resistive * scale * unit).Real / voltages.PerLineV * 100.0);
                        worstX = Math.Max(worstX, (flowing * reactive * scale * unit).Real / voltages.PerLineV * 100.0);
                    }

                    return (worstR, worstX);
                }
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
        return Math.Max(Magnitude(i[0]), Math.Max(Magnitude(i[1]), Magnitude(i[2])));
    }

    /// <summary>The line current magnitudes of the run into <paramref name="node"/> on a system of <paramref name="lines"/> lines, amperes.</summary>
    public double[] LineCurrentsA(int node, int lines)
    {
        var result = new double[lines];
        for (var x = 0; x < lines; x++)
        {
            result[x] = Magnitude(Currents[(node * 3) + x]);
        }

        return result;
    }

    /// <summary>The neutral current of the run into <paramref name="node"/>, amperes.</summary>
    public double NeutralCurrentA(int node)
    {
        var i = Currents.AsSpan(node * 3, 3);
        return (i[0] + i[1] + i[2]).Magnitude;
    }

    /// <summary>A transformer's regulation per secondary line, percent: (%R·P_x + %X·Q_x)/(S_rated/lines) − tap.</summary>
    public void TransformerRegulation(int node, TransformerData data, double percentR, double percentX, Span<double> into)
    {
        var lines = PhaseRules.Lines(data.Secondary);
        var vln = LineToNeutralV(data.Secondary);
        var perLine = data.Kva * 1000.0 / lines;
        var secondary = _secondaryCurrents[node];
        for (var x = 0; x < 3; x++)
        {
            var s = x < lines ? vln * Unit(x, lines) * Complex.Conjugate(secondary[x]) : Complex.Zero;
            into[x] = x < lines ? (((percentR * s.Real) + (percentX * s.Imaginary)) / perLine) - data.TapPercent : double.NegativeInfinity;
        }
    }

    // |c|, without the call for no current (a line a circuit does not take): the magnitude of zero is zero.
    private static double Magnitude(Complex c) => c.Real == 0 && c.Imaginary == 0 ? 0.0 : c.Magnitude;

    // The voltages of SetV and LineToNeutralV on the system, kept for the system last asked for.
    private static SystemVoltages VoltagesOf(ElectricalSystem system)
    {
        var last = t_last;
        if (last is null || !ReferenceEquals(system, last.System))
        {
            last = new KnownVoltages(system, Voltages(system));
            t_last = last;
        }

        return last.Voltages;
    }

    private static SystemVoltages Voltages(ElectricalSystem system) =>
        new(PhaseRules.Lines(system), SetV(1, system), SetV(2, system), LineToNeutralV(system), system.HasNeutral);

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
    public static void LoadCurrents(ComplexPower s, Phases phases, ElectricalSystem system, Span<Complex> into) =>
        LoadCurrents(s, phases, Voltages(system), into);

    // LoadCurrents on a system of the given lines and voltages.
    private static void LoadCurrents(ComplexPower s, Phases phases, SystemVoltages system, Span<Complex> into)
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
            into[x] += Complex.Conjugate(power / (v * Unit(x, lines)));
        }
        else if (count == 2)
        {
            var (x, y) = (BitOperations.TrailingZeroCount(on), 31 - BitOperations.LeadingZeroCount((uint)on));
            var u = Unit(x, lines) - Unit(y, lines);
            var i = Complex.Conjugate(power / (v * u / PairMagnitude[(lines * 8) + on]));
            into[x] += i;
            into[y] -= i;
        }
        else
        {
            for (var x = 0; x < lines; x++)
            {
                if ((on & (1 << x)) != 0)
                {
                    into[x] += Complex.Conjugate(power / count / (v * Unit(x, lines)));
                }
            }
        }
    }

    // Circuits without stated or numbered phases, largest first, each onto the least-loaded line (1 pole) or
    // pair of lines (2 poles); 3 poles take all lines. Ties go to the earlier line (A before B before C). Each
    // panel sets the lines of its own circuits only: the panels are shared out over the cores.
    private void Assign(ComplexPower[] power) => ParallelRanges.For(_network.NodeArray.Length, (start, end) => Assign(power, start, end));

    // Assign for the panels start … end − 1.
    private void Assign(ComplexPower[] power, int start, int end)
    {
        var nodes = _network.NodeArray;
        Span<double> load = stackalloc double[3];
        var automatic = new List<Automatic>();
        var largestFirst = Comparer<Automatic>.Create((a, b) =>
        {
            var order = b.VoltAmperes.CompareTo(a.VoltAmperes);
            return order != 0 ? order : string.CompareOrdinal(nodes[a.Child].Id, nodes[b.Child].Id);
        });
        var childStarts = _network.Levels.ChildStarts;
        for (var p = start; p < end; p++)
        {
            // A node without children (most are end points) is passed over without reading its object.
            var (firstChild, endChild) = (childStarts[p], childStarts[p + 1]);
            if (firstChild == endChild)
            {
                continue;
            }

            var panel = nodes[p];
            var lines = PhaseRules.Lines(panel.System);
            load.Clear();
            automatic.Clear();
            for (var child = firstChild; child < endChild; child++)
            {
                if (nodes[child].Circuit is not { } circuit)
                {
                    continue;
                }

                if (circuit.Phases is { } phases)
                {
                    Assigned[child] = phases;
                    AddLoad(load, phases, lines, power[child].VoltAmperes);
                }
                else
                {
                    automatic.Add(new Automatic(child, power[child].VoltAmperes));
                }
            }

            // Largest first; ids are unique in a panel, so the order is total.
            automatic.Sort(largestFirst);
            foreach (var (child, voltAmperes) in automatic)
            {
                var poles = Math.Min(nodes[child].Circuit!.Poles, lines);
                var best = Phases.None;
                var bestLoad = double.PositiveInfinity;
                foreach (var candidate in Candidates(poles, lines))
                {
                    var sum = 0.0;
                    for (var x = 0; x < lines; x++)
                    {
                        if (((int)candidate & (1 << x)) != 0)
                        {
                            sum += load[x];
                        }
                    }

                    if (sum < bestLoad - 1e-9)
                    {
                        best = candidate;
                        bestLoad = sum;
                    }
                }

                Assigned[child] = best;
                AddLoad(load, best, lines, voltAmperes);
            }
        }
    }

    // Spreads apparent power evenly over the lines of a set (limited to the system's lines).
    private static void AddLoad(Span<double> load, Phases phases, int lines, double voltAmperes)
    {
        var on = (int)phases & ((1 << lines) - 1);
        var count = BitOperations.PopCount((uint)on);
        for (var x = 0; x < lines; x++)
        {
            if ((on & (1 << x)) != 0)
            {
                load[x] += voltAmperes / count;
            }
        }
    }

    // A system's lines, the voltages a circuit on one line, on two lines and per line of a balanced set is
    // rated at (SetV(1), SetV(2), LineToNeutralV), and whether it has a neutral.
    private readonly record struct SystemVoltages(int Lines, double SingleV, double PairV, double PerLineV, bool HasNeutral);

    // A system and its voltages, kept together so that one reference holds both.
    private sealed record KnownVoltages(ElectricalSystem System, SystemVoltages Voltages);

    // A circuit without stated phases, and its apparent power (VA), worked out once for the sort.
    private readonly record struct Automatic(int Child, double VoltAmperes);

    private static Phases[] Candidates(int poles, int lines) => (poles, lines) switch
    {
        (1, 3) => OneOfThree,
        (1, 2) => OneOfTwo,
        (2, 3) => PairOfThree,
        (_, 3) => AllThree,
        (_, 2) => BothOfTwo,
        _ => TheOne,
    };

    // Bottom-up, a level at a time (see TreeLevels): each node works out its own currents; a node that is not an
    // end point pulls its children's (a level below, so already worked out). The service, above the levels the
    // pass takes, draws the sum of its children's.
    private void Accumulate(ComplexPower[] power)
    {
        ParallelRanges.BottomUp(_network.Levels.Steps, (start, end) => Accumulate(power, start, end));
        Currents.AsSpan(0, 3).Clear();
        AddChildren(0, Currents.AsSpan(0, 3));
    }

    // Accumulate for the nodes end − 1 down to start.
    private void Accumulate(ComplexPower[] power, int start, int end)
    {
        var nodes = _network.NodeArray;
        Span<Complex> bus = stackalloc Complex[3];
        for (var i = end - 1; i >= start; i--)
        {
            var node = nodes[i];
            var mine = Currents.AsSpan(i * 3, 3);
            mine.Clear();
            if (node.Circuit is not null)
            {
                LoadCurrents(power[i], Assigned[i], VoltagesOf(nodes[node.ParentIndex].System), mine);
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
                lock (_secondaryCurrents)
                {
                    _secondaryCurrents[i] = mine.ToArray();
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
        var (childStarts, currents) = (_network.Levels.ChildStarts, Currents);
        for (var child = childStarts[node + 1] - 1; child >= childStarts[node]; child--)
        {
            for (var x = 0; x < 3; x++)
            {
                into[x] += currents[(child * 3) + x];
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
