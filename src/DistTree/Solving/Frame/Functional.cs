using System.Numerics;

namespace DistTree.Solving;

/// <summary>
/// A voltage an end point or a check reads off a bus, as a linear function of the bus's conductor voltages to ground
/// (lines A, B, C and the neutral N): f(V) = a·V_A + b·V_B + c·V_C + n·V_N. Scaled so that f of the nominal bus is
/// exactly 1: |f(V)| is then that voltage in per unit of its nominal, and the linearised drop a change ΔV makes is
/// Re f(ΔV) (the part of ΔV in phase with the nominal voltage; common practice). Through a transformer it maps onto
/// the primary's conductors (see <see cref="TransformerModel.MapUp"/>).
/// </summary>
internal readonly record struct Functional(Complex A, Complex B, Complex C, Complex N)
{
    /// <summary>Conductor index of the neutral in the four-conductor arrays of the phase frame.</summary>
    public const int Neutral = 3;

    /// <summary>f(V) of four conductor voltages (A, B, C, N).</summary>
    public Complex Of(ReadOnlySpan<Complex> v) => (A * v[0]) + (B * v[1]) + (C * v[2]) + (N * v[3]);

    /// <summary>
    /// f of the drops along a run whose lines carry the current-lengths <paramref name="m"/> (A·km, per set, three
    /// lines) on conductors of impedance <paramref name="zLine"/> and <paramref name="zNeutral"/> (Ω/km): each line
    /// drops z·M_x and the neutral, carrying the return −ΣM, drops z_N·(−ΣM).
    /// </summary>
    public Complex OfRun(ReadOnlySpan<Complex> m, Complex zLine, Complex zNeutral) =>
        (zLine * ((A * m[0]) + (B * m[1]) + (C * m[2]))) - (zNeutral * N * (m[0] + m[1] + m[2]));

    /// <summary>
    /// The linearised drop in percent, Re f(ΔV)·100, along a run of current-lengths <paramref name="m"/> whose every
    /// conductor, the neutral too, is R + jX = <paramref name="r"/> + j<paramref name="x"/> Ω/km: R·Re P − X·Im P with
    /// P = 100·<see cref="PerOhm"/>, the same arithmetic as the unit drops the sizer prices with.
    /// </summary>
    public double DropPercent(ReadOnlySpan<Complex> m, double r, double x)
    {
        var p = PerOhm(m) * 100.0;
        return (r * p.Real) + (x * -p.Imaginary);
    }

    /// <summary>
    /// The linearised drop in percent along a run of current-lengths <paramref name="m"/> whose lines are
    /// <paramref name="r"/> + j<paramref name="x"/> Ω/km and whose neutral is <paramref name="rN"/> +
    /// j<paramref name="xN"/> Ω/km: Re f(ΔV)·100 (see <see cref="OfRun"/>); a neutral like the lines by
    /// <see cref="DropPercent(ReadOnlySpan{Complex}, double, double)"/>, to the bit.
    /// </summary>
    public double DropPercent(ReadOnlySpan<Complex> m, double r, double x, double rN, double xN) =>
        r == rN && x == xN ? DropPercent(m, r, x) : OfRun(m, new Complex(r, x), new Complex(rN, xN)).Real * 100.0;

    /// <summary>The sum of the line coefficients' products with <paramref name="m"/> and the neutral's with −ΣM: f(M) per ohm of the run, for unit drops.</summary>
    public Complex PerOhm(ReadOnlySpan<Complex> m) => (A * m[0]) + (B * m[1]) + (C * m[2]) - (N * (m[0] + m[1] + m[2]));

    /// <summary>The coefficient of conductor <paramref name="k"/> (0 … 2 the lines, 3 the neutral).</summary>
    public Complex this[int k] => k switch
    {
        0 => A,
        1 => B,
        2 => C,
        _ => N,
    };

    /// <summary>
    /// The voltage between conductors <paramref name="x"/> and <paramref name="y"/> (3 = the neutral) of a bus whose
    /// nominal conductor voltages are <paramref name="nominal"/>, scaled to 1 at nominal.
    /// </summary>
    public static Functional Between(int x, int y, ReadOnlySpan<Complex> nominal)
    {
        var scale = 1.0 / (nominal[x] - nominal[y]);
        Span<Complex> c = stackalloc Complex[4];
        c[x] = scale;
        c[y] = -scale;
        return new Functional(c[0], c[1], c[2], c[3]);
    }
}
