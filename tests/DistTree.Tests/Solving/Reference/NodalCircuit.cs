using DistTree.Model;
using MathNet.Numerics.LinearAlgebra;
using Complex = System.Numerics.Complex;

namespace DistTree.Tests.Solving.Reference;

/// <summary>One winding of an ideal transformer: from <paramref name="Plus"/> (its dotted end) to <paramref name="Minus"/>, of <paramref name="Turns"/> turns.</summary>
internal readonly record struct Winding(int Plus, int Minus, double Turns);

/// <summary>A load between two nodes: its power at <paramref name="NominalV"/> across it, and how that power follows the voltage.</summary>
internal readonly record struct NodalLoad(int A, int B, LoadModel Model, Complex PowerVa, double NominalV);

/// <summary>
/// A small general circuit solved by modified nodal analysis in complex phasors (any one frequency: the impedances
/// are given at it). Unknowns: every node's voltage to ground, the current of every ideal voltage source and of
/// every ideal-transformer winding. The equations are the circuit laws as textbooks state them: Kirchhoff's current
/// law at each node, each source's voltage, and for each ideal transformer V_w/N_w equal for all windings and
/// Σ N_w·I_w = 0. Loads at constant impedance are admittances in the matrix; loads at constant current or power are
/// currents injected at their nodes, found by fixed-point iteration on the one LU factorisation (MathNet.Numerics,
/// dense complex) until the largest change of a node voltage is below the tolerance relative to the largest voltage.
/// Independent of DistTree's solver: it is the check of it (issue 17).
/// </summary>
internal sealed class NodalCircuit
{
    /// <summary>The ground node: voltage zero by definition.</summary>
    public const int Ground = 0;

    private readonly List<string> _names = ["ground"];
    private readonly List<(int A, int B, Complex Z)> _impedances = [];
    private readonly List<(int Plus, int Minus, Complex V)> _sources = [];
    private readonly List<Winding[]> _transformers = [];
    private readonly List<NodalLoad> _loads = [];

    /// <summary>Nodes including ground.</summary>
    public int NodeCount => _names.Count;

    /// <summary>Impedances in the order added.</summary>
    public IReadOnlyList<(int A, int B, Complex Z)> Impedances => _impedances;

    /// <summary>Voltage sources in the order added.</summary>
    public IReadOnlyList<(int Plus, int Minus, Complex V)> Sources => _sources;

    /// <summary>Loads in the order added.</summary>
    public IReadOnlyList<NodalLoad> Loads => _loads;

    /// <summary>The name a node was added with.</summary>
    public string NameOf(int node) => _names[node];

    /// <summary>A new node; returns its number.</summary>
    public int AddNode(string name)
    {
        _names.Add(name);
        return _names.Count - 1;
    }

    /// <summary>An impedance in ohms between two nodes (not zero); returns its number.</summary>
    public int AddImpedance(int a, int b, Complex impedanceOhm)
    {
        CheckNodes(a, b);
        if (impedanceOhm == Complex.Zero || !double.IsFinite(impedanceOhm.Real) || !double.IsFinite(impedanceOhm.Imaginary))
        {
            throw new ArgumentException($"impedance {impedanceOhm} between {NameOf(a)} and {NameOf(b)}: must be finite and not zero");
        }

        _impedances.Add((a, b, impedanceOhm));
        return _impedances.Count - 1;
    }

    /// <summary>An ideal voltage source: V(plus) − V(minus) = <paramref name="voltageV"/>; returns its number.</summary>
    public int AddVoltageSource(int plus, int minus, Complex voltageV)
    {
        CheckNodes(plus, minus);
        _sources.Add((plus, minus, voltageV));
        return _sources.Count - 1;
    }

    /// <summary>An ideal transformer of two or more windings on one core.</summary>
    public void AddTransformer(params Winding[] windings)
    {
        if (windings.Length < 2)
        {
            throw new ArgumentException("an ideal transformer has two windings or more");
        }

        foreach (var w in windings)
        {
            CheckNodes(w.Plus, w.Minus);
            if (!(w.Turns > 0))
            {
                throw new ArgumentException($"turns must be positive: {w.Turns}");
            }
        }

        _transformers.Add(windings);
    }

    /// <summary>
    /// A load from <paramref name="a"/> to <paramref name="b"/> drawing <paramref name="powerVa"/> at
    /// <paramref name="nominalV"/> across it: constant power S = S₀; constant current |I| = |S₀|/V_nom at the angle of
    /// its own voltage less φ = arg S₀; constant impedance Y = conj(S₀)/V_nom². Returns its number.
    /// </summary>
    public int AddLoad(int a, int b, LoadModel model, Complex powerVa, double nominalV)
    {
        CheckNodes(a, b);
        if (!(nominalV > 0))
        {
            throw new ArgumentException($"nominal voltage must be positive: {nominalV}");
        }

        _loads.Add(new NodalLoad(a, b, model, powerVa, nominalV));
        return _loads.Count - 1;
    }

