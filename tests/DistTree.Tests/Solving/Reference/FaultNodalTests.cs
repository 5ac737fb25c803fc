using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using Complex = System.Numerics.Complex;

namespace DistTree.Tests.Solving.Reference;

/// <summary>
/// The short-circuit study (issue 23) against an independent solution of the same circuit: each project built as a
/// <see cref="ProjectCircuit"/> in phase coordinates (lines, neutral, Dyn1 and single-phase windings, no loads, so the
/// voltage before the fault is nominal) and solved by modified nodal analysis (MathNet.Numerics) with a bolted fault
/// added: two lines shorted, a line shorted to the neutral, or a line joined to the grounded source through the run's
/// grounding conductors (their impedance summed from the fault back to the grounded neutral of the service or the
/// transformer's secondary). The study's currents are those of the equivalent voltage source c·U_n/√3 of IEC 60909-0,
/// so they must equal c times the nodal currents: c_min at the far ends (conductors at their rated temperature,
/// `conductor_temperature: rated` makes the reference's the same), c_max at the equipment (conductors at 20 °C).
/// Invented data.
/// </summary>
public sealed class FaultNodalTests
{
    private const string Head = """
        disttree: 1
        project: { name: Fault reference case, units: metric }

        """;

    // No loads (at constant impedance, so that one across the fault draws nothing). Far ends: a 208Y/120 panel with 1-, 2- and 3-pole circuits; a Dyn1 transformer's panel; a centre-tapped
    // single-phase transformer across B–C with 1- and 2-pole circuits.
    public static TheoryData<string> FarEndCases => ["PanelOnService", "BehindDyn1", "BehindCentreTap"];

    private static readonly Dictionary<string, string> Cases = new(StringComparer.Ordinal)
    {
        ["PanelOnService"] = """
            rules: { conductor_temperature: rated }
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 40, size: 2 AWG, ground_size: 8 AWG, ocpd: 100 }
                circuits:
                  - { id: "1", poles: 1, ocpd: 20, load: { va: 0, model: impedance }, run: { length: 30, size: 12 AWG, ground_size: 12 AWG } }
                  - { id: "2", poles: 2, ocpd: 30, load: { va: 0, model: impedance }, run: { length: 25, size: 10 AWG, ground_size: 10 AWG } }
                  - { id: "3", poles: 3, ocpd: 40, load: { va: 0, model: impedance }, run: { length: 45, size: 8 AWG, ground_size: 10 AWG } }
            """,
        ["BehindDyn1"] = """
            rules: { conductor_temperature: rated }
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: T1
                kind: transformer
                from: SVC
                kva: 75
                secondary: 208Y/120
                impedance_percent: 4.5
                x_r: 2.5
                feeder: { length: 20, size: 4 AWG, ground_size: 8 AWG, ocpd: 125 }
              - id: LP
                kind: panelboard
                from: T1
                feeder: { length: 15, size: 2/0 AWG, ground_size: 6 AWG, ocpd: 200 }
                circuits:
                  - { id: "1", poles: 1, ocpd: 20, load: { va: 0, model: impedance }, run: { length: 35, size: 12 AWG, ground_size: 12 AWG } }
                  - { id: "2", poles: 3, ocpd: 30, load: { va: 0, model: impedance }, run: { length: 20, size: 10 AWG, ground_size: 10 AWG } }
            """,
        ["BehindCentreTap"] = """
            rules: { conductor_temperature: rated }
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: T2
                kind: transformer
                from: SVC
                kva: 25
                secondary: 120/240
                impedance_percent: 3
                x_r: 1.5
                phase: BC
                feeder: { length: 10, size: 6 AWG, ground_size: 10 AWG, ocpd: 125 }
              - id: LP
                kind: panelboard
                from: T2
                feeder: { length: 8, size: 1/0 AWG, ground_size: 6 AWG, ocpd: 125 }
                circuits:
                  - { id: "1", poles: 1, ocpd: 20, load: { va: 0, model: impedance }, run: { length: 30, size: 12 AWG, ground_size: 12 AWG } }
                  - { id: "2", poles: 2, ocpd: 30, load: { va: 0, model: impedance }, run: { length: 25, size: 10 AWG, ground_size: 10 AWG } }
            """,
        ["ColdPanels"] = """
            rules: { conductor_temperature: 20 }
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: DP
                kind: switchboard
                from: SVC
                feeder: { length: 25, size: 250 kcmil, ground_size: 4 AWG, ocpd: 250 }
              - id: HP
                kind: panelboard
                from: DP
                feeder: { length: 40, size: 3 AWG, ground_size: 8 AWG, ocpd: 100 }
                circuits:
                  - { id: "1", poles: 1, ocpd: 20, load: { va: 0, model: impedance }, run: { length: 30, size: 12 AWG, ground_size: 12 AWG } }
            """,
    };

