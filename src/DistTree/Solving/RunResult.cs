using DistTree.Diagnostics;

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

/// <summary>The solved figures of one feeder, branch circuit or transformer.</summary>
public sealed record RunResult
{
    /// <summary>The id of the node it feeds.</summary>
    public required string Id { get; init; }

    /// <summary>Feeder, branch or transformer.</summary>
    public required RunResultKind Kind { get; init; }

    /// <summary>The source node's id.</summary>
    public required string From { get; init; }

    /// <summary>The fed node's id.</summary>
    public required string To { get; init; }

    /// <summary>Index of the fed node in the network.</summary>
    public required int NodeIndex { get; init; }

    /// <summary>The system designation the run carries.</summary>
    public required string System { get; init; }

    /// <summary>Nominal voltage in volts that the percentages refer to.</summary>
    public required double VoltageV { get; init; }

    /// <summary>Phases: 1 or 3.</summary>
    public required int Phases { get; init; }

    /// <summary>Line current in amperes the drop is computed at.</summary>
    public required double CurrentA { get; init; }

    /// <summary>Design current in amperes for the ampacity check (125 % of continuous load plus the rest).</summary>
    public required double DesignCurrentA { get; init; }

    /// <summary>The current in each line (A, B, C; as many as the run's system has), amperes; empty for a transformer.</summary>
    public IReadOnlyList<double> LineCurrentsA { get; init; } = [];

    /// <summary>Neutral current in amperes (Ia + Ib + Ic), or null on a system without a neutral or for a transformer.</summary>
    public double? NeutralCurrentA { get; init; }

    /// <summary>A branch circuit's lines (<c>A</c>, <c>BC</c>, <c>ABC</c> …), or null for feeders and transformers.</summary>
    public string? Lines { get; init; }

    /// <summary>Power factor of the power carried.</summary>
    public required double PowerFactor { get; init; }

    /// <summary>Apparent power carried, in VA.</summary>
    public required double ApparentPowerVa { get; init; }

    /// <summary>Conductor size text, or null for a transformer.</summary>
    public string? Size { get; init; }

    /// <summary><c>cu</c> or <c>al</c>, or null for a transformer.</summary>
    public string? Material { get; init; }

    /// <summary><c>pvc</c>, <c>aluminum</c> or <c>steel</c>, or null for a transformer.</summary>
    public string? Raceway { get; init; }

    /// <summary>Parallel sets.</summary>
    public int Sets { get; init; } = 1;

    /// <summary>One-way length in metres (0 for a transformer).</summary>
    public double LengthM { get; init; }

    /// <summary>Conductor temperature in °C used for resistance, or null for a transformer.</summary>
    public double? TemperatureC { get; init; }

    /// <summary>AC resistance per conductor in ohm/km.</summary>
    public double? ResistanceOhmPerKm { get; init; }

    /// <summary>Reactance per conductor in ohm/km.</summary>
    public double? ReactanceOhmPerKm { get; init; }

    /// <summary>Allowable ampacity of all sets, in amperes (for a transformer: its rated current).</summary>
    public double? AmpacityA { get; init; }

    /// <summary>Overcurrent device rating in amperes, if given.</summary>
    public double? OcpdA { get; init; }

    /// <summary>Voltage drop in volts.</summary>
    public required double DropV { get; init; }

    /// <summary>Voltage drop in percent of <see cref="VoltageV"/>, by the method the rules choose.</summary>
    public required double DropPercent { get; init; }

    /// <summary>The drop by the percent-sum (effective-impedance) method, percent.</summary>
    public double PercentSumDropPercent { get; init; }

    /// <summary>The drop by the load flow, percent (difference of the per-unit voltages at its ends); null when it did not converge.</summary>
    public double? LoadFlowDropPercent { get; init; }

    /// <summary>The run's own limit in percent, or null for a transformer.</summary>
    public double? LimitPercent { get; init; }

    /// <summary>Longest length in metres at which the run meets its own limit, the rest unchanged; null when unbounded.</summary>
    public double? MaxLengthM { get; init; }

    /// <summary>Longest length in metres at which every end point below it meets the total limit; null when unbounded.</summary>
    public double? MaxLengthTotalM { get; init; }

    /// <summary>True when this run's drop counts in the totals of the end points below it.</summary>
    public bool CountsInTotal { get; init; } = true;

    /// <summary>The limits this run exceeds.</summary>
    public IReadOnlyList<Finding> Findings { get; init; } = [];

    /// <summary>
    /// Per set of lines ((int)Phases, 1 = A … 7 = ABC), the drop in percent that a circuit on those lines sees
    /// on this run per ohm/km of resistance and per ohm/km of reactance, at the run's present length and sets:
    /// the drop is linear in R and X, so the sizer can price any size without solving the tree again.
    /// </summary>
    internal ReadOnlyMemory<double> UnitDropsR { get; init; } = NoUnitDrops;

    /// <summary>See <see cref="UnitDropsR"/>, per ohm/km of reactance.</summary>
    internal ReadOnlyMemory<double> UnitDropsX { get; init; } = NoUnitDrops;

    /// <summary>The set of lines whose drop is the run's own (a branch circuit's lines), or 0 for the worst of all (a feeder).</summary>
    internal int OwnLines { get; init; }

    /// <summary>The drop on each set of lines at the run's size: R·UnitDropsR + X·UnitDropsX.</summary>
    internal double LineDrop(int set) => (ResistanceOhmPerKm!.Value * UnitDropsR.Span[set]) + (ReactanceOhmPerKm!.Value * UnitDropsX.Span[set]);

    // No unit drops (a transformer's drop is not a conductor's): shared, never written.
    private static readonly double[] NoUnitDrops = new double[8];

    /// <summary>Where the run is in the project file.</summary>
    public SourceLocation Location { get; init; } = SourceLocation.None;
}
