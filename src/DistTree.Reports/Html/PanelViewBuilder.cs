using DistTree.Model;
using DistTree.Reports.Schedules;
using DistTree.Solving;
using DistTree.Vocabulary;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// The panels section: each panelboard's schedule (<see cref="ScheduleViewBuilder"/>, left out in a large project), then
/// its branch circuits, worst total first, with their runs' figures and
/// totals as the solver gave them (by both methods). In a large project each panel lists its worst circuits
/// and counts the rest.
/// </summary>
internal static class PanelViewBuilder
{
    /// <summary>Circuits listed per panel in a large project.</summary>
    public const int LargeProjectRowsPerPanel = 10;

    /// <summary>The tables of every node that feeds circuits, in network order.</summary>
    public static PanelView[] Build(Solution s, NodeRollup below, bool large)
    {
        var nodes = s.Network.Nodes;
        var schedules = large ? new Dictionary<int, PanelSchedule>() : PanelSchedules.Of(s).ToDictionary(p => p.NodeIndex);
        var panels = new List<PanelView>();
        var faults = FaultViewBuilder.ByNode(s);
        for (var i = 0; i < nodes.Count; i++)
        {
            if (below.OwnCircuits[i] == 0)
            {
                continue;
            }

            var circuits = new List<EndPointResult>(below.OwnCircuits[i]);
            foreach (var child in nodes[i].Children)
            {
                if (s.EndPointAt(child) is { } e)
                {
                    circuits.Add(e);
                }
            }

            circuits.Sort(static (a, b) =>
            {
                var byTotal = b.TotalDropPercent.CompareTo(a.TotalDropPercent);
                return byTotal != 0 ? byTotal : string.CompareOrdinal(a.Id, b.Id);
            });
            panels.Add(PanelOf(s, below, i, circuits, large) with
            {
                Schedule = schedules.TryGetValue(i, out var schedule) ? ScheduleViewBuilder.Build(schedule) : null,
                Fault = FaultViewBuilder.Heading(faults.GetValueOrDefault(i)),
            });
        }

        return panels.ToArray();
    }

    /// <summary>The note on a large project's tables, or null.</summary>
    public static string? Rule(Solution s, bool large) => large
        ? $"This project has {Count(s.EndPoints.Count)} end points (more than {ReportViewBuilder.LargeProjectEndPoints:#,0}): each panel lists its {LargeProjectRowsPerPanel} worst circuits, and a closing line counts the rest and how many of them exceed a limit. The JSON results (--json) list every circuit. The panel schedules are left out here: --schedules DIR writes each panel's as a CSV file."
        : null;

    /// <summary>The link to the table of the panel that feeds the end point, in the page.</summary>
    public static string AnchorOf(Solution s, EndPointResult e) => $"#panel-{Count(s.Network.Nodes[e.NodeIndex].ParentIndex)}";

    private static PanelView PanelOf(Solution s, NodeRollup below, int i, List<EndPointResult> circuits, bool large)
    {
        var rows = large ? circuits.Take(LargeProjectRowsPerPanel).ToList() : circuits;
        string? more = null;
        if (rows.Count < circuits.Count)
        {
            var rest = circuits.Count - rows.Count;
            var withFindings = circuits.Skip(rows.Count).Count(e => HasAnyFinding(s, e));
            more = withFindings == 0
                ? $"{Count(rest)} more, all within limits"
                : $"{Count(rest)} more, {Count(withFindings)} of them with findings (see Findings)";
        }

        var node = s.Network.Nodes[i];
        return new PanelView
        {
            Anchor = $"panel-{Count(i)}",
            Id = Escape(node.Id),
            System = Escape(node.System.Name),
            From = node.ParentIndex >= 0 ? Escape(s.Network.Nodes[node.ParentIndex].Id) : "–",
            Circuits = Count(circuits.Count),
            Worst = Percent(below.WorstOwn[i]),
            Band = Bands.Class(below.BandOwn[i]),
            Rows = rows.Select(e => CircuitRowOf(s, e)).ToArray(),
            More = more,
        };
    }

    // True where the end point or its own run has a finding.
    private static bool HasAnyFinding(Solution s, EndPointResult e) =>
        e.Findings.Count > 0 || s.IncomingRun(e.NodeIndex) is { Findings.Count: > 0 };

    private static CircuitRow CircuitRowOf(Solution s, EndPointResult e)
    {
        var circuit = s.Network.Nodes[e.NodeIndex].Circuit;
        var run = s.IncomingRun(e.NodeIndex);
        var findings = (run?.Findings ?? []).Concat(e.Findings);
        var length = s.Project.Units == UnitSystem.Imperial ? (Func<double?, string>)Feet : Metres;
        return new CircuitRow(
            Escape(circuit?.Id ?? e.Id),
            Escape(e.Name),
            OfRun(r => VoltAmperes(r.ApparentPowerVa)),
            OfRun(RunText.Conductor),
            OfRun(r => Metres(r.LengthM)),
            OfRun(r => Feet(r.LengthM)),
            OfRun(r => Percent(r.DropPercent)),
            run is { Findings.Count: > 0 },
            Percent(e.TotalDropPercent),
            OtherTotal(s, e),
            OfRun(r => length(r.MaxLengthM)),
            run?.MaxLengthM < run?.LengthM,
            OfRun(r => length(r.MaxLengthTotalM)),
            run?.MaxLengthTotalM < run?.LengthM,
            circuit is { Points.Count: > 0 } c ? $"{Count(c.Points.Count)} points" : "",
            circuit is { Points.Count: > 0 } d
                ? $"{Count(d.Points.Count)} loads along the run, the farthest at {LengthText.Of(d.Points[^1].AtM, s.Project.Units)}; the drop is computed span by span"
                : "",
            Bands.Class(Bands.Of(e)),
            RunText.Codes(findings));

        // A figure of the end point's own run, or a dash where it has none.
        string OfRun(Func<RunResult, string> figure) => run is { } r ? figure(r) : "–";
    }

    // The end point's total by the method not in force (the one in force is TotalDropPercent).
    private static string OtherTotal(Solution s, EndPointResult e) => s.Project.Rules.Method == SolutionMethod.LoadFlow
        ? Percent(e.PercentSumTotalDropPercent)
        : e.LoadFlowTotalDropPercent is { } flow ? Percent(flow) : "–";
}
