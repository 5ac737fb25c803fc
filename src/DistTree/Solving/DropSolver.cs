using System.Globalization;
using System.Numerics;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// Solves the voltage drop of every run and every end point of a tree (DESIGN.md section 4) by the percent-sum
/// method and by an exact load flow, and finds every limit exceeded on the method the rules choose. Walks the
/// node array iteratively: bottom-up for power, top-down for totals, bottom-up again for reach.
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
        var project = network.Project;
        var rules = project.Rules;
        var nodes = network.Nodes;
        var n = nodes.Count;
        var frequency = project.Service.FrequencyHz;

        var power = new ComplexPower[n];
        var continuous = new ComplexPower[n];
        AccumulatePower(nodes, power, continuous);
        var phases = new PhaseFlow(network, power);

        // Runs in network order, each transformer's row after its primary feeder's.
        var runs = new List<RunResult>(n + 8);
        var lineDrops = new List<double[]>(n + 8);
        var incomingRow = new int[n];
        var transformerRow = new int[n];
        Array.Fill(incomingRow, -1);
        Array.Fill(transformerRow, -1);
        for (var i = 0; i < n; i++)
        {
            var node = nodes[i];
            if (node.Incoming is { } run)
            {
                incomingRow[i] = runs.Count;
                var (row, drops) = SolveRun(run, power, continuous[i], rules, frequency, phases);
                runs.Add(row);
                lineDrops.Add(drops);
            }

            if (node.Equipment?.Transformer is { } transformer)
            {
                transformerRow[i] = runs.Count;
                var (row, drops) = SolveTransformer(node, transformer, power[i], rules, phases);
                runs.Add(row);
                lineDrops.Add(drops);
            }
        }

        var flow = SolveLoadFlow(network, power, runs, incomingRow);
        ChooseMethod(network, runs, incomingRow, transformerRow, flow, rules);
        for (var r = 0; r < runs.Count; r++)
        {
            if (runs[r].Kind != RunResultKind.Transformer)
            {
                runs[r] = runs[r] with { Findings = RunFindings(runs[r], nodes[runs[r].NodeIndex].Incoming!.Conductors) };
            }
        }

        var endPoints = SolveEndPoints(network, runs, lineDrops, incomingRow, transformerRow, power, flow, phases, rules);
        AddReach(network, runs, incomingRow, endPoints, rules);
        var findings = runs.Sum(r => r.Findings.Count) + endPoints.Sum(e => e.Findings.Count);
        var worst = endPoints.Count == 0 ? null : endPoints.OrderByDescending(e => e.TotalDropPercent).ThenBy(e => e.Id, StringComparer.Ordinal).First();
        return new Solution
        {
            Project = project,
            Network = network,
            Runs = runs,
            EndPoints = endPoints,
            Summary = new SolutionSummary(endPoints.Count, runs.Count, findings, worst?.TotalDropPercent ?? 0.0, worst?.Id),
            LoadFlow = flow,
            Panels = nodes.Where(x => x.Equipment is { Circuits.Count: > 0 }).Select(phases.Panel).ToArray(),
            CatalogName = _catalog.SourceName,
        };
    }

    // Bottom-up: an end point's power is its load; a node's is the phasor sum of its children's times its demand factor.
    private static void AccumulatePower(IReadOnlyList<NetworkNode> nodes, ComplexPower[] power, ComplexPower[] continuous)
    {
        for (var i = nodes.Count - 1; i >= 0; i--)
        {
            var node = nodes[i];
            if (node.Circuit is { } circuit)
            {
                try
                {
                    power[i] = LoadPower.Of(circuit.Load, circuit.Supply);
                }
                catch (ArgumentException e)
                {
                    throw ProjectException.At(circuit.Location, e.Message);
                }

                continuous[i] = circuit.Continuous ? power[i] : ComplexPower.Zero;
            }
            else
            {
                var factor = node.Equipment?.DemandFactor ?? 1.0;
                power[i] *= factor;
                continuous[i] *= factor;
            }

            if (node.ParentIndex >= 0)
            {
                power[node.ParentIndex] += power[i];
                continuous[node.ParentIndex] += continuous[i];
            }
        }
    }

    // A run's figures, and the drop in percent that each kind of circuit below sees on it (see LineDrops).
    private (RunResult Row, double[] LineDrops) SolveRun(NetworkRun run, ComplexPower[] power, ComplexPower continuousPart, Rules rules, double frequencyHz, PhaseFlow phases)
    {
        var supply = run.Supply;
        var conductors = run.Conductors;
        var index = run.Target.Index;
        var carried = power[index];
        var lineA = phases.MaxLineCurrentA(index);
        var points = run.Target.Circuit?.Points ?? [];
        var currentA = run.Kind == RunKind.Branch && points.Count == 0 ? BranchCurrent(lineA, conductors.OcpdA, rules.BranchCurrent) : lineA;

        // Design current: 125 % of the continuous part plus the rest, as a phasor sum: S + 0.25·S_continuous.
        var designA = LoadPower.CurrentA((carried + (continuousPart * 0.25)).VoltAmperes, supply);
        var figures = RunElectrics.Compute(
            _catalog, rules, conductors, conductors.Size, conductors.Sets, supply, frequencyHz, currentA, carried.PowerFactor, carried.SinTheta);
        var system = run.Source.System;
        double[] unitR, unitX;
        if (points.Count > 0)
        {
            unitR = Uniform(SpanDropV(points, supply, conductors, 1, 0) / supply.VoltageV * 100.0);
            unitX = Uniform(SpanDropV(points, supply, conductors, 0, 1) / supply.VoltageV * 100.0);
        }
        else
        {
            var km = conductors.LengthM / 1000.0 / conductors.Sets;
            var scale = lineA > 0 ? currentA / lineA : 1.0;
            Span<Complex> deltaV = stackalloc Complex[3];
            phases.RunDeltaV(index, new Complex(km, 0), system.HasNeutral, scale, deltaV);
            unitR = LineDrops(deltaV, system);
            phases.RunDeltaV(index, new Complex(0, km), system.HasNeutral, scale, deltaV);
            unitX = LineDrops(deltaV, system);
        }

        var ownLines = run.Kind == RunKind.Branch ? (int)phases.Assigned[index] : 0;
        var ownDrop = OwnDrop(unitR, unitX, figures.ResistanceOhmPerKm, figures.ReactanceOhmPerKm, ownLines);
        figures = figures with { DropPercent = ownDrop, DropV = ownDrop / 100.0 * supply.VoltageV };

        var row = new RunResult
        {
            Id = run.Id,
            Kind = run.Kind == RunKind.Branch ? RunResultKind.Branch : RunResultKind.Feeder,
            From = run.Source.Id,
            To = run.Target.Id,
            NodeIndex = run.Target.Index,
            System = run.Source.System.Name,
            VoltageV = supply.VoltageV,
            Phases = supply.Phases,
            CurrentA = currentA,
            DesignCurrentA = designA,
            PowerFactor = carried.PowerFactor,
            ApparentPowerVa = carried.VoltAmperes,
            Size = conductors.Size.Text,
            Material = conductors.Material == Material.Copper ? "cu" : "al",
            Raceway = RacewayWord(conductors.Raceway),
            Sets = conductors.Sets,
            LengthM = conductors.LengthM,
            TemperatureC = figures.TemperatureC,
            ResistanceOhmPerKm = figures.ResistanceOhmPerKm,
            ReactanceOhmPerKm = figures.ReactanceOhmPerKm,
            AmpacityA = figures.AmpacityA,
            OcpdA = conductors.OcpdA,
            DropV = figures.DropV,
            DropPercent = figures.DropPercent,
            PercentSumDropPercent = figures.DropPercent,
            LimitPercent = run.LimitPercent,
            NeutralCurrentA = system.HasNeutral ? phases.NeutralCurrentA(index) : null,
            LineCurrentsA = phases.LineCurrentsA(index, PhaseRules.Lines(system)),
            Lines = run.Kind == RunKind.Branch ? PhaseRules.Text(phases.Assigned[index]) : null,
            UnitDropsR = unitR,
            UnitDropsX = unitX,
            OwnLines = ownLines,
            Location = conductors.Location,
        };
        return (row, Enumerable.Range(0, 8).Select(set => (figures.ResistanceOhmPerKm * unitR[set]) + (figures.ReactanceOhmPerKm * unitX[set])).ToArray());
    }

    /// <summary>A run's own drop: on a branch circuit's lines, or for a feeder the worst that any circuit below sees.</summary>
    internal static double OwnDrop(double[] unitR, double[] unitX, double r, double x, int ownLines)
    {
        if (ownLines > 0)
        {
            return (r * unitR[ownLines]) + (x * unitX[ownLines]);
        }

        var worst = double.NegativeInfinity;
        for (var set = 1; set < 8; set++)
        {
            worst = Math.Max(worst, (r * unitR[set]) + (x * unitX[set]));
        }

        return worst;
    }

    // The drop a circuit below sees on this run, by the lines it is on: index (int)Phases (1 = A … 7 = ABC).
    private static double[] LineDrops(ReadOnlySpan<Complex> deltaV, ElectricalSystem system)
    {
        var drops = new double[8];
        for (var set = 1; set < 8; set++)
        {
            drops[set] = PhaseFlow.DropPercent(deltaV, (Phases)set, system);
        }

        return drops;
    }

    private static double[] Uniform(double dropPercent)
    {
        var drops = new double[8];
        Array.Fill(drops, dropPercent);
        return drops;
    }

    // Loads along a run: span by span, each span carrying the phasor sum of the loads beyond it, at the
    // resistance and reactance of the whole run (temperature from the head current, the safe side).
    private static double SpanDropV(IReadOnlyList<LoadPoint> points, CircuitSupply supply, Run conductors, double resistanceOhmPerKm, double reactanceOhmPerKm)
    {
        var k = supply.Phases == 3 ? Math.Sqrt(3) : 2.0;
        var beyond = new ComplexPower[points.Count];
        var sum = ComplexPower.Zero;
        for (var j = points.Count - 1; j >= 0; j--)
        {
            sum += LoadPower.Of(points[j].Load, supply);
            beyond[j] = sum;
        }

        var dropV = 0.0;
        var from = 0.0;
        for (var j = 0; j < points.Count; j++)
        {
            var spanKm = (points[j].AtM - from) / 1000.0;
            var currentA = LoadPower.CurrentA(beyond[j].VoltAmperes, supply);
            dropV += k * currentA * spanKm * ((resistanceOhmPerKm * beyond[j].PowerFactor) + (reactanceOhmPerKm * beyond[j].SinTheta)) / conductors.Sets;
            from = points[j].AtM;
        }

        return dropV;
    }

    private static string RacewayWord(Raceway raceway) => raceway switch
    {
        Raceway.Pvc => "pvc",
        Raceway.Aluminum => "aluminum",
        _ => "steel",
    };

    private static double BranchCurrent(double connectedA, double? ocpdA, BranchCurrentBasis basis) => (basis, ocpdA) switch
    {
        (BranchCurrentBasis.Ocpd80, { } ocpd) => 0.8 * ocpd,
        (BranchCurrentBasis.Lesser, { } ocpd) => Math.Min(connectedA, 0.8 * ocpd),
        _ => connectedA,
    };

    // The load flow on the same impedances the percent sum used.
    private static LoadFlowResult SolveLoadFlow(DistributionNetwork network, ComplexPower[] power, List<RunResult> runs, int[] incomingRow)
    {
        var n = network.Nodes.Count;
        var z = new Complex[n];
        for (var i = 0; i < n; i++)
        {
            if (incomingRow[i] >= 0)
            {
                var r = runs[incomingRow[i]];
                var km = r.LengthM / 1000.0 / r.Sets;
                z[i] = new Complex(r.ResistanceOhmPerKm!.Value * km, r.ReactanceOhmPerKm!.Value * km);
            }
        }

        return LoadFlow.Solve(network, power, z);
    }

    // Records the load flow's drops beside the percent sum's, and makes the chosen method's the ones that count.
    private static void ChooseMethod(DistributionNetwork network, List<RunResult> runs, int[] incomingRow, int[] transformerRow, LoadFlowResult flow, Rules rules)
    {
        if (!flow.Converged)
        {
            if (rules.Method == SolutionMethod.LoadFlow)
            {
                throw ProjectException.At(network.Project.Service.Location, Invariant(
                    $"the load flow did not converge in {flow.Iterations} sweeps: the loads are too heavy for the conductors and transformers (a voltage collapse); fix the worst runs, or use 'method: percent_sum' to see them"));
            }

            return;
        }

        var nodes = network.Nodes;
        void Record(int row, double drop)
        {
            var r = runs[row];
            runs[row] = rules.Method == SolutionMethod.LoadFlow
                ? r with { LoadFlowDropPercent = drop, DropPercent = drop, DropV = drop / 100.0 * r.VoltageV }
                : r with { LoadFlowDropPercent = drop };
        }

        for (var i = 1; i < nodes.Count; i++)
        {
            if (incomingRow[i] >= 0)
            {
                Record(incomingRow[i], (flow.BusPu[nodes[i].ParentIndex] - flow.InputPu[i]) * 100.0);
            }

            if (transformerRow[i] >= 0)
            {
                Record(transformerRow[i], (flow.InputPu[i] - flow.BusPu[i]) * 100.0);
            }
        }
    }

    private List<Finding> RunFindings(RunResult r, Run conductors)
    {
        var findings = new List<Finding>();
        var what = r.Kind == RunResultKind.Branch ? "branch circuit" : "feeder";
        if (r.LimitPercent is { } limit && r.DropPercent > limit + 1e-9)
        {
            findings.Add(new Finding(
                r.Kind == RunResultKind.Branch ? FindingKind.BranchDrop : FindingKind.FeederDrop,
                r.Id,
                r.DropPercent,
                limit,
                Invariant($"{what} {r.Id}: drop {r.DropPercent:0.00} % ({r.DropV:0.0} V of {r.VoltageV:0} V at {r.CurrentA:0.0} A over {r.LengthM:0.0} m of {r.Size}) exceeds its {limit:0.##} % limit"),
                r.Location));
        }

        if (r.AmpacityA is { } ampacity)
        {
            if (r.DesignCurrentA > ampacity + 1e-9)
            {
                findings.Add(new Finding(
                    FindingKind.Ampacity,
                    r.Id,
                    r.DesignCurrentA,
                    ampacity,
                    Invariant($"{what} {r.Id}: design current {r.DesignCurrentA:0.0} A (125 % of continuous load plus the rest) exceeds the {r.Sets}×{r.Size} ampacity of {ampacity:0.#} A"),
                    r.Location));
            }

            if (r.OcpdA is { } ocpd && !OcpdRatings.Permits(ocpd, ampacity))
            {
                findings.Add(new Finding(
                    FindingKind.OcpdAboveAmpacity,
                    r.Id,
                    ocpd,
                    ampacity,
                    Invariant($"{what} {r.Id}: the {ocpd:0} A overcurrent device is above the {r.Sets}×{r.Size} ampacity of {ampacity:0.#} A (and not the next standard rating above it)"),
                    r.Location));
            }
        }

        if (r.OcpdA is { } device && _catalog.SmallConductorMaxOcpdA(conductors.Size, conductors.Material) is { } smallMax && device > (smallMax * conductors.Sets) + 1e-9)
        {
            findings.Add(new Finding(
                FindingKind.OcpdAboveAmpacity,
                r.Id,
                device,
                smallMax,
                Invariant($"{what} {r.Id}: a {r.Size} {r.Material} conductor may be protected at {smallMax:0} A at most (small-conductor rule), not {device:0} A"),
                r.Location));
        }

        return findings;
    }

    // Regulation ≈ (%R·cos θ + %X·sin θ)·(S/S_rated) − tap, %R = %Z/√(1 + (X/R)²), %X = %R·X/R (common practice).
    // Per secondary line: (%R·P_x + %X·Q_x)/(S_rated/lines) − tap; balanced, the same as the three-phase formula.
    private static (RunResult Row, double[] LineDrops) SolveTransformer(NetworkNode node, TransformerData data, ComplexPower carried, Rules rules, PhaseFlow phases)
    {
        var supply = data.Secondary.FeederSupply;
        var (percentR, percentX) = PercentRx(data);
        var loading = carried.VoltAmperes / (data.Kva * 1000.0);
        var perLine = new double[3];
        phases.TransformerRegulation(node.Index, data, percentR, percentX, perLine);
        var drops = new double[8];
        for (var set = 1; set < 8; set++)
        {
            var on = PhaseFlow.LinesOf((Phases)set, PhaseRules.Lines(data.Secondary));
            drops[set] = on.Count == 0 ? perLine[0] : (on.Count == 2 ? (perLine[on[0]] + perLine[on[1]]) / 2 : on.Max(x => perLine[x]));
        }

        var dropPercent = drops[(int)Phases.ABC];
        var ratedA = LoadPower.CurrentA(data.Kva * 1000.0, supply);
        var currentA = LoadPower.CurrentA(carried.VoltAmperes, supply);
        var findings = new List<Finding>();
        if (loading > 1 + 1e-9)
        {
            findings.Add(new Finding(
                FindingKind.TransformerOverload,
                node.Id,
                carried.VoltAmperes / 1000.0,
                data.Kva,
                Invariant($"transformer {node.Id}: load {carried.VoltAmperes / 1000.0:0.0} kVA exceeds its {data.Kva:0.#} kVA rating ({loading * 100:0} %)"),
                node.Equipment!.Location));
        }

        var row = new RunResult
        {
            Id = node.Id,
            Kind = RunResultKind.Transformer,
            From = node.Id,
            To = node.Id,
            NodeIndex = node.Index,
            System = data.Secondary.Name,
            VoltageV = supply.VoltageV,
            Phases = supply.Phases,
            CurrentA = currentA,
            DesignCurrentA = currentA,
            PowerFactor = carried.PowerFactor,
            ApparentPowerVa = carried.VoltAmperes,
            AmpacityA = ratedA,
            DropV = dropPercent / 100.0 * supply.VoltageV,
            DropPercent = dropPercent,
            PercentSumDropPercent = dropPercent,
            CountsInTotal = rules.TransformerDrop == TransformerDropMode.Count,
            Findings = findings,
            Location = node.Equipment!.Location,
        };
        return (row, drops);
    }

    private static (double PercentR, double PercentX) PercentRx(TransformerData data)
    {
        var percentR = data.ImpedancePercent / Math.Sqrt(1 + (data.XOverR * data.XOverR));
        return (percentR, percentR * data.XOverR);
    }

    private static List<EndPointResult> SolveEndPoints(
        DistributionNetwork network, List<RunResult> runs, List<double[]> lineDrops, int[] incomingRow, int[] transformerRow, ComplexPower[] power,
        LoadFlowResult flow, PhaseFlow phases, Rules rules)
    {
        var nodes = network.Nodes;
        var newOrigin = rules.TransformerDrop == TransformerDropMode.NewOrigin;
        var endPoints = new List<EndPointResult>();
        var counted = new List<int>();
        var path = new List<string>();
        foreach (var node in nodes)
        {
            if (node.Circuit is not { } circuit)
            {
                continue;
            }

            counted.Clear();
            path.Clear();
            var counting = true;
            for (var i = node.Index; i >= 0; i = nodes[i].ParentIndex)
            {
                path.Add(nodes[i].Id);
                if (transformerRow[i] >= 0 && i != node.Index)
                {
                    if (counting && !newOrigin)
                    {
                        counted.Add(transformerRow[i]);
                    }

                    counting &= !newOrigin;
                }

                if (counting && incomingRow[i] >= 0)
                {
                    counted.Add(incomingRow[i]);
                }
            }

            path.Reverse();
            double percentSum = 0, loadFlow = 0;

            // Walking up from the end point: its own lines, until a transformer between systems of different
            // line counts, above which the worst line counts (the safe side).
            var set = (int)phases.Assigned[node.Index];
            var shares = new double[counted.Count];
            for (var k = 0; k < counted.Count; k++)
            {
                var r = counted[k];
                shares[counted.Count - 1 - k] = rules.Method == SolutionMethod.LoadFlow && flow.Converged ? runs[r].LoadFlowDropPercent!.Value : lineDrops[r][set];
                percentSum += lineDrops[r][set];
                loadFlow += runs[r].LoadFlowDropPercent ?? 0;
                if (runs[r].Kind == RunResultKind.Transformer && nodes[runs[r].NodeIndex].Equipment is { Transformer: { } t } e
                    && PhaseRules.Lines(t.Secondary) != PhaseRules.Lines(e.System))
                {
                    set = (int)Phases.ABC;
                }
            }

            counted.Reverse();
            var total = rules.Method == SolutionMethod.LoadFlow && flow.Converged ? loadFlow : percentSum;

            var limit = rules.TotalLimitPercent;
            var findings = new List<Finding>(1);
            if (total > limit + 1e-9)
            {
                findings.Add(new Finding(
                    FindingKind.TotalDrop,
                    circuit.FullId,
                    total,
                    limit,
                    Invariant($"end point {circuit.FullId}: total drop {total:0.00} % from {(newOrigin && counted.Count < path.Count - 1 ? "its origin" : "the service")} exceeds the {limit:0.##} % limit"),
                    circuit.Location));
            }

            var start = circuit.Load.IsMotor ? MotorStartCheck(network, runs, incomingRow, transformerRow, node, power[node.Index], rules) : null;
            if (start is not null && start.TerminalDipPercent > start.LimitPercent + 1e-9)
            {
                findings.Add(new Finding(
                    FindingKind.MotorStart,
                    circuit.FullId,
                    start.TerminalDipPercent,
                    start.LimitPercent,
                    Invariant($"motor {circuit.FullId}: while starting ({start.LockedRotorVa / 1000:0.#} kVA locked-rotor) its terminals dip {start.TerminalDipPercent:0.0} % and its panel {start.PanelDipPercent:0.0} %, over the {start.LimitPercent:0.##} % limit"),
                    circuit.Location));
            }

            endPoints.Add(new EndPointResult
            {
                Id = circuit.FullId,
                Name = circuit.Name,
                Panel = nodes[node.ParentIndex].Id,
                NodeIndex = node.Index,
                Path = path.ToArray(),
                RunIndices = counted.ToArray(),
                RunSharesPercent = shares,
                VoltageV = circuit.Supply.VoltageV,
                TotalDropPercent = total,
                PercentSumTotalDropPercent = percentSum,
                LoadFlowTotalDropPercent = flow.Converged ? loadFlow : null,
                LoadFlowEndVoltageV = flow.Converged ? flow.InputPu[node.Index] * circuit.Supply.VoltageV : null,
                LimitPercent = limit,
                EndVoltageV = circuit.Supply.VoltageV * (1 - (total / 100.0)),
                MotorStart = start,
                Findings = findings,
            });
        }

        return endPoints;
    }

    // The extra drop of ΔS = S_locked-rotor − S_running on each run: 100·(ΔP·R_loop + ΔQ·X_loop)/V², R_loop and
    // X_loop the run's impedance (both conductors for single-phase); on a transformer (%R·ΔP + %X·ΔQ)/S_rated.
    // Superposed on the steady drops of the whole path (a new origin does not stop a physical dip).
    private static MotorStartResult MotorStartCheck(
        DistributionNetwork network, List<RunResult> runs, int[] incomingRow, int[] transformerRow, NetworkNode motor, ComplexPower running, Rules rules)
    {
        var nodes = network.Nodes;
        var lockedRotor = MotorStarting.LockedRotor(motor.Circuit!.Load, running);
        var delta = lockedRotor + (running * -1.0);
        double terminal = 0, panel = 0;
        for (var i = motor.Index; i > 0; i = nodes[i].ParentIndex)
        {
            var extraHere = 0.0;
            var steadyHere = 0.0;
            if (incomingRow[i] >= 0)
            {
                var r = runs[incomingRow[i]];
                var loop = r.Phases == 3 ? 1.0 : 2.0;
                var km = r.LengthM / 1000.0 / r.Sets * loop;
                extraHere += 100.0 * ((delta.Watts * r.ResistanceOhmPerKm!.Value * km) + (delta.Vars * r.ReactanceOhmPerKm!.Value * km)) / (r.VoltageV * r.VoltageV);
                steadyHere += r.DropPercent;
            }

            if (transformerRow[i] >= 0 && i != motor.Index)
            {
                var t = nodes[i].Equipment!.Transformer!;
                var (percentR, percentX) = PercentRx(t);
                extraHere += ((percentR * delta.Watts) + (percentX * delta.Vars)) / (t.Kva * 1000.0);
                steadyHere += runs[transformerRow[i]].DropPercent;
            }

            terminal += extraHere + steadyHere;
            if (i != motor.Index)
            {
                panel += extraHere + steadyHere;
            }
        }

        return new MotorStartResult(lockedRotor.VoltAmperes, terminal, panel, rules.MotorStartLimitPercent);
    }

    // Reach. Own limit: drop is proportional to length (current and temperature do not depend on it; points
    // scale with the run), so L_max = L·limit/drop. Total: the least slack (limit − total) of the end points
    // whose totals include the run, found bottom-up; L_max = L·(drop + slack)/drop.
    private static void AddReach(DistributionNetwork network, List<RunResult> runs, int[] incomingRow, List<EndPointResult> endPoints, Rules rules)
    {
        var nodes = network.Nodes;
        var slack = new double[nodes.Count];
        Array.Fill(slack, double.PositiveInfinity);
        foreach (var e in endPoints)
        {
            slack[e.NodeIndex] = e.LimitPercent - e.TotalDropPercent;
        }

        var newOrigin = rules.TransformerDrop == TransformerDropMode.NewOrigin;
        for (var i = nodes.Count - 1; i > 0; i--)
        {
            var node = nodes[i];
            var visible = newOrigin && node.Kind == NodeKind.Transformer ? double.PositiveInfinity : slack[i];
            if (incomingRow[i] >= 0)
            {
                var row = runs[incomingRow[i]];
                runs[incomingRow[i]] = row with
                {
                    MaxLengthM = Reach(row.LengthM, row.DropPercent, row.LimitPercent!.Value),
                    MaxLengthTotalM = double.IsPositiveInfinity(visible) ? null : Reach(row.LengthM, row.DropPercent, row.DropPercent + visible),
                };
            }

            var parent = node.ParentIndex;
            slack[parent] = Math.Min(slack[parent], visible);
        }
    }

    private static double? Reach(double lengthM, double dropPercent, double allowedPercent) =>
        dropPercent <= 0 ? null : Math.Max(0.0, lengthM * allowedPercent / dropPercent);

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
