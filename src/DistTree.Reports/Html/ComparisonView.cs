namespace DistTree.Reports.Html;

/// <summary>The comparison section: what changed from the old revision to the one the report shows.</summary>
internal sealed record ComparisonView
{
    public required string BeforeFile { get; init; }
    public required string BeforeSha256 { get; init; }
    public required string AfterFile { get; init; }
    public required string WorstBefore { get; init; }
    public required string WorstAfter { get; init; }
    public required string FindingsBefore { get; init; }
    public required string FindingsAfter { get; init; }
    public required string GateClass { get; init; }
    public required string GateText { get; init; }
    public required string Counts { get; init; }
    public required bool Unchanged { get; init; }
    public required IReadOnlyList<ElementRow> Elements { get; init; }
    public string? ElementsMore { get; init; }
    public required IReadOnlyList<EndPointChangeRow> NewlyFailing { get; init; }
    public required IReadOnlyList<EndPointChangeRow> NewlyPassing { get; init; }
    public required IReadOnlyList<EndPointChangeRow> Largest { get; init; }
    public string? LargestMore { get; init; }
    public required IReadOnlyList<UpstreamRow> Upstream { get; init; }
    public string? UpstreamMore { get; init; }
    public required IReadOnlyList<FaultChangeRow> Faults { get; init; }
    public string? FaultsMore { get; init; }
    public string? FaultsUnchanged { get; init; }
    public required IReadOnlyList<FindingItem> NewFindings { get; init; }
    public required IReadOnlyList<FindingItem> ResolvedFindings { get; init; }
}

/// <summary>Equipment, a circuit or the project itself, added, removed or changed, with its fields.</summary>
internal sealed record ElementRow(string Id, string Change, string ChangeText, IReadOnlyList<FieldRow> Fields);

/// <summary>One field of an element: its value before and after (either may be "–").</summary>
internal sealed record FieldRow(string Field, string Before, string After, bool Both);

/// <summary>An end point whose total moved.</summary>
internal sealed record EndPointChangeRow(string Id, string Name, string Before, string After, string Change, string Direction, string Status, string Anchor);

/// <summary>A feeder or transformer whose current or margin moved.</summary>
internal sealed record UpstreamRow(
    string Id,
    string Kind,
    string CurrentBefore,
    string CurrentAfter,
    string MarginBefore,
    string MarginAfter,
    string MarginClass,
    string DropChange,
    string Status);

/// <summary>A piece of equipment whose available fault current moved, or which was added or removed.</summary>
internal sealed record FaultChangeRow(
    string Id,
    string Kind,
    string Status,
    string Before,
    string After,
    string Change,
    string LgBefore,
    string LgAfter,
    string LgChange,
    string Rating,
    string RatingClass);
