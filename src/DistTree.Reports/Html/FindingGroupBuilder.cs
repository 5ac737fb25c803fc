using DistTree.Solving;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// The findings section, and the summary's count of each kind: the solver's findings grouped by kind in
/// network order, each kind under its title (<see cref="FindingKinds"/>).
/// </summary>
internal static class FindingGroupBuilder
{
    /// <summary>Findings listed per kind in a large project.</summary>
    public const int LargeProjectFindingsPerKind = 200;

    /// <summary>The findings of <paramref name="s"/> by kind (indexed by the kind's value), each list in network order.</summary>
    public static List<Finding>[] ByKind(Solution s)
    {
        var groups = Enum.GetValues<FindingKind>().Select(_ => new List<Finding>()).ToArray();
        foreach (var f in s.AllFindings)
        {
            groups[(int)f.Kind].Add(f);
        }

        return groups;
    }

    /// <summary>The summary's line per kind that has findings.</summary>
    public static KindCount[] Counts(List<Finding>[] byKind) =>
        Present(byKind)
            .Select(g => new KindCount(Escape(g.List[0].Code), FindingKinds.Of(g.Kind).Title, Count(g.List.Count), "kind-" + g.List[0].Code))
            .ToArray();

    /// <summary>The section's group per kind that has findings; in a large project each lists its first <see cref="LargeProjectFindingsPerKind"/>.</summary>
    public static FindingGroup[] Groups(List<Finding>[] byKind, bool large) =>
        Present(byKind).Select(g => Group(g.List, g.Kind, large)).ToArray();

    /// <summary>The note on a large project's lists, or null.</summary>
    public static string? Rule(bool large) => large
        ? $"In a project this large each kind lists its first {LargeProjectFindingsPerKind} findings in network order; the console output and the JSON results list all."
        : null;

    private static IEnumerable<(List<Finding> List, FindingKind Kind)> Present(List<Finding>[] byKind) =>
        byKind.Select((list, k) => (list, (FindingKind)k)).Where(g => g.list.Count > 0);

    private static FindingGroup Group(List<Finding> list, FindingKind kind, bool large)
    {
        var shown = large ? list.Take(LargeProjectFindingsPerKind).ToList() : list;
        var more = list.Count - shown.Count;
        return new FindingGroup(
            Escape(list[0].Code),
            FindingKinds.Of(kind).Title,
            "kind-" + list[0].Code,
            Count(list.Count),
            shown.Select(Item).ToArray(),
            more > 0 ? $"{Count(more)} more of this kind, listed in the JSON results." : null);
    }

    /// <summary>One finding as the page lists it.</summary>
    public static FindingItem Item(Finding f) => new(Escape(f.Subject), Escape(f.Message), Escape(f.Reference), Escape(Where(f.Location)));
}
