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
    IReadOnlyList<LabelValue> Unresolvable)
{
    /// <summary>The transformers whose taps the plan sets.</summary>
    public IReadOnlyList<TapRow> Taps { get; init; } = [];

    /// <summary>The stated taps over the light-load limit, which the plan keeps.</summary>
    public IReadOnlyList<LabelValue> Cautions { get; init; } = [];
}

/// <summary>One transformer's tap to set.</summary>
internal sealed record TapRow(string Transformer, string TapBefore, string TapAfter, string RegulationBefore, string RegulationAfter, string Cost, string Location);

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
