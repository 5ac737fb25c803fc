using System.Numerics;
using DistTree.Model;

namespace DistTree.Solving;

/// <summary>
/// The geometry of a system's lines, for the per-line currents and drops (see <see cref="PhaseFlow"/>): the unit
/// phasor of each line's voltage to the (virtual) neutral, and the voltages a circuit on one line, on two lines and
/// per line of a balanced set is rated at. Three lines are 120° apart; two lines are opposite (a centre-tapped
/// single-phase system); one line is the system's own.
/// </summary>
internal static class LineVoltages
{
    private static readonly Complex[] ThreeLines = [Complex.FromPolarCoordinates(1, 0), Complex.FromPolarCoordinates(1, -2 * Math.PI / 3), Complex.FromPolarCoordinates(1, 2 * Math.PI / 3)];
    private static readonly Complex[] TwoLines = [Complex.One, -Complex.One];

    // The voltages of the system this thread last asked for (see Of): runs of one panel share its system, and the
    // solver asks from several threads at once. A system's voltages follow from the system alone.
    [ThreadStatic]
    private static KnownVoltages? t_last;

    static LineVoltages()
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

    /// <summary>Per (lines × 8 + set of two lines): conj(u) of u = Unit(a) − Unit(b), a and b the set's lines.</summary>
    public static Complex[] PairConjugate { get; } = new Complex[32];

    /// <summary>Per (lines × 8 + set of two lines): |u| of u = Unit(a) − Unit(b), a and b the set's lines.</summary>
    public static double[] PairMagnitude { get; } = new double[32];

    /// <summary>Per (lines × 3 + line): conj(Unit(line, lines)).</summary>
    public static Complex[] UnitConjugate { get; } = new Complex[12];

    /// <summary>The voltages of <paramref name="system"/>, kept for the system this thread last asked for.</summary>
    public static SystemVoltages Of(ElectricalSystem system)
    {
        var last = t_last;
        if (last is null || !ReferenceEquals(system, last.System))
        {
            last = new KnownVoltages(system, Voltages(system));
            t_last = last;
        }

        return last.Voltages;
    }

    /// <summary>The voltages of <paramref name="system"/>, worked out afresh.</summary>
    public static SystemVoltages Voltages(ElectricalSystem system) =>
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

    // A system and its voltages, kept together so that one reference holds both.
    private sealed record KnownVoltages(ElectricalSystem System, SystemVoltages Voltages);
}

/// <summary>
/// A system's lines, the voltages a circuit on one line, on two lines and per line of a balanced set is rated at
/// (volts), and whether it has a neutral (see <see cref="LineVoltages"/>).
/// </summary>
internal readonly record struct SystemVoltages(int Lines, double SingleV, double PairV, double PerLineV, bool HasNeutral);
