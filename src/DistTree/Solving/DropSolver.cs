using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving.Passes;

namespace DistTree.Solving;

/// <summary>
/// Solves the voltage drop of every run and every end point of a tree (DESIGN.md section 4) by the percent-sum
/// method and by an exact load flow, and finds every limit exceeded on the method the rules choose. The solve is a
/// few passes over the node array, each with one job (see <c>Solving/Passes</c> and DEVELOPERS.md, The solver):
/// the power and the phase currents bottom-up, the runs' drops and the transformers' regulation, the load flow,
/// the end points' totals and motor starts, and the reach.
/// </summary>
public sealed class DropSolver
{
    private readonly ConductorCatalog _catalog;

    /// <summary>Creates a solver that takes conductor data from <paramref name="catalog"/>.</summary>
    public DropSolver(ConductorCatalog catalog) => _catalog = catalog;

    /// <summary>A solver on the embedded catalogue.</summary>
    public static DropSolver Standard { get; } = new(ConductorCatalog.Standard);

    /// <summary>Solves <paramref name="network"/>. Throws <see cref="ProjectException"/> when the rules ask for the load flow and it does not converge.</summary>
    public Solution Solve(DistributionNetwork network)
    {
        var n = network.NodeArray.Length;

        // Bottom-up: each node's power and what it has; each circuit's lines; each node's line currents, their continuous
        // part and each line's largest motor.
        using var sums = new PowerSums(network);
        var assigned = new Phases[n];
        PhaseAssignment.Assign(network, sums.Power, assigned);
        var frame = PhaseFrame.Of(network);
        var phases = PhaseCurrents.Solve(network, frame, sums.Power, assigned, AnyContinuous(network));
        var motors = LargestMotors.Of(network, sums, assigned);
        var catalog = network.Project.Rules.ConductorCatalog ?? _catalog;
        var code = CodeRules.For(network.Project.Rules, catalog);

        // Each run's figures and drops and each transformer's regulation, in rows; then the load flow on the same
        // impedances, whose drops are recorded beside the percent sum's. A run's findings follow from its drop: on
        // the percent sum they are found with its figures; on the load flow, once it is solved.
        using var runs = new RunRows(sums.Has, n);
        var findings = RunDrops.Solve(catalog, code, network, sums, phases, motors, runs);
        if (motors is not null)
        {
            Scratch.Return(motors, n * 3);
        }

        var (flow, voltagesTaken) = LoadFlow.Solve(network, phases, sums.Power, runs);
        using var voltages = voltagesTaken;
        LoadFlowDrops.Record(network, phases, runs, flow, voltages);
        if (network.Project.Rules.Method != SolutionMethod.PercentSum)
        {
            findings += RunFindings.OnLoadFlow(network.NodeArray, runs, code, network.Project.Units);
        }

        // The end points' totals, findings and motor starts; then each run's reach from them.
        var points = EndPointTotals.Solve(network, sums, phases, runs, flow, voltages, code);
        Reach.Add(network, runs, points.EndPoints.Rows);
        var solved = new SolvedRows(network, phases, sums.Power, new SolvedRuns(runs.Rows, runs.Findings), points.EndPoints, code);

        // The short-circuit study on the same impedances: the maximum at every piece of equipment, the minimum at every
        // run's far end (its findings join the run's).
        var (faults, faultFindings) = FaultSolver.Solve(network, frame, solved, runs.IncomingRow, code);
        return Result(network, solved, runs.Count, findings + points.Findings + faultFindings, points.Worst, flow, code, faults);
    }

    // True when any load of the tree is continuous (its currents' continuous part is then worked out too).
    private static bool AnyContinuous(DistributionNetwork network)
    {
        foreach (var node in network.NodeArray)
        {
            if (node.Circuit is { Continuous: true, Load.IsMotor: false })
            {
                return true;
            }
        }

        return false;
    }

    // The solution over the solved rows, with each panel's phase loads.
    private Solution Result(DistributionNetwork network, SolvedRows solved, int runCount, int findings, int worstIndex, LoadFlowResult flow, CodeRules code, FaultStudy faults)
    {
        var endPoints = new ViewList<EndPointResult>(solved.EndPoints.Length, e => new EndPointResult(solved, e));
        EndPointResult? worst = worstIndex < 0 ? null : endPoints[worstIndex];
        return new Solution
        {
            Project = network.Project,
            Network = network,
            Runs = new ViewList<RunResult>(runCount, r => new RunResult(solved, r)),
            EndPoints = endPoints,
            Summary = new SolutionSummary(endPoints.Count, runCount, findings, worst?.TotalDropPercent ?? 0.0, worst?.Id),
            LoadFlow = flow,
            Panels = Panels(network, solved.Phases, solved.Power),
            CatalogName = code.Catalog.SourceName,
            Code = code,
            Faults = faults,
        };
    }

    // Each panel's phase loads, in node order. Only a node with children can be a panel with circuits, so the end
    // points (nearly all the nodes) are passed over without reading them.
    private static PanelResult[] Panels(DistributionNetwork network, PhaseFlow phases, ComplexPower[] power)
    {
        var (nodes, childStarts) = (network.NodeArray, network.Levels.ChildStarts);
        var panels = new List<PanelResult>();
        for (var i = 0; i < nodes.Length; i++)
        {
            if (childStarts[i + 1] > childStarts[i] && nodes[i].Equipment is { Circuits.Count: > 0 })
            {
                var connected = ComplexPower.Zero;
                for (var child = childStarts[i]; child < childStarts[i + 1]; child++)
                {
                    connected += power[child];
                }

                panels.Add(phases.Panel(nodes[i]) with { ConnectedVa = connected.VoltAmperes });
            }
        }

        return panels.ToArray();
    }
}
