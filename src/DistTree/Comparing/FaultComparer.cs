using DistTree.Solving;

namespace DistTree.Comparing;

/// <summary>
/// Pairs the two revisions' short-circuit studies by equipment id (<see cref="FaultDelta"/>): every switchboard,
/// panelboard, transformer and splitter in either revision. It reads each study's figures and computes none.
/// </summary>
internal static class FaultComparer
{
    /// <summary>
    /// Every piece of equipment in either revision: newly over its rating first, then those whose fault current rose,
    /// then those whose fault current fell, then added, then removed, then unchanged; within a group by the largest
    /// absolute change of three-phase current (then line-to-ground), ties by id (<see cref="NaturalOrder"/>).
    /// </summary>
    public static FaultDelta[] Compare(Solution before, Solution after)
    {
        var old = new Dictionary<string, EquipmentFault>(StringComparer.Ordinal);
        foreach (var e in before.Faults.Equipment)
        {
            old[e.Id] = e;
        }

        var deltas = new List<FaultDelta>();
        var matched = new HashSet<string>(StringComparer.Ordinal);
        foreach (var a in after.Faults.Equipment)
        {
            var b = old.GetValueOrDefault(a.Id);
            if (b is not null)
            {
                matched.Add(a.Id);
            }

            deltas.Add(new FaultDelta { Id = a.Id, Kind = a.Kind, Before = b, After = a });
        }

        foreach (var (id, b) in old)
        {
            if (!matched.Contains(id))
            {
                deltas.Add(new FaultDelta { Id = id, Kind = b.Kind, Before = b });
            }
        }

        return deltas
            .OrderBy(Group)
            .ThenByDescending(d => SortKey(d.ChangeKa))
            .ThenByDescending(d => SortKey(d.ChangeLgKa))
            .ThenBy(d => d.Id, NaturalOrder.Instance)
            .ToArray();
    }

    private static int Group(FaultDelta d) => d switch
    {
        { OverRatingAfter: true, OverRatingBefore: false } => 0,
        { IsAdded: true } => 3,
        { IsRemoved: true } => 4,
        { Rose: true } => 1,
        { Moved: true } => 2,
        _ => 5,
    };

    // Changes equal within the tolerance tie, so that their order is by id rather than by rounding noise.
    private static long SortKey(double? changeKa) =>
        changeKa is { } c ? (long)Math.Round(Math.Abs(c) / ComparisonTolerance.Relative) : 0;
}
