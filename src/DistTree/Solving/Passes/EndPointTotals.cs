using System.Buffers;
using System.Numerics;
using DistTree.Codes;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The end points' pass: every end point's total, walking up from it, the sum of the counted rows' shares in its own
/// voltage (see <see cref="PathShares"/>; the load flow's on the load flow); its findings (total drop, motor start; see
/// <see cref="MotorStartCheck"/>); the counted runs of its path and each one's share (see <see cref="SolvedRows"/>);
/// and the worst end point. End points are independent: the pass runs on every core.
/// </summary>
internal sealed class EndPointTotals
{
    // The longest path whose scratch figures an end point keeps on the stack.
    private const int StackPathRuns = 32;

    private readonly DistributionNetwork _network;
    private readonly NetworkNode[] _nodes;
    private readonly int[] _parents;
    private readonly PowerSums _sums;
    private readonly PhaseFlow _phases;
    private readonly RunRows _runs;
    private readonly PhaseVoltages? _voltages;
    private readonly PathShares _shares;
    private readonly MotorStartCheck _motors;
    private readonly bool _newOrigin;
    private readonly bool _onLoadFlow;
    private readonly Rules _rules;
    private readonly bool _limitVaries;
    private readonly string _totalClause;
    private readonly string _motorClause;

    // Per node, its depth (the service is 1) and, where the limit grows with it, the wiring length from its origin;
    // per end point, its node and the start of its path (see Number).
    private readonly int[] _depth;
    private readonly double[]? _pathLengthM;
    private readonly int[] _endPointNode;
    private readonly int[] _pathStart;
    private int _count;

    // What the pass gives: a row, findings and motor-start check per end point, the paths, the worst end point (−1
    // without any) and the number of findings, merged under the gate.
    private EndPointRow[] _endPoints = [];
    private IReadOnlyList<Finding>?[] _findings = [];
    private MotorStartResult?[] _motorStarts = [];
    private int[] _pathRuns = [];
    private double[] _pathShares = [];
    private int _worst = -1;
    private int _findingCount;
    private readonly Lock _gate = new();

    private EndPointTotals(DistributionNetwork network, PowerSums sums, PhaseFlow phases, RunRows runs, LoadFlowResult flow, PhaseVoltages voltages, CodeRules code)
    {
        _totalClause = code.Cite(CodeCheck.TotalDrop);
        _motorClause = code.Cite(CodeCheck.MotorStart);
        var rules = network.Project.Rules;
        _network = network;
        _nodes = network.NodeArray;
        _parents = network.ParentIndices;
        _sums = sums;
        _phases = phases;
        _runs = runs;
        _voltages = flow.Converged ? voltages : null;
        _shares = new PathShares(network, phases, runs, _voltages);
        _onLoadFlow = rules.Method == SolutionMethod.LoadFlow && flow.Converged;
        _motors = new MotorStartCheck(network, phases, runs, _shares, _onLoadFlow);
        _newOrigin = rules.TransformerDrop == TransformerDropMode.NewOrigin;
        _rules = rules;
        _limitVaries = rules.TotalLimitVaries;
        _depth = Scratch.RentToFill<int>(_nodes.Length);
        _pathLengthM = rules.LongPathAllowance is null ? null : Scratch.RentToFill<double>(_nodes.Length);
        _endPointNode = Scratch.RentToFill<int>(_nodes.Length);
        _pathStart = Scratch.RentToFill<int>(_nodes.Length + 1);
    }

    /// <summary>
    /// Solves every end point of <paramref name="network"/>, its findings judged by <paramref name="code"/>; gives the end
    /// points, the worst (−1 without any) and the number of findings.
    /// </summary>
    public static (SolvedEndPoints EndPoints, int Worst, int Findings) Solve(
        DistributionNetwork network, PowerSums sums, PhaseFlow phases, RunRows runs, LoadFlowResult flow, PhaseVoltages voltages, CodeRules code)
    {
        var pass = new EndPointTotals(network, sums, phases, runs, flow, voltages, code);
        pass.Number();
        ParallelRanges.For(pass._count, pass.SolveRange);
        var n = pass._nodes.Length;
        Scratch.Return(pass._depth, n);
        Scratch.Return(pass._endPointNode, n);
        Scratch.Return(pass._pathStart, n + 1);
        if (pass._pathLengthM is { } lengths)
        {
            Scratch.Return(lengths, n);
        }

        return (new SolvedEndPoints(pass._endPoints, pass._findings, pass._motorStarts, pass._pathRuns, pass._pathShares), pass._worst, pass._findingCount);
    }

