using DistTree.Solving;

namespace DistTree.Comparing;

/// <summary>
/// What a change of design does: the elements added, removed and changed, and what moved downstream.
/// Every list is in a deterministic order that does not depend on the order of either project file.
/// </summary>
public sealed record Comparison
{
    /// <summary>The old revision.</summary>
    public required RevisionInfo Before { get; init; }

    /// <summary>The new revision.</summary>
    public required RevisionInfo After { get; init; }

    /// <summary>Counts.</summary>
    public required ComparisonSummary Summary { get; init; }

    /// <summary>Project-level fields that differ (name, rules, service, defaults), in a fixed order.</summary>
    public required IReadOnlyList<FieldChange> ProjectChanges { get; init; }

    /// <summary>Equipment added, removed or changed, by id (ordinal).</summary>
    public required IReadOnlyList<ElementChange> Equipment { get; init; }

    /// <summary>Circuits added, removed or changed, by full id (ordinal).</summary>
    public required IReadOnlyList<ElementChange> Circuits { get; init; }

    /// <summary>
    /// End points in both revisions whose total, limit or findings moved: newly failing first, then newly passing,
    /// then by the largest absolute change of total, ties by id (ordinal).
    /// </summary>
    public required IReadOnlyList<EndPointDelta> EndPoints { get; init; }

    /// <summary>Runs in both revisions whose drop, loading or findings moved, in the same order as <see cref="EndPoints"/>.</summary>
    public required IReadOnlyList<RunDelta> Runs { get; init; }

    /// <summary>
    /// Feeders and transformers in both revisions whose current or ampacity margin moved: newly failing first,
    /// then newly passing, then by the largest absolute change of margin, ties by id (ordinal).
    /// </summary>
    public required IReadOnlyList<RunDelta> UpstreamRuns { get; init; }

    /// <summary>
    /// The available fault current at every switchboard, panelboard, transformer and splitter in either revision, each
    /// revision's figures from its own short-circuit study (see <see cref="FaultDelta"/> for the order).
    /// </summary>
    public required IReadOnlyList<FaultDelta> Faults { get; init; }

    /// <summary>Findings present after and absent before by (kind, subject), by subject then code (ordinal).</summary>
    public required IReadOnlyList<Finding> NewFindings { get; init; }

    /// <summary>Findings present before and absent after by (kind, subject), by subject then code (ordinal).</summary>
    public required IReadOnlyList<Finding> ResolvedFindings { get; init; }

    /// <summary>True when the new revision has a finding the old one did not (the gate a CI job checks).</summary>
    public bool HasNewFindings => NewFindings.Count > 0;

    /// <summary>True when nothing differs: no field, figure (fault currents included) or finding moved beyond <see cref="ComparisonTolerance"/>.</summary>
    public bool IsUnchanged =>
        ProjectChanges.Count == 0 && Equipment.Count == 0 && Circuits.Count == 0 && EndPoints.Count == 0 &&
        Runs.Count == 0 && NewFindings.Count == 0 && ResolvedFindings.Count == 0 && !Faults.Any(f => f.Moved);
}
