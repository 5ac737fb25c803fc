namespace DistTree.Reports.Html;

/// <summary>A panelboard's table of circuits, worst first.</summary>
internal sealed record PanelView
{
    public required string Anchor { get; init; }
    public required string Id { get; init; }
    public required string System { get; init; }
    public required string From { get; init; }
    public required string Circuits { get; init; }
    public required string Worst { get; init; }
    public required string Band { get; init; }
    public required IReadOnlyList<CircuitRow> Rows { get; init; }
    public string? More { get; init; }
}

/// <summary>One circuit of a panel table.</summary>
internal sealed record CircuitRow(
    string Circuit,
    string Name,
    string LoadVa,
    string Conductor,
    string LengthM,
    string LengthFt,
    string RunDrop,
    bool RunOver,
    string Total,
    string OtherTotal,
    string Reach,
    bool ReachOver,
    string ReachTotal,
    bool ReachTotalOver,
    string Points,
    string PointsTitle,
    string Band,
    string Findings);
