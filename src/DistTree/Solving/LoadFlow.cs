using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>The result of a load flow: per node, the per-unit voltage at its input (after its run) and at its bus.</summary>
/// <param name="Converged">True when the sweep reached the tolerance.</param>
/// <param name="Iterations">Sweeps made.</param>
/// <param name="InputPu">Per node, |V| in per unit of its nominal voltage after its incoming run (the service: 1).</param>
/// <param name="BusPu">Per node, |V| on its bus (a transformer's secondary; else the same as its input).</param>
public sealed record LoadFlowResult(bool Converged, int Iterations, double[] InputPu, double[] BusPu);

/// <summary>
/// An exact solution of the radial tree by backward/forward sweep (common practice for radial distribution
/// networks): per unit on a 100 kVA base, balanced, one phase standing for all. Backward: each end point draws
/// I = conj(S(V)/V), with S = S₀ (constant power), S₀·|V| (constant current) or S₀·|V|² (constant impedance);
/// currents add up the tree, times each node's demand factor. Forward: V_child = V_parent − I·Z along every run;
/// a transformer is an ideal ratio (1 + tap) behind its series impedance (%R, %X on its own rating).
/// Repeats until no voltage moves by more than the tolerance.
/// </summary>
public static class LoadFlow
{
    /// <summary>The power base, VA.</summary>
    public const double BaseVa = 100_000;

    /// <summary>Convergence tolerance on every node voltage, per unit.</summary>
    public const double TolerancePu = 1e-6;

    /// <summary>Most sweeps before giving up.</summary>
    public const int MaxIterations = 100;

    /// <summary>Solves the tree. <paramref name="loads"/> is per node (end points only) at nominal voltage; <paramref name="runImpedanceOhm"/> per node: its run's R + jX, whole length, sets in parallel.</summary>
    public static LoadFlowResult Solve(DistributionNetwork network, ComplexPower[] loads, Complex[] runImpedanceOhm)
    {
        var nodes = network.NodeArray;
        var n = nodes.Length;
        var parents = network.ParentIndices;
        var levels = network.Levels;
        var sweeps = new Sweeps(n, levels.ChildStarts);

        // What the objects of the tree hold, then the arithmetic on it, each node on its own: on every core.
        ParallelRanges.For(n, (start, end) => sweeps.Prepare(nodes, parents, loads, runImpedanceOhm, start, end));

        Action<int, int> backward = sweeps.Backward;
        Action<int, int> forward = sweeps.Forward;
        for (var iteration = 1; iteration <= MaxIterations; iteration++)
        {
            // Backward sweep: currents from the end points up, the deepest level first.
            ParallelRanges.BottomUp(levels.Steps, backward);

            // Forward sweep: voltages from the service down.
            sweeps.MovedSquared = 0.0;
            sweeps.Finite = true;
            ParallelRanges.TopDown(levels.Steps, forward);

            // Not finite: a voltage collapse. A square beyond the double range is still a finite (large) change.
            var movedSquared = sweeps.MovedSquared;
            var moved = !sweeps.Finite ? double.NaN : (double.IsPositiveInfinity(movedSquared) ? double.MaxValue : Math.Sqrt(movedSquared));
            if (moved < TolerancePu)
            {
                return sweeps.Result(true, iteration);
            }

            if (!double.IsFinite(moved))
            {
                return sweeps.Result(false, iteration);
            }
        }

        return sweeps.Result(false, MaxIterations);
    }

    // The per-node arrays of the sweeps (scratch arrays, see Scratch: only the first n elements are used) and the
    // sweeps over a range of nodes. Every sweep reads link, current, zPu and bus of every node; the other arrays
    // only at the few nodes that are not end points. Each node writes its own elements only.
    private sealed class Sweeps
    {
        private readonly int _n;
        private readonly int[] _childStarts;

        // Per node: its parent, role and run; its run's and its transformer's impedance, per unit; its load at
        // nominal voltage, per unit; its demand factor and its transformer's ratio.
        private readonly Link[] _link;
        private readonly Complex[] _zPu;
        private readonly Complex[] _zTransformer;
        private readonly Complex[] _s0;
        private readonly double[] _demand;
        private readonly double[] _ratio;

        // The voltage on each node's bus; only a transformer has an input apart from it (before its ratio and
        // impedance), elsewhere the input is the bus.
        private readonly Complex[] _bus;
        private readonly Complex[] _transformerInput;

