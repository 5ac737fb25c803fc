using DistTree.Reports.Schedules;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// A panel's schedule for the page (<see cref="PanelSchedule"/>): each circuit on its first space with its id, name,
/// poles, device, conductors, and each line it is on with its load (VA), a further space of a multi-pole circuit marked as taken
/// by it; at the foot the panel's load per line, connected load and neutral current, all the solution's.
/// </summary>
internal static class ScheduleViewBuilder
{
    /// <summary>The view of <paramref name="p"/>.</summary>
    public static ScheduleView Build(PanelSchedule p) => new(
        p.Rows.Select(r => new ScheduleRowView(Side(r.Left), Side(r.Right), Gap(r))).ToArray(),
        p.Unnumbered.Select(c => Circuit("", c, null)).ToArray(),
        p.Panel.LineVa.Select((va, x) => new ScheduleTotalView(Line(x), VoltAmperes(va))).ToArray(),
        VoltAmperes(p.Panel.ConnectedVa),
        p.Panel.NeutralCurrentA is { } n ? Amperes(n) : null);

    private static string? Gap(ScheduleRow r) => r.GapEndSpace is { } end ? $"Spaces {Count(r.LeftSpace)}–{Count(end)}: none used" : null;

    private static ScheduleSideView Side(ScheduleCell cell)
    {
        var space = Count(cell.Space);
        return cell.Circuit is { } c
            ? Circuit(space, c, cell.TakenBy)
            : new ScheduleSideView(space, "", "", "", "", "", "", cell.TakenBy is { } t ? $"taken by circuit {Escape(t.Id)}" : "", cell.TakenBy is null);
    }

    private static ScheduleSideView Circuit(string space, ScheduleCircuit c, ScheduleCircuit? takenBy) => new(
        space,
        Escape(c.Id),
        Escape(c.Name),
        Count(c.Poles),
        c.DeviceA is { } d ? Limit(d) : "–",
        RunText.Conductor(c.Run),
        string.Join("<br>", Enumerable.Range(0, c.LineVa.Count).Where(c.IsOn).Select(x => $"{Line(x)}: {VoltAmperes(c.LineVa[x])}")),
        takenBy is null ? "" : $"also taken by circuit {Escape(takenBy.Id)}",
        false);

    private static string Line(int x) => ((char)('A' + x)).ToString();
}
