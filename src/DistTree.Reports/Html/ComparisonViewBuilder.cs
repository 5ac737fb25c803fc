using DistTree.Comparing;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// Turns a <see cref="Comparison"/> into the escaped, formatted comparison section. It selects, orders and
/// formats the comparer's figures (each change is the comparer's <see cref="Delta.Change"/>); it computes none.
/// </summary>
internal static class ComparisonViewBuilder
{
    /// <summary>Elements (equipment, circuits, project fields) listed at most.</summary>
    public const int ElementRows = 100;

    /// <summary>End points listed among the largest changes.</summary>
    public const int LargestRows = 10;

    /// <summary>End points listed at most as newly failing, and again as newly passing.</summary>
    public const int StatusRows = 200;

    /// <summary>Upstream runs listed at most.</summary>
    public const int UpstreamRows = 20;

    /// <summary>Equipment listed at most whose fault current moved, or which was added or removed.</summary>
    public const int FaultRows = 100;

    /// <summary>Builds the section for <paramref name="c"/>; <paramref name="panelAnchor"/> gives the link to an end point's panel table in the report from its id, or "" where it has none.</summary>
    public static ComparisonView Build(Comparison c, Func<string, string> panelAnchor)
    {
        var s = c.Summary;
        var elements = Elements(c);
        var shownElements = elements.Take(ElementRows).ToArray();
        EndPointChangeRow Row(EndPointDelta e) => EndPointRow(e, panelAnchor);

        // The largest changes list only moves the page can show (at least 0.01 point once rounded).
        var largest = c.EndPoints
            .Where(e => Shown(e.TotalDropPercent.Change) != "0.00")
            .OrderByDescending(e => Math.Abs(e.TotalDropPercent.Change))
            .ThenBy(e => e.Id, StringComparer.Ordinal)
            .ToArray();
        var upstream = c.UpstreamRuns.Take(UpstreamRows).Select(UpstreamRowOf).ToArray();
        var faults = c.Faults.Where(f => f.Changed).ToArray();
        var unchanged = c.Faults.Count - faults.Length;

        return new ComparisonView
        {
            BeforeFile = Escape(c.Before.File),
            BeforeSha256 = Escape(c.Before.Sha256),
            AfterFile = Escape(c.After.File),
            WorstBefore = Percent(c.Before.Summary.WorstTotalDropPercent),
            WorstAfter = Percent(c.After.Summary.WorstTotalDropPercent),
            FindingsBefore = Count(c.Before.Summary.Findings),
            FindingsAfter = Count(c.After.Summary.Findings),
            GateClass = c.HasNewFindings ? "fail" : "pass",
            GateText = GateText(c),
            Counts = Escape(ComparisonText.Summary(s)),
            Unchanged = c.IsUnchanged,
            Elements = shownElements,
            ElementsMore = More(elements.Count, shownElements.Length, "elements"),
            NewlyFailing = c.EndPoints.Where(e => e.Status == StatusChange.NewlyFailing).Take(StatusRows).Select(Row).ToArray(),
            NewlyPassing = c.EndPoints.Where(e => e.Status == StatusChange.NewlyPassing).Take(StatusRows).Select(Row).ToArray(),
            Largest = largest.Take(LargestRows).Select(Row).ToArray(),
            LargestMore = More(largest.Length, Math.Min(largest.Length, LargestRows), "end points moved by 0.01 point or more"),
            Upstream = upstream,
            UpstreamMore = More(c.UpstreamRuns.Count, upstream.Length, "upstream runs moved"),
            Faults = faults.Take(FaultRows).Select(FaultRowOf).ToArray(),
            FaultsMore = More(faults.Length, Math.Min(faults.Length, FaultRows), "pieces of equipment whose fault current moved"),
            FaultsUnchanged = unchanged > 0 && faults.Length > 0 ? $"Available fault current unchanged at {Count(unchanged)} other piece{(unchanged == 1 ? "" : "s")} of equipment." : null,
            NewFindings = c.NewFindings.Select(FindingGroupBuilder.Item).ToArray(),
            ResolvedFindings = c.ResolvedFindings.Select(FindingGroupBuilder.Item).ToArray(),
        };
    }

