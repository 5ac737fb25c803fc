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

        // Scratch arrays (see Scratch): only the first n elements are used. Every sweep reads link, current, zPu
        // and bus of every node; the other arrays only at the few nodes that are not end points.
        var link = Scratch.Rent<Link>(n);
        var zPu = Scratch.Rent<Complex>(n);
        var s0 = Scratch.Rent<Complex>(n);
        var demand = Scratch.Rent<double>(n);
        var ratio = Scratch.Rent<double>(n);
        var zTransformer = Scratch.Rent<Complex>(n);
        var supply = Scratch.Rent<CircuitSupply>(n);

        // First what the objects of the tree hold, in a loop of reads only: the processor then has the reads of
        // many nodes under way at once (objects of a large tree are rarely in cache). The arithmetic follows.
        for (var i = 0; i < n; i++)
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
            supply[i] = run?.Supply ?? default;
            link[i] = new Link(parents[i], role, run is not null);
            demand[i] = node.Equipment?.DemandFactor ?? 1.0;
            ratio[i] = 1.0;
            if (node.Equipment?.Transformer is { } t)
            {
                var r = t.ImpedancePercent / Math.Sqrt(1 + (t.XOverR * t.XOverR)) / 100.0;
                zTransformer[i] = new Complex(r, r * t.XOverR) * BaseVa / (t.Kva * 1000.0);
                ratio[i] = 1.0 + (t.TapPercent / 100.0);
            }
        }

        for (var i = 0; i < n; i++)
        {
            if (link[i].HasRun)
            {
                // Loop impedance: both conductors for single-phase (×2), one phase against V_LL for three-phase.
                var loop = supply[i].Phases == 3 ? 1.0 : 2.0;
                zPu[i] = runImpedanceOhm[i] * loop * BaseVa / (supply[i].VoltageV * supply[i].VoltageV);
            }

            if (link[i].Role >= Role.ConstantPower)
            {
                s0[i] = new Complex(loads[i].Watts, loads[i].Vars) / BaseVa;
            }
        }

        // The voltage on each node's bus; only a transformer has an input apart from it (before its ratio and
        // impedance), elsewhere the input is the bus.
        var bus = Scratch.Rent<Complex>(n);
        var transformerInput = Scratch.Rent<Complex>(n);
        for (var i = 0; i < n; i++)
        {
            bus[i] = Complex.One;
            transformerInput[i] = Complex.One;
        }

        var current = Scratch.Rent<Complex>(n);
        var busCurrent = Scratch.Rent<Complex>(n);

        // The result, with the scratch arrays given back.
        LoadFlowResult Result(bool converged, int iterations)
        {
            var result = new LoadFlowResult(converged, iterations, new double[n], new double[n]);
            for (var i = 0; i < n; i++)
            {
                result.BusPu[i] = bus[i].Magnitude;
                result.InputPu[i] = link[i].Role == Role.Transformer ? transformerInput[i].Magnitude : result.BusPu[i];
            }

            foreach (var array in new[] { zPu, s0, zTransformer, bus, transformerInput, current, busCurrent })
            {
                Scratch.Return(array, n);
            }

            Scratch.Return(link, n);
            Scratch.Return(demand, n);
            Scratch.Return(ratio, n);
            Scratch.Return(supply, n);
            return result;
        }

        for (var iteration = 1; iteration <= MaxIterations; iteration++)
        {
            // Backward sweep: currents from the end points up. A node's bus current is complete when the sweep
            // reaches it (its children come after it); it is cleared there for the next sweep.
            for (var i = n - 1; i > 0; i--)
            {
                var (parent, role, _) = link[i];
                Complex drawn;
                if (role >= Role.ConstantPower)
                {
                    var v = bus[i];
                    var s = role switch
                    {
                        Role.ConstantCurrent => s0[i] * v.Magnitude,
                        Role.ConstantImpedance => s0[i] * v.Magnitude * v.Magnitude,
                        _ => s0[i],
                    };
                    drawn = Complex.Conjugate(s / v);
                }
                else
                {
                    drawn = busCurrent[i] * demand[i] * ratio[i];
                    busCurrent[i] = Complex.Zero;
                }

                current[i] = drawn;
                busCurrent[parent] += drawn;
            }

            busCurrent[0] = Complex.Zero;

            // Forward sweep: voltages from the service down. The largest change is compared by its square.
            var movedSquared = 0.0;
            var finite = true;
            for (var i = 1; i < n; i++)
            {
                var (parent, role, _) = link[i];
                var after = bus[parent] - (current[i] * zPu[i]);
                double squared;
                if (role == Role.Transformer)
                {
                    var onBus = ratio[i] * (after - (current[i] * zTransformer[i]));
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

            // Not finite: a voltage collapse. A square beyond the double range is still a finite (large) change.
            var moved = !finite ? double.NaN : (double.IsPositiveInfinity(movedSquared) ? double.MaxValue : Math.Sqrt(movedSquared));
            if (moved < TolerancePu)
            {
                return Result(true, iteration);
            }

            if (!double.IsFinite(moved))
            {
                return Result(false, iteration);
            }
        }

        return Result(false, MaxIterations);
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
