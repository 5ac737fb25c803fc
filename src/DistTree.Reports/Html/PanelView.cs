namespace DistTree.Reports.Html;

/// <summary>A panelboard's schedule and its table of circuits, worst first.</summary>
internal sealed record PanelView
{
    public required string Anchor { get; init; }
    public required string Id { get; init; }
    public required string System { get; init; }
    public required string From { get; init; }
    public required string Circuits { get; init; }
    public required string Worst { get; init; }
    public required string Band { get; init; }

    /// <summary>The panel's available fault current in words (its study's figures), or null where the study has none.</summary>
    public string? Fault { get; init; }
    public required IReadOnlyList<CircuitRow> Rows { get; init; }
    public string? More { get; init; }

    /// <summary>The panel's schedule, or null in a large project (the CSV schedules hold it).</summary>
    public ScheduleView? Schedule { get; init; }
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

/// <summary>A panel's schedule as the page prints it: the facing rows, the circuits with no space of their own, the foot.</summary>
internal sealed record ScheduleView(
    IReadOnlyList<ScheduleRowView> Rows,
    IReadOnlyList<ScheduleSideView> Others,
    IReadOnlyList<ScheduleTotalView> LineTotals,
    string ConnectedVa,
    string? NeutralA);

/// <summary>One facing row (odd space left, even right), or a gap of empty spaces (<see cref="Gap"/> not null).</summary>
internal sealed record ScheduleRowView(ScheduleSideView Left, ScheduleSideView Right, string? Gap);

/// <summary>
/// One space of a schedule: a circuit shown on its first space, a further space of a multi-pole circuit, or nothing.
/// <see cref="LineVa"/> is each line the circuit is on with its load (<c>A: 1 200</c>), one a line (joined by <c>&lt;br&gt;</c>).
/// </summary>
internal sealed record ScheduleSideView(
    string Space,
    string Circuit,
    string Name,
    string Poles,
    string DeviceA,
    string Conductor,
    string LineVa,
    string TakenBy,
    bool Empty);

/// <summary>A line's total at the foot of a schedule: its letter and its load, VA.</summary>
internal sealed record ScheduleTotalView(string Line, string Va);
