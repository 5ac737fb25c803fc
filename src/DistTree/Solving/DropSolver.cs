using System.Globalization;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// Solves the voltage drop of every run and every end point of a tree by the percent-sum method
/// (DESIGN.md section 4), and finds every limit exceeded. Walks the node array iteratively:
/// bottom-up for power, top-down for totals, bottom-up again for reach.
/// </summary>
public sealed class DropSolver
{
    private readonly ConductorCatalog _catalog;

    /// <summary>Creates a solver that takes conductor data from <paramref name="catalog"/>.</summary>
    public DropSolver(ConductorCatalog catalog) => _catalog = catalog;

    /// <summary>A solver on the embedded catalogue.</summary>
    public static DropSolver Standard { get; } = new(ConductorCatalog.Standard);

    /// <summary>Solves <paramref name="network"/>.</summary>
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

        var runs = new List<RunResult>(n + 8);
        var incomingRow = new int[n];
        var transformerRow = new int[n];
        Array.Fill(incomingRow, -1);
        Array.Fill(transformerRow, -1);
        var totalIn = new double[n];
        var totalOut = new double[n];
        for (var i = 0; i < n; i++)
        {
            var node = nodes[i];
            var before = node.ParentIndex >= 0 ? totalOut[node.ParentIndex] : 0.0;
            if (node.Incoming is { } run)
            {
                incomingRow[i] = runs.Count;
                var row = SolveRun(run, power[i], continuous[i], rules, frequency);
                runs.Add(row);
                before += row.DropPercent;
            }

            totalIn[i] = before;
            totalOut[i] = before;
            if (node.Equipment?.Transformer is { } transformer)
            {
                transformerRow[i] = runs.Count;
                var row = SolveTransformer(node, transformer, power[i], rules);
                runs.Add(row);
                totalOut[i] = rules.TransformerDrop == TransformerDropMode.NewOrigin ? 0.0 : before + row.DropPercent;
            }
        }

        var endPoints = SolveEndPoints(network, runs, incomingRow, transformerRow, totalIn, rules);
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

    private RunResult SolveRun(NetworkRun run, ComplexPower carried, ComplexPower continuousPart, Rules rules, double frequencyHz)
    {
        var supply = run.Supply;
        var conductors = run.Conductors;
        var connectedA = LoadPower.CurrentA(carried.VoltAmperes, supply);
        var currentA = run.Kind == RunKind.Branch ? BranchCurrent(connectedA, conductors.OcpdA, rules.BranchCurrent) : connectedA;
        // Design current: 125 % of the continuous part plus the rest, as a phasor sum: S + 0.25·S_continuous.
        var designA = LoadPower.CurrentA((carried + (continuousPart * 0.25)).VoltAmperes, supply);
        var figures = RunElectrics.Compute(
            _catalog, rules, conductors, conductors.Size, conductors.Sets, supply, frequencyHz, currentA, carried.PowerFactor, carried.SinTheta);
        var result = new RunResult
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
            LimitPercent = run.LimitPercent,
            Location = conductors.Location,
        };
        return result with { Findings = RunFindings(result, conductors) };
    }

    private static string RacewayWord(Raceway raceway) => raceway switch
    {
        Conductors.Raceway.Pvc => "pvc",
        Conductors.Raceway.Aluminum => "aluminum",
        Conductors.Raceway.Steel => "steel",
        _ => raceway.ToString().ToLowerInvariant(),
    };

    private static double BranchCurrent(double connectedA, double? ocpdA, BranchCurrentBasis basis) => (basis, ocpdA) switch
    {
        (BranchCurrentBasis.Ocpd80, { } ocpd) => 0.8 * ocpd,
        (BranchCurrentBasis.Lesser, { } ocpd) => Math.Min(connectedA, 0.8 * ocpd),
        _ => connectedA,
    };

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

        if (r.OcpdA is { } device && _catalog.SmallConductorMaxOcpdA(conductors.Size, conductors.Material) is { } smallMax && device > smallMax * conductors.Sets + 1e-9)
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
    private static RunResult SolveTransformer(NetworkNode node, TransformerData data, ComplexPower carried, Rules rules)
    {
        var supply = data.Secondary.FeederSupply;
        var percentR = data.ImpedancePercent / Math.Sqrt(1 + (data.XOverR * data.XOverR));
        var percentX = percentR * data.XOverR;
        var loading = carried.VoltAmperes / (data.Kva * 1000.0);
        var dropPercent = (((percentR * carried.PowerFactor) + (percentX * carried.SinTheta)) * loading) - data.TapPercent;
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

        return new RunResult
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
            CountsInTotal = rules.TransformerDrop == TransformerDropMode.Count,
            Findings = findings,
            Location = node.Equipment!.Location,
        };
    }

    private static List<EndPointResult> SolveEndPoints(
        DistributionNetwork network, List<RunResult> runs, int[] incomingRow, int[] transformerRow, double[] totalIn, Rules rules)
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
            counted.Reverse();
            var total = totalIn[node.Index];
            var limit = rules.TotalLimitPercent;
            var findings = total > limit + 1e-9
                ? new[]
                {
                    new Finding(
                        FindingKind.TotalDrop,
                        circuit.FullId,
                        total,
                        limit,
                        Invariant($"end point {circuit.FullId}: total drop {total:0.00} % from {(newOrigin && counted.Count < path.Count - 1 ? "its origin" : "the service")} exceeds the {limit:0.##} % limit"),
                        circuit.Location),
                }
                : [];
            endPoints.Add(new EndPointResult
            {
                Id = circuit.FullId,
                Name = circuit.Name,
                Panel = nodes[node.ParentIndex].Id,
                NodeIndex = node.Index,
                Path = path.ToArray(),
                RunIndices = counted.ToArray(),
                VoltageV = circuit.Supply.VoltageV,
                TotalDropPercent = total,
                LimitPercent = limit,
                EndVoltageV = circuit.Supply.VoltageV * (1 - (total / 100.0)),
                Findings = findings,
            });
        }

        return endPoints;
    }

    // Reach. Own limit: drop is proportional to length (current and temperature do not depend on it), so
    // L_max = L·limit/drop. Total: the least slack (limit − total) of the end points whose totals include
    // the run, found bottom-up; L_max = L·(drop + slack)/drop.
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
            if (incomingRow[i] >= 0)
            {
                var row = runs[incomingRow[i]];
                var visible = newOrigin && node.Kind == NodeKind.Transformer ? double.PositiveInfinity : slack[i];
                runs[incomingRow[i]] = row with
                {
                    MaxLengthM = Reach(row.LengthM, row.DropPercent, row.LimitPercent!.Value),
                    MaxLengthTotalM = double.IsPositiveInfinity(visible) ? null : Reach(row.LengthM, row.DropPercent, row.DropPercent + visible),
                };
            }

            var up = newOrigin && node.Kind == NodeKind.Transformer ? double.PositiveInfinity : slack[i];
            var parent = node.ParentIndex;
            slack[parent] = Math.Min(slack[parent], up);
        }
    }

    private static double? Reach(double lengthM, double dropPercent, double allowedPercent) =>
        dropPercent <= 0 ? null : Math.Max(0.0, lengthM * allowedPercent / dropPercent);

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
