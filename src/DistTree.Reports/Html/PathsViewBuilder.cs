using DistTree.Solving;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// The worst-paths section: the end points with the largest totals, worst first, each a bar stacking its runs'
/// shares (the solver's figures) on one percent axis shared by every bar, so that bars compare at a glance.
/// </summary>
internal static class PathsViewBuilder
{
    private const double Width = 720;

    /// <summary>The section for the <paramref name="worst"/> worst end points of <paramref name="s"/> (none for 0).</summary>
    public static PathsView Build(Solution s, int worst)
    {
        var shown = worst > 0 ? s.WorstEndPoints(worst) : [];
        var rules = s.Project.Rules;
        var limit = shown.Count == 0 ? rules.TotalLimitPercent : shown.Max(e => e.LimitPercent);
        var axis = Axis.Of(shown, limit);
        var ticks = new List<AxisTick>();
        for (var t = 0.0; t <= axis.Max + 1e-9; t += axis.Step)
        {
            ticks.Add(new AxisTick(Coordinate(axis.X(t)), Limit(t)));
        }

        var items = new List<PathView>(shown.Count);
        foreach (var e in shown)
        {
            items.Add(PathOf(s, e, items.Count + 1, axis));
        }

        return new PathsView(
            Count(shown.Count),
            Coordinate(Width),
            Coordinate(Width + 40),
            rules.TotalLimitVaries ? null : Limit(rules.TotalLimitPercent),
            ticks,
            items);
    }

    // Where a bar's limit line and its near and over zones lie on the axis.
    private static LimitMarks MarksOf(double limit, Axis axis) => new(
        Coordinate(axis.X(limit)),
        Coordinate(axis.X(Bands.NearFraction * limit)),
        Coordinate(axis.X(limit) - axis.X(Bands.NearFraction * limit)),
        Coordinate(Math.Max(0, Width - axis.X(limit))));

    private static PathView PathOf(Solution s, EndPointResult e, int rank, Axis axis)
    {
        var segments = new List<BarSegment>();
        var rows = new List<PathRunRow>();
        var x = 0.0;
        // Each run's share is the drop on this end point's own lines (a feeder's worst line may be another), and so are
        // the line and current beside it (see EndPointResult.RunLineCurrents).
        var lines = e.RunLineCurrents;
        foreach (var (i, share) in e.RunIndices.Zip(e.RunSharesPercent))
        {
            var number = rows.Count + 1;
            var r = s.Runs[i];
            var w = axis.X(Math.Max(0, share));
            segments.Add(new BarSegment(
                Coordinate(x),
                Coordinate(w),
                RunText.KindClass(r.Kind),
                Count(number),
                w >= 16,
                Coordinate(x + (w / 2)),
                Escape($"{number}. {r.Id} ({RunText.KindText(r.Kind)}): {Percent(share)} %")));
            x += w;
            rows.Add(RunRowOf(r, number, share, lines[number - 1]));
        }

        var band = Bands.Of(e);
        return new PathView
        {
            Rank = Count(rank),
            Id = Escape(e.Id),
            Name = Escape(e.Name),
            Route = string.Join(" → ", e.Path.Select(Escape)),
            Total = Percent(e.TotalDropPercent),
            Limit = Limit(e.LimitPercent),
            Marks = MarksOf(e.LimitPercent, axis),
            Band = Bands.Class(band),
            BandText = Bands.Text(band),
            EndVoltage = Metres(e.EndVoltageV) + " V of " + Limit(e.VoltageV) + " V",
            BarWidth = Coordinate(x),
            Segments = segments,
            Runs = rows,
        };
    }

    private static PathRunRow RunRowOf(RunResult r, int number, double share, PathLineCurrent line) => new(
        Count(number),
        Escape(r.Id),
        RunText.KindClass(r.Kind),
        RunText.KindText(r.Kind),
        RunText.Conductor(r),
        r.Kind == RunResultKind.Transformer ? "–" : Metres(r.LengthM),
        r.Kind == RunResultKind.Transformer ? "–" : Feet(r.LengthM),
        line.Line,
        Amperes(line.CurrentA),
        Percent(share),
        r.LimitPercent is null ? "–" : Limit(r.LimitPercent),
        RunText.Codes(r.Findings),
        r.Findings.Count > 0);

    // The percent axis: its top (a round number of steps above the limit and every bar) and its step.
    private readonly record struct Axis(double Max, double Step)
    {
        public static Axis Of(IReadOnlyList<EndPointResult> shown, double limit)
        {
            var top = limit * 1.2;
            foreach (var e in shown)
            {
                var stacked = e.RunSharesPercent.Sum(d => Math.Max(0, d));
                top = Math.Max(top, Math.Max(e.TotalDropPercent, stacked) * 1.04);
            }

            var step = top <= 8 ? 1.0 : top <= 16 ? 2.0 : top <= 40 ? 5.0 : Math.Pow(10, Math.Ceiling(Math.Log10(top / 4)));
            return new Axis(Math.Ceiling(top / step) * step, step);
        }

        // The x of a percent on the axis, in SVG units.
        public double X(double percent) => Width * percent / Max;
    }
}
