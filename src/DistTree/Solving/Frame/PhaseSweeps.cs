using System.Numerics;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving.Passes;

namespace DistTree.Solving;

/// <summary>
/// The arrays and the two sweeps of the phase-frame load flow (see <see cref="LoadFlow"/>). Per node: the currents
/// it draws from its parent (three lines; the neutral carries their negated sum), its bus voltages (four
/// conductors), its run's impedance per conductor, its load. Transformers and loads along runs, which are few, keep
/// theirs in side tables. A sweep writes only a node's own elements, so a wide level runs on every core.
/// </summary>
internal sealed class PhaseSweeps : IDisposable
{
    private readonly int _n;
    private readonly NetworkNode[] _nodes;
    private readonly int[] _parents;
    private readonly int[] _childStarts;
    private readonly TransformerModel?[] _models;
    private readonly Complex[] _current;
    private readonly Complex[] _bus;
    private readonly Complex[] _zLine;
    private readonly Complex[] _zNeutral;
    private readonly EndLoad[] _loads;
    private readonly double[] _demand;
    private readonly double[] _base;
    private readonly Dictionary<int, Complex[]> _primary = [];
    private readonly Dictionary<int, Complex[]> _secondaryCurrent = [];
    private readonly Dictionary<int, LoadSpans> _spans = [];
    private readonly Lock _gate = new();
    private readonly Complex _source;
    private readonly Complex[] _emf = new Complex[4];
    private bool _taken;

    public PhaseSweeps(DistributionNetwork network, PhaseFlow phases, ComplexPower[] power, RunRows runs)
    {
        var n = _n = network.NodeArray.Length;
        _nodes = network.NodeArray;
        _parents = network.ParentIndices;
        _childStarts = network.Levels.ChildStarts;
        _models = phases.Frame.Models;
        _current = Scratch.RentToFill<Complex>(n * 3);
        _bus = Scratch.RentToFill<Complex>(n * 4);
        _zLine = Scratch.RentToFill<Complex>(n);
        _zNeutral = Scratch.RentToFill<Complex>(n);
        _loads = Scratch.RentToFill<EndLoad>(n);
        _demand = Scratch.RentToFill<double>(n);
        _base = Scratch.RentToFill<double>(n);
        ParallelRanges.For(n, (start, end) => Prepare(phases, power, runs, start, end));
        _source = phases.Frame.SourceImpedance;
        _bus.AsSpan(0, 4).CopyTo(_emf);
        for (var i = 0; i < n; i++)
        {
            if (_nodes[i].Circuit is { Points.Count: > 0 } circuit)
            {
                _spans[i] = LoadSpans.Of(_nodes[i].Incoming!, circuit, _zLine[i], _zNeutral[i], _bus.AsSpan(i * 4, 4));
            }

            if (_models[i] is not null)
            {
                var primary = new Complex[4];
                phases.Frame.Nominal(_nodes[_parents[i]], primary);
                _primary[i] = primary;
                _secondaryCurrent[i] = new Complex[3];
            }
        }
    }

    /// <summary>The largest square of a voltage change (per unit) in the last forward sweep.</summary>
    public double MovedSquared { get; set; }

    /// <summary>Whether every voltage of the last forward sweep was finite.</summary>
    public bool Finite { get; set; }

