using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// The currents of the phase frame at nominal voltage (see <c>PhaseCurrents</c>): the lines of every circuit (see
/// <c>PhaseAssignment</c>), the line currents every node draws from its parent and each transformer's secondary
/// currents. A run's neutral carries the return of its lines, −(I_A + I_B + I_C). Conductor temperatures, ampacity,
/// the percent sum and the motor starts read them.
/// </summary>
internal sealed class PhaseFlow
{
    // The functionals of the bus this thread last asked for (see SlotOn).
    [ThreadStatic]
    private static BusFunctionals? t_last;

    // Per transformer node, the secondary's line currents (A) on its bus.
    private readonly Dictionary<int, Complex[]> _secondaryCurrents;

    /// <summary>The lines and currents the passes worked out (see <c>PhaseCurrents.Solve</c>).</summary>
    public PhaseFlow(PhaseFrame frame, Phases[] assigned, Complex[] currents, Dictionary<int, Complex[]> secondaryCurrents)
    {
        Frame = frame;
        Assigned = assigned;
        Currents = currents;
        _secondaryCurrents = secondaryCurrents;
    }

    /// <summary>The tree's phase frame: nominal voltages and transformer models.</summary>
    public PhaseFrame Frame { get; }

    /// <summary>Per node, the lines its circuit is on (end points only).</summary>
    public Phases[] Assigned { get; }

    /// <summary>Per node × 3, the line currents (A) it draws from its parent, at nominal voltage.</summary>
    public Complex[] Currents { get; }

    /// <summary>Per node × 3, the continuous loads' part of <see cref="Currents"/>, or null where no load is continuous.</summary>
    public Complex[]? ContinuousCurrents { get; init; }

    /// <summary>The secondary line currents (A) of the transformer at <paramref name="node"/>.</summary>
    public ReadOnlySpan<Complex> SecondaryCurrents(int node) => _secondaryCurrents[node];

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

        // Loops, not LINQ over doubles (compiled at start: DEVELOPERS.md, Start-up); the same sums in the same order.
        var sum = 0.0;
        foreach (var s in va)
        {
            sum += s;
        }

        var average = sum / lines;
        var deviation = Math.Abs(va[0] - average);
        for (var x = 1; x < lines; x++)
        {
            deviation = Math.Max(deviation, Math.Abs(va[x] - average));
        }

        var imbalance = lines < 2 || average <= 0 ? 0.0 : deviation / average * 100.0;
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

    /// <summary>The functional of slot <paramref name="slot"/> (see <see cref="Slots"/>) on the bus of <paramref name="node"/>.</summary>
    public Functional SlotOn(NetworkNode node, int slot)
    {
        // A bus's functionals follow from its system and its turn alone: the last asked for are kept, per thread
        // (the nodes of one panel come one after another, and the passes run on several threads).
        var system = PhaseFrame.BusSystem(node);
        var rotation = Frame.Rotation[node.Index];
        var last = t_last;
        if (last is null || !ReferenceEquals(last.System, system) || last.Rotation != rotation)
        {
            Span<Complex> nominal = stackalloc Complex[4];
            PhaseFrame.Nominal(system, rotation, nominal);
            var functionals = new Functional[Slots.Count];
            var has = Slots.Of(PhaseRules.Lines(system), system.HasNeutral);
            for (var s = 0; s < Slots.Count; s++)
            {
                functionals[s] = (has & (1 << s)) != 0 ? Slots.Functional(s, nominal) : default;
            }

            last = t_last = new BusFunctionals(system, rotation, functionals);
        }

        return last.Functionals[slot];
    }

    // |c|, without the call for no current (a line a circuit does not take): the magnitude of zero is zero.
    private static double Magnitude(Complex c) => c.Real == 0 && c.Imaginary == 0 ? 0.0 : c.Magnitude;

    // A bus's system, its turn and its slots' functionals (default where the system lacks the slot).
    private sealed record BusFunctionals(ElectricalSystem System, Complex Rotation, Functional[] Functionals);
}
