using System.Numerics;

namespace DistTree.Tests.Solving.Reference;

/// <summary>A solved <see cref="NodalCircuit"/>: node voltages, source currents, and the currents and powers that follow from them.</summary>
internal sealed class NodalSolution
{
    private readonly NodalCircuit _circuit;
    private readonly Complex[] _x;
    private readonly int _nodes;

    internal NodalSolution(NodalCircuit circuit, Complex[] x, int nodes, int iterations)
    {
        _circuit = circuit;
        _x = x;
        _nodes = nodes;
        Iterations = iterations;
    }

    /// <summary>Fixed-point iterations taken (0 when every load is a constant impedance).</summary>
    public int Iterations { get; }

    /// <summary>A node's voltage to ground, volts.</summary>
    public Complex Voltage(int node) => node == NodalCircuit.Ground ? Complex.Zero : _x[node - 1];

    /// <summary>V(a) − V(b), volts.</summary>
    public Complex Between(int a, int b) => Voltage(a) - Voltage(b);

    /// <summary>The current through an impedance from its A to its B, amperes.</summary>
    public Complex ImpedanceCurrent(int impedance)
    {
        var (a, b, z) = _circuit.Impedances[impedance];
        return Between(a, b) / z;
    }

    /// <summary>The current out of a source's plus terminal into the circuit, amperes.</summary>
    public Complex SourceCurrent(int source) => _x[_nodes + source];

    /// <summary>The complex power a source delivers, VA: E·conj(I).</summary>
    public Complex SourcePowerVa(int source) => _circuit.Sources[source].V * Complex.Conjugate(SourceCurrent(source));

    /// <summary>The current a load draws from its A to its B, amperes.</summary>
    public Complex LoadCurrent(int load)
    {
        var l = _circuit.Loads[load];
        return NodalCircuit.LoadCurrent(l, Between(l.A, l.B));
    }

    /// <summary>The complex power a load takes, VA: V·conj(I).</summary>
    public Complex LoadPowerVa(int load)
    {
        var l = _circuit.Loads[load];
        return Between(l.A, l.B) * Complex.Conjugate(LoadCurrent(load));
    }

    /// <summary>All sources' power, VA.</summary>
    public Complex TotalSourcePowerVa => Sum(_circuit.Sources.Count, SourcePowerVa);

    /// <summary>All loads' power, VA.</summary>
    public Complex TotalLoadPowerVa => Sum(_circuit.Loads.Count, LoadPowerVa);

    /// <summary>Power taken by all impedances, VA: Σ |I|²·Z.</summary>
    public Complex TotalLossVa => Sum(_circuit.Impedances.Count, k =>
    {
        var i = ImpedanceCurrent(k);
        return i.Magnitude * i.Magnitude * _circuit.Impedances[k].Z;
    });

    private static Complex Sum(int count, Func<int, Complex> item)
    {
        var total = Complex.Zero;
        for (var k = 0; k < count; k++)
        {
            total += item(k);
        }

        return total;
    }
}
