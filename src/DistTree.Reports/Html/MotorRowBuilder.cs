using DistTree.Solving;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>The motor-starting section: each motor's starting check as the solver gave it, worst terminal dip first.</summary>
internal static class MotorRowBuilder
{
    /// <summary>Motors listed in the starting table at most (worst dip first).</summary>
    public const int MotorRowsCap = 200;

    /// <summary>The end points with a motor, worst terminal dip first (ties by id, ordinal).</summary>
    public static List<EndPointResult> Motors(Solution s)
    {
        var list = s.EndPoints.Where(e => e.MotorStart is not null).ToList();
        list.Sort(static (a, b) =>
        {
            var byDip = b.MotorStart!.TerminalDipPercent.CompareTo(a.MotorStart!.TerminalDipPercent);
            return byDip != 0 ? byDip : string.CompareOrdinal(a.Id, b.Id);
        });
        return list;
    }

    /// <summary>The table's rows: the first <see cref="MotorRowsCap"/> of <paramref name="motors"/>.</summary>
    public static MotorRow[] Rows(Solution s, List<EndPointResult> motors) =>
        motors.Take(MotorRowsCap).Select(e => RowOf(s, e)).ToArray();

    /// <summary>The line counting the motors left out of the table, or null.</summary>
    public static string? More(List<EndPointResult> motors) => motors.Count > MotorRowsCap
        ? $"{Count(motors.Count - MotorRowsCap)} more motors with smaller dips, listed in the JSON results."
        : null;

    private static MotorRow RowOf(Solution s, EndPointResult e)
    {
        var m = e.MotorStart!;
        var fails = e.Findings.Any(f => f.Kind == FindingKind.MotorStart);
        return new MotorRow(
            Escape(e.Id),
            Escape(e.Name),
            PanelViewBuilder.AnchorOf(s, e),
            Kva(m.LockedRotorVa),
            Percent(m.TerminalDipPercent),
            Percent(m.PanelDipPercent),
            Limit(m.LimitPercent),
            fails ? "fail" : "pass",
            fails ? "fail" : "pass");
    }
}
