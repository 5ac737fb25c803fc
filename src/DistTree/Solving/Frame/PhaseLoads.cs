using System.Numerics;
using DistTree.Model;

namespace DistTree.Solving;

/// <summary>
/// A load's line currents in the phase frame, I = conj(S(V)/V), with S = S₀ (constant power), S₀·|V|/V_n (constant
/// current) or S₀·(|V|/V_n)² (constant impedance), V_n its nominal voltage: a 1-pole load across its line and the
/// neutral, a 2-pole load across its two lines, a 3-pole load as three equal parts across the three line pairs (a
/// delta: no neutral current; common practice).
/// </summary>
internal static class PhaseLoads
{
    /// <summary>
    /// Adds into <paramref name="current"/> (three lines) what a load of <paramref name="s0"/> (VA at nominal
    /// voltage) draws on the lines <paramref name="on"/> (bits 0 … 2 = A … C) at the terminal voltages
    /// <paramref name="v"/> (four conductors), its nominal line-to-neutral voltage <paramref name="singleV"/> and the
    /// nominal voltage between two lines <paramref name="pairV"/>.
    /// </summary>
    public static void Add(Complex s0, LoadModel model, int on, ReadOnlySpan<Complex> v, double singleV, double pairV, Span<Complex> current)
    {
        switch (BitOperations.PopCount((uint)on))
        {
            case 1:
                {
                    var x = BitOperations.TrailingZeroCount(on);
                    current[x] += Current(s0, model, v[x] - v[Functional.Neutral], singleV);
                    break;
                }

            case 2:
                {
                    var (x, y) = (BitOperations.TrailingZeroCount(on), 31 - BitOperations.LeadingZeroCount((uint)on));
                    var i = Current(s0, model, v[x] - v[y], pairV);
                    current[x] += i;
                    current[y] -= i;
                    break;
                }

            case 3:
                for (var p = 0; p < 3; p++)
                {
                    var q = (p + 1) % 3;
                    var i = Current(s0 / 3, model, v[p] - v[q], pairV);
                    current[p] += i;
                    current[q] -= i;
                }

                break;
        }
    }

    // conj(S(V)/V) for a load of s0 at nominal voltage vn.
    private static Complex Current(Complex s0, LoadModel model, Complex v, double vn)
    {
        var s = model switch
        {
            LoadModel.ConstantCurrent => s0 * (v.Magnitude / vn),
            LoadModel.ConstantImpedance => s0 * (v.Magnitude * v.Magnitude / (vn * vn)),
            LoadModel.ConstantPower => s0,
        };
        return Complex.Conjugate(s / v);
    }
}
