using System.Numerics;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The runs' pass: each run's figures at the current it carries (temperature, R and X, ampacity; see
/// <see cref="RunElectrics"/>) and its drop on every set of lines below it, drop = R·unitR + X·unitX with the unit
/// drops of <see cref="PhaseFlow.UnitDropsOn"/>; in the same sweep each transformer's regulation (see
/// <see cref="TransformerRegulation"/>), and on the percent sum each row's findings (see <see cref="RunFindings"/>),
/// known as soon as the row is, while the run's objects are at hand. Runs are independent: the pass runs on every
/// core, each node writing its own rows.
/// </summary>
internal sealed class RunDrops
{
    private readonly ConductorCatalog _catalog;
    private readonly ProtectionRules _protection;
    private readonly Rules _rules;
    private readonly double _frequencyHz;
    private readonly RunElectrics.Bases _bases;
    private readonly NetworkNode[] _nodes;
    private readonly PowerSums _sums;
    private readonly PhaseFlow _phases;
    private readonly RunRows _runs;
    private readonly bool _findingsWithRuns;
    private readonly Complex[] _z;
    private int _findings;

    private RunDrops(ConductorCatalog catalog, ProtectionRules protection, DistributionNetwork network, PowerSums sums, PhaseFlow phases, RunRows runs)
    {
        _catalog = catalog;
        _protection = protection;
        _rules = network.Project.Rules;
        _frequencyHz = network.Project.Service.FrequencyHz;
        _bases = new RunElectrics.Bases(catalog, _rules, _frequencyHz);
        _nodes = network.NodeArray;
        _sums = sums;
        _phases = phases;
        _runs = runs;
        _findingsWithRuns = _rules.Method == SolutionMethod.PercentSum;
        _z = Scratch.RentToFill<Complex>(_nodes.Length); // read only where a run comes in, and written there
    }

    /// <summary>
    /// Fills <paramref name="runs"/>' rows, line drops and run figures, and on the percent sum their findings. Gives
    /// each node's incoming run impedance in ohms (its whole length, sets in parallel: the load flow's; a scratch
    /// array, to give back) and the number of findings.
    /// </summary>
    public static (Complex[] ImpedanceOhm, int Findings) Solve(
        ConductorCatalog catalog, ProtectionRules protection, DistributionNetwork network, PowerSums sums, PhaseFlow phases, RunRows runs)
    {
        var pass = new RunDrops(catalog, protection, network, sums, phases, runs);
        ParallelRanges.For(pass._nodes.Length, pass.SolveRange);
        return (pass._z, pass._findings);
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

    // The nodes start … end − 1: each one's incoming run and transformer.
    private void SolveRange(int start, int end)
    {
        var (nodes, rows, lineDrops, findings) = (_nodes, _runs.Rows, _runs.LineDrops, _runs.Findings);
        var (incomingRow, transformerRow, power, continuous) = (_runs.IncomingRow, _runs.TransformerRow, _sums.Power, _sums.Continuous);
        var (z, loopKm, lengthM, limitPercent) = (_z, _runs.LoopKm, _runs.LengthM, _runs.LimitPercent);
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
                SolveRun(ref row, run, continuous[i], drops);
                if (_findingsWithRuns)
                {
                    found += (findings[r] = RunFindings.Of(ref row, run, _protection))?.Count ?? 0;
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
                found += (findings[r] = TransformerRegulation.Solve(ref rows[r], node, transformer, power[i], _phases, drops))?.Count ?? 0;
            }
        }

        Interlocked.Add(ref _findings, found);
    }

    // A run's figures, and into lineDrops the drop in percent that each kind of circuit below sees on it (see
    // RunRows.LineDrops).
    private void SolveRun(ref RunRow row, NetworkRun run, ComplexPower continuousPart, Span<double> lineDrops)
    {
        var supply = run.Supply;
        var conductors = run.Conductors;
        var index = run.Target.Index;
        var lineA = _phases.MaxLineCurrentA(index);
        var points = run.Target.Circuit?.Points ?? [];
        var currentA = run.Kind == RunKind.Branch && points.Count == 0 ? BranchCurrent(lineA, conductors.OcpdA, _rules.BranchCurrent) : lineA;
        var designA = _protection.DesignCurrentA(_sums.Power[index], continuousPart, supply);
        var figures = RunElectrics.Compute(_catalog, _rules, conductors, conductors.Size, conductors.Sets, _frequencyHz, currentA, _bases.Of(conductors));
        var ownLines = run.Kind == RunKind.Branch ? (int)_phases.Assigned[index] : 0;
        double ownDrop;
        if (ownLines > 0 && points.Count == 0)
        {
            // A branch circuit's row is read on its own lines only, by the one end point it feeds: that set alone
            // is worked out (the others stay zero), by the same arithmetic as all of them.
            var (unitR, unitX) = _phases.UnitDropsOn(index, PerSetKm(conductors), run.Source.System, LineScale(currentA, lineA), ownLines);
            ownDrop = (figures.ResistanceOhmPerKm * unitR) + (figures.ReactanceOhmPerKm * unitX);
            lineDrops[ownLines] = ownDrop;
        }
        else
        {
            Span<double> unitR = stackalloc double[8];
            Span<double> unitX = stackalloc double[8];
            UnitDrops(run, _phases, currentA, lineA, unitR, unitX);
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

    // A run's length in km per set: the sets share the current.
    private static double PerSetKm(Run conductors) => conductors.LengthM / 1000.0 / conductors.Sets;

    // The phase currents scaled to the current the run is figured at (a branch circuit on its device's rating).
    private static double LineScale(double currentA, double lineA) => lineA > 0 ? currentA / lineA : 1.0;

    // The current a branch circuit's drop is figured at, by the rules' basis: its connected load, 80 % of its
    // device's rating, or the lesser.
    private static double BranchCurrent(double connectedA, double? ocpdA, BranchCurrentBasis basis) => (basis, ocpdA) switch
    {
        (BranchCurrentBasis.Ocpd80, { } ocpd) => 0.8 * ocpd,
        (BranchCurrentBasis.Lesser, { } ocpd) => Math.Min(connectedA, 0.8 * ocpd),
        _ => connectedA,
    };

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
}
