using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// The phase frame of a tree: every bus's nominal conductor voltages and every transformer's model (see
/// <see cref="TransformerModel"/>). The service is a balanced set at nominal line-to-line voltage, line A at 0°, the
/// line-to-neutral base V_LL/√3 (a two-line system: ±V_LL/2; one line: its nominal); each transformer turns the
/// set below it by its connection (Dyn1: −30°). The neutral is grounded at the service and at each transformer's
/// secondary, nowhere else.
/// </summary>
internal sealed class PhaseFrame
{
    private PhaseFrame(TransformerModel?[] models, Complex[] rotation, double[] noLoad, Complex sourceImpedance)
    {
        NoLoad = noLoad;
        SourceImpedance = sourceImpedance;
        Models = models;
        Rotation = rotation;
    }

    /// <summary>
    /// The utility's impedance in each line ahead of the service (Ω), from its available fault current and X/R: three
    /// phases V_LL/(√3·I_sc); single-phase the loop V/I_sc, split between two lines; or from its transformer's nameplate,
    /// %Z·V²/S the same way; zero for a stiff source.
    /// </summary>
    public Complex SourceImpedance { get; }

    /// <summary>Per node, its transformer's model, or null.</summary>
    public TransformerModel?[] Models { get; }

    /// <summary>Per node, the turn of its bus's nominal voltages from the service's.</summary>
    public Complex[] Rotation { get; }

    /// <summary>
    /// Per node, its bus's no-load voltage in per unit of nominal: 1, but below a tapped transformer the product of
    /// 1/(1 + tap) of every tap above. Loads draw their currents at it in the percent sum (the linearisation is about
    /// the no-load state).
    /// </summary>
    public double[] NoLoad { get; }

    /// <summary>The frame of <paramref name="network"/>: a model per transformer and each bus's turn, top-down.</summary>
    public static PhaseFrame Of(DistributionNetwork network)
    {
        var (nodes, parents) = (network.NodeArray, network.ParentIndices);
        var models = new TransformerModel?[nodes.Length];
        var rotation = Scratch.Uninitialized<Complex>(nodes.Length);
        var noLoad = Scratch.Uninitialized<double>(nodes.Length);
        (rotation[0], noLoad[0]) = (Complex.One, 1.0);
        for (var i = 1; i < nodes.Length; i++)
        {
            (rotation[i], noLoad[i]) = (rotation[parents[i]], noLoad[parents[i]]);
            if (nodes[i].Equipment?.Transformer is { } t)
            {
                var model = TransformerModel.Of(nodes[i], t, BusSystem(nodes[parents[i]]));
                models[i] = model;
                rotation[i] *= model.Rotation;
                noLoad[i] *= model.Ratio / model.RatioUntapped;
            }
        }

        return new PhaseFrame(models, rotation, noLoad, Source(network.Project.Service));
    }

    // The utility's impedance per line (see SourceImpedance).
    private static Complex Source(Service service)
    {
        var system = service.System;
        var lines = PhaseRules.Lines(system);
        if (service is { UtilityTransformerKva: { } kva, UtilityTransformerImpedancePercent: { } percent, FaultXOverR: { } txr })
        {
            // The utility's transformer: %Z·V²/S per phase on three lines, else the loop's, split between two lines.
            var loop = percent / 100.0 * system.NominalV * system.NominalV / (kva * 1000.0);
            return Complex.FromPolarCoordinates(lines == 2 ? loop / 2 : loop, Math.Atan(txr));
        }

        if (service is not { AvailableFaultCurrentKa: { } ka, FaultXOverR: { } xOverR })
        {
            return Complex.Zero;
        }

        var amperes = ka * 1000.0;
        var ohms = lines switch
        {
            3 => system.LineToLineV!.Value / (Math.Sqrt(3) * amperes),
            2 => system.NominalV / amperes / 2,
            _ => system.NominalV / amperes,
        };
        return Complex.FromPolarCoordinates(ohms, Math.Atan(xOverR));
    }

    /// <summary>The system on a node's bus: a transformer's secondary, else the node's own.</summary>
    public static ElectricalSystem BusSystem(NetworkNode node) => node.Equipment?.OutputSystem ?? node.System;

    /// <summary>Into <paramref name="v"/> (four conductors), the nominal voltages of a bus of <paramref name="system"/> turned by <paramref name="rotation"/>.</summary>
    public static void Nominal(ElectricalSystem system, Complex rotation, Span<Complex> v)
    {
        var lines = PhaseRules.Lines(system);
        var vln = LineVoltages.LineToNeutralV(system);
        for (var x = 0; x < 4; x++)
        {
            v[x] = x < lines ? vln * LineVoltages.Unit(x, lines) * rotation : Complex.Zero;
        }
    }

    /// <summary>A load's nominal voltages on <paramref name="system"/>: line to neutral (V_LL/√3 on three lines) and between two lines.</summary>
    public static (double SingleV, double PairV) LoadBases(ElectricalSystem system)
    {
        var single = LineVoltages.LineToNeutralV(system);
        return (single, system.LineToLineV ?? single);
    }

    /// <summary>Into <paramref name="v"/> (four conductors), the nominal voltages of node <paramref name="node"/>'s bus.</summary>
    public void Nominal(NetworkNode node, Span<Complex> v) => Nominal(BusSystem(node), Rotation[node.Index], v);
}
