namespace DistTree.Reports.Html;

/// <summary>
/// The worst-paths section: a common scale and one bar per path. <paramref name="LimitLabel"/> is the total limit where
/// every end point has the same, null where each has its own (a lighting limit, a long-path allowance).
/// </summary>
internal sealed record PathsView(
    string Count,
    string Width,
    string SvgWidth,
    string? LimitLabel,
    IReadOnlyList<AxisTick> Ticks,
    IReadOnlyList<PathView> Items);

/// <summary>A tick on the bars' percent axis.</summary>
internal sealed record AxisTick(string X, string Label);

/// <summary>One worst path: its bar and its runs' figures.</summary>
internal sealed record PathView
{
    public required string Rank { get; init; }
    public required string Id { get; init; }
    public required string Name { get; init; }
    public required string Route { get; init; }
    public required string Total { get; init; }
    public required string Limit { get; init; }
    public required LimitMarks Marks { get; init; }
    public required string Band { get; init; }
    public required string BandText { get; init; }
    public required string EndVoltage { get; init; }
    public required string BarWidth { get; init; }
    public required IReadOnlyList<BarSegment> Segments { get; init; }
    public required IReadOnlyList<PathRunRow> Runs { get; init; }
}

/// <summary>Where a path's limit line (<paramref name="LimitX"/>) and its near and over zones lie on the bar's axis.</summary>
internal sealed record LimitMarks(string LimitX, string NearX, string NearWidth, string OverWidth);

/// <summary>One run's share of a path's bar.</summary>
internal sealed record BarSegment(string X, string Width, string Kind, string Number, bool ShowNumber, string LabelX, string Title);

/// <summary>One run's figures beneath a path's bar; <paramref name="Line"/> and <paramref name="CurrentA"/> are the line the end point's share in the run is read on and its current.</summary>
internal sealed record PathRunRow(
    string Number,
    string Id,
    string Kind,
    string KindText,
    string Conductor,
    string LengthM,
    string LengthFt,
    string Line,
    string CurrentA,
    string DropPercent,
    string LimitPercent,
    string Flag,
    bool Over);