    // The project's own fields (as one element) where they changed, then equipment and circuits.
    private static List<ElementRow> Elements(Comparison c)
    {
        var elements = c.ProjectChanges.Count == 0
            ? new List<ElementRow>()
            : [new ElementRow("project", "changed", "changed", c.ProjectChanges.Select(Field).ToArray())];
        elements.AddRange(c.Equipment.Concat(c.Circuits).Select(e => new ElementRow(
            Escape(e.Id),
            ComparisonText.Change(e.Change),
            ComparisonText.Change(e.Change),
            e.Fields.Select(Field).ToArray())));
        return elements;
    }

    private static string GateText(Comparison c) => c.IsUnchanged
        ? "No change: no field, drop, current or finding differs"
        : c.HasNewFindings
            ? $"{Count(c.Summary.NewFindings)} new finding{(c.Summary.NewFindings == 1 ? "" : "s")} in this revision"
            : "No new findings in this revision";

    private static EndPointChangeRow EndPointRow(EndPointDelta e, Func<string, string> panelAnchor)
    {
        var change = Shown(e.TotalDropPercent.Change);
        return new(
            Escape(e.Id),
            Escape(e.Name),
            Percent(e.TotalDropPercent.Before),
            Percent(e.TotalDropPercent.After),
            change,
            change.StartsWith('+') ? "up" : change.StartsWith('-') ? "down" : "same",
            Escape(ComparisonText.StatusPhrase(e.Status, e.FindingsBefore, e.FindingsAfter)),
            panelAnchor(e.Id));
    }

    private static UpstreamRow UpstreamRowOf(RunDelta r) => new(
        Escape(r.Id),
        ComparisonText.RunKind(r.Kind),
        Amperes(r.CurrentA.Before),
        Amperes(r.CurrentA.After),
        r.MarginA is { } m ? Amperes(m.Before) : "–",
        r.MarginA is { } n ? Amperes(n.After) : "–",
        r.MarginA is { } k && k.After < 0 ? "cell-over" : "",
        ComparisonText.Signed(r.DropPercent.Change, 2),
        Escape(ComparisonText.StatusPhrase(r.Status, r.FindingsBefore, r.FindingsAfter)));

    private static FaultChangeRow FaultRowOf(FaultDelta f) => new(
        Escape(f.Id),
        Vocabulary.Words.EquipmentKind.Of(f.Kind),
        ComparisonText.FaultStatus(f),
        Ka(f.Before?.AvailableFaultCurrentKa),
        Ka(f.After?.AvailableFaultCurrentKa),
        f.ChangeKa is null ? "–" : ComparisonText.KaChange(f.ChangeKa, f.ChangePercent),
        Ka(f.Before?.AvailableFaultCurrentLgKa),
        Ka(f.After?.AvailableFaultCurrentLgKa),
        f.ChangeLgKa is null ? "–" : ComparisonText.KaChange(f.ChangeLgKa, f.ChangeLgPercent),
        ComparisonText.FaultRating(f),
        f.OverRatingAfter ? "cell-over" : "");

    private static string Ka(double? ka) => ka is null ? "–" : ComparisonText.Ka(ka);

    private static string Shown(double points) => ComparisonText.Signed(points, 2);

    private static FieldRow Field(FieldChange f) =>
        new(Escape(f.Label), f.BeforeText is null ? "–" : Escape(f.BeforeText), f.AfterText is null ? "–" : Escape(f.AfterText), f.BeforeText is not null && f.AfterText is not null);

    private static string? More(int total, int shown, string what) =>
        total > shown ? $"{Count(total - shown)} more {what}; the comparison document (--json) lists all." : null;
}