    /// <summary>
    /// The backward sweep over nodes end − 1 down to start: each end point's load currents at its voltages; each other
    /// node the sum of its children's (a level below, so already worked out) times its demand factor, through its
    /// transformer. Children are added from the last to the first.
    /// </summary>
    public void Backward(int start, int end)
    {
        Span<Complex> secondary = stackalloc Complex[3];
        var (current, loads, childStarts) = (_current, _loads, _childStarts);
        for (var i = end - 1; i >= start; i--)
        {
            var mine = current.AsSpan(i * 3, 3);
            mine.Clear();
            ref readonly var load = ref loads[i];
            if (load.On != 0)
            {
                if (load.Spans)
                {
                    _spans[i].Currents(load, mine);
                }
                else
                {
                    PhaseLoads.Add(load.S0, load.Model, load.On, _bus.AsSpan(i * 4, 4), load.SingleV, load.PairV, mine);
                }

                continue;
            }

            for (var child = childStarts[i + 1] - 1; child >= childStarts[i]; child--)
            {
                mine[0] += current[child * 3];
                mine[1] += current[(child * 3) + 1];
                mine[2] += current[(child * 3) + 2];
            }

            var factor = _demand[i];
            mine[0] *= factor;
            mine[1] *= factor;
            mine[2] *= factor;
            if (_models[i] is { } model)
            {
                mine.CopyTo(_secondaryCurrent[i]);
                mine.CopyTo(secondary);
                model.PrimaryCurrents(secondary, mine);
            }
        }
    }

    /// <summary>
    /// The service's bus behind the utility's impedance: V = E − Z_s·I on each line, I the sum of what the service's
    /// children draw (after a backward sweep); its change is counted with the forward sweep's.
    /// </summary>
    public void Source()
    {
        if (_source == Complex.Zero)
        {
            return;
        }

        Span<Complex> drawn = stackalloc Complex[3];
        for (var child = _childStarts[1] - 1; child >= _childStarts[0]; child--)
        {
            drawn[0] += _current[child * 3];
            drawn[1] += _current[(child * 3) + 1];
            drawn[2] += _current[(child * 3) + 2];
        }

        var moved = 0.0;
        for (var x = 0; x < 3; x++)
        {
            var v = _emf[x] - (_source * drawn[x]);
            var change = (v - _bus[x]) / _base[0];
            moved = Math.Max(moved, (change.Real * change.Real) + (change.Imaginary * change.Imaginary));
            _bus[x] = v;
        }

        MovedSquared = moved;
        Finite = double.IsFinite(_bus[0].Real + _bus[0].Imaginary + _bus[1].Real + _bus[1].Imaginary + _bus[2].Real + _bus[2].Imaginary);
    }

    /// <summary>
    /// The forward sweep over nodes start … end − 1: V = V_parent − I·Z on each line, the neutral rising by its
    /// return current times its impedance; along a run with points span by span; a transformer's bus from its primary
    /// terminals. The largest change is compared by its square, per unit of the bus's base.
    /// </summary>
    public void Forward(int start, int end)
    {
        Span<Complex> v = stackalloc Complex[4];
        var (bus, current, parents) = (_bus, _current, _parents);
        var moved = 0.0;
        var finite = true;
        for (var i = Math.Max(start, 1); i < end; i++)
        {
            var p = parents[i] * 4;
            var j = current.AsSpan(i * 3, 3);
            if (_loads[i].Spans)
            {
                _spans[i].Voltages(bus.AsSpan(p, 4), j, v);
            }
            else
            {
                var (zl, zn) = (_zLine[i], _zNeutral[i]);
                v[0] = bus[p] - (j[0] * zl);
                v[1] = bus[p + 1] - (j[1] * zl);
                v[2] = bus[p + 2] - (j[2] * zl);
                v[3] = bus[p + 3] + ((j[0] + j[1] + j[2]) * zn);
            }

            if (_models[i] is { } model)
            {
                var primary = _primary[i];
                v.CopyTo(primary);
                model.Secondary(primary, _secondaryCurrent[i], model.Ratio, v);
            }

            var scale = 1.0 / _base[i];
            for (var k = 0; k < 4; k++)
            {
                var change = (v[k] - bus[(i * 4) + k]) * scale;
                var squared = (change.Real * change.Real) + (change.Imaginary * change.Imaginary);
                moved = squared > moved ? squared : moved;
                finite &= double.IsFinite(v[k].Real) && double.IsFinite(v[k].Imaginary);
                bus[(i * 4) + k] = v[k];
            }
        }

        // A largest value and an AND: the same whichever range comes first.
        lock (_gate)
        {
            MovedSquared = moved > MovedSquared ? moved : MovedSquared;
            Finite &= finite;
        }
    }

