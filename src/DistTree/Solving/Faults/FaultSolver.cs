using System.Numerics;
using DistTree.Codes;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// Short-circuit currents by the ohmic method of IEC 60909-0 (an equivalent voltage source c·U_n/√3 at the fault, every
/// other source shorted, symmetrical components with the negative-sequence impedance equal to the positive), on the
/// impedances of the voltage drop: the utility's source, each transformer's leakage (Dyn1 blocks the zero sequence; a
/// single-phase transformer sees the loop of the two primary lines it is across), and each run's lines, neutral and
/// grounding conductor, sets in parallel. Two cases:
/// <list type="bullet">
/// <item>maximum, at every piece of equipment: c_max, conductors at 20 °C, transformers' impedance corrected by
/// K_T = 0.95·c_max/(1 + 0.6·x_T) (IEC 60909-0 eq. 12a; recalled), three-phase induction motors feeding in through their
/// branch circuits as a source of <see cref="MotorMultiple"/> times full-load current (common practice) at
/// R/X = 0.42 (IEC 60909-0 for low-voltage motors; recalled);</item>
/// <item>minimum, at every run's far end: c_min, conductors at their insulation's rated temperature, no motors, no K_T.</item>
/// </list>
/// Each bus keeps three impedances, ohms per phase: the positive sequence Z1 and the zero sequence returning by the
/// neutral (Z0n) or by the grounding conductors (Z0g), so that the loops are 2·Z1 between two lines, (2·Z1 + Z0n)/3 line
/// to neutral and (2·Z1 + Z0g)/3 line to ground. A run adds Z to Z1 and Z + 3·Z_return to each Z0, whether it has three
/// lines or two; a single-phase bus keeps its loops in the same form. The passes are two walks of the node array.
/// </summary>
internal static partial class FaultSolver
{
    /// <summary>The multiple of full-load current a three-phase induction motor feeds into a nearby fault (common practice: about 4).</summary>
    public const double MotorMultiple = 4.0;

    // IEC 60909-0's R/X of low-voltage motors (groups of motors with their cables): 0.42 (recalled).
    private const double MotorROverX = 0.42;

    /// <summary>The conductor temperature of the maximum currents (IEC 60909-0: 20 °C).</summary>
    internal const double ColdC = 20;

    /// <summary>
    /// The study of <paramref name="network"/> (its frame <paramref name="frame"/>, its solved rows and each node's incoming
    /// row) judged by <paramref name="code"/>: a far-end finding is added to the run's own findings, an equipment finding
    /// to the study's. Gives the study and the number of findings it made.
    /// </summary>
    public static (FaultStudy Study, int Findings) Solve(DistributionNetwork network, PhaseFrame frame, SolvedRows solved, int[] incomingRow, CodeRules code)
    {
        var nodes = network.NodeArray;
        var n = nodes.Length;
        var rules = network.Project.Rules;
        var impedances = new RunImpedances(code, solved, incomingRow, n, network.Project.Service.FrequencyHz);
        var source = FaultSource.Of(network.Project.Service, rules.FaultVoltageFactorMax);
        using var hot = new Sequences(n);
        using var cold = new Sequences(n);
        source.Seed(hot, cold);

        // Maximum: the motors' admittance below every bus, bottom-up; then each bus's impedance looking up, top-down.
        var below = MotorAdmittances(network, frame, impedances, rules.FaultVoltageFactorMax);
        var farEnds = new FarEndRow[n];
        var findings = 0;
        for (var i = 1; i < n; i++)
        {
            var node = nodes[i];
            var parent = node.ParentIndex;
            var run = node.Incoming;

            // A feeder's grounding conductor is the code's minimum at once (its figures reach the equipment below); an end
            // point's at first the table's, made exact only where its far end does not clear with it.
            var exact = node.Circuit is null;
            cold.Through(parent, i, run is null ? RunZ.None : impedances.Of(i, run, hot: false, exact), ExcludingOwn(cold.Z1[parent], below, parent, i));
            hot.Through(parent, i, run is null ? RunZ.None : impedances.Of(i, run, hot: true, exact), hot.Z1[parent]);
            if (run is not null)
            {
                var farEnd = FarEnd(node, run, hot, i, impedances, code, rules.FaultVoltageFactorMin);
                if (farEnd is { Clears: false } && !impedances.GroundIsExact(i))
                {
                    hot.Through(parent, i, impedances.Of(i, run, hot: true, exact: true), hot.Z1[parent]);
                    farEnd = FarEnd(node, run, hot, i, impedances, code, rules.FaultVoltageFactorMin);
                }

                if (farEnd is { } end)
                {
                    var (ground, basis) = impedances.Ground(i, run);
                    farEnds[i] = new FarEndRow
                    {
                        MinimumA = end.MinimumCurrentA,
                        SourceEndA = end.SourceEndA,
                        TripA = end.TripCurrentA ?? double.NaN,
                        GroundIndex = (short)ground.Index,
                        Kind = end.Kind,
                        GroundBasis = basis,
                        Present = true,
                    };
                }

                if (farEnd is { Clears: false } f)
                {
                    var row = incomingRow[i];
                    solved.RunFindings[row] = [.. solved.RunFindings[row] ?? [], code.FaultClearingFinding(run, f)];
                    findings++;
                }
            }

            if (frame.Models[i] is { } model)
            {
                var data = node.Equipment!.Transformer!;
                cold.Transform(i, model, data.Secondary, KFactor(data, rules.FaultVoltageFactorMax));
                hot.Transform(i, model, data.Secondary, 1.0);
            }
        }

        var equipment = Equipment(network, cold, below, code, rules.FaultVoltageFactorMax, ref findings);
        return (new FaultStudy(source.Kind, rules.FaultVoltageFactorMax, rules.FaultVoltageFactorMin, equipment, farEnds, MotorMultiple, nodes), findings);
    }

