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
        // Scratch arrays (see Scratch): only the first n elements are used.
        var zPu = Scratch.Rent<Complex>(n);
        var zTransformer = Scratch.Rent<Complex>(n);
        var ratio = Scratch.Rent<double>(n);
        var model = Scratch.Rent<LoadModel>(n);
        var demand = Scratch.Rent<double>(n);
        var s0 = Scratch.Rent<Complex>(n);
        var parent = network.ParentIndices;
        var isLoad = Scratch.Rent<bool>(n);
        var isTransformer = Scratch.Rent<bool>(n);
        for (var i = 0; i < n; i++)
        {
            var node = nodes[i];
            isLoad[i] = node.Circuit is not null;
            isTransformer[i] = node.Kind == NodeKind.Transformer;
            ratio[i] = 1.0;
            demand[i] = node.Equipment?.DemandFactor ?? 1.0;
            if (node.Incoming is { } run)
            {
                // Loop impedance: both conductors for single-phase (×2), one phase against V_LL for three-phase.
                var loop = run.Supply.Phases == 3 ? 1.0 : 2.0;
                zPu[i] = runImpedanceOhm[i] * loop * BaseVa / (run.Supply.VoltageV * run.Supply.VoltageV);
            }

            if (node.Equipment?.Transformer is { } t)
            {
                var r = t.ImpedancePercent / Math.Sqrt(1 + (t.XOverR * t.XOverR)) / 100.0;
                zTransformer[i] = new Complex(r, r * t.XOverR) * BaseVa / (t.Kva * 1000.0);
                ratio[i] = 1.0 + (t.TapPercent / 100.0);
            }

            if (node.Circuit is { } circuit)
            {
                model[i] = circuit.Load.Model;
                s0[i] = new Complex(loads[i].Watts, loads[i].Vars) / BaseVa;
            }
        }

        var input = Scratch.Rent<Complex>(n);
        var bus = Scratch.Rent<Complex>(n);
        input.AsSpan(0, n).Fill(Complex.One);
        bus.AsSpan(0, n).Fill(Complex.One);
        var current = Scratch.Rent<Complex>(n);
        var busCurrent = Scratch.Rent<Complex>(n);

        // The result, with the scratch arrays given back.
        LoadFlowResult Result(bool converged, int iterations)
        {
            var result = new LoadFlowResult(converged, iterations, Magnitudes(input, n), Magnitudes(bus, n));
            foreach (var array in new[] { zPu, zTransformer, s0, input, bus, current, busCurrent })
            {
                Scratch.Return(array, n);
            }

            Scratch.Return(ratio, n);
            Scratch.Return(demand, n);
            Scratch.Return(model, n);
            Scratch.Return(isLoad, n);
            Scratch.Return(isTransformer, n);
            return result;
        }

        for (var iteration = 1; iteration <= MaxIterations; iteration++)
        {
            // Backward sweep: currents from the end points up.
            busCurrent.AsSpan(0, n).Clear();
            for (var i = n - 1; i > 0; i--)
            {
                Complex drawn;
                if (isLoad[i])
                {
                    var v = input[i];
                    var s = model[i] switch
                    {
                        LoadModel.ConstantCurrent => s0[i] * v.Magnitude,
                        LoadModel.ConstantImpedance => s0[i] * v.Magnitude * v.Magnitude,
                        _ => s0[i],
                    };
                    drawn = Complex.Conjugate(s / v);
                }
                else
                {
                    drawn = busCurrent[i] * demand[i] * ratio[i];
                }

                current[i] = drawn;
                busCurrent[parent[i]] += drawn;
            }

            // Forward sweep: voltages from the service down. The largest change is compared by its square.
            var movedSquared = 0.0;
            var finite = true;
            for (var i = 1; i < n; i++)
            {
                var after = bus[parent[i]] - (current[i] * zPu[i]);
                var onBus = isTransformer[i] ? ratio[i] * (after - (current[i] * zTransformer[i])) : after;
                var changeIn = after - input[i];
                var changeBus = onBus - bus[i];
                var squared = Math.Max(
                    (changeIn.Real * changeIn.Real) + (changeIn.Imaginary * changeIn.Imaginary),
                    (changeBus.Real * changeBus.Real) + (changeBus.Imaginary * changeBus.Imaginary));
                movedSquared = squared > movedSquared ? squared : movedSquared;
                finite &= double.IsFinite(after.Real) && double.IsFinite(after.Imaginary) && double.IsFinite(onBus.Real) && double.IsFinite(onBus.Imaginary);
                input[i] = after;
                bus[i] = onBus;
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

    private static double[] Magnitudes(Complex[] values, int n)
    {
        var magnitudes = new double[n];
        for (var i = 0; i < n; i++)
        {
            magnitudes[i] = values[i].Magnitude;
        }

        return magnitudes;
    }
}
