namespace DistTree.Comparing;

/// <summary>The counts of a comparison.</summary>
public sealed record ComparisonSummary
{
    /// <summary>Project-level fields (name, rules, service, defaults) that differ.</summary>
    public required int ProjectChanges { get; init; }

    /// <summary>Equipment only in the new revision.</summary>
    public required int EquipmentAdded { get; init; }

    /// <summary>Equipment only in the old revision.</summary>
    public required int EquipmentRemoved { get; init; }

    /// <summary>Equipment in both with a field changed.</summary>
    public required int EquipmentChanged { get; init; }

    /// <summary>Circuits only in the new revision.</summary>
    public required int CircuitsAdded { get; init; }

    /// <summary>Circuits only in the old revision.</summary>
    public required int CircuitsRemoved { get; init; }

    /// <summary>Circuits in both with a field changed.</summary>
    public required int CircuitsChanged { get; init; }

    /// <summary>End points in both revisions.</summary>
    public required int EndPointsCompared { get; init; }

    /// <summary>End points in both whose total, limit or findings moved.</summary>
    public required int EndPointsAffected { get; init; }

    /// <summary>End points in both that pass before and fail after.</summary>
    public required int EndPointsNewlyFailing { get; init; }

    /// <summary>End points in both that fail before and pass after.</summary>
    public required int EndPointsNewlyPassing { get; init; }

    /// <summary>Runs (feeders, branch circuits, transformers) in both revisions.</summary>
    public required int RunsCompared { get; init; }

    /// <summary>Runs in both whose figures or findings moved.</summary>
    public required int RunsAffected { get; init; }

    /// <summary>The largest rise of an end point's total, percentage points (0 when none rose).</summary>
    public required double LargestRisePoints { get; init; }

    /// <summary>The end point with that rise, or null.</summary>
    public string? LargestRiseEndPoint { get; init; }

    /// <summary>The largest fall of an end point's total, percentage points, as a positive number (0 when none fell).</summary>
    public required double LargestFallPoints { get; init; }

    /// <summary>The end point with that fall, or null.</summary>
    public string? LargestFallEndPoint { get; init; }

    /// <summary>Switchboards, panelboards, transformers and splitters in both revisions whose fault currents were compared.</summary>
    public required int FaultsCompared { get; init; }

    /// <summary>Those of them whose three-phase or line-to-ground fault current rose (<see cref="FaultDelta.Rose"/>).</summary>
    public required int FaultsRose { get; init; }

    /// <summary>Equipment (in both revisions or added) whose fault current exceeds its stated rating in the new revision and did not in the old.</summary>
    public required int FaultsNewlyOverRating { get; init; }

    /// <summary>Findings present after and absent before, by (kind, subject).</summary>
    public required int NewFindings { get; init; }

    /// <summary>Findings present before and absent after, by (kind, subject).</summary>
    public required int ResolvedFindings { get; init; }
}
