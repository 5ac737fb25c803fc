using DistTree.Solving;

namespace DistTree.Comparing;

/// <summary>A feeder, branch circuit or transformer present in both revisions whose figures or findings moved.</summary>
public sealed record RunDelta
{
    /// <summary>The id of the node it feeds (for a transformer row: the transformer's id).</summary>
    public required string Id { get; init; }

    /// <summary>Feeder, branch or transformer (a transformer and its primary feeder share an id).</summary>
    public required RunResultKind Kind { get; init; }

    /// <summary>The source node's id in the new revision.</summary>
    public required string From { get; init; }

    /// <summary>Drop in percent of the run's nominal voltage; <see cref="Delta.Change"/> is in percentage points.</summary>
    public required Delta DropPercent { get; init; }

    /// <summary>Drop in volts.</summary>
    public required Delta DropV { get; init; }

    /// <summary>Line current in amperes that the drop is computed at.</summary>
    public required Delta CurrentA { get; init; }

    /// <summary>Design current in amperes (125 % of continuous load plus the rest).</summary>
    public required Delta DesignCurrentA { get; init; }

    /// <summary>Allowable ampacity in amperes (a transformer's rated current), or null when either revision has none.</summary>
    public Delta? AmpacityA { get; init; }

    /// <summary>Ampacity margin in amperes: ampacity minus design current (negative when overloaded); null without ampacity.</summary>
    public Delta? MarginA { get; init; }

    /// <summary>Finding codes before, distinct, ordinal order; empty when it passed.</summary>
    public required IReadOnlyList<string> FindingsBefore { get; init; }

    /// <summary>Finding codes after.</summary>
    public required IReadOnlyList<string> FindingsAfter { get; init; }

    /// <summary>How its status changed.</summary>
    public required StatusChange Status { get; init; }

    /// <summary>True when its drop moved by more than <see cref="ComparisonTolerance.PercentPoints"/>.</summary>
    public bool DropMoved => ComparisonTolerance.PercentMoved(DropPercent.Before, DropPercent.After);

    /// <summary>True when its current, design current, ampacity or margin moved by more than <see cref="ComparisonTolerance.Relative"/>.</summary>
    public bool LoadingMoved =>
        ComparisonTolerance.Moved(CurrentA.Before, CurrentA.After) ||
        ComparisonTolerance.Moved(DesignCurrentA.Before, DesignCurrentA.After) ||
        ComparisonTolerance.Moved(AmpacityA?.Before, AmpacityA?.After) ||
        ComparisonTolerance.Moved(MarginA?.Before, MarginA?.After);
}
