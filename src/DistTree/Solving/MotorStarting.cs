using DistTree.Model;

namespace DistTree.Solving;

/// <summary>
/// Locked-rotor power of a starting motor. From a code letter: NEC Table 430.7(B)'s locked-rotor kVA per
/// horsepower, taking the upper end of the letter's range, the safe side (memory; verify against the edition in
/// force; V, open-ended, at 22.4). From a multiple: that many times the full-load current. Neither: 6 × (see
/// <see cref="MotorStart.DefaultMultiple"/>).
/// </summary>
public static class MotorStarting
{
    private static readonly Dictionary<string, double> KvaPerHp = new(StringComparer.Ordinal)
    {
        ["A"] = 3.14,
        ["B"] = 3.54,
        ["C"] = 3.99,
        ["D"] = 4.49,
        ["E"] = 4.99,
        ["F"] = 5.59,
        ["G"] = 6.29,
        ["H"] = 7.09,
        ["J"] = 7.99,
        ["K"] = 8.99,
        ["L"] = 9.99,
        ["M"] = 11.19,
        ["N"] = 12.49,
        ["P"] = 13.99,
        ["R"] = 15.99,
        ["S"] = 17.99,
        ["T"] = 19.99,
        ["U"] = 22.39,
        ["V"] = 22.4,
    };

    /// <summary>The complex power the motor draws while starting, at nominal voltage.</summary>
    /// <param name="load">The motor load (hp or fla).</param>
    /// <param name="running">Its running power, as the solver computed it.</param>
    public static ComplexPower LockedRotor(Load load, ComplexPower running)
    {
        var start = load.Start ?? MotorStart.Default;
        var va = start.CodeLetter is { } letter && load.Kind == LoadKind.Hp
            ? KvaPerHp[letter] * load.Value * 1000.0
            : (start.LockedRotorMultiple ?? MotorStart.DefaultMultiple) * running.VoltAmperes;
        return ComplexPower.FromApparent(va, start.PowerFactor);
    }
}
