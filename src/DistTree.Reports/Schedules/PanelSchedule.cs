using DistTree.Solving;

namespace DistTree.Reports.Schedules;

/// <summary>
/// A panel's schedule: its circuits by number, the odd-numbered spaces on the left facing the even on the right, row
/// by row, with the panel's figures at the foot. Every figure is the solution's; the schedule only places them.
/// </summary>
/// <param name="NodeIndex">The panel's node in the network.</param>
/// <param name="Panel">The panel's phase loads, connected load and neutral (the foot).</param>
/// <param name="Lines">How many lines the panel's system has (1, 2 or 3).</param>
/// <param name="Circuits">Every circuit of the panel, in natural order of id (see <see cref="NaturalOrder"/>).</param>
/// <param name="Rows">The facing rows: row k holds spaces 2k − 1 (left) and 2k (right); a run of more than two empty rows is one gap row.</param>
/// <param name="Unnumbered">The circuits whose id is not a whole number (they take no numbered space), in natural order.</param>
internal sealed record PanelSchedule(
    int NodeIndex,
    PanelResult Panel,
    int Lines,
    IReadOnlyList<ScheduleCircuit> Circuits,
    IReadOnlyList<ScheduleRow> Rows,
    IReadOnlyList<ScheduleCircuit> Unnumbered);

/// <summary>One circuit of a schedule, with the solution's figures of its run.</summary>
/// <param name="Id">The circuit's id in its panel.</param>
/// <param name="Name">The circuit's name.</param>
/// <param name="Spaces">The numbered spaces it takes, first the one its id names (n, n + 2, … one per pole, on its side); empty for an id that is not a whole number.</param>
/// <param name="Poles">Its poles.</param>
/// <param name="Run">The solution's row of its branch circuit.</param>
internal sealed record ScheduleCircuit(string Id, string Name, IReadOnlyList<int> Spaces, int Poles, RunResult Run)
{
    /// <summary>The space its id names, or null.</summary>
    public int? FirstSpace => Spaces.Count > 0 ? Spaces[0] : null;

    /// <summary>The lines the solver put it on (<c>A</c>, <c>BC</c>, <c>ABC</c> …).</summary>
    public string Lines => Run.Lines ?? "";

    /// <summary>The overcurrent device's rating, amperes, or null where none is given.</summary>
    public double? DeviceA => Run.OcpdA;

    /// <summary>Its apparent power, VA.</summary>
    public double LoadVa => Run.ApparentPowerVa;

    /// <summary>The apparent power on each line of the panel's system (A, B, C), VA (see <see cref="RunResult.LineVa"/>).</summary>
    public IReadOnlyList<double> LineVa => Run.LineVa;

    /// <summary>True when the circuit is on line <paramref name="line"/> (0 for A).</summary>
    public bool IsOn(int line) => Lines.Contains((char)('A' + line), StringComparison.Ordinal);
}

/// <summary>One facing row of a schedule, or a gap of empty rows.</summary>
/// <param name="LeftSpace">The left (odd) space of the row; for a gap, the first space of the gap.</param>
/// <param name="Left">What is on the left space.</param>
/// <param name="Right">What is on the right space (<paramref name="LeftSpace"/> + 1).</param>
/// <param name="GapEndSpace">For a gap of empty rows, its last space; null for a row.</param>
internal sealed record ScheduleRow(int LeftSpace, ScheduleCell Left, ScheduleCell Right, int? GapEndSpace = null)
{
    /// <summary>True when neither space holds anything.</summary>
    public bool IsEmpty => Left.IsEmpty && Right.IsEmpty;
}

/// <summary>What one numbered space holds: the circuit whose first space it is, or another space of a multi-pole circuit, or nothing.</summary>
/// <param name="Space">The space's number.</param>
/// <param name="Circuit">The circuit whose id names this space, or null.</param>
/// <param name="TakenBy">The multi-pole circuit that also takes this space (it is shown on its first space), or null.</param>
internal sealed record ScheduleCell(int Space, ScheduleCircuit? Circuit, ScheduleCircuit? TakenBy)
{
    /// <summary>True when the space holds nothing.</summary>
    public bool IsEmpty => Circuit is null && TakenBy is null;
}
