using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving.Passes;
using DistTree.Vocabulary;

namespace DistTree.Solving;

/// <summary>What a result row describes.</summary>
public enum RunResultKind
{
    /// <summary>A feeder.</summary>
    Feeder,

    /// <summary>A branch circuit.</summary>
    Branch,

    /// <summary>A transformer's regulation.</summary>
    Transformer,
}

/// <summary>
/// The solved figures of one feeder, branch circuit or transformer: a view into its solution (a copy is cheap,
/// and reading a figure reads the solve's own arrays). Two views are equal when they show the same row of the same solution.
/// </summary>
public readonly struct RunResult : IEquatable<RunResult>
{
    private readonly SolvedRows _rows;
    private readonly int _index;

    internal RunResult(SolvedRows rows, int index)
    {
        _rows = rows;
        _index = index;
    }

    private ref readonly RunRow Row => ref _rows.Runs[_index];

    private NetworkRun? Run => Row.IsTransformer ? null : Node.Incoming;

    private TransformerData Transformer => Node.Equipment!.Transformer!;

    private NetworkNode Node => _rows.Nodes[Row.Node];

    /// <summary>The id of the node it feeds.</summary>
    public string Id => Node.Id;

    /// <summary>Feeder, branch or transformer.</summary>
    public RunResultKind Kind => Run switch
    {
        null => RunResultKind.Transformer,
        { Kind: RunKind.Branch } => RunResultKind.Branch,
        _ => RunResultKind.Feeder,
    };

    /// <summary>The source node's id.</summary>
    public string From => Run?.Source.Id ?? Node.Id;

    /// <summary>The fed node's id.</summary>
    public string To => Node.Id;

    /// <summary>Index of the fed node in the network.</summary>
    public int NodeIndex => Row.Node;

    /// <summary>The system designation the run carries.</summary>
    public string System => Run is { } run ? run.System.Name : Transformer.Secondary.Name;

    /// <summary>Nominal voltage in volts that the percentages refer to.</summary>
    public double VoltageV => Row.VoltageV;

    /// <summary>Phases: 1 or 3.</summary>
    public int Phases => Run is { } run ? run.Supply.Phases : Transformer.Secondary.FeederSupply.Phases;

    /// <summary>Line current in amperes the drop is computed at.</summary>
    public double CurrentA => Row.CurrentA;

    /// <summary>
    /// Design current in amperes for the ampacity and device checks: the most loaded line's, as the code in force
    /// counts it (under the NEC, 125 % of that line's continuous current plus the rest, and 25 % more of the largest
    /// motor on it; a motor's branch circuit 125 % of its full-load current, air-conditioning equipment's its nameplate
    /// minimum circuit ampacity).
    /// </summary>
    public double DesignCurrentA => Row.DesignCurrentA;

    /// <summary>The line whose design current <see cref="DesignCurrentA"/> is (<c>A</c>, <c>B</c> or <c>C</c>), or null for a transformer.</summary>
    public string? DesignLine => Run is null ? null : ((char)('A' + Row.DesignLine)).ToString();

    /// <summary>The neutral's design current in amperes, as the code in force counts it, or null where the run has no neutral.</summary>
    public double? NeutralDesignCurrentA => Run is null ? null : Row.NeutralDesignCurrentA;

    /// <summary>The rule set that judged the run (its grouping count's unit and threshold, for the outputs).</summary>
    public Codes.CodeRules Code => _rows.Code;

    /// <summary>
    /// The current-carrying conductors in the run's raceway that its ampacity is adjusted for (above 3): as stated,
    /// the sum of the runs sharing its named raceway, or its own set's as the code counts them; null for a transformer.
    /// </summary>
    public int? CurrentCarryingConductors => Run is null ? null : Row.CurrentCarrying;

    /// <summary>The run's shared raceway as the project names it, or null.</summary>
    public string? RacewayId => Run?.Conductors.RacewayId;

    /// <summary>The neutral's allowable ampacity of all sets, in amperes, or null where the run has no neutral or the table has none.</summary>
    public double? NeutralAmpacityA => Run is null ? null : Row.NeutralAmpacityA;

    /// <summary>The current in each line (A, B, C; as many as the run's system has), amperes; empty for a transformer.</summary>
    public IReadOnlyList<double> LineCurrentsA => Run is { } run ? _rows.Phases.LineCurrentsA(NodeIndex, PhaseRules.Lines(run.System)) : [];

    /// <summary>
    /// The apparent power on each line (A, B, C; as many as the run's system has), VA: the line's current times the
    /// system's line-to-neutral voltage, as <see cref="PanelResult.LineVa"/> counts a panel's (a 2-pole circuit's load is
    /// so shared between its two lines); empty for a transformer.
    /// </summary>
    public IReadOnlyList<double> LineVa
    {
        get
        {
            if (Run is not { } run)
            {
                return [];
            }

            var v = LineVoltages.LineToNeutralV(run.System);
            var currents = _rows.Phases.LineCurrentsA(NodeIndex, PhaseRules.Lines(run.System));
            for (var x = 0; x < currents.Length; x++)
            {
                currents[x] *= v;
            }

            return currents;
        }
    }

    /// <summary>Neutral current in amperes (Ia + Ib + Ic), or null on a system without a neutral or for a transformer.</summary>
    public double? NeutralCurrentA => Run is { System.HasNeutral: true } ? _rows.Phases.NeutralCurrentA(NodeIndex) : null;

    /// <summary>A branch circuit's lines (<c>A</c>, <c>BC</c>, <c>ABC</c> …), or null for feeders and transformers.</summary>
    public string? Lines => Run is { Kind: RunKind.Branch } ? SolvedRows.LinesOf(_rows.Phases.Assigned[NodeIndex]) : null;

    /// <summary>Power factor of the power carried.</summary>
    public double PowerFactor => _rows.Power[NodeIndex].PowerFactor;

    /// <summary>Apparent power carried, in VA.</summary>
    public double ApparentPowerVa => _rows.Power[NodeIndex].VoltAmperes;

    /// <summary>Conductor size text, or null for a transformer.</summary>
    public string? Size => Run?.Conductors.Size.Text;

    /// <summary><c>cu</c> or <c>al</c>, or null for a transformer.</summary>
    public string? Material => Run is { } run ? Words.Material.Of(run.Conductors.Material) : null;

    /// <summary><c>pvc</c>, <c>aluminum</c> or <c>steel</c>, or null for a transformer.</summary>
    public string? Raceway => Run is { } run ? Words.Raceway.Of(run.Conductors.Raceway) : null;

    /// <summary>Parallel sets (1 for a transformer).</summary>
    public int Sets => Run?.Conductors.Sets ?? 1;

    /// <summary>One-way length in metres (0 for a transformer).</summary>
    public double LengthM => Run?.Conductors.LengthM ?? 0;

    /// <summary>Conductor temperature in °C used for resistance, or null for a transformer.</summary>
    public double? TemperatureC => Run is null ? null : Row.TemperatureC;

    /// <summary>AC resistance per conductor in ohm/km, or null for a transformer.</summary>
    public double? ResistanceOhmPerKm => Run is null ? null : Row.ResistanceOhmPerKm;

    /// <summary>Reactance per conductor in ohm/km, or null for a transformer.</summary>
    public double? ReactanceOhmPerKm => Run is null ? null : Row.ReactanceOhmPerKm;

    /// <summary>Allowable ampacity of all sets, in amperes (for a transformer: its rated current).</summary>
    public double? AmpacityA => Run is null ? Row.RatedA : Row.AmpacityA;

    /// <summary>The stated neutral size of each set (<c>neutral_size</c>), or null where none is stated.</summary>
    public string? NeutralSize => Run?.Conductors.NeutralSize?.Text;

    /// <summary>The stated equipment grounding conductor of each set (<c>ground_size</c>), or null where none is stated.</summary>
    public string? GroundSize => Run?.Conductors.GroundSize?.Text;

    /// <summary>
    /// The smallest equipment grounding conductor each set needs, as the code in force sizes it (NEC: by the device and
    /// in proportion to lines larger than the load needs), or null where it gives none (no device, or a transformer).
    /// </summary>
    public ConductorSize? GroundMinimum => Run switch
    {
        null => null,
        { Conductors.GroundSize: not null } => Row.GroundMinIndex == 0 ? null : ConductorSize.All[Row.GroundMinIndex - 1],
        { Conductors: var c } run => _rows.Code.MinimumGroundSize(c, c.Size, c.Sets, Row.DesignCurrentA, _rows.Rules, Row.CurrentCarrying, Codes.CircuitDuty.Of(run)),
    };

    /// <summary>The text of <see cref="GroundMinimum"/>, or null.</summary>
    public string? GroundMinSize => GroundMinimum?.Text;

    /// <summary>Overcurrent device rating in amperes, if given.</summary>
    public double? OcpdA => Run?.Conductors.OcpdA;

    /// <summary>Voltage drop in volts.</summary>
    public double DropV => Row.DropV;

    /// <summary>Voltage drop in percent of <see cref="VoltageV"/>, by the method the rules choose.</summary>
    public double DropPercent => Row.DropPercent;

    /// <summary>The drop by the percent-sum (effective-impedance) method, percent.</summary>
    public double PercentSumDropPercent => Row.PercentSumDropPercent;

    /// <summary>The drop by the load flow, percent (difference of the per-unit voltages at its ends); null when it did not converge.</summary>
    public double? LoadFlowDropPercent => Row.LoadFlowDropPercent;

    /// <summary>The run's own limit in percent, or null for a transformer.</summary>
    public double? LimitPercent => Run?.LimitPercent;

    /// <summary>Longest length in metres at which the run meets its own limit, the rest unchanged; null when unbounded.</summary>
    public double? MaxLengthM => Row.MaxLengthM;

    /// <summary>Longest length in metres at which every end point below it meets the total limit; null when unbounded.</summary>
    public double? MaxLengthTotalM => Row.MaxLengthTotalM;

    /// <summary>True when this run's drop counts in the totals of the end points below it.</summary>
    public bool CountsInTotal => Run is not null || _rows.Rules.TransformerDrop == TransformerDropMode.Count;

    /// <summary>The limits this run exceeds.</summary>
    public IReadOnlyList<Finding> Findings => _rows.RunFindings[_index] ?? [];

    /// <summary>
    /// Per voltage of its bus (see <c>Slots</c>), the drop in percent this run makes in it per ohm/km of resistance
    /// (into <paramref name="unitR"/>) and per ohm/km of reactance (into <paramref name="unitX"/>), at the run's
    /// present length and sets and the currents it carries: the drop is linear in R and X, so the sizer can price any
    /// size without solving the tree again. Gives the voltages (bits) its own drop is the worst of; none for a
    /// transformer. Worked out when asked, as the solve did.
    /// </summary>
    internal int UnitDrops(Span<double> unitR, Span<double> unitX)
    {
        if (Run is { } run)
        {
            return RunDrops.UnitDrops(run, _rows.Phases, Row.CurrentA, _rows.Phases.MaxLineCurrentA(NodeIndex), unitR, unitX);
        }

        unitR.Clear();
        unitX.Clear();
        return 0;
    }

    /// <summary>Where the run is in the project file.</summary>
    public SourceLocation Location => Run is { } run ? run.Conductors.Location : Node.Equipment!.Location;

    /// <summary>Equal when both show the same row of the same solution.</summary>
    public static bool operator ==(RunResult left, RunResult right) => left.Equals(right);

    /// <summary>Not equal unless both show the same row of the same solution.</summary>
    public static bool operator !=(RunResult left, RunResult right) => !left.Equals(right);

    /// <inheritdoc/>
    public bool Equals(RunResult other) => ReferenceEquals(_rows, other._rows) && _index == other._index;

    /// <inheritdoc/>
    public override bool Equals(object? obj) => obj is RunResult other && Equals(other);

    /// <inheritdoc/>
    public override int GetHashCode() => HashCode.Combine(_rows, _index);

    /// <inheritdoc/>
    public override string ToString() => $"{Kind} {Id}: {DropPercent} %";
}
