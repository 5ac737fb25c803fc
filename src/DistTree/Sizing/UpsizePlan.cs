using DistTree.Diagnostics;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>One run's change in an upsize plan.</summary>
public sealed record UpsizeChange
{
    /// <summary>The run's id (the node it feeds).</summary>
    public required string RunId { get; init; }

    /// <summary>Feeder or branch circuit.</summary>
    public required RunResultKind Kind { get; init; }

    /// <summary>Size before, canonical text.</summary>
    public required string SizeBefore { get; init; }

    /// <summary>Size after, canonical text.</summary>
    public required string SizeAfter { get; init; }

    /// <summary>Parallel sets before.</summary>
    public required int SetsBefore { get; init; }

    /// <summary>Parallel sets after.</summary>
    public required int SetsAfter { get; init; }

    /// <summary>The run's drop before, percent.</summary>
    public required double DropPercentBefore { get; init; }

    /// <summary>The run's drop after, percent.</summary>
    public required double DropPercentAfter { get; init; }

    /// <summary>
    /// Conductor material added: Δ(area × length × current-carrying conductors × sets), in mm²·m (or the price table's unit),
    /// and a grounding conductor the plan names (<see cref="GroundSizeAfter"/> beyond what the code makes follow the lines):
    /// Δ(area × length × sets).
    /// </summary>
    public required double CostAdded { get; init; }

    /// <summary>
    /// What the new size needs of the equipment grounding conductor, in words with the clause the code in force cites: the
    /// minimum in each set (<see cref="GroundMinSize"/>), and where the stated one is smaller, that it must be increased too.
    /// </summary>
    public string? GroundingNote { get; init; }

    /// <summary>The smallest equipment grounding conductor each set needs at the new size, or null where the code gives none (no device).</summary>
    public string? GroundMinSize { get; init; }

    /// <summary>The run's stated equipment grounding conductor (<c>ground_size</c>), or null where none is stated.</summary>
    public string? GroundSize { get; init; }

    /// <summary>True when the stated grounding conductor is smaller than the new size needs: it must be increased too.</summary>
    public bool GroundMustIncrease { get; init; }

    /// <summary>
    /// The grounding conductor the plan writes on the run (<c>ground_size</c>, each set), or null where it writes none: the
    /// stated one raised to the new size's minimum, or one raised beyond the code's minimum so that a fault at the far end
    /// trips the device (<see cref="FaultClearingNote"/>).
    /// </summary>
    public string? GroundSizeAfter { get; init; }

    /// <summary>
    /// Where the change goes beyond what the drops need so that a fault at the run's far end trips its device without delay:
    /// what was changed, what the far end drew against the trip current, and the device that would clear it instead.
    /// </summary>
    public string? FaultClearingNote { get; init; }

    /// <summary>The node the run feeds, in the tree the plan was made on.</summary>
    internal int NodeIndex { get; init; }

    /// <summary>Where the run's size value is in the project file.</summary>
    public SourceLocation SizeLocation { get; init; } = SourceLocation.None;
}

/// <summary>A transformer's tap in an upsize plan: set it from one position to another.</summary>
public sealed record TapChange
{
    /// <summary>The transformer's id.</summary>
    public required string TransformerId { get; init; }

    /// <summary>The tap before, percent (<c>tap_percent</c>; negative raises the secondary).</summary>
    public required double TapPercentBefore { get; init; }

    /// <summary>The tap to set, percent.</summary>
    public required double TapPercentAfter { get; init; }

    /// <summary>The transformer's regulation before (its worst voltage, the tap's part included), percent.</summary>
    public required double RegulationPercentBefore { get; init; }

    /// <summary>The transformer's regulation at the new tap, percent.</summary>
    public required double RegulationPercentAfter { get; init; }

    /// <summary>What setting it costs (<c>sizing: tap_cost</c>), in the plan's unit; 0 by default.</summary>
    public required double CostAdded { get; init; }

    /// <summary>Where the transformer is in the project file.</summary>
    public SourceLocation Location { get; init; } = SourceLocation.None;
}

/// <summary>A path or run that no allowed choice can bring within its limits, and what it would take.</summary>
/// <param name="Subject">The end point or run id.</param>
/// <param name="Message">What fails even at the largest choice, and what would fix it.</param>
public sealed record UnresolvableLimit(string Subject, string Message);

/// <summary>What the plan leaves as it is but a person should know: a stated tap that raises a bus over the light-load limit.</summary>
/// <param name="Subject">The transformer's id.</param>
/// <param name="Message">What is over the limit, and what the plan does about it.</param>
public sealed record PlanCaution(string Subject, string Message);

/// <summary>The least-material set of upsizes that brings the tree within its limits, proved by re-solving.</summary>
public sealed record UpsizePlan
{
    /// <summary>The runs that change, in network order.</summary>
    public required IReadOnlyList<UpsizeChange> Changes { get; init; }

    /// <summary>The transformers whose taps the plan sets, in network order.</summary>
    public IReadOnlyList<TapChange> TapChanges { get; init; } = [];

    /// <summary>Total cost of the changes (material added, or priced; the taps' cost included).</summary>
    public required double TotalCostAdded { get; init; }

    /// <summary>
    /// The part of <see cref="TotalCostAdded"/> that the far-end fault repair added after the optimum on the drop grid
    /// (see <c>FarEndRepair</c>): the optimum itself is the rest.
    /// </summary>
    public double FarEndRepairCostAdded { get; init; }

    /// <summary>The cost unit: <c>mm2·m</c> of conductor, or the price table's currency.</summary>
    public required string CostUnit { get; init; }

    /// <summary>Limits no allowed choice satisfies.</summary>
    public IReadOnlyList<UnresolvableLimit> Unresolvable { get; init; } = [];

    /// <summary>
    /// Each transformer whose stated tap already puts its secondary over the light-load limit
    /// (<c>sizing: light_load_rise_percent</c>) at no load: the plan keeps the tap and raises none below it.
    /// </summary>
    public IReadOnlyList<PlanCaution> Cautions { get; init; } = [];

    /// <summary>The solution before the plan.</summary>
    public required Solution Before { get; init; }

    /// <summary>The tree re-solved with the plan applied: the proof that every limit holds.</summary>
    public required Solution After { get; init; }
}