        // The current each node draws from its parent.
        private readonly Complex[] _current;

        // Guards MovedSquared and Finite, to which each range of a forward sweep adds its own.
        private readonly Lock _gate = new();

        public Sweeps(int n, int[] childStarts)
        {
            _n = n;
            _childStarts = childStarts;
            // Every element is written by Prepare, on every core.
            _link = Scratch.RentToFill<Link>(n);
            _zPu = Scratch.RentToFill<Complex>(n);
            _s0 = Scratch.RentToFill<Complex>(n);
            _demand = Scratch.RentToFill<double>(n);
            _ratio = Scratch.RentToFill<double>(n);
            _zTransformer = Scratch.RentToFill<Complex>(n);
            _bus = Scratch.RentToFill<Complex>(n);
            _transformerInput = Scratch.RentToFill<Complex>(n);
            _current = Scratch.RentToFill<Complex>(n);
        }

        /// <summary>The largest square of a voltage change in the last forward sweep.</summary>
        public double MovedSquared { get; set; }

        /// <summary>Whether every voltage of the last forward sweep was finite.</summary>
        public bool Finite { get; set; }

        // Fills the arrays of nodes start … end − 1 from the tree, the loads and the runs' impedances.
        public void Prepare(NetworkNode[] nodes, int[] parents, ComplexPower[] loads, Complex[] runImpedanceOhm, int start, int end)
        {
            // The sweeps start from the nominal voltage everywhere and no current.
            _bus.AsSpan(start, end - start).Fill(Complex.One);
            _transformerInput.AsSpan(start, end - start).Fill(Complex.One);
            _current.AsSpan(start, end - start).Clear();

            // First a loop of reads only: the processor then has the reads of many nodes under way at once
            // (objects of a large tree are rarely in cache). The arithmetic follows.
            var supply = Scratch.RentToFill<CircuitSupply>(end - start);
            Read(nodes, parents, supply, start, end);

            // The arrays in locals, read once: the loop then indexes them without going through this object.
            var (link, zPu, s0) = (_link, _zPu, _s0);
            for (var i = start; i < end; i++)
            {
                zPu[i] = Complex.Zero;
                if (link[i].HasRun)
                {
                    // Loop impedance: both conductors for single-phase (×2), one phase against V_LL for three-phase.
                    var feed = supply[i - start];
                    var loop = feed.Phases == 3 ? 1.0 : 2.0;
                    zPu[i] = runImpedanceOhm[i] * loop * BaseVa / (feed.VoltageV * feed.VoltageV);
                }

                s0[i] = Complex.Zero;
                if (link[i].Role >= Role.ConstantPower)
                {
                    s0[i] = new Complex(loads[i].Watts, loads[i].Vars) / BaseVa;
                }
            }

            Scratch.Return(supply, end - start);
        }

        // Prepare's reads: each node's role, parent, demand factor and transformer, and its run's supply into
        // supply[i − start].
        private void Read(NetworkNode[] nodes, int[] parents, CircuitSupply[] supply, int start, int end)
        {
            // The arrays in locals, read once: the loop then indexes them without going through this object.
            var (link, demand, ratio, zTransformer) = (_link, _demand, _ratio, _zTransformer);
            for (var i = start; i < end; i++)
            {
                var node = nodes[i];
                var role = node.Kind == NodeKind.Transformer ? Role.Transformer : Role.Junction;
                if (node.Circuit is { } circuit)
                {
                    // An end point is never a transformer (it has a circuit, not equipment).
                    role = circuit.Load.Model switch
                    {
                        LoadModel.ConstantCurrent => Role.ConstantCurrent,
                        LoadModel.ConstantImpedance => Role.ConstantImpedance,
                        _ => Role.ConstantPower,
                    };
                }

                var run = node.Incoming;
                supply[i - start] = run?.Supply ?? default;
                link[i] = new Link(parents[i], role, run is not null);
                demand[i] = node.Equipment?.DemandFactor ?? 1.0;
                ratio[i] = 1.0;
                zTransformer[i] = Complex.Zero;
                if (node.Equipment?.Transformer is { } t)
                {
                    var r = t.ImpedancePercent / Math.Sqrt(1 + (t.XOverR * t.XOverR)) / 100.0;
                    zTransformer[i] = new Complex(r, r * t.XOverR) * BaseVa / (t.Kva * 1000.0);
                    ratio[i] = 1.0 + (t.TapPercent / 100.0);
                }
            }
        }