    /// <summary>
    /// Solves the circuit. <paramref name="relativeTolerance"/>: the iteration stops when no node voltage changed by
    /// more than this times the largest node voltage. Throws <see cref="InvalidOperationException"/> when the matrix is
    /// singular or the iteration does not converge in <paramref name="maxIterations"/>.
    /// </summary>
    public NodalSolution Solve(double relativeTolerance = 1e-12, int maxIterations = 500)
    {
        var windings = _transformers.Sum(t => t.Length);
        var nodes = NodeCount - 1;
        var size = nodes + _sources.Count + windings;
        var matrix = Matrix<Complex>.Build.Dense(size, size);
        var fixedRhs = Vector<Complex>.Build.Dense(size);
        StampImpedances(matrix);
        StampSources(matrix, fixedRhs, nodes);
        StampTransformers(matrix, nodes + _sources.Count);
        var lu = matrix.LU();

        var x = lu.Solve(fixedRhs);
        CheckFinite(x);
        var iterations = 0;
        if (_loads.Any(l => l.Model != LoadModel.ConstantImpedance))
        {
            while (true)
            {
                if (++iterations > maxIterations)
                {
                    throw new InvalidOperationException($"no convergence in {maxIterations} iterations");
                }

                var rhs = fixedRhs.Clone();
                foreach (var load in _loads.Where(l => l.Model != LoadModel.ConstantImpedance))
                {
                    var current = LoadCurrent(load, At(x, load.A) - At(x, load.B));
                    Inject(rhs, load.A, -current);
                    Inject(rhs, load.B, current);
                }

                var next = lu.Solve(rhs);
                CheckFinite(next);
                double change = 0, largest = 0;
                for (var k = 0; k < nodes; k++)
                {
                    change = Math.Max(change, (next[k] - x[k]).Magnitude);
                    largest = Math.Max(largest, next[k].Magnitude);
                }

                x = next;
                if (change <= relativeTolerance * largest)
                {
                    break;
                }
            }
        }

        return new NodalSolution(this, x.ToArray(), nodes, iterations);
    }

    /// <summary>The current a load draws from A to B at <paramref name="voltage"/> = V(A) − V(B): I = conj(S(V)/V).</summary>
    public static Complex LoadCurrent(NodalLoad load, Complex voltage) => load.Model switch
    {
        LoadModel.ConstantPower => Complex.Conjugate(load.PowerVa / voltage),
        LoadModel.ConstantCurrent => Complex.Conjugate(load.PowerVa) * voltage / (load.NominalV * voltage.Magnitude),
        LoadModel.ConstantImpedance => Complex.Conjugate(load.PowerVa) * voltage / (load.NominalV * load.NominalV),
    };

    private static Complex At(Vector<Complex> x, int node) => node == Ground ? Complex.Zero : x[node - 1];

    private static void Inject(Vector<Complex> rhs, int node, Complex current)
    {
        if (node != Ground)
        {
            rhs[node - 1] += current;
        }
    }

    private static void Add(Matrix<Complex> m, int row, int column, Complex value)
    {
        if (row >= 0 && column >= 0)
        {
            m[row, column] += value;
        }
    }

    // Each admittance y between a and b adds y to (a,a) and (b,b) and −y to (a,b) and (b,a) (node k is row k − 1;
    // ground has none). Constant-impedance loads are admittances too.
    private void StampImpedances(Matrix<Complex> m)
    {
        var admittances = _impedances.Select(z => (z.A, z.B, Y: 1 / z.Z))
            .Concat(_loads.Where(l => l.Model == LoadModel.ConstantImpedance)
                .Select(l => (l.A, l.B, Y: Complex.Conjugate(l.PowerVa) / (l.NominalV * l.NominalV))));
        foreach (var (a, b, y) in admittances)
        {
            Add(m, a - 1, a - 1, y);
            Add(m, b - 1, b - 1, y);
            Add(m, a - 1, b - 1, -y);
            Add(m, b - 1, a - 1, -y);
        }
    }

    // A source's current i flows out of its plus terminal into the circuit: it enters KCL at plus as −i (the rows
    // hold currents leaving a node) and at minus as +i; its own row is V(plus) − V(minus) = E.
    private void StampSources(Matrix<Complex> m, Vector<Complex> rhs, int firstRow)
    {
        for (var s = 0; s < _sources.Count; s++)
        {
            var (plus, minus, v) = _sources[s];
            var k = firstRow + s;
            Add(m, plus - 1, k, -1);
            Add(m, minus - 1, k, 1);
            Add(m, k, plus - 1, 1);
            Add(m, k, minus - 1, -1);
            rhs[k] = v;
        }
    }

    // A winding's current I_w flows into its plus end (leaving that node) and out of its minus end. Rows: for each
    // winding w after the first, N_1·(V_w) − N_w·(V_1) = 0 (equal volts per turn), and Σ N_w·I_w = 0 (ampere-turns).
    private void StampTransformers(Matrix<Complex> m, int firstColumn)
    {
        var k = firstColumn;
        foreach (var windings in _transformers)
        {
            var first = windings[0];
            for (var w = 0; w < windings.Length; w++)
            {
                var (plus, minus, turns) = windings[w];
                Add(m, plus - 1, k + w, 1);
                Add(m, minus - 1, k + w, -1);
                Add(m, k + windings.Length - 1, k + w, turns);
                if (w > 0)
                {
                    var row = k + w - 1;
                    Add(m, row, plus - 1, first.Turns);
                    Add(m, row, minus - 1, -first.Turns);
                    Add(m, row, first.Plus - 1, -turns);
                    Add(m, row, first.Minus - 1, turns);
                }
            }

            k += windings.Length;
        }
    }

    private static void CheckFinite(Vector<Complex> x)
    {
        if (x.Any(v => !double.IsFinite(v.Real) || !double.IsFinite(v.Imaginary)))
        {
            throw new InvalidOperationException("the circuit's matrix is singular (a floating node, or a loop of sources)");
        }
    }

    private void CheckNodes(int a, int b)
    {
        if (a < 0 || a >= NodeCount || b < 0 || b >= NodeCount || a == b)
        {
            throw new ArgumentException($"nodes {a} and {b}: must be two different nodes of the circuit");
        }
    }
}
