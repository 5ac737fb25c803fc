namespace DistTree.Reports.Html;

/// <summary>The findings of one kind.</summary>
internal sealed record FindingGroup(string Code, string Title, string Anchor, string Count, IReadOnlyList<FindingItem> Items, string? More);

/// <summary>One finding: what, with its figures, and where in the project file.</summary>
internal sealed record FindingItem(string Subject, string Message, string Reference, string Location);
