using DistTree.Solving;
using DistTree.Vocabulary;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// The available fault current section and each panel's figures in its heading, read from the solution's short-circuit
/// study (<see cref="FaultStudy"/>); it formats, and computes no current.
/// </summary>
internal static class FaultViewBuilder
{
    /// <summary>The section, or null where the study has no equipment.</summary>
    public static FaultView? Build(Solution s, Func<int, string> panelAnchor)
    {
        if (s.Faults is not { Equipment.Count: > 0 } faults)
        {
            return null;
        }

        return new FaultView
        {
            Method = Escape(FaultText.Method),
            Factors = Escape(FaultText.Factors(faults)),
            // The infinite bus's sentence stands alone in a caution; the others follow "Source:".
            Source = Escape(faults.Source == FaultSourceKind.InfiniteBus ? Capitalized(FaultText.Source(faults, s.Project.Service)) : FaultText.Source(faults, s.Project.Service)),
            InfiniteBus = faults.Source == FaultSourceKind.InfiniteBus,
            Rows = faults.Equipment.Select(e => Row(e, panelAnchor(e.NodeIndex))).ToArray(),
        };
    }

    /// <summary>The equipment's study by node index (for the panels' headings).</summary>
    public static Dictionary<int, EquipmentFault> ByNode(Solution s) =>
        s.Faults.Equipment.ToDictionary(e => e.NodeIndex);

    /// <summary>A panel heading's words: <c>available fault current 14.32 kA, L-G 12.10 kA</c>.</summary>
    public static string? Heading(EquipmentFault? e) => e is null
        ? null
        : $"available fault current {Ka(e.AvailableFaultCurrentKa, "unbounded")} kA, L-G {Ka(e.AvailableFaultCurrentLgKa, "–")} kA";

    private static FaultRow Row(EquipmentFault e, string anchor)
    {
        var (status, text) = e.InterruptingKa is null ? ("none", "–") : e.Findings.Count > 0 ? ("fail", "over") : ("pass", "ok");
        return new FaultRow(
            Escape(e.Id),
            anchor,
            Words.EquipmentKind.Of(e.Kind),
            Escape(e.System),
            Ka(e.AvailableFaultCurrentKa, "unbounded"),
            Ka(e.AvailableFaultCurrentLgKa, "–"),
            e.XOverR is { } x ? Number(x, "0.00") : "–",
            Limit(e.InterruptingKa),
            status,
            text);
    }

    private static string Capitalized(string text) => text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];

    private static string Ka(double? ka, string none) => ka is { } k ? Number(k, "0.00") : none;
}
