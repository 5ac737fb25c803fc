using System.Globalization;
using DistTree.Solving;

namespace DistTree.Reports.Schedules;

/// <summary>
/// Lays out each panel's circuits as a schedule (<see cref="PanelSchedule"/>): a circuit whose id is a whole number n
/// takes space n and, for each further pole, the next space on its side (n + 2, n + 4), as the usual panelboard
/// numbering places it; odd spaces face even ones row by row. Nothing is computed: the figures are the solution's.
/// </summary>
internal static class PanelSchedules
{
    /// <summary>Consecutive empty rows up to this many are shown; a longer run is one gap row.</summary>
    public const int EmptyRowsShown = 2;

    // The largest space number laid out: an id above it takes no space (it would have no row on any real panel).
    private const int MaxSpace = 1_000_000;

    /// <summary>The schedule of every panel of the solution (every node with circuits), in network order.</summary>
    public static PanelSchedule[] Of(Solution s)
    {
        var nodes = s.Network.Nodes;
        var schedules = new List<PanelSchedule>(s.Panels.Count);
        var next = 0;
        for (var i = 0; i < nodes.Count && next < s.Panels.Count; i++)
        {
            if (nodes[i].Id != s.Panels[next].Id || nodes[i].Equipment is not { Circuits.Count: > 0 })
            {
                continue;
            }

            schedules.Add(Of(s, i, s.Panels[next]));
            next++;
        }

        return schedules.ToArray();
    }

    /// <summary>The schedule of the panel at node <paramref name="nodeIndex"/>, whose phase loads are <paramref name="panel"/>.</summary>
    public static PanelSchedule Of(Solution s, int nodeIndex, PanelResult panel)
    {
        var node = s.Network.Nodes[nodeIndex];
        var circuits = new List<ScheduleCircuit>();
        foreach (var child in node.Children)
        {
            if (s.Network.Nodes[child].Circuit is { } c && s.IncomingRun(child) is { } run)
            {
                circuits.Add(new ScheduleCircuit(c.Id, c.Name, SpacesOf(c.Id, c.Poles), c.Poles, run));
            }
        }

        circuits.Sort(static (a, b) => NaturalOrder.Instance.Compare(a.Id, b.Id));
        var (rows, unnumbered) = Layout(circuits);
        return new PanelSchedule(nodeIndex, panel, Model.PhaseRules.Lines(node.System), circuits, rows, unnumbered);
    }

    /// <summary>The spaces a circuit with id <paramref name="id"/> and <paramref name="poles"/> poles takes: n, n + 2, …; none when the id is not a whole number from 1 to 1,000,000.</summary>
    public static int[] SpacesOf(string id, int poles)
    {
        if (!int.TryParse(id, NumberStyles.None, CultureInfo.InvariantCulture, out var n) || n is < 1 or > MaxSpace)
        {
            return [];
        }

        var spaces = new int[Math.Max(1, poles)];
        for (var k = 0; k < spaces.Length; k++)
        {
            spaces[k] = n + (2 * k);
        }

        return spaces;
    }

    // The facing rows, from row 1 to the last row that holds anything, and the circuits with no space of their own (an
    // id that is not a whole number, or a space another circuit's id names first in natural order).
    private static (ScheduleRow[] Rows, ScheduleCircuit[] Unnumbered) Layout(List<ScheduleCircuit> circuits)
    {
        var starts = new Dictionary<int, ScheduleCircuit>();
        var taken = new Dictionary<int, ScheduleCircuit>();
        var unnumbered = new List<ScheduleCircuit>();
        foreach (var c in circuits)
        {
            if (c.FirstSpace is not { } first || !starts.TryAdd(first, c))
            {
                unnumbered.Add(c);
                continue;
            }

            foreach (var space in c.Spaces.Skip(1))
            {
                taken.TryAdd(space, c);
            }
        }

        var used = starts.Keys.Concat(taken.Keys).Select(RowOf).Distinct().Order().ToArray();
        var rows = new List<ScheduleRow>();
        var row = 1;
        foreach (var full in used)
        {
            if (full - row > EmptyRowsShown)
            {
                rows.Add(new ScheduleRow(SpaceOf(row), Cell(SpaceOf(row)), Cell(SpaceOf(row) + 1), SpaceOf(full) - 1));
                row = full;
            }

            for (; row <= full; row++)
            {
                rows.Add(new ScheduleRow(SpaceOf(row), Cell(SpaceOf(row)), Cell(SpaceOf(row) + 1)));
            }
        }

        return (rows.ToArray(), unnumbered.ToArray());

        ScheduleCell Cell(int space) => new(space, starts.GetValueOrDefault(space), taken.GetValueOrDefault(space));
    }

    // Row k holds spaces 2k − 1 and 2k.
    private static int RowOf(int space) => (space + 1) / 2;

    private static int SpaceOf(int row) => (2 * row) - 1;
}