    // Top-down: the depth of every node, and how many rows a walk up from below a node counts from it to the
    // service: its transformer's and its incoming run's, unless the transformer is a new origin, where the counting
    // stops (and so does the wiring length, where it is needed). An end point's counted rows are its own run's and
    // those above its panel; they take the next places in the path arrays, which are made here.
    private void Number()
    {
        var (n, parents, depth, incomingRow, transformerRow, has) = (_nodes.Length, _parents, _depth, _runs.IncomingRow, _runs.TransformerRow, _sums.Has);
        var counted = Scratch.RentToFill<int>(n);
        var used = 0;
        for (var i = 0; i < n; i++)
        {
            var above = i == 0 ? 0 : counted[parents[i]];
            depth[i] = i == 0 ? 1 : depth[parents[i]] + 1;
            var origin = _newOrigin && transformerRow[i] >= 0;
            counted[i] = origin ? 0 : above + (incomingRow[i] >= 0 ? 1 : 0) + (transformerRow[i] >= 0 ? 1 : 0);
            if (_pathLengthM is { } lengths)
            {
                lengths[i] = i == 0 || origin ? 0 : lengths[parents[i]] + (incomingRow[i] >= 0 ? _runs.LengthM[incomingRow[i]] : 0);
            }

            if ((has[i] & Has.Circuit) != 0)
            {
                _endPointNode[_count] = i;
                _pathStart[_count++] = used;
                used += (incomingRow[i] >= 0 ? 1 : 0) + above;
            }
        }

        _pathStart[_count] = used;
        Scratch.Return(counted, n);
        _endPoints = Scratch.Uninitialized<EndPointRow>(_count);
        _findings = new IReadOnlyList<Finding>?[_count];
        _motorStarts = new MotorStartResult?[_count];
        _pathRuns = Scratch.Uninitialized<int>(used);
        _pathShares = Scratch.Uninitialized<double>(used);
    }

    // The end points start … end − 1. The worst of the range and its findings are merged into the whole under the
    // gate: the worst-first order is total (ties go by id), so the merge order does not matter.
    private void SolveRange(int start, int end)
    {
        var worstHere = -1;
        var found = 0;
        for (var e = start; e < end; e++)
        {
            found += SolveEndPoint(e);
            worstHere = worstHere < 0 || WorseThan(e, worstHere) ? e : worstHere;
        }

        lock (_gate)
        {
            _findingCount += found;
            _worst = worstHere >= 0 && (_worst < 0 || WorseThan(worstHere, _worst)) ? worstHere : _worst;
        }
    }

    private bool WorseThan(int a, int b) =>
        Solution.WorstFirst(_endPoints[a].TotalDropPercent, _nodes[_endPoints[a].Node].Id, _endPoints[b].TotalDropPercent, _nodes[_endPoints[b].Node].Id) < 0;

