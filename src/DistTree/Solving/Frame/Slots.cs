using System.Numerics;
using DistTree.Model;

namespace DistTree.Solving;

/// <summary>
/// The voltages of a bus a circuit can be connected to, numbered: 0 … 2 line A, B, C to neutral; 3 … 5 the line
/// pairs AB, BC, CA. A system has some of them (see <see cref="Of"/>); a run's own drop is the worst of the ones its
/// system has (a feeder) or of its own circuit's (a branch circuit: one line, one pair, or the worst of three pairs).
/// </summary>
internal static class Slots
{
    /// <summary>How many there are.</summary>
    public const int Count = 6;

    /// <summary>The line pairs of slots 3, 4, 5.</summary>
    public static ReadOnlySpan<int> PairFirst => [0, 1, 2];

    /// <summary>The second line of the pairs of slots 3, 4, 5.</summary>
    public static ReadOnlySpan<int> PairSecond => [1, 2, 0];

    /// <summary>The slots a system of <paramref name="lines"/> lines, with or without a neutral, has, as bits.</summary>
    public static int Of(int lines, bool hasNeutral) => (lines, hasNeutral) switch
    {
        (3, true) => 0b111111,
        (3, false) => 0b111000,
        (2, true) => 0b001011,
        (2, false) => 0b001000,
        _ => 0b000001,
    };

    /// <summary>The slots a circuit on the lines <paramref name="set"/> ((int)<see cref="Phases"/>) reads, as bits: one line, one pair, or all three pairs.</summary>
    public static int OfCircuit(int set) => set switch
    {
        1 => 0b000001,
        2 => 0b000010,
        4 => 0b000100,
        3 => 0b001000,
        6 => 0b010000,
        5 => 0b100000,
        _ => 0b111000,
    };

    /// <summary>The nominal voltage (volts) of slot <paramref name="slot"/>'s functional <paramref name="f"/>: 1/|its first line's coefficient|.</summary>
    public static double NominalV(Functional f, int slot) => 1.0 / f[slot < 3 ? slot : PairFirst[slot - 3]].Magnitude;

    /// <summary>The functional of slot <paramref name="slot"/> on a bus whose nominal conductor voltages are <paramref name="nominal"/>.</summary>
    public static Functional Functional(int slot, ReadOnlySpan<Complex> nominal) => slot < 3
        ? Solving.Functional.Between(slot, Solving.Functional.Neutral, nominal)
        : Solving.Functional.Between(PairFirst[slot - 3], PairSecond[slot - 3], nominal);
}
