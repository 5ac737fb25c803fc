using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Comparing;

/// <summary>
/// The available fault current at one switchboard, panelboard, transformer (at its secondary terminals) or splitter in
/// either revision: each revision's own figures as its short-circuit study gave them, and their change. The comparer
/// computes no fault current; it pairs the two studies' entries by id.
/// </summary>
public sealed record FaultDelta
{
    /// <summary>The equipment's id.</summary>
    public required string Id { get; init; }

    /// <summary>What it is (in the new revision; in the old one where it was removed).</summary>
    public required EquipmentKind Kind { get; init; }

    /// <summary>Its figures in the old revision; null where it is added.</summary>
    public EquipmentFault? Before { get; init; }

    /// <summary>Its figures in the new revision; null where it is removed.</summary>
    public EquipmentFault? After { get; init; }

    /// <summary>True when it is only in the new revision.</summary>
    public bool IsAdded => Before is null;

    /// <summary>True when it is only in the old revision.</summary>
    public bool IsRemoved => After is null;

    /// <summary>The change of the three-phase (bolted) fault current, kA; null unless both revisions have a figure.</summary>
    public double? ChangeKa => Difference(Before?.AvailableFaultCurrentKa, After?.AvailableFaultCurrentKa);

    /// <summary>The change of the line-to-ground fault current, kA; null unless both revisions have a figure.</summary>
    public double? ChangeLgKa => Difference(Before?.AvailableFaultCurrentLgKa, After?.AvailableFaultCurrentLgKa);

    /// <summary>The change of the three-phase (bolted) fault current in percent of the old figure; null unless both are above zero.</summary>
    public double? ChangePercent => Percent(Before?.AvailableFaultCurrentKa, After?.AvailableFaultCurrentKa);

    /// <summary>The change of the line-to-ground fault current in percent of the old figure; null unless both are above zero.</summary>
    public double? ChangeLgPercent => Percent(Before?.AvailableFaultCurrentLgKa, After?.AvailableFaultCurrentLgKa);

    /// <summary>
    /// True when it is in both revisions and either of its fault currents moved by more than
    /// <see cref="ComparisonTolerance.Relative"/> (a figure appearing or disappearing is a move).
    /// </summary>
    public bool Moved =>
        Before is { } b && After is { } a &&
        (ComparisonTolerance.Moved(b.AvailableFaultCurrentKa, a.AvailableFaultCurrentKa) ||
         ComparisonTolerance.Moved(b.AvailableFaultCurrentLgKa, a.AvailableFaultCurrentLgKa));

    /// <summary>True when it is added, removed, or its fault currents moved: what the outputs for people list.</summary>
    public bool Changed => IsAdded || IsRemoved || Moved;

    /// <summary>
    /// True when it is in both revisions and its three-phase or its line-to-ground fault current rose by more than
    /// <see cref="ComparisonTolerance.Relative"/> (where both revisions have the figure).
    /// </summary>
    public bool Rose =>
        Before is { } b && After is { } a &&
        (Rises(b.AvailableFaultCurrentKa, a.AvailableFaultCurrentKa) || Rises(b.AvailableFaultCurrentLgKa, a.AvailableFaultCurrentLgKa));

    /// <summary>True when the new revision's fault current exceeds the equipment's stated <c>interrupting_ka</c> (its study's <c>interrupting_rating</c> finding).</summary>
    public bool OverRatingAfter => Over(After);

    /// <summary>True when the old revision's fault current exceeded the equipment's stated rating.</summary>
    public bool OverRatingBefore => Over(Before);

    private static bool Over(EquipmentFault? e) => e is not null && e.Findings.Any(f => f.Kind == FindingKind.InterruptingRating);

    private static bool Rises(double? before, double? after) =>
        before is { } b && after is { } a && a > b && ComparisonTolerance.Moved(b, a);

    private static double? Difference(double? before, double? after) => before is { } b && after is { } a ? a - b : null;

    private static double? Percent(double? before, double? after) => before is { } b && after is { } a && b > 0 ? (a - b) / b * 100 : null;
}
