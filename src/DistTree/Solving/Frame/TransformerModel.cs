using System.Numerics;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>How a transformer's windings are connected (see <see cref="TransformerModel"/>).</summary>
internal enum WindingConnection : byte
{
    /// <summary>Three-phase, delta primary, grounded-wye secondary, the low side lagging 30° (Dyn1).</summary>
    DeltaWye,

    /// <summary>Single-phase, a two-wire secondary of one line and a grounded neutral (120, 230).</summary>
    OneLine,

    /// <summary>Single-phase, a two-wire secondary of two lines about a grounded virtual midpoint (240).</summary>
    TwoLines,

    /// <summary>Single-phase, a three-wire secondary with a grounded centre tap (120/240).</summary>
    CentreTapped,
}

/// <summary>
/// A transformer in the phase frame: an ideal ratio behind leakage impedances referred to the secondary, %R and %X
/// from %Z and X/R on its rating (%R = %Z/√(1 + (X/R)²), %X = %R·X/R; common practice). Three-phase: Dyn1, winding a
/// across primary lines A–C, b across B–A, c across C–B, so E_a = k·(V_A − V_C) and the primary line currents are
/// I_A = k·(I_a − I_b), I_B = k·(I_b − I_c), I_C = k·(I_c − I_a), k = V_LN,sec/V_LL,pri; a zero-sequence secondary
/// current stays in the delta. Single-phase: across two primary lines (A-B unless the transformer says BC or CA; a
/// one-line primary, line to neutral), E = k·(V_P − V_Q), k = V_sec/V_P-Q. A centre-tapped secondary is the usual
/// three-winding model: with R + jX the full winding's impedance, a primary-side 0.5·R + j0.8·X (referred to the
/// full winding) and each half 0.25·R + j0.1·X, so a 240 V load sees R + jX and a 120 V load 1.5·%R and 1.2·%X
/// (common practice, no source). The tap is the nameplate's primary tap: k is divided by (1 + tap/100).
/// </summary>
internal sealed class TransformerModel
{
    private readonly Complex _zt;
    private readonly Complex _zp;
    private readonly Complex _zh;

    // Per primary conductor k × 4 + secondary conductor j: the secondary's voltage j at no load and the principal
    // tap when primary conductor k stands at 1 V and the others at 0 (the connection is linear).
    private readonly Complex[] _noLoad = new Complex[16];

    private TransformerModel(WindingConnection connection, int primaryLines, int p, int q, double k0, double tap, Complex zt, Complex zp, Complex zh)
    {
        Connection = connection;
        P = p;
        Q = q;
        RatioUntapped = k0;
        Ratio = k0 / (1 + tap);
        TapShare = tap / (1 + tap);
        _zt = zt;
        _zp = zp;
        _zh = zh;
        Span<Complex> primary = stackalloc Complex[4];
        Span<Complex> secondary = stackalloc Complex[4];
        for (var x = 0; x < primaryLines; x++)
        {
            primary[x] = LineVoltages.Unit(x, primaryLines);
        }

        Secondary(primary, [Complex.Zero, Complex.Zero, Complex.Zero], k0, secondary);
        Rotation = secondary[0] / secondary[0].Magnitude;
        for (var k = 0; k < 4; k++)
        {
            primary.Clear();
            primary[k] = Complex.One;
            Secondary(primary, [Complex.Zero, Complex.Zero, Complex.Zero], k0, _noLoad.AsSpan(k * 4, 4));
        }
    }

    /// <summary>How its windings are connected.</summary>
    public WindingConnection Connection { get; }

    /// <summary>The first primary conductor a single-phase transformer is across (0 … 2).</summary>
    public int P { get; }

    /// <summary>The second primary conductor a single-phase transformer is across (0 … 2, or 3 for the neutral).</summary>
    public int Q { get; }

    /// <summary>The turns ratio k at the tap: secondary winding volts per primary volt.</summary>
    public double Ratio { get; }

    /// <summary>The turns ratio at the principal tap.</summary>
    public double RatioUntapped { get; }

    /// <summary>The part of the voltage the tap takes off the secondary, tap/(1 + tap) (negative for a raising tap).</summary>
    public double TapShare { get; }

    /// <summary>
    /// The leakage impedance referred to the secondary, ohms: per phase for three-phase, the full winding's for
    /// single-phase (a centre-tapped winding's is <see cref="PrimarySideOhms"/> + 2·<see cref="HalfOhms"/>).
    /// </summary>
    public Complex LeakageOhms => _zt;

    /// <summary>A centre-tapped winding's primary-side branch, referred to the full secondary winding, ohms (else zero).</summary>
    public Complex PrimarySideOhms => _zp;

    /// <summary>A centre-tapped winding's branch of each half, in the half's own ohms (else zero).</summary>
    public Complex HalfOhms => _zh;

    /// <summary>The turn of the secondary's nominal voltages from the primary's: −30° for Dyn1.</summary>
    public Complex Rotation { get; }