    // Fills end point e's row, findings and motor-start check; gives the number of its findings. Its voltage: a
    // 1-pole load's line to neutral, a 2-pole load's line to line, a 3-pole load's worst line pair (by each method
    // on its own); each row's share in it (see PathShares), service side first.
    private int SolveEndPoint(int e)
    {
        var index = _endPointNode[e];
        var (first, pathCount) = (_pathStart[e], _pathStart[e + 1] - _pathStart[e]);
        var panel = _nodes[_parents[index]];
        var system = PhaseFrame.BusSystem(panel);
        var lines = PhaseRules.Lines(system);
        var slots = Slots.OfCircuit((int)_phases.Assigned[index] & ((1 << lines) - 1)) & Slots.Of(lines, system.HasNeutral);
        // On the stack for a path of up to StackPathRuns runs (the pool of doubles is compiled at start: DEVELOPERS.md, Start-up).
        var buffer = pathCount <= StackPathRuns ? stackalloc double[2 * StackPathRuns] : new double[pathCount * 2];
        var rowsBuffer = ArrayPool<int>.Shared.Rent(pathCount);
        var ps = buffer.Slice(0, pathCount);
        var lf = buffer.Slice(pathCount, pathCount);
        var withSource = !_newOrigin || pathCount == _shares.AllRows(index);
        var (worstPs, worstLf, slotPs, slotLf) = (default(PathTotals), default(PathTotals), -1, -1);
        for (var slot = 0; slot < Slots.Count; slot++)
        {
            if ((slots & (1 << slot)) != 0)
            {
                var totals = _shares.Walk(index, _phases.SlotOn(panel, slot), pathCount, ps, lf, rowsBuffer, withSource);
                (worstPs, slotPs) = slotPs < 0 || totals.PercentSum > worstPs.PercentSum ? (totals, slot) : (worstPs, slotPs);
                (worstLf, slotLf) = slotLf < 0 || totals.LoadFlow > worstLf.LoadFlow ? (totals, slot) : (worstLf, slotLf);
            }
        }

        // The shares of the voltage that counts, in the path arrays, service side first (walked again where a
        // 3-pole load's worst pair was not the last walked).
        var counted = _onLoadFlow ? slotLf : slotPs;
        if (counted != 31 - BitOperations.LeadingZeroCount((uint)slots))
        {
            _shares.Walk(index, _phases.SlotOn(panel, counted), pathCount, ps, lf, rowsBuffer, withSource);
        }

        for (var k = 0; k < pathCount; k++)
        {
            _pathRuns[first + pathCount - 1 - k] = rowsBuffer[k];
            _pathShares[first + pathCount - 1 - k] = _onLoadFlow ? lf[k] : ps[k];
        }

        ArrayPool<int>.Shared.Return(rowsBuffer);

        var total = _onLoadFlow ? worstLf.LoadFlow : worstPs.PercentSum;
        var start = (_sums.Has[index] & Has.Motor) != 0 ? _motors.Of(index, slots, _sums.Power[index], _sums.LockedRotor[index]) : null;
        var limit = _limitVaries ? _rules.TotalLimitFor(_nodes[index].Circuit!.Category, _pathLengthM?[index] ?? 0) : _rules.TotalLimitPercent;
        var found = Findings(index, total, limit, pathCount, start);
        var nominal = _phases.SlotOn(panel, slotLf);
        _endPoints[e] = new EndPointRow
        {
            Node = index,
            PathStart = first,
            PathCount = pathCount,
            TotalDropPercent = total,
            LimitPercent = limit,
            PercentSumTotalDropPercent = worstPs.PercentSum,
            LoadFlowTotalDropPercent = _voltages is null ? null : worstLf.LoadFlow,
            SourceSharePercent = _onLoadFlow ? worstLf.SourceLoadFlow : worstPs.SourcePercentSum,
            LoadFlowEndVoltageV = _voltages is null ? null : nominal.Of(_voltages.Bus(index)).Magnitude * Slots.NominalV(nominal, slotLf),
            CountedSlot = (byte)counted,
        };
        _motorStarts[e] = start;
        _findings[e] = found;
        return found?.Count ?? 0;
    }

    // The end point's findings, or null for none: its total over the limit, and a motor's dip over its limit. The
    // end point's objects are read only for a finding (see Has).
    private List<Finding>? Findings(int index, double total, double limit, int pathCount, MotorStartResult? start)
    {
        List<Finding>? found = null;
        if (total > limit + 1e-9)
        {
            var circuit = _nodes[index].Circuit!;
            (found ??= []).Add(Finding.Written(
                FindingKind.TotalDrop,
                _totalClause,
                circuit.FullId,
                total,
                limit,
                $"end point {circuit.FullId}: total drop {total:0.00} % from {(_newOrigin && pathCount < _depth[index] - 1 ? "its origin" : "the service")} exceeds the {limit:0.##} % limit",
                circuit.Location));
        }

        if (start is not null && start.TerminalDipPercent > start.LimitPercent + 1e-9)
        {
            var circuit = _nodes[index].Circuit!;
            (found ??= []).Add(Finding.Written(
                FindingKind.MotorStart,
                _motorClause,
                circuit.FullId,
                start.TerminalDipPercent,
                start.LimitPercent,
                $"motor {circuit.FullId}: while starting ({start.LockedRotorVa / 1000:0.#} kVA locked-rotor) its terminals dip {start.TerminalDipPercent:0.0} % and its panel {start.PanelDipPercent:0.0} %, over the {start.LimitPercent:0.##} % limit",
                circuit.Location));
        }

        return found;
    }
}
