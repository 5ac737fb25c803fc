using DistTree.Comparing;
using DistTree.Solving;
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

    /// <summary>Builds the section for <paramref name="c"/>; <paramref name="panelAnchors"/> maps an end point's id to its panel table in the report, where it has one.</summary>
    public static ComparisonView Build(Comparison c, IReadOnlyDictionary<string, string> panelAnchors)
    {
        var s = c.Summary;
        var elements = c.ProjectChanges.Count == 0
            ? new List<ElementRow>()
            : [new ElementRow("project", "changed", "changed", c.ProjectChanges.Select(Field).ToArray())];
        elements.AddRange(c.Equipment.Concat(c.Circuits).Select(e => new ElementRow(
            Escape(e.Id),
            ComparisonText.Change(e.Change),
            ComparisonText.Change(e.Change),
            e.Fields.Select(Field).ToArray())));
        var shownElements = elements.Take(ElementRows).ToArray();

        EndPointChangeRow Row(EndPointDelta e)
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
                panelAnchors.TryGetValue(e.Id, out var anchor) ? anchor : "");
        }

        // The largest changes list only moves the page can show (at least 0.01 point once rounded).
        var largest = c.EndPoints
            .Where(e => Shown(e.TotalDropPercent.Change) != "0.00")
            .OrderByDescending(e => Math.Abs(e.TotalDropPercent.Change))
            .ThenBy(e => e.Id, StringComparer.Ordinal)
            .ToArray();
        var upstream = c.UpstreamRuns.Take(UpstreamRows).Select(r => new UpstreamRow(
            Escape(r.Id),
            ComparisonText.RunKind(r.Kind),
            Amperes(r.CurrentA.Before),
            Amperes(r.CurrentA.After),
            r.MarginA is { } m ? Amperes(m.Before) : "–",
            r.MarginA is { } n ? Amperes(n.After) : "–",
            r.MarginA is { } k && k.After < 0 ? "cell-over" : "",
            ComparisonText.Signed(r.DropPercent.Change, 2),
            Escape(ComparisonText.StatusPhrase(r.Status, r.FindingsBefore, r.FindingsAfter)))).ToArray();

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
            GateText = c.IsUnchanged
                ? "No change: no field, drop, current or finding differs"
                : c.HasNewFindings
                    ? $"{Count(s.NewFindings)} new finding{(s.NewFindings == 1 ? "" : "s")} in this revision"
                    : "No new findings in this revision",
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
            NewFindings = c.NewFindings.Select(Item).ToArray(),
            ResolvedFindings = c.ResolvedFindings.Select(Item).ToArray(),
        };
    }

    private static string Shown(double points) => ComparisonText.Signed(points, 2);

    private static FieldRow Field(FieldChange f) =>
        new(Escape(f.Field), f.Before is null ? "–" : Escape(f.Before), f.After is null ? "–" : Escape(f.After), f.Before is not null && f.After is not null);

    private static FindingItem Item(Finding f) =>
        new(Escape(f.Subject), Escape(f.Message), f.Location.Line == 0 ? "(no source location)" : Escape(f.Location.ToString()));

    private static string? More(int total, int shown, string what) =>
        total > shown ? $"{Count(total - shown)} more {what}; the comparison document (--json) lists all." : null;
}
