namespace DistTree.Solving;

/// <summary>The solved figures of one point of use: the total along its path from the service.</summary>
public sealed record EndPointResult
{
    /// <summary>The circuit's full id (<c>PANEL/ID</c>).</summary>
    public required string Id { get; init; }

    /// <summary>The circuit's name.</summary>
    public required string Name { get; init; }

    /// <summary>The panel's id.</summary>
    public required string Panel { get; init; }

    /// <summary>Index of the end point's node in the network.</summary>
    public required int NodeIndex { get; init; }

    /// <summary>Node ids from the service to the end point.</summary>
    public required IReadOnlyList<string> Path { get; init; }

    /// <summary>Indices into <see cref="Solution.Runs"/> of the runs along the path that count in the total, service side first.</summary>
    public required IReadOnlyList<int> RunIndices { get; init; }

    /// <summary>Each counted run's share of <see cref="TotalDropPercent"/>, percent, aligned with <see cref="RunIndices"/>: the drop on the end point's own lines.</summary>
    public required IReadOnlyList<double> RunSharesPercent { get; init; }

    /// <summary>The circuit's nominal voltage in volts.</summary>
    public required double VoltageV { get; init; }

    /// <summary>Sum of the percent drops along the path (from a new origin where the rules say so).</summary>
    public required double TotalDropPercent { get; init; }

    /// <summary>The total limit in percent.</summary>
    public required double LimitPercent { get; init; }

    /// <summary>The voltage at the point of use: nominal × (1 − total/100).</summary>
    public required double EndVoltageV { get; init; }

    /// <summary>The total by the percent-sum method, percent.</summary>
    public double PercentSumTotalDropPercent { get; init; }

    /// <summary>The total by the load flow, percent; null when it did not converge.</summary>
    public double? LoadFlowTotalDropPercent { get; init; }

    /// <summary>The voltage at the point of use by the load flow, volts; null when it did not converge.</summary>
    public double? LoadFlowEndVoltageV { get; init; }

    /// <summary>The starting check of a motor end point; null for other loads.</summary>
    public MotorStartResult? MotorStart { get; init; }

    /// <summary>The limits this end point exceeds (the total; its own runs' findings are on the runs).</summary>
    public IReadOnlyList<Finding> Findings { get; init; } = [];
}
