using System.Numerics;
using DistTree.Model;

namespace DistTree.Solving;

/// <summary>
/// The geometry of a system's lines in the phase frame (see <see cref="PhaseFrame"/>): the unit phasor of each line's
/// voltage to the (virtual) neutral, and the line-to-neutral base. Three lines are 120° apart; two lines are
/// opposite (a centre-tapped single-phase system); one line is the system's own.
/// </summary>
internal static class LineVoltages
{
    private static readonly Complex[] ThreeLines = [Complex.FromPolarCoordinates(1, 0), Complex.FromPolarCoordinates(1, -2 * Math.PI / 3), Complex.FromPolarCoordinates(1, 2 * Math.PI / 3)];
    private static readonly Complex[] TwoLines = [Complex.One, -Complex.One];

    /// <summary>The unit phasor of line <paramref name="line"/>'s voltage to neutral on a system of <paramref name="lines"/> lines.</summary>
    public static Complex Unit(int line, int lines) => lines == 3 ? ThreeLines[line] : (lines == 2 ? TwoLines[line] : Complex.One);

    /// <summary>The voltage of one line to the (virtual) neutral in a balanced set: V_LL/√3 for 3 lines, V_LL/2 for 2, else the nominal.</summary>
    public static double LineToNeutralV(ElectricalSystem system) => PhaseRules.Lines(system) switch
    {
        3 => system.LineToLineV!.Value / Math.Sqrt(3),
        2 => system.LineToLineV!.Value / 2,
        _ => system.NominalV,
    };
}
