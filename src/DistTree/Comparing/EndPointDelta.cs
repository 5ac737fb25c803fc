namespace DistTree.Comparing;

/// <summary>An end point present in both revisions whose total drop, limit or findings moved.</summary>
public sealed record EndPointDelta
{
    /// <summary>The circuit's full id (<c>PANEL/ID</c>).</summary>
    public required string Id { get; init; }

    /// <summary>The circuit's name in the new revision.</summary>
    public required string Name { get; init; }

    /// <summary>The panel's id.</summary>
    public required string Panel { get; init; }

    /// <summary>Total drop from the service (or a new origin) in percent; <see cref="Delta.Change"/> is in percentage points.</summary>
    public required Delta TotalDropPercent { get; init; }

    /// <summary>The total limit in percent.</summary>
    public required Delta LimitPercent { get; init; }

    /// <summary>Voltage at the point of use in volts.</summary>
    public required Delta EndVoltageV { get; init; }

    /// <summary>
    /// Finding codes before (the end point's own and its branch circuit's: <c>total_drop</c>, <c>branch_drop</c>, <c>ampacity</c>, …),
    /// distinct, ordinal order; empty when it passed.
    /// </summary>
    public required IReadOnlyList<string> FindingsBefore { get; init; }

    /// <summary>Finding codes after, as <see cref="FindingsBefore"/>.</summary>
    public required IReadOnlyList<string> FindingsAfter { get; init; }

    /// <summary>How its status changed.</summary>
    public required StatusChange Status { get; init; }
}