    // K_T of IEC 60909-0 eq. (12a): 0.95·c_max/(1 + 0.6·x_T), x_T the transformer's reactance in per unit (recalled).
    internal static double KFactor(TransformerData data, double factorMax)
    {
        var xT = data.ImpedancePercent / 100.0 * Math.Sin(Math.Atan(data.XOverR));
        return 0.95 * factorMax / (1 + (0.6 * xT));
    }

    // The positive-sequence impedance looking up from the far end of the run into node i, without the motors of i's own
    // subtree: the parent bus's series impedance in parallel with every other motor below it, then the run.
    private static Complex ExcludingOwn(Complex parentUp, MotorBelow? below, int parent, int i)
    {
        if (below is null)
        {
            return parentUp;
        }

        var others = below.Down[parent] - below.Feeds[i];
        return Parallel(parentUp, others);
    }

    /// <summary>An impedance <paramref name="z"/> in parallel with an admittance <paramref name="y"/>; zero stays zero (an infinite bus).</summary>
    internal static Complex Parallel(Complex z, Complex y) => z == Complex.Zero || y == Complex.Zero ? z : 1.0 / ((1.0 / z) + y);

    // The motors' positive-sequence admittance at every bus, looking down (Down), and what each node's subtree feeds into
    // its parent's bus through its run (Feeds), at 20 °C; null where the tree has no three-phase motor.
    private static MotorBelow? MotorAdmittances(DistributionNetwork network, PhaseFrame frame, RunImpedances impedances, double factorMax)
    {
        var nodes = network.NodeArray;
        MotorBelow? below = null;
        for (var i = nodes.Length - 1; i > 0; i--)
        {
            var node = nodes[i];
            if (node.Circuit is { Poles: 3, Load.IsMotor: true } circuit && node.Incoming is { } run
                && PhaseRules.Lines(run.System) == 3 && circuit.Load.FullLoadCurrentA(circuit.Supply) is { } fla and > 0)
            {
                below ??= new MotorBelow(nodes.Length);
                var zm = LineVoltages.LineToNeutralV(run.System) / (MotorMultiple * fla);
                below.Down[i] = 1.0 / Complex.FromPolarCoordinates(zm, Math.Atan(1 / MotorROverX));
            }

            if (below is null || below.Down[i] == Complex.Zero)
            {
                continue;
            }

            var into = 1.0 / below.Down[i];
            if (frame.Models[i] is { Connection: WindingConnection.DeltaWye } model)
            {
                var data = node.Equipment!.Transformer!;
                into = (into + (KFactor(data, factorMax) * model.LeakageOhms)) / (3 * model.Ratio * model.Ratio);
            }
            else if (frame.Models[i] is not null)
            {
                continue; // a single-phase transformer: no three-phase motor feeds through it
            }

            if (node.Incoming is { } incoming)
            {
                into += impedances.Of(i, incoming, hot: false, exact: false).Line;
            }

            var feeds = 1.0 / into;
            below.Feeds[i] = feeds;
            below.Down[node.ParentIndex] += feeds;
        }

        return below;
    }
}

/// <summary>The motors' admittances of a tree: per node, looking down from its bus, and what its subtree feeds its parent's bus.</summary>
internal sealed class MotorBelow(int n)
{
    public Complex[] Down { get; } = new Complex[n];

    public Complex[] Feeds { get; } = new Complex[n];
}
