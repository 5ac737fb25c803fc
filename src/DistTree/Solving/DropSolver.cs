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
    private readonly ProtectionRules _protection;

    /// <summary>Creates a solver that takes conductor data from <paramref name="catalog"/>.</summary>
    public DropSolver(ConductorCatalog catalog)
    {
        _catalog = catalog;
        _protection = new ProtectionRules(catalog);
    }

    /// <summary>A solver on the embedded catalogue.</summary>
    public static DropSolver Standard { get; } = new(ConductorCatalog.Standard);

    /// <summary>Solves <paramref name="network"/>. Throws <see cref="ProjectException"/> when the rules ask for the load flow and it does not converge.</summary>
    public Solution Solve(DistributionNetwork network)
    {
        var project = network.Project;
        var rules = project.Rules;
        var nodes = network.NodeArray;
        var n = nodes.Length;
        var frequency = project.Service.FrequencyHz;

        // Scratch arrays (see Scratch): only the first n (nodes) or count (rows) elements are used. The power,
        // the phase currents and the rows are the solution's own (see SolvedRows). The arrays that the passes
        // fill whole are made without clearing, so that their memory is first written on every core.
        var power = GC.AllocateUninitializedArray<ComplexPower>(n);
        var continuous = Scratch.RentToFill<ComplexPower>(n);
        var has = Scratch.RentToFill<Has>(n);
        var lockedRotor = Scratch.RentToFill<ComplexPower>(n); // read only for a motor, and written there
        AccumulatePower(nodes, network.ParentIndices, power, continuous, has, lockedRotor);
        var phases = new PhaseFlow(network, power, GC.AllocateUninitializedArray<Complex>(n * 3), new Phases[n]);

        // Rows in network order, each transformer's row after its primary feeder's, filled in stage by stage.
        var incomingRow = Scratch.RentToFill<int>(n);
        var transformerRow = Scratch.RentToFill<int>(n);
        var count = 0;
        for (var i = 0; i < n; i++)
        {
            incomingRow[i] = (has[i] & Has.Run) == 0 ? -1 : count++;
            transformerRow[i] = (has[i] & Has.Transformer) == 0 ? -1 : count++;
        }

        var rows = GC.AllocateUninitializedArray<RunRow>(count);
        var runFindings = new IReadOnlyList<Finding>?[count];
        var lineDrops = Scratch.RentToFill<double>(count * 8);
        var z = Scratch.RentToFill<Complex>(n); // read only where a run comes in, and written there

        // What later passes read of a run, kept by its row: they read only a run's rows, and the runs' pass writes them.
        var loopKm = Scratch.RentToFill<double>(count);
        var lengthM = Scratch.RentToFill<double>(count);
        var limitPercent = Scratch.RentToFill<double>(count);

        // A run's findings follow from its drop: on the percent sum, known as soon as the run is solved, so they are
        // found in the same pass, while the run's objects are at hand; on the load flow, once it is solved.
        var findingsWithRuns = rules.Method == SolutionMethod.PercentSum;
        var bases = new RunElectrics.Bases(_catalog, rules, frequency);
        var findings = 0;
        ParallelRanges.For(n, (start, end) =>
        {
            var found = 0;
            for (var i = start; i < end; i++)
            {
                var node = nodes[i];
                if (node.Incoming is { } run)
                {
                    var r = incomingRow[i];
                    ref var row = ref rows[r];
                    var drops = lineDrops.AsSpan(r * 8, 8);
                    drops.Clear();
                    SolveRun(ref row, run, bases, power, continuous[i], rules, frequency, phases, drops);
                    if (findingsWithRuns)
                    {
                        found += (runFindings[r] = RunFindings(ref row, run))?.Count ?? 0;
                    }

                    // The load flow's impedance of the run: its whole length, sets in parallel. Its loop, for the
                    // motor-start check: both conductors for single-phase.
                    var km = PerSetKm(run.Conductors);
                    z[i] = new Complex(row.ResistanceOhmPerKm * km, row.ReactanceOhmPerKm * km);
                    loopKm[r] = km * (run.Supply.Phases == 3 ? 1.0 : 2.0);
                    lengthM[r] = run.Conductors.LengthM;
                    limitPercent[r] = run.LimitPercent;
                }

                if (node.Equipment?.Transformer is { } transformer)
                {
                    var r = transformerRow[i];
                    var drops = lineDrops.AsSpan(r * 8, 8);
                    drops.Clear();
                    found += (runFindings[r] = SolveTransformer(ref rows[r], node, transformer, power[i], rules, phases, drops))?.Count ?? 0;
                }
            }

            Interlocked.Add(ref findings, found);
        });

        // The load flow on the same impedances the percent sum used.
        var flow = LoadFlow.Solve(network, power, z);
        Scratch.Return(z, n);
        ChooseMethod(network, rows, incomingRow, transformerRow, flow, rules);
        if (!findingsWithRuns)
        {
            ParallelRanges.For(count, (start, end) =>
            {
                var found = 0;
                for (var r = start; r < end; r++)
                {
                    ref var row = ref rows[r];
                    if (!row.IsTransformer)
                    {
                        found += (runFindings[r] = RunFindings(ref row, nodes[row.Node].Incoming!))?.Count ?? 0;
                    }
                }

                Interlocked.Add(ref findings, found);
            });
        }

        var points = SolveEndPoints(network, rows, phases, power, lineDrops, loopKm, lockedRotor, incomingRow, transformerRow, has, flow);
        AddReach(network, rows, incomingRow, lengthM, limitPercent, points.EndPoints.Rows, rules);
        Scratch.Return(lineDrops, count * 8);
        Scratch.Return(loopKm, count);
        Scratch.Return(lengthM, count);
        Scratch.Return(limitPercent, count);
        Scratch.Return(incomingRow, n);
        Scratch.Return(transformerRow, n);
        Scratch.Return(continuous, n);
        Scratch.Return(has, n);
        Scratch.Return(lockedRotor, n);

        var solved = new SolvedRows(network, phases, power, new SolvedRuns(rows, runFindings), points.EndPoints);
        var endPoints = new ViewList<EndPointResult>(points.EndPoints.Rows.Length, e => new EndPointResult(solved, e));
        EndPointResult? worst = points.Worst < 0 ? null : endPoints[points.Worst];

        // Each panel's phase loads, in node order. Only a node with children can be a panel with circuits, so the
        // end points (nearly all the nodes) are passed over without reading them.
        var childStarts = network.Levels.ChildStarts;
        var panels = new List<PanelResult>();
        for (var i = 0; i < n; i++)
        {
            if (childStarts[i + 1] > childStarts[i] && nodes[i].Equipment is { Circuits.Count: > 0 })
            {
                panels.Add(phases.Panel(nodes[i]));
            }
        }

        return new Solution
        {
            Project = project,
            Network = network,
            Runs = new ViewList<RunResult>(count, r => new RunResult(solved, r)),
            EndPoints = endPoints,
            Summary = new SolutionSummary(endPoints.Count, count, findings + points.Findings, worst?.TotalDropPercent ?? 0.0, worst?.Id),
            LoadFlow = flow,
            Panels = panels.ToArray(),
            CatalogName = _catalog.SourceName,
        };
    }

    // What a node has, read from its objects once (see AccumulatePower): the passes that need only this read a
    // byte, and the end points' pass reads an end point's objects only for a finding.
    [Flags]
    private enum Has : byte
    {
        None = 0,
        Circuit = 1,
        Run = 2,
        Transformer = 4,
        Motor = 8,
    }

    // Bottom-up: an end point's power is its load; a node's is the phasor sum of its children's times its demand factor.
    // Notes on the way what each node has, for the passes that need only that, and a motor's locked-rotor power
    // (its load is at hand here; an end point's demand factor is 1, so its power is the one the check would read).
    private static void AccumulatePower(
        NetworkNode[] nodes, int[] parents, ComplexPower[] power, ComplexPower[] continuous, Has[] has, ComplexPower[] lockedRotor)
    {
        // The end points' loads and the other nodes' demand factors first, each node on its own, on every core.
        // Each range runs from its last index down, so that on one thread the bad load met first is the same one
        // the plain bottom-up loop met first.
        var n = nodes.Length;
        var demand = Scratch.RentToFill<double>(n);
        ParallelRanges.For(n, (start, end) =>
        {
            for (var i = end - 1; i >= start; i--)
            {
                var node = nodes[i];
                demand[i] = node.Equipment?.DemandFactor ?? 1.0;
                has[i] = (node.Circuit is null ? Has.None : Has.Circuit)
                    | (node.Circuit is { Load.IsMotor: true } ? Has.Motor : Has.None)
                    | (node.Incoming is null ? Has.None : Has.Run)
                    | (node.Equipment?.Transformer is null ? Has.None : Has.Transformer);
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
                    if (circuit.Load.IsMotor)
                    {
                        lockedRotor[i] = MotorStarting.LockedRotor(circuit.Load, power[i]);
                    }
                }
                else
                {
                    power[i] = ComplexPower.Zero;
                    continuous[i] = ComplexPower.Zero;
                }
            }
        });

        // Then the sums, in flat arrays. An end point's factor is 1, and a product by 1 is exact: its load stays as it is.
        for (var i = n - 1; i >= 0; i--)
        {
            power[i] *= demand[i];
            continuous[i] *= demand[i];
            if (parents[i] >= 0)
            {
                power[parents[i]] += power[i];
                continuous[parents[i]] += continuous[i];
            }
        }

        Scratch.Return(demand, n);
    }

    // A run's figures, and into lineDrops the drop in percent that each kind of circuit below sees on it (see LineDrops).
    private void SolveRun(
        ref RunRow row, NetworkRun run, RunElectrics.Bases bases, ComplexPower[] power, ComplexPower continuousPart, Rules rules, double frequencyHz,
        PhaseFlow phases, Span<double> lineDrops)
    {
        var supply = run.Supply;
        var conductors = run.Conductors;
        var index = run.Target.Index;
        var carried = power[index];
        var lineA = phases.MaxLineCurrentA(index);
        var points = run.Target.Circuit?.Points ?? [];
        var currentA = run.Kind == RunKind.Branch && points.Count == 0 ? BranchCurrent(lineA, conductors.OcpdA, rules.BranchCurrent) : lineA;

        var designA = _protection.DesignCurrentA(carried, continuousPart, supply);
        var figures = RunElectrics.Compute(_catalog, rules, conductors, conductors.Size, conductors.Sets, frequencyHz, currentA, bases.Of(conductors));
        var ownLines = run.Kind == RunKind.Branch ? (int)phases.Assigned[index] : 0;
        double ownDrop;
        if (ownLines > 0 && points.Count == 0)
        {
            // A branch circuit's row is read on its own lines only, by the one end point it feeds: that set alone
            // is worked out (the others stay zero), by the same arithmetic as all of them.
            var (unitR, unitX) = phases.UnitDropsOn(index, PerSetKm(conductors), run.Source.System, LineScale(currentA, lineA), ownLines);
            ownDrop = (figures.ResistanceOhmPerKm * unitR) + (figures.ReactanceOhmPerKm * unitX);
            lineDrops[ownLines] = ownDrop;
        }
        else
        {
            Span<double> unitR = stackalloc double[8];
            Span<double> unitX = stackalloc double[8];
            UnitDrops(run, phases, currentA, lineA, unitR, unitX);
            ownDrop = OwnDrop(unitR, unitX, figures.ResistanceOhmPerKm, figures.ReactanceOhmPerKm, ownLines);
            for (var set = 0; set < 8; set++)
            {
                lineDrops[set] = (figures.ResistanceOhmPerKm * unitR[set]) + (figures.ReactanceOhmPerKm * unitX[set]);
            }
        }

        row = new RunRow
        {
            Node = index,
            CurrentA = currentA,
            DesignCurrentA = designA,
            TemperatureC = figures.TemperatureC,
            ResistanceOhmPerKm = figures.ResistanceOhmPerKm,
            ReactanceOhmPerKm = figures.ReactanceOhmPerKm,
            AmpacityA = figures.AmpacityA,
            OwnLines = ownLines,
            DropPercent = ownDrop,
            PercentSumDropPercent = ownDrop,
            VoltageV = supply.VoltageV,
        };
    }

    /// <summary>
    /// A run's unit drops (see <see cref="RunResult.UnitDrops"/>) at the current it carries and the largest of its
    /// line currents: loads along the run span by span, else the phase currents of what it feeds.
    /// </summary>
    internal static void UnitDrops(NetworkRun run, PhaseFlow phases, double currentA, double lineA, Span<double> unitR, Span<double> unitX)
    {
        var supply = run.Supply;
        var conductors = run.Conductors;
        var points = run.Target.Circuit?.Points ?? [];
        if (points.Count > 0)
        {
            unitR.Fill(SpanDropV(points, supply, conductors, 1, 0) / supply.VoltageV * 100.0);
            unitX.Fill(SpanDropV(points, supply, conductors, 0, 1) / supply.VoltageV * 100.0);
        }
        else
        {
            phases.UnitDrops(run.Target.Index, PerSetKm(conductors), run.Source.System, LineScale(currentA, lineA), unitR, unitX);
        }
    }

    // A run's length in km per set: the sets share the current.
    private static double PerSetKm(Run conductors) => conductors.LengthM / 1000.0 / conductors.Sets;

    // The phase currents scaled to the current the run is figured at (a branch circuit on its device's rating).
    private static double LineScale(double currentA, double lineA) => lineA > 0 ? currentA / lineA : 1.0;

    /// <summary>A run's own drop: on a branch circuit's lines, or for a feeder the worst that any circuit below sees.</summary>
    internal static double OwnDrop(ReadOnlySpan<double> unitR, ReadOnlySpan<double> unitX, double r, double x, int ownLines)
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

    private static double BranchCurrent(double connectedA, double? ocpdA, BranchCurrentBasis basis) => (basis, ocpdA) switch
    {
        (BranchCurrentBasis.Ocpd80, { } ocpd) => 0.8 * ocpd,
        (BranchCurrentBasis.Lesser, { } ocpd) => Math.Min(connectedA, 0.8 * ocpd),
        _ => connectedA,
    };

    // Records the load flow's drops beside the percent sum's, and makes the chosen method's the ones that count.
    private static void ChooseMethod(DistributionNetwork network, RunRow[] rows, int[] incomingRow, int[] transformerRow, LoadFlowResult flow, Rules rules)
    {
        if (!flow.Converged)
        {
            if (rules.Method == SolutionMethod.LoadFlow)
            {
                throw ProjectException.At(network.Project.Service.Location, string.Create(
                    CultureInfo.InvariantCulture,
                    $"the load flow did not converge in {flow.Iterations} sweeps: the loads are too heavy for the conductors and transformers (a voltage collapse); fix the worst runs, or use 'method: percent_sum' to see them"));
            }

            return;
        }

        var parents = network.ParentIndices;
        void Record(ref RunRow r, double drop)
        {
            r.LoadFlowDropPercent = drop;
            if (rules.Method == SolutionMethod.LoadFlow)
            {
                r.DropPercent = drop;
            }
        }

        ParallelRanges.For(parents.Length, (start, end) =>
        {
            for (var i = Math.Max(start, 1); i < end; i++)
            {
                if (incomingRow[i] >= 0)
                {
                    Record(ref rows[incomingRow[i]], (flow.BusPu[parents[i]] - flow.InputPu[i]) * 100.0);
                }

                if (transformerRow[i] >= 0)
                {
                    Record(ref rows[transformerRow[i]], (flow.InputPu[i] - flow.BusPu[i]) * 100.0);
                }
            }
        });
    }

    // A run's findings, or null for none.
    private List<Finding>? RunFindings(ref RunRow r, NetworkRun run)
    {
        List<Finding>? findings = null;
        var conductors = run.Conductors;
        var branch = run.Kind == RunKind.Branch;
        var what = branch ? "branch circuit" : "feeder";
        var size = conductors.Size.Text;
        var sets = conductors.Sets;
        var limit = run.LimitPercent;
        if (r.DropPercent > limit + 1e-9)
        {
            (findings ??= []).Add(Finding.Written(
                branch ? FindingKind.BranchDrop : FindingKind.FeederDrop,
                run.Id,
                r.DropPercent,
                limit,
                $"{what} {run.Id}: drop {r.DropPercent:0.00} % ({r.DropV:0.0} V of {r.VoltageV:0} V at {r.CurrentA:0.0} A over {conductors.LengthM:0.0} m of {size}) exceeds its {limit:0.##} % limit",
                conductors.Location));
        }

        return _protection.AddFindings(findings, run, r.DesignCurrentA, r.AmpacityA);
    }

    // Regulation ≈ (%R·cos θ + %X·sin θ)·(S/S_rated) − tap, %R = %Z/√(1 + (X/R)²), %X = %R·X/R (common practice).
    // Per secondary line: (%R·P_x + %X·Q_x)/(S_rated/lines) − tap; balanced, the same as the three-phase formula.
    // Fills the transformer's row; gives its findings, or null for none.
    private static List<Finding>? SolveTransformer(ref RunRow row, NetworkNode node, TransformerData data, ComplexPower carried, Rules rules, PhaseFlow phases, Span<double> drops)
    {
        var supply = data.Secondary.FeederSupply;
        var (percentR, percentX) = PercentRx(data);
        var loading = carried.VoltAmperes / (data.Kva * 1000.0);
        Span<double> perLine = stackalloc double[3];
        phases.TransformerRegulation(node.Index, data, percentR, percentX, perLine);
        var lines = PhaseRules.Lines(data.Secondary);
        for (var set = 1; set < 8; set++)
        {
            var mask = set & ((1 << lines) - 1);
            drops[set] = BitOperations.PopCount((uint)mask) switch
            {
                0 => perLine[0],
                2 => (perLine[BitOperations.TrailingZeroCount(mask)] + perLine[31 - BitOperations.LeadingZeroCount((uint)mask)]) / 2,
                _ => WorstOf(perLine, mask),
            };
        }

        var dropPercent = drops[(int)Phases.ABC];
        var currentA = LoadPower.CurrentA(carried.VoltAmperes, supply);
        List<Finding>? findings = null;
        if (loading > 1 + 1e-9)
        {
            findings = [Finding.Written(
                FindingKind.TransformerOverload,
                node.Id,
                carried.VoltAmperes / 1000.0,
                data.Kva,
                $"transformer {node.Id}: load {carried.VoltAmperes / 1000.0:0.0} kVA exceeds its {data.Kva:0.#} kVA rating ({loading * 100:0} %)",
                node.Equipment!.Location)];
        }

        row = new RunRow
        {
            Node = node.Index,
            IsTransformer = true,
            CurrentA = currentA,
            DesignCurrentA = currentA,
            RatedA = LoadPower.CurrentA(data.Kva * 1000.0, supply),
            DropPercent = dropPercent,
            PercentSumDropPercent = dropPercent,
            VoltageV = supply.VoltageV,
            WidensToAllLines = PhaseRules.Lines(data.Secondary) != PhaseRules.Lines(node.Equipment!.System),
        };
        return findings;
    }

    // The largest of the per-line figures on the lines of a set (bits 0..2 = A..C). A line whose figure is not a
    // number (an overflowing load) is passed over unless every line's is, as the maximum always has been taken.
    private static double WorstOf(ReadOnlySpan<double> perLine, int mask)
    {
        var worst = double.NaN;
        for (var x = 0; x < 3; x++)
        {
            if ((mask & (1 << x)) != 0 && (double.IsNaN(worst) || perLine[x] > worst))
            {
                worst = perLine[x];
            }
        }

        return worst;
    }

    private static (double PercentR, double PercentX) PercentRx(TransformerData data)
    {
        var percentR = data.ImpedancePercent / Math.Sqrt(1 + (data.XOverR * data.XOverR));
        return (percentR, percentR * data.XOverR);
    }

    // Every end point's total: walking up from it, the counted rows' drops on its own lines. Gives the end point
    // rows, their counted runs and shares (see SolvedRows), the worst end point (-1 without any) and the number of
    // end-point findings.
    private static (SolvedEndPoints EndPoints, int Worst, int Findings) SolveEndPoints(
        DistributionNetwork network, RunRow[] rows, PhaseFlow phases, ComplexPower[] power, double[] lineDrops, double[] loopKm,
        ComplexPower[] lockedRotor, int[] incomingRow, int[] transformerRow, Has[] has, LoadFlowResult flow)
    {
        var rules = network.Project.Rules;
        var nodes = network.NodeArray;
        var parents = network.ParentIndices;
        var n = nodes.Length;
        var newOrigin = rules.TransformerDrop == TransformerDropMode.NewOrigin;
        var onLoadFlow = rules.Method == SolutionMethod.LoadFlow && flow.Converged;

        // Top-down: the depth of every node (the service is 1), and how many rows a walk up from below a node
        // counts from it to the service: its transformer's and its incoming run's, unless the transformer is a
        // new origin, where the counting stops. An end point's counted rows are its own run's and those above its
        // panel; they take the next places in the path arrays.
        var depth = Scratch.RentToFill<int>(n);
        var counted = Scratch.RentToFill<int>(n);
        var endPointNode = Scratch.RentToFill<int>(n);
        var pathStart = Scratch.RentToFill<int>(n + 1);
        var endPointCount = 0;
        var used = 0;
        for (var i = 0; i < n; i++)
        {
            var above = i == 0 ? 0 : counted[parents[i]];
            depth[i] = i == 0 ? 1 : depth[parents[i]] + 1;
            counted[i] = newOrigin && transformerRow[i] >= 0 ? 0 : above + (incomingRow[i] >= 0 ? 1 : 0) + (transformerRow[i] >= 0 ? 1 : 0);
            if ((has[i] & Has.Circuit) != 0)
            {
                endPointNode[endPointCount] = i;
                pathStart[endPointCount++] = used;
                used += (incomingRow[i] >= 0 ? 1 : 0) + above;
            }
        }

        pathStart[endPointCount] = used;
        var endPoints = GC.AllocateUninitializedArray<EndPointRow>(endPointCount);
        var findings = new IReadOnlyList<Finding>?[endPointCount];
        var motorStarts = new MotorStartResult?[endPointCount];
        var pathRuns = GC.AllocateUninitializedArray<int>(used);
        var pathShares = GC.AllocateUninitializedArray<double>(used);
        var worst = -1;
        var findingCount = 0;
        var gate = new object();
        ParallelRanges.For(endPointCount, (start, end) =>
        {
            // The worst of the range and its findings, merged into the whole under the gate: the worst-first
            // order is total (ties go by id), so the merge order does not matter.
            var worstHere = -1;
            var found = 0;
            for (var e = start; e < end; e++)
            {
                found += SolveEndPoint(e);
                worstHere = worstHere < 0 || WorseThan(e, worstHere) ? e : worstHere;
            }

            lock (gate)
            {
                findingCount += found;
                worst = worstHere >= 0 && (worst < 0 || WorseThan(worstHere, worst)) ? worstHere : worst;
            }
        });

        Scratch.Return(depth, n);
        Scratch.Return(counted, n);
        Scratch.Return(endPointNode, n);
        Scratch.Return(pathStart, n + 1);
        return (new SolvedEndPoints(endPoints, findings, motorStarts, pathRuns, pathShares), worst, findingCount);

        bool WorseThan(int a, int b) =>
            Solution.WorstFirst(endPoints[a].TotalDropPercent, nodes[endPoints[a].Node].Id, endPoints[b].TotalDropPercent, nodes[endPoints[b].Node].Id) < 0;

        // Fills end point e's row, findings and motor-start check; gives the number of its findings.
        int SolveEndPoint(int e)
        {
            var index = endPointNode[e];
            var (first, pathCount) = (pathStart[e], pathStart[e + 1] - pathStart[e]);
            double percentSum = 0, loadFlow = 0;

            // Walking up from the end point: its own lines, until a transformer between systems of different
            // line counts, above which the worst line counts (the safe side). Each transformer's row before its
            // primary feeder's; the rows are stored service side first.
            var set = (int)phases.Assigned[index];
            var at = first + pathCount;
            for (var i = index; at > first; i = parents[i])
            {
                // The node's transformer's row (an end point has none), then its incoming run's.
                for (var k = 0; k < 2; k++)
                {
                    var r = k == 0 ? transformerRow[i] : incomingRow[i];
                    if (r < 0)
                    {
                        continue;
                    }

                    ref var row = ref rows[r];
                    pathRuns[--at] = r;
                    pathShares[at] = onLoadFlow ? row.LoadFlowDropPercent!.Value : lineDrops[(r * 8) + set];
                    percentSum += lineDrops[(r * 8) + set];
                    loadFlow += row.LoadFlowDropPercent ?? 0;
                    if (row.WidensToAllLines)
                    {
                        set = (int)Phases.ABC;
                    }
                }
            }

            var total = onLoadFlow ? loadFlow : percentSum;
            var limit = rules.TotalLimitPercent;
            // The end point's objects are read only for a finding or a motor (see Has).
            List<Finding>? found = null;
            if (total > limit + 1e-9)
            {
                var circuit = nodes[index].Circuit!;
                (found ??= []).Add(Finding.Written(
                    FindingKind.TotalDrop,
                    circuit.FullId,
                    total,
                    limit,
                    $"end point {circuit.FullId}: total drop {total:0.00} % from {(newOrigin && pathCount < depth[index] - 1 ? "its origin" : "the service")} exceeds the {limit:0.##} % limit",
                    circuit.Location));
            }

            var start = (has[index] & Has.Motor) != 0 ? MotorStartCheck(network, rows, loopKm, incomingRow, transformerRow, index, power[index], lockedRotor[index]) : null;
            if (start is not null && start.TerminalDipPercent > start.LimitPercent + 1e-9)
            {
                var circuit = nodes[index].Circuit!;
                (found ??= []).Add(Finding.Written(
                    FindingKind.MotorStart,
                    circuit.FullId,
                    start.TerminalDipPercent,
                    start.LimitPercent,
                    $"motor {circuit.FullId}: while starting ({start.LockedRotorVa / 1000:0.#} kVA locked-rotor) its terminals dip {start.TerminalDipPercent:0.0} % and its panel {start.PanelDipPercent:0.0} %, over the {start.LimitPercent:0.##} % limit",
                    circuit.Location));
            }

            endPoints[e] = new EndPointRow
            {
                Node = index,
                PathStart = first,
                PathCount = pathCount,
                TotalDropPercent = total,
                PercentSumTotalDropPercent = percentSum,
                LoadFlowTotalDropPercent = flow.Converged ? loadFlow : null,
                LoadFlowEndVoltageV = flow.Converged ? flow.InputPu[index] * rows[incomingRow[index]].VoltageV : null,
            };
            motorStarts[e] = start;
            findings[e] = found;
            return found?.Count ?? 0;
        }
    }

    // The extra drop of ΔS = S_locked-rotor − S_running on each run: 100·(ΔP·R_loop + ΔQ·X_loop)/V², R_loop and
    // X_loop the run's impedance (both conductors for single-phase); on a transformer (%R·ΔP + %X·ΔQ)/S_rated.
    // Superposed on the steady drops of the whole path (a new origin does not stop a physical dip).
    private static MotorStartResult MotorStartCheck(
        DistributionNetwork network, RunRow[] rows, double[] loopKm, int[] incomingRow, int[] transformerRow, int motor, ComplexPower running,
        ComplexPower lockedRotor)
    {
        var (nodes, parents) = (network.NodeArray, network.ParentIndices);
        var delta = lockedRotor + (running * -1.0);
        double terminal = 0, panel = 0;
        for (var i = motor; i > 0; i = parents[i])
        {
            var extraHere = 0.0;
            var steadyHere = 0.0;
            if (incomingRow[i] >= 0)
            {
                ref var r = ref rows[incomingRow[i]];
                var km = loopKm[incomingRow[i]];
                extraHere += 100.0 * ((delta.Watts * r.ResistanceOhmPerKm * km) + (delta.Vars * r.ReactanceOhmPerKm * km)) / (r.VoltageV * r.VoltageV);
                steadyHere += r.DropPercent;
            }

            if (transformerRow[i] >= 0 && i != motor)
            {
                var t = nodes[i].Equipment!.Transformer!;
                var (percentR, percentX) = PercentRx(t);
                extraHere += ((percentR * delta.Watts) + (percentX * delta.Vars)) / (t.Kva * 1000.0);
                steadyHere += rows[transformerRow[i]].DropPercent;
            }

            terminal += extraHere + steadyHere;
            if (i != motor)
            {
                panel += extraHere + steadyHere;
            }
        }

        return new MotorStartResult(lockedRotor.VoltAmperes, terminal, panel, network.Project.Rules.MotorStartLimitPercent);
    }

    // Reach. Own limit: drop is proportional to length (current and temperature do not depend on it; points
    // scale with the run), so L_max = L·limit/drop. Total: the least slack (limit − total) of the end points
    // whose totals include the run, found bottom-up; L_max = L·(drop + slack)/drop.
    private static void AddReach(
        DistributionNetwork network, RunRow[] rows, int[] incomingRow, double[] lengthM, double[] limitPercent, EndPointRow[] endPoints, Rules rules)
    {
        var nodes = network.NodeArray;
        var slack = Scratch.RentToFill<double>(nodes.Length);
        slack.AsSpan(0, nodes.Length).Fill(double.PositiveInfinity);
        foreach (var e in endPoints)
        {
            slack[e.Node] = rules.TotalLimitPercent - e.TotalDropPercent;
        }

        // Bottom-up, the slack each node's incoming run sees (a new origin hides what is below it from above);
        // then each run's reach from it, run by run.
        var newOrigin = rules.TransformerDrop == TransformerDropMode.NewOrigin;
        var parents = network.ParentIndices;
        for (var i = nodes.Length - 1; i > 0; i--)
        {
            if (newOrigin && nodes[i].Kind == NodeKind.Transformer)
            {
                slack[i] = double.PositiveInfinity;
            }

            slack[parents[i]] = Math.Min(slack[parents[i]], slack[i]);
        }

        ParallelRanges.For(nodes.Length, (start, end) =>
        {
            for (var i = Math.Max(start, 1); i < end; i++)
            {
                if (incomingRow[i] >= 0)
                {
                    var r = incomingRow[i];
                    ref var row = ref rows[r];
                    var visible = slack[i];
                    row.MaxLengthM = Reach(lengthM[r], row.DropPercent, limitPercent[r]);
                    row.MaxLengthTotalM = double.IsPositiveInfinity(visible) ? null : Reach(lengthM[r], row.DropPercent, row.DropPercent + visible);
                }
            }
        });

        Scratch.Return(slack, nodes.Length);
    }

    private static double? Reach(double lengthM, double dropPercent, double allowedPercent) =>
        dropPercent <= 0 ? null : Math.Max(0.0, lengthM * allowedPercent / dropPercent);
}
