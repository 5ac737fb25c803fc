using System.Numerics;
using DistTree.Codes;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>The currents of the study from the buses' impedances (see <see cref="FaultSolver"/>).</summary>
internal static partial class FaultSolver
{
    // The far end of run into node i (the minimum: hot, c_min, no motors): the smallest of the faults its conductors can
    // make (two lines, a line and the neutral, a line and the grounding conductor), against its device's instantaneous trip.
    private static FarEndFault? FarEnd(NetworkNode node, NetworkRun run, Sequences hot, int i, RunImpedances impedances, CodeRules code, double factorMin)
    {
        var system = run.System;
        var lines = run.Target.Circuit is { } circuit ? circuit.Poles : PhaseRules.Lines(system);
        var uLn = LineVoltages.LineToNeutralV(system);
        var (z1, z0n, z0g) = (hot.Z1[i], hot.Z0n[i], hot.Z0g[i]);
        var (least, kind) = (double.PositiveInfinity, FaultKind.LineToGround);
        if (lines >= 2 && system.LineToLineV is { } vll)
        {
            Consider(factorMin * vll / (2 * z1).Magnitude, FaultKind.LineToLine, ref least, ref kind);
        }

        if (RunImpedances.HasNeutral(run) && Sequences.Has(z0n))
        {
            Consider(factorMin * uLn / (((2 * z1) + z0n) / 3).Magnitude, FaultKind.LineToNeutral, ref least, ref kind);
        }

        if (Sequences.Has(z0g))
        {
            Consider(factorMin * uLn / (((2 * z1) + z0g) / 3).Magnitude, FaultKind.LineToGround, ref least, ref kind);
        }

        if (double.IsPositiveInfinity(least))
        {
            return null;
        }

        // The same fault at the run's source end (its own impedance nothing): the most any size of this run could give.
        var p = node.ParentIndex;
        var (p1, p0n, p0g) = (hot.Z1[p], hot.Z0n[p], hot.Z0g[p]);
        var above = kind switch
        {
            FaultKind.LineToLine => factorMin * system.LineToLineV!.Value / (2 * p1).Magnitude,
            FaultKind.LineToNeutral => factorMin * uLn / (((2 * p1) + p0n) / 3).Magnitude,
            FaultKind.LineToGround => factorMin * uLn / (((2 * p1) + p0g) / 3).Magnitude,
            FaultKind.ThreePhase => factorMin * uLn / p1.Magnitude,
        };

        var (ground, groundBasis) = impedances.Ground(i, run);
        return new FarEndFault(least, kind, code.InstantaneousTripA(run.Conductors), run.Conductors, ground, groundBasis) { SourceEndA = above };
    }

    private static void Consider(double currentA, FaultKind of, ref double least, ref FaultKind kind)
    {
        if (currentA < least)
        {
            (least, kind) = (currentA, of);
        }
    }

    // The maximum currents at every piece of equipment (a transformer's at its secondary terminals), and a finding where
    // its stated rating is below the largest.
    private static EquipmentFault[] Equipment(DistributionNetwork network, Sequences cold, MotorBelow? below, CodeRules code, double factorMax, ref int findings)
    {
        var nodes = network.NodeArray;
        var list = new List<EquipmentFault>();
        for (var i = 1; i < nodes.Length; i++)
        {
            if (nodes[i].Equipment is not { } equipment)
            {
                continue;
            }

            var system = PhaseFrame.BusSystem(nodes[i]);
            var z1 = below is null ? cold.Z1[i] : Parallel(cold.Z1[i], below.Down[i]);
            var (bolted, lg, xr) = BusCurrents(system, z1, cold.Z0n[i], cold.Z0g[i], factorMax);
            var fault = new EquipmentFault(equipment.Id, equipment.Kind, i, system.Name, Ka(bolted), Ka(lg), bolted is null ? null : xr, equipment.InterruptingKa, []);
            if (equipment.InterruptingKa is { } rating && fault.LargestKa is { } largest && largest > rating * (1 + 1e-9))
            {
                fault = fault with { Findings = [code.InterruptingFinding(equipment, fault, largest)] };
                findings++;
            }

            list.Add(fault);
        }

        return [.. list];
    }

    /// <summary>
    /// A bus's largest bolted current between conductors (three-phase on three lines; the larger of line to line and line
    /// to neutral on a single-phase bus; line to neutral on one line), its line-to-ground current, amperes, and the X/R of
    /// the largest; null where the impedance is zero (unbounded) or the path is missing.
    /// </summary>
    internal static (double? Bolted, double? LineToGround, double XOverR) BusCurrents(ElectricalSystem system, Complex z1, Complex z0n, Complex z0g, double factor)
    {
        var uLn = LineVoltages.LineToNeutralV(system);
        var lines = PhaseRules.Lines(system);
        var (bolted, xr) = (0.0, 0.0);
        if (lines == 3)
        {
            (bolted, xr) = (Current(factor * uLn, z1), Ratio(z1));
        }
        else
        {
            if (lines == 2)
            {
                (bolted, xr) = (Current(factor * system.LineToLineV!.Value, 2 * z1), Ratio(z1));
            }

            if (Sequences.Has(z0n))
            {
                var loop = ((2 * z1) + z0n) / 3;
                var ln = Current(factor * uLn, loop);
                (bolted, xr) = ln > bolted ? (ln, Ratio(loop)) : (bolted, xr);
            }
        }

        double? lg = Sequences.Has(z0g) ? Current(factor * uLn, ((2 * z1) + z0g) / 3) : null;
        return (double.IsFinite(bolted) ? bolted : null, lg is { } g && double.IsFinite(g) ? g : null, xr);
    }

    private static double Current(double volts, Complex loop) => volts / loop.Magnitude;

    private static double Ratio(Complex z) => z.Real == 0 ? double.PositiveInfinity : z.Imaginary / z.Real;

    private static double? Ka(double? amperes) => amperes / 1000.0;
}
