namespace DistTree.Solving;

/// <summary>A panel's phase loads: what each line of its feeder carries, the neutral, and the imbalance.</summary>
/// <param name="Id">The panel's (or switchboard's) id.</param>
/// <param name="System">Its system designation.</param>
/// <param name="LineVa">Apparent power per line (A, B, C; as many as the system has), VA, after its demand factor.</param>
/// <param name="NeutralCurrentA">Neutral current, amperes, or null on a system without a neutral.</param>
/// <param name="ImbalancePercent">Largest deviation of a line's load from the lines' average, in percent of the average (0 for one line or no load).</param>
public sealed record PanelResult(string Id, string System, IReadOnlyList<double> LineVa, double? NeutralCurrentA, double ImbalancePercent)
{
    /// <summary>
    /// The connected load, VA: the apparent power of the sum of what the panel's circuits and feeders carry, before its
    /// own demand factor (a feeder's share is after its own panel's).
    /// </summary>
    public double ConnectedVa { get; init; }
}