    /// <summary>The model of <paramref name="node"/>'s transformer, fed from a bus of <paramref name="primary"/>.</summary>
    public static TransformerModel Of(NetworkNode node, TransformerData data, ElectricalSystem primary)
    {
        var secondary = data.Secondary;
        var (pLines, sLines) = (PhaseRules.Lines(primary), PhaseRules.Lines(secondary));
        var angle = Math.Atan(data.XOverR);
        var perUnit = data.ImpedancePercent / 100.0 * Complex.FromPolarCoordinates(1, angle);
        var tap = data.TapPercent / 100.0;
        if (secondary.Phases == 3)
        {
            if (pLines != 3)
            {
                throw ProjectException.At(node.Equipment!.Location, $"transformer {node.Id}: a three-phase secondary needs a three-phase primary; '{primary.Name}' has {pLines} line{(pLines == 1 ? "" : "s")}");
            }

            var vll = secondary.LineToLineV!.Value;
            var z = perUnit * vll * vll / (data.Kva * 1000.0);
            return new TransformerModel(WindingConnection.DeltaWye, 3, 0, 2, LineVoltages.LineToNeutralV(secondary) / primary.LineToLineV!.Value, tap, z, Complex.Zero, Complex.Zero);
        }

        var (p, q) = pLines switch
        {
            3 => Pair(data.PrimaryPhases),
            2 => (0, 1),
            _ => (0, Functional.Neutral),
        };
        var primaryV = q == Functional.Neutral ? primary.NominalV : (pLines == 3 ? primary.LineToLineV!.Value : primary.NominalV);
        var full = secondary.NominalV;
        var zFull = perUnit * full * full / (data.Kva * 1000.0);
        var connection = (sLines, secondary.HasNeutral) switch
        {
            (2, true) => WindingConnection.CentreTapped,
            (2, false) => WindingConnection.TwoLines,
            _ => WindingConnection.OneLine,
        };
        return connection == WindingConnection.CentreTapped
            ? new TransformerModel(connection, pLines, p, q, full / primaryV, tap, zFull, new Complex(0.5 * zFull.Real, 0.8 * zFull.Imaginary), new Complex(0.25 * zFull.Real, 0.1 * zFull.Imaginary))
            : new TransformerModel(connection, pLines, p, q, full / primaryV, tap, zFull, Complex.Zero, Complex.Zero);
    }

    /// <summary>Into <paramref name="primary"/> (three lines), the primary line currents that the secondary line currents <paramref name="secondary"/> draw.</summary>
    public void PrimaryCurrents(ReadOnlySpan<Complex> secondary, Span<Complex> primary)
    {
        var k = Ratio;
        primary[..3].Clear();
        switch (Connection)
        {
            case WindingConnection.DeltaWye:
                primary[0] = k * (secondary[0] - secondary[1]);
                primary[1] = k * (secondary[1] - secondary[2]);
                primary[2] = k * (secondary[2] - secondary[0]);
                break;
            case WindingConnection.OneLine:
                AddAcross(primary, k * secondary[0]);
                break;
            case WindingConnection.TwoLines:
            case WindingConnection.CentreTapped:
                AddAcross(primary, k * (secondary[0] - secondary[1]) / 2);
                break;
        }
    }

    /// <summary>
    /// Into <paramref name="secondary"/> (four conductors, the neutral grounded), the secondary's voltages from the
    /// primary terminals' <paramref name="primary"/> (four conductors) and the secondary line currents
    /// <paramref name="current"/>, at the turns ratio <paramref name="k"/>.
    /// </summary>
    public void Secondary(ReadOnlySpan<Complex> primary, ReadOnlySpan<Complex> current, double k, Span<Complex> secondary)
    {
        secondary[..4].Clear();
        switch (Connection)
        {
            case WindingConnection.DeltaWye:
                secondary[0] = (k * (primary[0] - primary[2])) - (_zt * current[0]);
                secondary[1] = (k * (primary[1] - primary[0])) - (_zt * current[1]);
                secondary[2] = (k * (primary[2] - primary[1])) - (_zt * current[2]);
                break;
            case WindingConnection.OneLine:
                secondary[0] = (k * (primary[P] - primary[Q])) - (_zt * current[0]);
                break;
            case WindingConnection.TwoLines:
                {
                    var e = (k * (primary[P] - primary[Q])) - (_zt * (current[0] - current[1]) / 2);
                    secondary[0] = e / 2;
                    secondary[1] = -e / 2;
                    break;
                }

            case WindingConnection.CentreTapped:
                {
                    var core = (k * (primary[P] - primary[Q])) - (_zp * (current[0] - current[1]) / 2);
                    secondary[0] = (core / 2) - (_zh * current[0]);
                    secondary[1] = (-core / 2) - (_zh * current[1]);
                    break;
                }
        }
    }

    /// <summary>
    /// The primary's functional that reads what <paramref name="below"/> reads on the secondary at no load, at the
    /// principal tap: coefficient k is f of the secondary voltages a unit voltage on primary conductor k gives (see
    /// <see cref="_noLoad"/>).
    /// </summary>
    public Functional MapUp(Functional below)
    {
        var m = _noLoad;
        return new Functional(
            (below.A * m[0]) + (below.B * m[1]) + (below.C * m[2]) + (below.N * m[3]),
            (below.A * m[4]) + (below.B * m[5]) + (below.C * m[6]) + (below.N * m[7]),
            (below.A * m[8]) + (below.B * m[9]) + (below.C * m[10]) + (below.N * m[11]),
            (below.A * m[12]) + (below.B * m[13]) + (below.C * m[14]) + (below.N * m[15]));
    }

    /// <summary>What the windings' leakage takes off <paramref name="below"/> when the secondary carries <paramref name="current"/>: f(E) − f(V).</summary>
    public Complex WindingDrop(Functional below, ReadOnlySpan<Complex> current)
    {
        Span<Complex> secondary = stackalloc Complex[4];
        Secondary([Complex.Zero, Complex.Zero, Complex.Zero, Complex.Zero], current, Ratio, secondary);
        return -below.Of(secondary);
    }

    // A single-phase primary current: into P, out of Q (a neutral's return is the lines' sum, not stored).
    private void AddAcross(Span<Complex> primary, Complex current)
    {
        primary[P] += current;
        if (Q != Functional.Neutral)
        {
            primary[Q] -= current;
        }
    }

    private static (int P, int Q) Pair(Phases phases) => phases switch
    {
        Phases.BC => (1, 2),
        Phases.CA => (2, 0),
        _ => (0, 1),
    };
}
