using System.Numerics;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Tests.Solving.Reference;

/// <summary>
/// The conductors at one point of the tree: a node per line (A, B, C, as many as the system has; 1 and 2 on a
/// single-phase system), and the neutral's node (<see cref="NodalCircuit.Ground"/> where it is grounded, −1 where
/// there is no neutral conductor).
/// </summary>
internal sealed record Bus(int[] Lines, int Neutral);

/// <summary>
/// A DistTree project as a <see cref="NodalCircuit"/>, by the phase-frame conventions of issue 17, built from the
/// project and its solution's run figures (each run's R and X at its solved temperature) and nothing else of the
/// solver: a balanced source at nominal voltage (behind the utility's impedance when the service gives its fault
/// current), every run's lines and neutral as impedances of their own without mutual coupling, the neutral grounded
/// at the service and at each transformer's secondary only, Dyn1 three-phase and single-phase (two-wire or
/// centre-tapped) transformers from ideal windings and leakage impedances, loads line-to-neutral, line-to-line or as
/// three equal deltas, span by span along a run's points. <see cref="EndPointDropsPercent()"/> gives the figures to
/// compare with the solver's.
/// </summary>
internal sealed partial class ProjectCircuit
{
    private readonly AnalysisResult _analysis;
    private readonly ConductorCatalog _catalog;
    private readonly Bus[] _buses;
    private readonly Dictionary<string, EndTerminals> _ends = new(StringComparer.Ordinal);

    private ProjectCircuit(AnalysisResult analysis, ConductorCatalog catalog)
    {
        _analysis = analysis;
        _catalog = catalog;
        _buses = new Bus[analysis.Network.Nodes.Count];
    }

    /// <summary>The lines and the neutral node (−1 for none) at the far end of end point <paramref name="id"/>'s run.</summary>
    public (int[] Lines, int Neutral) EndOf(string id) => (_ends[id].Lines, _ends[id].Neutral);

    /// <summary>The bus of the node at <paramref name="nodeIndex"/> (a transformer's: its secondary).</summary>
    public Bus BusOf(int nodeIndex) => _buses[nodeIndex];

    /// <summary>The circuit built.</summary>
    public NodalCircuit Circuit { get; } = new();

    private double FrequencyHz => _analysis.Project.Service.FrequencyHz;

    /// <summary>
    /// Builds the circuit of an analysed project. <paramref name="catalog"/> is the one the analysis used (the
    /// standard catalogue unless given); a run's neutral of another size takes its figures from it.
    /// Throws <see cref="NotSupportedException"/> for what the reference does not model (a demand factor other than 1).
    /// </summary>
    public static ProjectCircuit Of(AnalysisResult analysis, ConductorCatalog? catalog = null)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        catalog ??= ConductorCatalog.Standard;
        if (analysis.Solution.CatalogName != catalog.SourceName)
        {
            throw new ArgumentException($"the analysis used the catalogue '{analysis.Solution.CatalogName}', not '{catalog.SourceName}'");
        }

