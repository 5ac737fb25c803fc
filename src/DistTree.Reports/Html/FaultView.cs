namespace DistTree.Reports.Html;

/// <summary>The available fault current section: the method, the source, a row per piece of equipment.</summary>
internal sealed record FaultView
{
    public required string Method { get; init; }
    public required string Factors { get; init; }
    public required string Source { get; init; }

    /// <summary>True where the service is taken as an infinite bus: the source is shown as a caution.</summary>
    public required bool InfiniteBus { get; init; }

    public required IReadOnlyList<FaultRow> Rows { get; init; }
}

/// <summary>One switchboard, panelboard, transformer (at its secondary terminals) or splitter.</summary>
internal sealed record FaultRow(
    string Id,
    string Anchor,
    string Kind,
    string System,
    string Bolted,
    string LineToGround,
    string Ratio,
    string Rating,
    string Status,
    string StatusText);
