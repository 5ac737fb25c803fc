namespace DistTree.Reports.Html;

/// <summary>The equipment tree drawing.</summary>
internal sealed record TreeView(
    string Fit,
    string Width,
    string Height,
    string NodeWidth,
    string NodeHeight,
    string FlagX,
    IReadOnlyList<TreeNodeView> Nodes,
    IReadOnlyList<TreeEdge> Edges,
    string Note,
    bool PrintWide);

/// <summary>A feeder's line in the drawing, marked by the band of the node it feeds.</summary>
internal sealed record TreeEdge(string D, string Band);

/// <summary>One equipment node placed in the drawing.</summary>
internal sealed record TreeNodeView
{
    public required string X { get; init; }
    public required string Y { get; init; }
    public required string Kind { get; init; }
    public required string Id { get; init; }
    public required string Line2 { get; init; }
    public required string Line3 { get; init; }
    public required string Band { get; init; }
    public required string Title { get; init; }
    public string? Anchor { get; init; }
    public string? Flags { get; init; }
}