        var built = new ProjectCircuit(analysis, catalog);
        built.Build();
        return built;
    }

    /// <summary>
    /// Solves the circuit and gives each end point's drop in percent of its nominal voltage, by its id: a 1-pole end
    /// point's on |V_line − V_neutral| against the line-to-neutral voltage, a 2-pole's on |V_x − V_y| against the
    /// line-to-line voltage, a 3-pole's the worst (largest drop) of its three line-to-line voltages; at the far end of
    /// its run, or at the last of its points.
    /// </summary>
    public IReadOnlyDictionary<string, double> EndPointDropsPercent() => EndPointDropsPercent(Circuit.Solve());

    /// <summary>As <see cref="EndPointDropsPercent()"/> on a solution of <see cref="Circuit"/>.</summary>
    public IReadOnlyDictionary<string, double> EndPointDropsPercent(NodalSolution solution)
    {
        ArgumentNullException.ThrowIfNull(solution);
        var drops = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var (id, end) in _ends)
        {
            var volts = end.Poles switch
            {
                1 => solution.Between(end.Lines[0], end.Neutral).Magnitude,
                2 => solution.Between(end.Lines[0], end.Lines[1]).Magnitude,
                _ => Enumerable.Range(0, 3).Min(k => solution.Between(end.Lines[k], end.Lines[(k + 1) % 3]).Magnitude),
            };
            drops[id] = (end.NominalV - volts) / end.NominalV * 100;
        }

        return drops;
    }

    // Parent-first over the tree's nodes: each node's bus is made from its parent's.
    private void Build()
    {
        var nodes = _analysis.Network.Nodes;
        _buses[0] = AddService(_analysis.Project.Service);
        for (var i = 1; i < nodes.Count; i++)
        {
            var node = nodes[i];
            var parent = _buses[node.ParentIndex];
            if (node.Kind == NodeKind.EndPoint)
            {
                AddBranch(node, parent);
                continue;
            }

            var equipment = node.Equipment!;
            if (equipment.DemandFactor != 1.0)
            {
                throw new NotSupportedException($"'{equipment.Id}': the reference takes demand factors of 1 only, not {equipment.DemandFactor}");
            }

            var bus = node.Incoming is { } feeder ? AddFeeder(feeder, parent) : parent;
            _buses[i] = equipment.Transformer is { } transformer ? AddTransformer(equipment, transformer, bus) : bus;
        }
    }

    // A balanced set at nominal voltage from each line to the grounded neutral (a delta's virtual star point; the
    // midpoint of a 240 V two-wire system), each behind the utility's impedance when the service states its fault current.
    private Bus AddService(Service service)
    {
        var system = service.System;
        var emfs = SourceVoltages(system);
        var impedance = UtilityImpedance(service);
        var lines = new int[emfs.Length];
        for (var k = 0; k < emfs.Length; k++)
        {
            lines[k] = Circuit.AddNode($"{service.Id}.{Letter(k)}");
            if (impedance is { } z)
            {
                var emf = Circuit.AddNode($"{service.Id}.{Letter(k)}.emf");
                Circuit.AddVoltageSource(emf, NodalCircuit.Ground, emfs[k]);
                Circuit.AddImpedance(emf, lines[k], z);
            }
            else
            {
                Circuit.AddVoltageSource(lines[k], NodalCircuit.Ground, emfs[k]);
            }
        }

        return new Bus(lines, NodalCircuit.Ground);
    }

    /// <summary>
    /// The source's voltages from each line to the grounded neutral: three-phase V_LL/√3 at 0°, −120°, +120°; a
    /// two-line single-phase system (120/240, 240) ±V_LL/2; a one-line system its voltage at 0°.
    /// </summary>
    public static Complex[] SourceVoltages(ElectricalSystem system)
    {
        ArgumentNullException.ThrowIfNull(system);
        return PhaseRules.Lines(system) switch
        {
            3 => [.. Enumerable.Range(0, 3).Select(k => Complex.FromPolarCoordinates(system.LineToLineV!.Value / Math.Sqrt(3), -k * 2 * Math.PI / 3))],
            2 => [system.LineToLineV!.Value / 2, -system.LineToLineV!.Value / 2],
            _ => [system.LineToNeutralV!.Value],
        };
    }

    // Per line: three-phase V_LL/(√3·I_sc); single-phase the loop V/I_sc, halved between two lines; at angle atan(X/R).
    private static Complex? UtilityImpedance(Service service)
    {
        if (service.AvailableFaultCurrentKa is not { } ka)
        {
            return null;
        }

        var xOverR = service.FaultXOverR ?? throw new NotSupportedException("a fault current without its X/R");
        var system = service.System;
        var currentA = ka * 1000;
        var ohms = PhaseRules.Lines(system) switch
        {
            3 => system.LineToLineV!.Value / (Math.Sqrt(3) * currentA),
            2 => system.NominalV / currentA / 2,
            _ => system.NominalV / currentA,
        };
        return Complex.FromPolarCoordinates(ohms, Math.Atan(xOverR));
    }

    // A feeder: every line of its system, and the neutral where the system has one (a transformer's feeder: its
    // primary's, none for a delta primary), from the parent's bus to a new one.
    private Bus AddFeeder(NetworkRun feeder, Bus parent)
    {
        var figures = _analysis.Solution.IncomingRun(feeder.Target.Index) ?? throw new InvalidOperationException($"no run result for '{feeder.Id}'");
        var withNeutral = feeder.Target.Equipment!.System.HasNeutral;
        var km = feeder.Conductors.LengthM / 1000;
        return AddSpan(feeder.Id, parent, parent.Lines, withNeutral, LineImpedance(figures, feeder.Conductors, km), NeutralImpedance(figures, feeder.Conductors, km));
    }

    // A branch circuit on its lines (the solution's), with a neutral when it is 1-pole; split into spans at its points.
    private void AddBranch(NetworkNode node, Bus panel)
    {
        var circuit = node.Circuit!;
        var figures = _analysis.Solution.IncomingRun(node.Index) ?? throw new InvalidOperationException($"no run result for '{circuit.FullId}'");
        var phases = PhaseRules.Parse(figures.Lines ?? "") ?? throw new InvalidOperationException($"'{circuit.FullId}' has no lines");
        var lines = Enumerable.Range(0, 3).Where(k => ((int)phases & (1 << k)) != 0).Select(k => panel.Lines[k]).ToArray();
        var withNeutral = circuit.Poles == 1;
        var run = circuit.Run;
        IReadOnlyList<LoadPoint> points = circuit.Points.Count > 0 ? circuit.Points : [new LoadPoint(run.LengthM, circuit.Load)];
        var bus = new Bus(lines, panel.Neutral);
        var atM = 0.0;
        foreach (var point in points)
        {
            if (point.AtM > atM)
            {
                var km = (point.AtM - atM) / 1000;
                bus = AddSpan($"{circuit.FullId}@{point.AtM}", bus, bus.Lines, withNeutral, LineImpedance(figures, run, km), NeutralImpedance(figures, run, km));
                atM = point.AtM;
            }

            AddLoad(circuit, point.Load, bus, NominalV(node.System, circuit.Poles));
        }

        _ends[circuit.FullId] = new EndTerminals(circuit.Poles, bus.Lines, bus.Neutral, NominalV(node.System, circuit.Poles));
    }

    // A span of conductors: an impedance per line and, when carried, the neutral's; returns the far bus.
    private Bus AddSpan(string name, Bus near, int[] nearLines, bool withNeutral, Complex line, Complex neutral)
    {
        var lines = new int[nearLines.Length];
        for (var k = 0; k < lines.Length; k++)
        {
            lines[k] = Circuit.AddNode($"{name}.{k + 1}");
            Circuit.AddImpedance(nearLines[k], lines[k], line);
        }

        var farNeutral = -1;
        if (withNeutral)
        {
            farNeutral = Circuit.AddNode($"{name}.N");
            Circuit.AddImpedance(near.Neutral, farNeutral, neutral);
        }

        return new Bus(lines, farNeutral);
    }

    // A load as the solver states it (complex power at the circuit's nominal voltage): 1-pole line to neutral, 2-pole
    // line to line, 3-pole three equal deltas of S/3 across AB, BC, CA.
    // Its power is S₀ at the base voltage across it (NominalV), which its model scales by |V|/V or |V|²/V².
    private void AddLoad(Circuit circuit, Load load, Bus at, double v)
    {
        var power = LoadPower.Of(load, circuit.Supply);
        var s = new Complex(power.Watts, power.Vars);
        switch (circuit.Poles)
        {
            case 1:
                Circuit.AddLoad(at.Lines[0], at.Neutral, load.Model, s, v);
                break;
            case 2:
                Circuit.AddLoad(at.Lines[0], at.Lines[1], load.Model, s, v);
                break;
            default:
                for (var k = 0; k < 3; k++)
                {
                    Circuit.AddLoad(at.Lines[k], at.Lines[(k + 1) % 3], load.Model, s / 3, v);
                }

                break;
        }
    }

    /// <summary>
    /// The base an end point's figure is in percent of, and the nominal voltage across its load: line to line for 2
    /// and 3 poles; for 1 pole V_LL/√3 on a three-phase system (the line-to-neutral base of issue 17: 120.09 V on
    /// 208Y/120), V_LL/2 on 120/240, the system's voltage on a one-line system.
    /// </summary>
    public static double NominalV(ElectricalSystem system, int poles)
    {
        ArgumentNullException.ThrowIfNull(system);
        return poles switch
        {
            1 when system.Phases == 3 => system.LineToLineV!.Value / Math.Sqrt(3),
            1 => system.LineToLineV is { } lineToLine ? lineToLine / 2 : system.LineToNeutralV!.Value,
            _ => system.LineToLineV!.Value,
        };
    }

    // (R + jX)·length/sets per line conductor, at the run's solved temperature.
    private static Complex LineImpedance(RunResult figures, Run run, double km) =>
        new Complex(figures.ResistanceOhmPerKm!.Value, figures.ReactanceOhmPerKm!.Value) * km / run.Sets;

    // The neutral: the lines' figures, or its own size's from the catalogue at the same temperature.
    private Complex NeutralImpedance(RunResult figures, Run run, double km)
    {
        if (run.NeutralSize is not { } size)
        {
            return LineImpedance(figures, run, km);
        }

        var r = _catalog.AcResistanceOhmPerKm(size, run.Material, run.Raceway, figures.TemperatureC!.Value, FrequencyHz);
        var x = _catalog.ReactanceOhmPerKm(size, run.Raceway, FrequencyHz);
        return new Complex(r, x) * km / run.Sets;
    }

    private static string Letter(int line) => ((char)('A' + line)).ToString();

    private readonly record struct EndTerminals(int Poles, int[] Lines, int Neutral, double NominalV);
}