    /// <summary>The id of the node whose voltage stopped being a number first, else of the one whose lowest line-to-ground voltage is lowest per unit.</summary>
    public string Weakest()
    {
        var (weakest, lowest) = (0, double.PositiveInfinity);
        for (var i = 1; i < _n; i++)
        {
            for (var k = 0; k < 3; k++)
            {
                var v = _bus[(i * 4) + k];
                if (!double.IsFinite(v.Real) || !double.IsFinite(v.Imaginary))
                {
                    return _nodes[i].Id;
                }

                var pu = (v - _bus[(i * 4) + 3]).Magnitude / _base[i];
                if (pu > 0 && pu < lowest)
                {
                    (weakest, lowest) = (i, pu);
                }
            }
        }

        return _nodes[weakest].Id;
    }

    /// <summary>The voltages, handed over: the caller gives them back.</summary>
    public PhaseVoltages TakeVoltages()
    {
        _taken = true;
        return new PhaseVoltages(_n, _bus, _primary, _models);
    }

    /// <summary>Gives back the scratch arrays (the voltages too unless taken).</summary>
    public void Dispose()
    {
        Scratch.Return(_current, _n * 3);
        Scratch.Return(_zLine, _n);
        Scratch.Return(_zNeutral, _n);
        Scratch.Return(_loads, _n);
        Scratch.Return(_demand, _n);
        Scratch.Return(_base, _n);
        if (!_taken)
        {
            Scratch.Return(_bus, _n * 4);
        }
    }

    // What each node holds, read from the tree once: its nominal voltages to start from, its base, demand factor,
    // load and run impedance.
    private void Prepare(PhaseFlow phases, ComplexPower[] power, RunRows runs, int start, int end)
    {
        var (rows, incomingRow) = (runs.Rows, runs.IncomingRow);
        for (var i = start; i < end; i++)
        {
            var node = _nodes[i];
            phases.Frame.Nominal(node, _bus.AsSpan(i * 4, 4));
            _current.AsSpan(i * 3, 3).Clear();
            _base[i] = LineVoltages.LineToNeutralV(PhaseFrame.BusSystem(node));
            _demand[i] = node.Equipment?.DemandFactor ?? 1.0;
            _loads[i] = default;
            if (node.Circuit is { } circuit)
            {
                var system = PhaseFrame.BusSystem(_nodes[node.ParentIndex]);
                var (single, pair) = PhaseFrame.LoadBases(system);
                var on = (int)phases.Assigned[i] & ((1 << PhaseRules.Lines(system)) - 1);
                _loads[i] = new EndLoad(new Complex(power[i].Watts, power[i].Vars), circuit.Load.Model, (byte)on, circuit.Points.Count > 0, single, pair);
            }

            (_zLine[i], _zNeutral[i]) = (Complex.Zero, Complex.Zero);
            if (node.Incoming is { } run)
            {
                ref var row = ref rows[incomingRow[i]];
                var km = node.Circuit is { Points.Count: > 0 } ? 1.0 : run.Conductors.LengthM / 1000.0;
                _zLine[i] = new Complex(row.ResistanceOhmPerKm, row.ReactanceOhmPerKm) * km / run.Conductors.Sets;
                _zNeutral[i] = new Complex(row.NeutralResistanceOhmPerKm, row.NeutralReactanceOhmPerKm) * km / run.Conductors.Sets;
            }
        }
    }
}

/// <summary>An end point's load in the sweeps: its power at nominal voltage, model, lines (bits), whether it lies along its run, and its nominal voltages.</summary>
internal readonly record struct EndLoad(Complex S0, LoadModel Model, byte On, bool Spans, double SingleV, double PairV);
