using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// Per-phase currents and drops (common practice for unbalanced radial feeders): the lines of every circuit (see
/// <c>PhaseAssignment</c>) and the phasor line currents of every node (see <c>PhaseCurrents</c>), and from them
/// the drops. The neutral carries Ia + Ib + Ic (a neutral the size of the phase conductors). A line's drop is
/// ΔV = (I_line + I_neutral)·Z, and its percent is the part of ΔV in phase with the line's voltage (the
/// effective-impedance approximation, line by line).
/// </summary>
internal sealed class PhaseFlow
{
    // Per transformer node, the secondary's line currents (A) on its bus.
    private readonly Dictionary<int, Complex[]> _secondaryCurrents;

    /// <summary>The lines and currents the passes worked out (see <c>PhaseCurrents.Solve</c>).</summary>
    public PhaseFlow(Phases[] assigned, Complex[] currents, Dictionary<int, Complex[]> secondaryCurrents)
    {
        Assigned = assigned;
        Currents = currents;
        _secondaryCurrents = secondaryCurrents;
    }

    /// <summary>Per node, the lines its circuit is on (end points only).</summary>
    public Phases[] Assigned { get; }

    /// <summary>Per node × 3, the line currents (A) it draws from its parent, at its incoming run's voltage.</summary>
    public Complex[] Currents { get; }

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
        var voltages = LineVoltages.Of(system);
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
                    var unit = LineVoltages.UnitConjugate[(lines * 3) + x];
                    return ((flowing * resistive * scale * unit).Real / v * 100.0, (flowing * reactive * scale * unit).Real / v * 100.0);
                }

            case 2:
                {
                    var (a, b) = (BitOperations.TrailingZeroCount(on), 31 - BitOperations.LeadingZeroCount((uint)on));
                    var (flowingA, flowingB) = (i[a] + neutral, i[b] + neutral);
                    var (pair, magnitude) = (LineVoltages.PairConjugate[(lines * 8) + on], LineVoltages.PairMagnitude[(lines * 8) + on]);
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
                        var unit = LineVoltages.UnitConjugate[(lines * 3) + x];
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
        var v = LineVoltages.LineToNeutralV(node.System);
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
        var vln = LineVoltages.LineToNeutralV(data.Secondary);
        var perLine = data.Kva * 1000.0 / lines;
        var secondary = _secondaryCurrents[node];
        for (var x = 0; x < 3; x++)
        {
            var s = x < lines ? vln * LineVoltages.Unit(x, lines) * Complex.Conjugate(secondary[x]) : Complex.Zero;
            into[x] = x < lines ? (((percentR * s.Real) + (percentX * s.Imaginary)) / perLine) - data.TapPercent : double.NegativeInfinity;
        }
    }

    // |c|, without the call for no current (a line a circuit does not take): the magnitude of zero is zero.
    private static double Magnitude(Complex c) => c.Real == 0 && c.Imaginary == 0 ? 0.0 : c.Magnitude;
}