    [Theory]
    [MemberData(nameof(FarEndCases))]
    public void FarEnd_MinimumCurrent_EqualsNodalFaultTimesCMin(string name)
    {
        var analysis = ReferenceHarness.Analyse(Head + Cases[name]);
        var study = analysis.Solution.Faults!;
        var checkedCount = 0;
        foreach (var node in analysis.Network.Nodes)
        {
            if (node.Circuit is not { } circuit)
            {
                continue;
            }

            var farEnd = study.FarEndAt(node.Index)!.Value;
            var nodal = double.PositiveInfinity;
            foreach (var kind in KindsOf(circuit, node.System))
            {
                nodal = Math.Min(nodal, NodalFault(analysis, node, kind, hot: true));
            }

            // Reference: modified nodal analysis of the same circuit (MathNet.Numerics), times c_min = 0.95 (IEC 60909-0, recalled).
            Assert.Equal(0.95 * nodal, farEnd.MinimumCurrentA, 1e-6 * nodal);
            checkedCount++;
        }

        Assert.True(checkedCount >= 2);
    }

    [Fact]
    public void Equipment_MaximumCurrents_EqualNodalFaultsTimesCMax()
    {
        var analysis = ReferenceHarness.Analyse(Head + Cases["ColdPanels"]);
        foreach (var id in new[] { "DP", "HP" })
        {
            var node = analysis.Network.Nodes.Single(n => n.Id == id);
            var fault = analysis.Solution.Faults!.Equipment.Single(e => e.Id == id);

            // Reference: nodal three-phase and line-to-ground faults at the bus, times c_max = 1.05 (IEC 60909-0, recalled).
            var threePhase = NodalFault(analysis, node, FaultKind.ThreePhase, hot: false);
            var lineToGround = NodalFault(analysis, node, FaultKind.LineToGround, hot: false);
            Assert.Equal(1.05 * threePhase / 1000, fault.AvailableFaultCurrentKa!.Value, 1e-6 * threePhase / 1000);
            Assert.Equal(1.05 * lineToGround / 1000, fault.AvailableFaultCurrentLgKa!.Value, 1e-6 * lineToGround / 1000);
        }
    }

    // The faults a circuit's conductors can make at its far end.
    private static IEnumerable<FaultKind> KindsOf(Circuit circuit, ElectricalSystem system)
    {
        if (circuit.Poles >= 2)
        {
            yield return FaultKind.LineToLine;
        }

        if (circuit.Poles == 1 && system.HasNeutral)
        {
            yield return FaultKind.LineToNeutral;
        }

        yield return FaultKind.LineToGround;
    }

    // The current of a bolted fault of the given kind at the far end of node's run (an end point) or at node's bus
    // (equipment), from the nodal solution of the project's circuit with no loads and the fault added.
    private static double NodalFault(AnalysisResult analysis, NetworkNode node, FaultKind kind, bool hot)
    {
        var built = ProjectCircuit.Of(analysis);
        var circuit = built.Circuit;
        var (lines, neutral) = node.Circuit is not null ? built.EndOf(node.Circuit.FullId) : (built.BusOf(node.Index).Lines, built.BusOf(node.Index).Neutral);
        switch (kind)
        {
            case FaultKind.ThreePhase:
                {
                    var ab = circuit.AddVoltageSource(lines[0], lines[1], Complex.Zero);
                    circuit.AddVoltageSource(lines[1], lines[2], Complex.Zero);
                    return circuit.Solve().SourceCurrent(ab).Magnitude;
                }

            case FaultKind.LineToLine:
                {
                    var ab = circuit.AddVoltageSource(lines[0], lines[1], Complex.Zero);
                    return circuit.Solve().SourceCurrent(ab).Magnitude;
                }

            case FaultKind.LineToNeutral:
                {
                    var an = circuit.AddVoltageSource(lines[0], neutral, Complex.Zero);
                    return circuit.Solve().SourceCurrent(an).Magnitude;
                }

            default:
                {
                    var ground = circuit.AddImpedance(lines[0], NodalCircuit.Ground, GroundingPath(analysis, node, hot));
                    return circuit.Solve().ImpedanceCurrent(ground).Magnitude;
                }
        }
    }

    // The grounding conductors from node back to its grounded source (the service, or the transformer whose secondary it
    // is on), each set's stated ground_size in parallel: R at its rated temperature (hot) or 20 °C, X, per the catalogue.
    private static Complex GroundingPath(AnalysisResult analysis, NetworkNode node, bool hot)
    {
        var nodes = analysis.Network.Nodes;
        var catalog = ConductorCatalog.Standard;
        var f = analysis.Project.Service.FrequencyHz;
        var total = Complex.Zero;
        for (var at = node; at.ParentIndex >= 0 && at.Equipment?.Transformer is null; at = nodes[at.ParentIndex])
        {
            if (at.Incoming is { Conductors: var c })
            {
                var g = c.GroundSize!.Value;
                var t = hot ? ConductorCatalog.RatedTemperatureC(g, c.InsulationC) : 20;
                total += new Complex(catalog.AcResistanceOhmPerKm(g, c.Material, c.Raceway, t, f), catalog.ReactanceOhmPerKm(g, c.Raceway, f)) * (c.LengthM / 1000 / c.Sets);
            }
        }

        return total;
    }
}
