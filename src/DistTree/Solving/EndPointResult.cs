using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// The solved figures of one point of use, the total along its path from the service: a view into its solution
/// (a copy is cheap, and reading a figure reads the solve's own arrays). Two views are equal when they show the
/// same end point of the same solution.
/// </summary>
public readonly struct EndPointResult : IEquatable<EndPointResult>
{
    private readonly SolvedRows _rows;
    private readonly int _index;

    internal EndPointResult(SolvedRows rows, int index)
    {
        _rows = rows;
        _index = index;
    }

    private ref readonly EndPointRow Row => ref _rows.EndPoints[_index];

    private NetworkNode Node => _rows.Nodes[Row.Node];

    /// <summary>The circuit's full id (<c>PANEL/ID</c>).</summary>
    public string Id => Node.Circuit!.FullId;

    /// <summary>The circuit's name.</summary>
    public string Name => Node.Circuit!.Name;

    /// <summary>What the circuit's load is (<see cref="Circuit.Category"/>).</summary>
    public LoadCategory Category => Node.Circuit!.Category;

    /// <summary>The panel's id.</summary>
    public string Panel => _rows.Nodes[Node.ParentIndex].Id;

    /// <summary>Index of the end point's node in the network.</summary>
    public int NodeIndex => Row.Node;

    /// <summary>Node ids from the service to the end point (made anew at each reading).</summary>
    public IReadOnlyList<string> Path
    {
        get
        {
            var nodes = _rows.Nodes;
            var depth = 0;
            for (var i = Row.Node; i >= 0; i = nodes[i].ParentIndex)
            {
                depth++;
            }

            var path = new string[depth];
            for (var i = Row.Node; i >= 0; i = nodes[i].ParentIndex)
            {
                path[--depth] = nodes[i].Id;
            }

            return path;
        }
    }

    /// <summary>Indices into <see cref="Solution.Runs"/> of the runs along the path that count in the total, service side first.</summary>
    public IReadOnlyList<int> RunIndices => new ArraySegment<int>(_rows.PathRuns, Row.PathStart, Row.PathCount);

    /// <summary>
    /// The utility's share of <see cref="TotalDropPercent"/>, percent: the drop in its impedance ahead of the service,
    /// where the project gives its available fault current (else 0); the rest is <see cref="RunSharesPercent"/>.
    /// </summary>
    public double SourceDropPercent => Row.SourceSharePercent;

    /// <summary>Each counted run's share of <see cref="TotalDropPercent"/>, percent, aligned with <see cref="RunIndices"/>: the drop on the end point's own lines.</summary>
    public IReadOnlyList<double> RunSharesPercent => new ArraySegment<double>(_rows.PathShares, Row.PathStart, Row.PathCount);

    /// <summary>
    /// Aligned with <see cref="RunIndices"/>, the line each run's share is read on and its current: of the lines the end
    /// point's own voltage reads in that run (its line, its pair, its worst pair; above a delta-wye transformer the primary
    /// lines of its winding; a transformer's secondary lines), the one whose own conductor makes the largest part of the
    /// share (see <see cref="PathLineCurrent"/>). Worked out at each reading.
    /// </summary>
    public IReadOnlyList<PathLineCurrent> RunLineCurrents => PathLines.Of(_rows, _index);

    /// <summary>The circuit's nominal voltage in volts.</summary>
    public double VoltageV => Node.Circuit!.Supply.VoltageV;

    /// <summary>Sum of the percent drops along the path (from a new origin where the rules say so).</summary>
    public double TotalDropPercent => Row.TotalDropPercent;

    /// <summary>The end point's total limit in percent (see <see cref="Rules.TotalLimitFor"/>).</summary>
    public double LimitPercent => Row.LimitPercent;

    /// <summary>The voltage at the point of use: nominal × (1 − total/100).</summary>
    public double EndVoltageV => VoltageV * (1 - (TotalDropPercent / 100.0));

    /// <summary>The total by the percent-sum method, percent.</summary>
    public double PercentSumTotalDropPercent => Row.PercentSumTotalDropPercent;

    /// <summary>The total by the load flow, percent; null when it did not converge.</summary>
    public double? LoadFlowTotalDropPercent => Row.LoadFlowTotalDropPercent;

    /// <summary>The voltage at the point of use by the load flow, volts; null when it did not converge.</summary>
    public double? LoadFlowEndVoltageV => Row.LoadFlowEndVoltageV;

    /// <summary>The starting check of a motor end point; null for other loads.</summary>
    public MotorStartResult? MotorStart => _rows.MotorStarts[_index];

    /// <summary>The limits this end point exceeds (the total; its own runs' findings are on the runs).</summary>
    public IReadOnlyList<Finding> Findings => _rows.EndPointFindings[_index] ?? [];

    /// <summary>Equal when both show the same end point of the same solution.</summary>
    public static bool operator ==(EndPointResult left, EndPointResult right) => left.Equals(right);

    /// <summary>Not equal unless both show the same end point of the same solution.</summary>
    public static bool operator !=(EndPointResult left, EndPointResult right) => !left.Equals(right);

    /// <inheritdoc/>
    public bool Equals(EndPointResult other) => ReferenceEquals(_rows, other._rows) && _index == other._index;

    /// <inheritdoc/>
    public override bool Equals(object? obj) => obj is EndPointResult other && Equals(other);

    /// <inheritdoc/>
    public override int GetHashCode() => HashCode.Combine(_rows, _index);

    /// <inheritdoc/>
    public override string ToString() => $"{Id}: {TotalDropPercent} %";
}
