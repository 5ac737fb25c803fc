using DistTree.Sizing;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>The upsize plan section: each run's change and the figures before and after, as the planner gave them.</summary>
internal static class PlanViewBuilder
{
    /// <summary>The section for <paramref name="plan"/>.</summary>
    public static PlanView Build(UpsizePlan plan) => new(
        plan.Changes.Select(RowOf).ToArray(),
        Metres(plan.TotalCostAdded),
        Escape(plan.CostUnit),
        Percent(plan.Before.Summary.WorstTotalDropPercent),
        Percent(plan.After.Summary.WorstTotalDropPercent),
        Count(plan.Before.Summary.Findings),
        Count(plan.After.Summary.Findings),
        plan.After.Summary.WorstEndPoint is { } worstAfter ? Escape(worstAfter) : "–",
        plan.After.HasFindings ? "fail" : "pass",
        plan.After.HasFindings
            ? $"After the plan {Count(plan.After.Summary.Findings)} finding{(plan.After.Summary.Findings == 1 ? " remains" : "s remain")}"
            : "After the plan every run and end point is within its limits",
        plan.Unresolvable.Select(u => new LabelValue(Escape(u.Subject), Escape(u.Message))).ToArray())
    {
        Taps = [.. plan.TapChanges.Select(t => new TapRow(
            Escape(t.TransformerId),
            Tap(t.TapPercentBefore),
            Tap(t.TapPercentAfter),
            Percent(t.RegulationPercentBefore),
            Percent(t.RegulationPercentAfter),
            Metres(t.CostAdded),
            Escape(Where(t.Location))))],
        Cautions = [.. plan.Cautions.Select(c => new LabelValue(Escape(c.Subject), Escape(c.Message)))],
    };

    private static string Tap(double percent) => percent.ToString("0.#", System.Globalization.CultureInfo.InvariantCulture);

    private static PlanRow RowOf(UpsizeChange c) => new(
        Escape(c.RunId),
        RunText.KindText(c.Kind),
        Escape(c.SizeBefore),
        Escape(c.SizeAfter),
        Count(c.SetsBefore),
        Count(c.SetsAfter),
        Percent(c.DropPercentBefore),
        Percent(c.DropPercentAfter),
        Metres(c.CostAdded),
        Escape(string.Join(". ", new[] { c.GroundingNote, c.FaultClearingNote is { } f ? $"Fault at the far end: {f}" : null }.OfType<string>())),
        Escape(Where(c.SizeLocation)));
}
