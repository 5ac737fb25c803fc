namespace DistTree.Reports.Html;

// What the template prints. Every string here is already escaped HTML or a formatted number, so the
// template prints them as they are; nothing in the template computes a figure.

/// <summary>The whole page.</summary>
internal sealed record ReportView
{
    public required string Title { get; init; }
    public required string ProjectName { get; init; }
    public required string File { get; init; }
    public required string Sha256 { get; init; }
    public string? Date { get; init; }
    public required string CatalogName { get; init; }
    public required string Rules { get; init; }
    public required string Caution { get; init; }
    public required string CodeTitle { get; init; }
    public required string AmpacitySource { get; init; }
    public required string DesignCurrentFormula { get; init; }
    public required string DesignCurrentRule { get; init; }
    public required string Css { get; init; }
    public required string VerdictClass { get; init; }
    public required string VerdictText { get; init; }
    public required IReadOnlyList<LabelValue> Counts { get; init; }
    public string? WorstId { get; init; }
    public string? WorstName { get; init; }
    public required string WorstTotal { get; init; }
    public required string WorstBand { get; init; }
    public required string TotalLimit { get; init; }
    public required IReadOnlyList<LimitRow> Limits { get; init; }
    public required IReadOnlyList<KindCount> FindingKinds { get; init; }
    public required PathsView Paths { get; init; }
    public required TreeView Tree { get; init; }
    public required IReadOnlyList<PanelView> Panels { get; init; }
    public string? PanelRule { get; init; }
    public required bool ShowFeet { get; init; }
    public required string LengthUnit { get; init; }
    public required IReadOnlyList<FindingGroup> Findings { get; init; }
    public string? FindingsRule { get; init; }
    public PlanView? Plan { get; init; }
    public ComparisonView? Comparison { get; init; }
    public required SectionNumbers Num { get; init; }
    public required string MethodText { get; init; }
    public required string OtherMethodText { get; init; }
    public required string LoadFlowText { get; init; }
    public required string LoadFlowClass { get; init; }
    public required string Tolerance { get; init; }
    public FaultView? Faults { get; init; }
    public required IReadOnlyList<MotorRow> Motors { get; init; }
    public required string MotorLimit { get; init; }
    public string? MotorsMore { get; init; }
    public required bool AnyPoints { get; init; }
    public required IReadOnlyList<string> CatalogHeader { get; init; }

    /// <summary>The catalogue's columns with values recalled rather than read, and which (escaped).</summary>
    public IReadOnlyList<CatalogNotes.RecalledColumn> CatalogRecalled { get; init; } = [];
    public string? OwnCatalogName { get; init; }
    public GroundingTableView? GroundingTable { get; init; }
    public required IReadOnlyList<RuleMeaning> RuleMeanings { get; init; }
    public required string NearPercent { get; init; }
}

/// <summary>The number of each section shown; null for a section the page leaves out.</summary>
internal sealed record SectionNumbers(string Summary, string? Comparison, string Tree, string Worst, string Panels, string? Faults, string? Motors, string Findings, string? Plan, string Method);

/// <summary>The grounding table the project brings: its file, what it replaces, and its header.</summary>
internal sealed record GroundingTableView(string Name, string Replaces, IReadOnlyList<string> Header);

/// <summary>One motor's starting check.</summary>
internal sealed record MotorRow(string Circuit, string Name, string Anchor, string LockedRotorKva, string TerminalDip, string PanelDip, string Limit, string Status, string StatusText);

internal sealed record LabelValue(string Label, string Value);

internal sealed record LimitRow(string Name, string Limit, string Checked, string Over, string Worst, string Status, string StatusText);

internal sealed record KindCount(string Code, string Title, string Count, string Anchor);

internal sealed record RuleMeaning(string Name, string Value, string Meaning);
