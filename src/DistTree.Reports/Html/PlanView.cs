namespace DistTree.Reports.Html;

/// <summary>The upsize plan section.</summary>
internal sealed record PlanView(
    IReadOnlyList<PlanRow> Changes,
    string Total,
    string CostUnit,
    string WorstBefore,
    string WorstAfter,
    string FindingsBefore,
    string FindingsAfter,
    string WorstAfterId,
    string VerdictAfterClass,
    string VerdictAfterText,
    IReadOnlyList<LabelValue> Unresolvable);

/// <summary>One run's change.</summary>
internal sealed record PlanRow(
    string Run,
    string Kind,
    string SizeBefore,
    string SizeAfter,
    string SetsBefore,
    string SetsAfter,
    string DropBefore,
    string DropAfter,
    string Added,
    string Grounding,
    string Location);
