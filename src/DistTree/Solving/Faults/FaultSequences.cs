using System.Numerics;
using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// One run's impedances for a fault, ohms, all sets in parallel: a line, the neutral (where the run carries one) and the
/// grounding conductor the line-to-ground loop returns through.
/// </summary>
/// <param name="Line">One line.</param>
/// <param name="Neutral">The neutral, or zero where <paramref name="HasNeutral"/> is false.</param>
/// <param name="Ground">The grounding conductor.</param>
/// <param name="HasNeutral">True when the run carries a neutral (a node without a run passes its bus's on).</param>
internal readonly record struct RunZ(Complex Line, Complex Neutral, Complex Ground, bool HasNeutral)
{
    /// <summary>No run: equipment standing at its source shares its bus.</summary>
    public static RunZ None => new(Complex.Zero, Complex.Zero, Complex.Zero, true);
}

/// <summary>
/// Every bus's impedances looking up to the source, ohms per phase (see <see cref="FaultSolver"/>): positive sequence,
/// zero sequence by the neutral, zero sequence by the grounding conductors. Not a number where there is no such path
/// (no neutral, or no grounded source).
/// </summary>
internal sealed class Sequences(int n) : IDisposable
{
    /// <summary>A missing path.</summary>
    public static readonly Complex None = new(double.NaN, double.NaN);

    // Rented (Solving/Scratch): every node's are written, parent first, before they are read.
    public Complex[] Z1 { get; } = Scratch.RentToFill<Complex>(n);

    public Complex[] Z0n { get; } = Scratch.RentToFill<Complex>(n);

    public Complex[] Z0g { get; } = Scratch.RentToFill<Complex>(n);

    /// <summary>Gives the arrays back.</summary>
    public void Dispose()
    {
        Scratch.Return(Z1, n);
        Scratch.Return(Z0n, n);
        Scratch.Return(Z0g, n);
    }

    /// <summary>Node <paramref name="i"/>'s input: its parent's bus (<paramref name="upParent"/> the positive sequence there) and its run.</summary>
    public void Through(int parent, int i, in RunZ z, Complex upParent)
    {
        Z1[i] = upParent + z.Line;
        Z0n[i] = z.HasNeutral ? Z0n[parent] + z.Line + (3 * z.Neutral) : None;
        Z0g[i] = Z0g[parent] + z.Line + (3 * z.Ground);
    }

    /// <summary>
    /// Node <paramref name="i"/>'s bus behind its transformer, from its primary terminals: the leakage times
    /// <paramref name="kT"/> (IEC 60909-0's correction, 1 for none). Dyn1: the positive sequence referred by the square of
    /// the line-to-line ratio, the zero sequence the leakage alone (the delta holds it). Single-phase: the loop of the two
    /// primary lines (or line and neutral) referred by the square of the turns ratio, then the winding's own loops.
    /// </summary>
    public void Transform(int i, TransformerModel model, ElectricalSystem secondary, double kT)
    {
        var k2 = model.Ratio * model.Ratio;
        var zt = kT * model.LeakageOhms;
        if (model.Connection == WindingConnection.DeltaWye)
        {
            Z1[i] = (Z1[i] * 3 * k2) + zt;
            Z0n[i] = Z0g[i] = secondary.HasNeutral ? zt : None;
            return;
        }

        var primaryLoop = model.Q == Functional.Neutral ? ((2 * Z1[i]) + Z0n[i]) / 3 : 2 * Z1[i];
        var source = primaryLoop * k2;
        switch (model.Connection)
        {
            case WindingConnection.OneLine:
                Z1[i] = Z0n[i] = Z0g[i] = source + zt;
                break;
            case WindingConnection.TwoLines:
                Z1[i] = (source + zt) / 2;
                Z0n[i] = Z0g[i] = None;
                break;
            case WindingConnection.CentreTapped:
                {
                    var pair = source + zt;
                    var half = (source / 4) + (kT * ((model.PrimarySideOhms / 4) + model.HalfOhms));
                    Z1[i] = pair / 2;
                    Z0n[i] = Z0g[i] = (3 * half) - pair;
                    break;
                }
        }
    }

    /// <summary>True where <paramref name="z"/> is a path.</summary>
    public static bool Has(Complex z) => !double.IsNaN(z.Real);
}

/// <summary>
/// The runs' impedances for faults: each conductor's AC resistance at a temperature (20 °C for the maximum, its
/// insulation's rating for the minimum) and its reactance, per the catalogue, times the length over the sets. The
/// grounding conductor is the stated one, else the code's minimum for the run, else (no device or no table) the lines'
/// size, which the far end says.
/// </summary>
internal sealed class RunImpedances(CodeRules code, SolvedRows solved, int[] incomingRow, int n, double frequencyHz)
{
    private readonly ConductorCatalog _catalog = code.Catalog;

    // Per node, its run's grounding conductor once worked out: the size's index + 1 and its basis, 0 until then.
    private readonly int[] _ground = new int[n];
    private readonly byte[] _groundBasis = new byte[n];
    private readonly bool[] _groundExact = new bool[n];

    // The code's minimum by what it reads: a large tree repeats a few devices, sizes and loads.
    private readonly Dictionary<GroundKey, ConductorSize?> _minimums = [];

