using DistTree.Diagnostics;

namespace DistTree.Model;

/// <summary>A branch circuit of a panelboard: an end point of the tree.</summary>
public sealed record Circuit
{
    /// <summary>The circuit's id, unique in its panel (e.g. <c>"1"</c>).</summary>
    public required string Id { get; init; }

    /// <summary>The id unique in the project: <c>PANEL/ID</c>.</summary>
    public required string FullId { get; init; }

    /// <summary>What the circuit serves.</summary>
    public string Name { get; init; } = "";

    /// <summary>1 (line-neutral), 2 (line-line) or 3 (three-phase).</summary>
    public required int Poles { get; init; }

    /// <summary>The lines the circuit is on, or null to let the solver assign them to balance its panel.</summary>
    public Phases? Phases { get; init; }

    /// <summary>Where <see cref="Phases"/> comes from (stated or numbered; balanced when the solver assigns them).</summary>
    public PhaseSource PhaseSource { get; init; } = PhaseSource.Balanced;

    /// <summary>The supply the panel's system gives a circuit of this many poles.</summary>
    public required CircuitSupply Supply { get; init; }

    /// <summary>The load at the end of the run; for a circuit with <see cref="Points"/>, their sum as apparent power.</summary>
    public required Load Load { get; init; }

    /// <summary>Loads along the run, nearest first; empty for a load at the end. The farthest point is the end point.</summary>
    public IReadOnlyList<LoadPoint> Points { get; init; } = [];

    /// <summary>
    /// What the load is: as stated (<c>category</c>), else <see cref="LoadCategory.Motor"/> for a motor load and
    /// <see cref="LoadCategory.Other"/> for any other. A motor load is a motor or HVAC equipment.
    /// </summary>
    public LoadCategory Category { get; init; } = LoadCategory.Other;

    /// <summary>True when the load is continuous (3 hours or more): design current is 125 % of it (a motor's 125 % comes from the motor rules instead).</summary>
    public bool Continuous { get; init; }

    /// <summary>The branch-circuit conductors.</summary>
    public required Run Run { get; init; }

    /// <summary>Where the circuit is in the project file.</summary>
    public SourceLocation Location { get; init; } = SourceLocation.None;
}
