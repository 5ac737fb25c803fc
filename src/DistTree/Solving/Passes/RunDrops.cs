using System.Numerics;
using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The runs' pass: each run's figures at the current it carries (temperature, R and X, ampacity; see
/// <see cref="RunElectrics"/>), its current-lengths (see <see cref="Moments"/>) from which every end point's share
/// follows (see <see cref="Functional.OfRun"/>), and its own drop, the worst of its own voltages; in the same sweep each transformer's regulation (see
/// <see cref="TransformerRegulation"/>), and on the percent sum each row's findings (see <see cref="RunFindings"/>),
/// known as soon as the row is, while the run's objects are at hand. Runs are independent: the pass runs on every
/// core, each node writing its own rows.
/// </summary>
internal sealed class RunDrops
{
    private readonly ConductorCatalog _catalog;
    private readonly CodeRules _code;
    private readonly UnitSystem _units;
    private readonly Rules _rules;
    private readonly double _frequencyHz;
    private readonly RunElectrics.Bases _bases;
    private readonly NetworkNode[] _nodes;
    private readonly PowerSums _sums;
    private readonly PhaseFlow _phases;
    private readonly Complex[]? _continuous;
    private readonly int[]? _sharedCounts;
    private readonly double[]? _motors;
    private readonly RunRows _runs;
    private readonly bool _findingsWithRuns;
    private readonly double[]? _noLoad; // null where no stated tap raises (every bus at nominal at no load)
    private readonly double _riseLimitPercent;
    private int _findings;

    private RunDrops(ConductorCatalog catalog, CodeRules code, DistributionNetwork network, PowerSums sums, PhaseFlow phases, double[]? motors, RunRows runs)
    {
        _sharedCounts = RacewayCounts.Of(network, code);
        _catalog = catalog;
        _code = code;
        _units = network.Project.Units;
        _continuous = phases.ContinuousCurrents;
        _motors = motors;
        _rules = network.Project.Rules;
        _frequencyHz = network.Project.Service.FrequencyHz;
        _bases = new RunElectrics.Bases(code, _rules, _frequencyHz);
        _nodes = network.NodeArray;
        _sums = sums;
        _phases = phases;
        _runs = runs;
        _findingsWithRuns = _rules.Method == SolutionMethod.PercentSum;
        _noLoad = _nodes.Any(n => n.Equipment?.Transformer is { TapPercent: < 0 }) ? NoLoadRise.Stated(network) : null;
        _riseLimitPercent = network.Project.Sizing.LightLoadRisePercent;
    }

    /// <summary>
    /// Fills <paramref name="runs"/>' rows and current-lengths, and on the percent sum their findings; gives the number
    /// of findings. The design currents take each line's continuous part from <paramref name="phases"/> and the largest
    /// motor's full-load current on it from <paramref name="motors"/> (per node × 3; null where there is no motor).
    /// </summary>
    public static int Solve(
        ConductorCatalog catalog, CodeRules code, DistributionNetwork network, PowerSums sums, PhaseFlow phases, double[]? motors, RunRows runs)
    {
        var pass = new RunDrops(catalog, code, network, sums, phases, motors, runs);
        ParallelRanges.For(pass._nodes.Length, pass.SolveRange);
        return pass._findings;
    }

    /// <summary>
    /// A run's current-lengths per set (A·km, three lines; see <see cref="Functional.OfRun"/>) at the current it is
    /// figured at, <paramref name="scale"/> times its phase currents: loads along the run span by span (each point's
    /// current flows from the head to its point), else the phase currents of what it feeds over its length.
    /// </summary>
    internal static void Moments(NetworkRun run, PhaseFlow phases, double scale, Span<Complex> m)
    {
        var conductors = run.Conductors;
        var points = run.Target.Circuit?.Points ?? [];
        m[..3].Clear();
        if (points.Count == 0)
        {
            var km = PerSetKm(conductors) * scale;
            var i = phases.Currents.AsSpan(run.Target.Index * 3, 3);
            for (var x = 0; x < 3; x++)
            {
                m[x] = i[x] * km;
            }

            return;
        }

        var parent = run.Source;
        var set = phases.Assigned[run.Target.Index];
        Span<Complex> point = stackalloc Complex[3];
        foreach (var p in points)
        {
            point.Clear();
            PhaseCurrents.LoadCurrents(LoadPower.Of(p.Load, run.Supply), p.Load.Model, set, PhaseFrame.BusSystem(parent), phases.Frame.Rotation[parent.Index], phases.Frame.NoLoad[parent.Index], point);
            var km = p.AtM / 1000.0 / conductors.Sets;
            for (var x = 0; x < 3; x++)
            {
                m[x] += point[x] * km;
            }
        }
    }

    /// <summary>
    /// A run's unit drops: into <paramref name="unitR"/>[slot] and <paramref name="unitX"/>[slot] (see
    /// <see cref="Slots"/>), the drop in percent of each voltage of its bus per Ω/km of resistance and of reactance
    /// of its conductors, at its present length and sets (the drop is linear in R and X, so the sizer prices any size
    /// with them). Gives the slots its own drop is the worst of.
    /// </summary>
    internal static int UnitDrops(NetworkRun run, PhaseFlow phases, double currentA, double lineA, Span<double> unitR, Span<double> unitX)
    {
        Span<Complex> m = stackalloc Complex[3];
        Moments(run, phases, LineScale(currentA, lineA), m);
        var own = OwnSlots(run, phases);
        for (var slot = 0; slot < Slots.Count; slot++)
        {
            var perOhm = (own & (1 << slot)) != 0 ? phases.SlotOn(run.Source, slot).PerOhm(m) * 100.0 : Complex.Zero;
            (unitR[slot], unitX[slot]) = (perOhm.Real, -perOhm.Imaginary);
        }

        return own;
    }

    /// <summary>A run's own drop: the worst of its own slots' drops R·unitR + X·unitX.</summary>
    internal static double OwnDrop(ReadOnlySpan<double> unitR, ReadOnlySpan<double> unitX, double r, double x, int own)
    {
        var worst = double.NegativeInfinity;
        for (var slot = 0; slot < Slots.Count; slot++)
        {
            if ((own & (1 << slot)) != 0)
            {
                worst = Math.Max(worst, (r * unitR[slot]) + (x * unitX[slot]));
            }
        }

        return worst;
    }

    /// <summary>The slots a run's own drop is the worst of: a branch circuit's own voltages, a feeder's every voltage of its system.</summary>
    internal static int OwnSlots(NetworkRun run, PhaseFlow phases)
    {
        var system = run.System;
        var all = Slots.Of(PhaseRules.Lines(system), system.HasNeutral);
        return run.Kind == RunKind.Branch ? all & Slots.OfCircuit((int)phases.Assigned[run.Target.Index] & ((1 << PhaseRules.Lines(system)) - 1)) : all;
    }

    // The nodes start … end − 1: each one's incoming run and transformer.
    private void SolveRange(int start, int end)
    {
        var (nodes, rows, moments, findings) = (_nodes, _runs.Rows, _runs.Moments, _runs.Findings);
        var (incomingRow, transformerRow, power) = (_runs.IncomingRow, _runs.TransformerRow, _sums.Power);
        var (lengthM, limitPercent) = (_runs.LengthM, _runs.LimitPercent);
        var found = 0;
        for (var i = start; i < end; i++)
        {
            var node = nodes[i];
            if (node.Incoming is { } run)
            {
                var r = incomingRow[i];
                ref var row = ref rows[r];
                SolveRun(ref row, run, moments.AsSpan(r * 3, 3));
                if (_findingsWithRuns)
                {
                    found += (findings[r] = RunFindings.Of(ref row, run, _code, _units))?.Count ?? 0;
                }

                lengthM[r] = run.Conductors.LengthM;
                limitPercent[r] = run.LimitPercent;
            }

            if (node.Equipment?.Transformer is { } transformer)
            {
                var r = transformerRow[i];
                found += (findings[r] = TransformerRegulation.Solve(ref rows[r], node, transformer, power[i], _phases, _code, _noLoad?[i] ?? 1.0, _riseLimitPercent))?.Count ?? 0;
            }
        }

        Interlocked.Add(ref _findings, found);
    }

    // A run's figures, and into m its current-lengths (see Moments).
    private void SolveRun(ref RunRow row, NetworkRun run, Span<Complex> m)
    {
        var supply = run.Supply;
        var conductors = run.Conductors;
        var index = run.Target.Index;
        var lineA = _phases.MaxLineCurrentA(index);
        var points = run.Target.Circuit?.Points ?? [];
        var currentA = run.Kind == RunKind.Branch && points.Count == 0 ? BranchCurrent(lineA, conductors.OcpdA, _rules.BranchCurrent) : lineA;
        var carrying = _sharedCounts is { } counts && counts[index] > 0 ? counts[index] : _code.CurrentCarryingConductors(run);
        var figures = RunElectrics.Compute(_catalog, _rules, conductors, conductors.Size, conductors.Sets, _frequencyHz, currentA, _bases.Of(conductors, carrying));
        Moments(run, _phases, LineScale(currentA, lineA), m);

        // Its neutral: the lines' figures, or its own size's at the lines' temperature.
        var (rN, xN) = (figures.ResistanceOhmPerKm, figures.ReactanceOhmPerKm);
        if (conductors.NeutralSize is { } neutral)
        {
            rN = _catalog.AcResistanceOhmPerKm(neutral, conductors.Material, conductors.Raceway, figures.TemperatureC, _frequencyHz);
            xN = _catalog.ReactanceOhmPerKm(neutral, conductors.Raceway, _frequencyHz);
        }

        // Its own drop: the worst of its own voltages' (see OwnSlots), each Re f(ΔV) of the drops along it.
        var own = OwnSlots(run, _phases);
        var ownDrop = double.NegativeInfinity;
        for (var slot = 0; slot < Slots.Count; slot++)
        {
            if ((own & (1 << slot)) != 0)
            {
                ownDrop = Math.Max(ownDrop, _phases.SlotOn(run.Source, slot).DropPercent(m, figures.ResistanceOhmPerKm, figures.ReactanceOhmPerKm, rN, xN));
            }
        }

        var (designA, designLine, motorA, neutralA, fromEquipment) = DesignCurrents(run);
        double? neutralAmpacityA = neutralA is null ? null
            : conductors.NeutralSize is { } neutralSize ? _code.AllowableAmpacityA(neutralSize, conductors.Material, conductors.InsulationC, _rules.TerminalC, _rules.AmbientC, carrying, conductors.Installation) * conductors.Sets
            : figures.AmpacityA;
        row = new RunRow
        {
            Node = index,
            CurrentA = currentA,
            DesignCurrentA = designA,
            DesignLine = designLine,
            LargestMotorA = motorA,
            FromEquipment = fromEquipment,
            NeutralDesignCurrentA = neutralA,
            NeutralAmpacityA = neutralAmpacityA,
            CurrentCarrying = carrying,
            TemperatureC = figures.TemperatureC,
            ResistanceOhmPerKm = figures.ResistanceOhmPerKm,
            ReactanceOhmPerKm = figures.ReactanceOhmPerKm,
            NeutralResistanceOhmPerKm = rN,
            NeutralReactanceOhmPerKm = xN,
            AmpacityA = figures.AmpacityA,
            DropPercent = ownDrop,
            PercentSumDropPercent = ownDrop,
            VoltageV = supply.VoltageV,
            GroundMinIndex = conductors.GroundSize is null ? (short)0 : GroundMinIndex(run, designA, carrying),
        };
    }

    // A run's design currents, as the code in force counts them from each line's current, its continuous part and the
    // largest motor on it (a motor's or air-conditioning equipment's branch circuit: from the equipment, on each line
    // it is on): the most loaded line's, which line that is and its largest motor, and the neutral's where the run's
    // bus has one; and whether the run serves equipment with rules of its own (a motor, air conditioning).
    private (double DesignA, byte Line, double MotorA, double? NeutralA, bool FromEquipment) DesignCurrents(NetworkRun run)
    {
        var index = run.Target.Index;
        var i = _phases.Currents.AsSpan(index * 3, 3);
        // A device marked for continuous operation at 100 % (device_rated_continuous): the continuous part counts as
        // the rest does, so the lines' design current takes none of it apart.
        var c = _continuous is null || run.Conductors.DeviceRatedContinuous ? default : _continuous.AsSpan(index * 3, 3);
        var m = _motors is null ? default : _motors.AsSpan(index * 3, 3);
        var duty = (_sums.Has[index] & (Has.Motor | Has.Nameplate)) != 0 ? CircuitDuty.Of(run) : default;
        var equipmentA = duty.Kind == DutyKind.General ? null : _code.EquipmentDesignCurrentA(duty);
        var (worst, line) = (0.0, (byte)0);
        for (var x = 0; x < 3; x++)
        {
            var design = equipmentA is { } fromEquipment
                ? (i[x] == Complex.Zero ? 0.0 : fromEquipment)
                : _code.DesignCurrentA(i[x], c.IsEmpty ? Complex.Zero : c[x], m.IsEmpty ? 0.0 : m[x], protectedByDevice: true);
            if (design > worst || double.IsNaN(design))
            {
                (worst, line) = (design, (byte)x);
            }
        }

        double? neutral = null;
        if (run.System.HasNeutral)
        {
            var returned = -(i[0] + i[1] + i[2]);
            var continuousReturn = c.IsEmpty ? Complex.Zero : -(c[0] + c[1] + c[2]);
            neutral = _code.DesignCurrentA(returned, continuousReturn, 0.0, protectedByDevice: false);
        }

        return (worst, line, m.IsEmpty ? 0.0 : m[line], neutral, duty.Kind != DutyKind.General);
    }

    // The smallest equipment grounding conductor a run that states one needs, as its size's index + 1 (0 for none; see
    // RunRow). Another run's is worked out when it is read (RunResult.GroundMinimum): it judges nothing.
    private short GroundMinIndex(NetworkRun run, double designA, int carrying)
    {
        var conductors = run.Conductors;
        return _code.MinimumGroundSize(conductors, conductors.Size, conductors.Sets, designA, _rules, carrying, CircuitDuty.Of(run)) is { } least ? (short)(least.Index + 1) : (short)0;
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
}