        // Each end point draws I = conj(S(V)/V); every other node the sum of its children's currents. A node pulls
        // its children's (a level below, so already worked out), from the last child to the first: the order in
        // which they were first added up, so that the sums are the same to the bit.
        public void Backward(int start, int end)
        {
            // The arrays in locals, read once: the loop then indexes them without going through this object.
            var (link, current, bus, s0, childStarts) = (_link, _current, _bus, _s0, _childStarts);
            for (var i = end - 1; i >= start; i--)
            {
                var role = link[i].Role;
                if (role >= Role.ConstantPower)
                {
                    var v = bus[i];
                    var s = role switch
                    {
                        Role.ConstantCurrent => s0[i] * v.Magnitude,
                        Role.ConstantImpedance => s0[i] * v.Magnitude * v.Magnitude,
                        _ => s0[i],
                    };
                    current[i] = Complex.Conjugate(s / v);
                }
                else
                {
                    var busCurrent = Complex.Zero;
                    for (var child = childStarts[i + 1] - 1; child >= childStarts[i]; child--)
                    {
                        busCurrent += current[child];
                    }

                    current[i] = busCurrent * _demand[i] * _ratio[i];
                }
            }
        }

        // V_child = V_parent − I·Z, the parent a level above (so already worked out). The largest change is
        // compared by its square.
        public void Forward(int start, int end)
        {
            // The arrays in locals, as in Backward.
            var (link, current, bus, zPu, transformerInput) = (_link, _current, _bus, _zPu, _transformerInput);
            var movedSquared = 0.0;
            var finite = true;
            for (var i = start; i < end; i++)
            {
                var (parent, role, _) = link[i];
                var after = bus[parent] - (current[i] * zPu[i]);
                double squared;
                if (role == Role.Transformer)
                {
                    var onBus = _ratio[i] * (after - (current[i] * _zTransformer[i]));
                    var changeIn = after - transformerInput[i];
                    var changeBus = onBus - bus[i];
                    squared = Math.Max(
                        (changeIn.Real * changeIn.Real) + (changeIn.Imaginary * changeIn.Imaginary),
                        (changeBus.Real * changeBus.Real) + (changeBus.Imaginary * changeBus.Imaginary));
                    finite &= double.IsFinite(after.Real) && double.IsFinite(after.Imaginary) && double.IsFinite(onBus.Real) && double.IsFinite(onBus.Imaginary);
                    transformerInput[i] = after;
                    bus[i] = onBus;
                }
                else
                {
                    // The bus is the input: one change, both of the same size.
                    var change = after - bus[i];
                    squared = (change.Real * change.Real) + (change.Imaginary * change.Imaginary);
                    finite &= double.IsFinite(after.Real) && double.IsFinite(after.Imaginary);
                    bus[i] = after;
                }

                movedSquared = squared > movedSquared ? squared : movedSquared;
            }

            // A largest value and an AND: the same whichever range comes first.
            lock (_gate)
            {
                MovedSquared = movedSquared > MovedSquared ? movedSquared : MovedSquared;
                Finite &= finite;
            }
        }

        // The result, with the scratch arrays given back.
        public LoadFlowResult Result(bool converged, int iterations)
        {
            var n = _n;
            var result = new LoadFlowResult(converged, iterations, GC.AllocateUninitializedArray<double>(n), GC.AllocateUninitializedArray<double>(n));
            ParallelRanges.For(n, (start, end) =>
            {
                for (var i = start; i < end; i++)
                {
                    result.BusPu[i] = _bus[i].Magnitude;
                    result.InputPu[i] = _link[i].Role == Role.Transformer ? _transformerInput[i].Magnitude : result.BusPu[i];
                }
            });

            foreach (var array in new[] { _zPu, _s0, _zTransformer, _bus, _transformerInput, _current })
            {
                Scratch.Return(array, n);
            }

            Scratch.Return(_link, n);
            Scratch.Return(_demand, n);
            Scratch.Return(_ratio, n);
            return result;
        }
    }

    // What a node is to the sweeps: an end point by its load model, a transformer, or any other node.
    private enum Role : byte
    {
        Junction,
        Transformer,
        ConstantPower,
        ConstantCurrent,
        ConstantImpedance,
    }

    // A node's parent and role, read together by both sweeps, and whether a run comes into it.
    private readonly record struct Link(int Parent, Role Role, bool HasRun);
}