    // Each conductor's impedance per km by size, metal, raceway and insulation rating (60, 75, 90 °C), at 20 °C and at
    // its rated temperature, once worked out (NaN until then).
    private readonly Complex[] _ohms = Filled(ConductorSize.All.Count * 2 * 3 * 3 * 2);

    /// <summary>
    /// Run <paramref name="run"/>'s impedances (into node <paramref name="i"/>), each conductor at its rated temperature
    /// (<paramref name="hot"/>, for the minimum currents) or at 20 °C; its grounding conductor the code's minimum
    /// (<paramref name="exact"/>) or, where the project states none, at first the table's size without the increase for
    /// large lines (see <see cref="Ground"/>).
    /// </summary>
    public RunZ Of(int i, NetworkRun run, bool hot, bool exact)
    {
        var c = run.Conductors;
        var perSet = c.LengthM / 1000.0 / c.Sets;
        var hasNeutral = HasNeutral(run);
        var (ground, _) = Ground(i, run, exact);
        return new RunZ(
            Ohms(c.Size, c, hot) * perSet,
            hasNeutral ? Ohms(c.NeutralSize ?? c.Size, c, hot) * perSet : Complex.Zero,
            Ohms(ground, c, hot) * perSet,
            hasNeutral);
    }

    /// <summary>
    /// The grounding conductor of each set of <paramref name="run"/> and whether it is stated (0), the code's minimum (1),
    /// or the lines' size (2). Where the project states none and <paramref name="exact"/> is false, the table's size without
    /// NEC 250.122(B)'s increase for lines larger than the load needs (never larger than the minimum, so a far end that
    /// clears with it clears with the minimum; one that does not is worked out again exactly): sizing the lines for the load
    /// is most of the cost of the minimum, and few far ends need it. The last worked out is kept.
    /// </summary>
    public (ConductorSize Size, byte Basis) Ground(int i, NetworkRun run, bool exact = false)
    {
        if (_ground[i] == 0 || (exact && !_groundExact[i]))
        {
            var c = run.Conductors;
            var least = c.GroundSize is not null || incomingRow[i] < 0 ? null
                : exact ? Minimum(run, new RunResult(solved, incomingRow[i])) : code.TableGroundSize(c);
            var (size, basis) = c.GroundSize is { } stated
                ? (stated, 0)
                : least is { } found && _catalog.Contains(found) ? (found, 1) : (c.Size, 2);
            (_ground[i], _groundBasis[i], _groundExact[i]) = (size.Index + 1, (byte)basis, exact || basis == 0);
        }

        return (ConductorSize.All[_ground[i] - 1], _groundBasis[i]);
    }

    /// <summary>True when node <paramref name="i"/>'s grounding conductor is its stated one or the code's exact minimum.</summary>
    public bool GroundIsExact(int i) => _groundExact[i];

    /// <summary>True when <paramref name="run"/> carries a neutral: a feeder of a system with one, a 1-pole branch circuit.</summary>
    public static bool HasNeutral(NetworkRun run) =>
        run.System.HasNeutral && (run.Kind == RunKind.Feeder || run.Target.Circuit is { Poles: 1 });

    // The code's minimum grounding conductor of a run that states none, as its row gives it (RunResult.GroundMinimum).
    private ConductorSize? Minimum(NetworkRun run, RunResult row)
    {
        var c = run.Conductors;
        var duty = CircuitDuty.Of(run);
        var carrying = row.CurrentCarryingConductors ?? 3;
        var key = new GroundKey(c.OcpdA ?? -1, c.Size.Index, c.Sets, c.Material, c.InsulationC, c.InstallationMethod, c.LoadedConductors, c.DeviceType, row.DesignCurrentA, carrying, duty);
        if (!_minimums.TryGetValue(key, out var least))
        {
            least = row.GroundMinimum;
            _minimums[key] = least;
        }

        return least;
    }

    private Complex Ohms(ConductorSize size, Run c, bool hot)
    {
        var rating = c.InsulationC switch
        {
            60 => 0,
            75 => 1,
            90 => 2,
            _ => -1,
        };
        var key = ((((((size.Index * 2) + (int)c.Material) * 3) + (int)c.Raceway) * 3) + rating) * 2 + (hot ? 1 : 0);
        if (rating >= 0 && !double.IsNaN(_ohms[key].Real))
        {
            return _ohms[key];
        }

        var t = hot ? ConductorCatalog.RatedTemperatureC(size, c.InsulationC) : FaultSolver.ColdC;
        var ohms = new Complex(_catalog.AcResistanceOhmPerKm(size, c.Material, c.Raceway, t, frequencyHz), _catalog.ReactanceOhmPerKm(size, c.Raceway, frequencyHz));
        if (rating >= 0)
        {
            _ohms[key] = ohms;
        }

        return ohms;
    }

    private static Complex[] Filled(int length)
    {
        var a = new Complex[length];
        Array.Fill(a, Sequences.None);
        return a;
    }

    // What the code's minimum grounding conductor of a run reads (see CodeRules.MinimumGroundSize).
    private readonly record struct GroundKey(
        double OcpdA, int SizeIndex, int Sets, Material Material, int InsulationC, InstallationMethod Method, int Loaded, DeviceType Device, double DesignA, int Carrying, CircuitDuty Duty);
}
