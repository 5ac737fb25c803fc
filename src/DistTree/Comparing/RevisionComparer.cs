using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Comparing;

/// <summary>
/// Compares two solved revisions of a design: what was added, removed and changed, and what that does
/// downstream. Elements are matched by id (equipment id, circuit full id; a transformer's regulation row by
/// its id and kind), never by position, so reordering a file changes nothing. Linear in the size of the
/// designs apart from sorting the lists it returns: every match is a dictionary look-up.
/// </summary>
public static class RevisionComparer
{
    /// <summary>Compares <paramref name="before"/> (the old revision) with <paramref name="after"/> (the new one).</summary>
    public static Comparison Compare(Solution before, Solution after)
    {
        ArgumentNullException.ThrowIfNull(before);
        ArgumentNullException.ThrowIfNull(after);

        var projectChanges = FieldSet.Differences(FieldSet.ForProject(before.Project), FieldSet.ForProject(after.Project), after.Project.Units);
        var equipment = CompareElements(
            before.Project.Equipment, after.Project.Equipment, e => e.Id, FieldSet.SameDesign, e => FieldSet.ForEquipment(e, before.Project.Units), e => FieldSet.ForEquipment(e, after.Project.Units), after.Project.Units);
        var circuits = CompareElements(
            before.Project.Equipment.SelectMany(e => e.Circuits), after.Project.Equipment.SelectMany(e => e.Circuits), c => c.FullId, FieldSet.SameDesign,
            c => FieldSet.ForCircuit(c, before.Project.Units), c => FieldSet.ForCircuit(c, after.Project.Units), after.Project.Units);

        var beforeRuns = RunsByKey(before.Runs);
        var afterRuns = RunsByKey(after.Runs);
        var (runs, runsCompared) = CompareRuns(beforeRuns, after.Runs);
        var (endPoints, endPointsCompared) = CompareEndPoints(before, after, beforeRuns, afterRuns);
        var upstream = runs
            .Where(r => r.Kind != RunResultKind.Branch && r.LoadingMoved)
            .OrderBy(r => Group(r.Status))
            .ThenByDescending(r => SortKey(r.MarginA?.Change ?? 0))
            .ThenBy(r => r.Id, NaturalOrder.Instance)
            .ThenBy(r => r.Kind)
            .ToArray();

        var faults = FaultComparer.Compare(before, after);
        var newFindings = Unmatched(after.AllFindings, before.AllFindings);
        var resolvedFindings = Unmatched(before.AllFindings, after.AllFindings);

        return new Comparison
        {
            Before = Info(before),
            After = Info(after),
            ProjectChanges = projectChanges,
            Equipment = equipment,
            Circuits = circuits,
            EndPoints = endPoints,
            Runs = runs,
            UpstreamRuns = upstream,
            NewFindings = newFindings,
            ResolvedFindings = resolvedFindings,
            Faults = faults,
            Summary = Summarize(projectChanges.Count, equipment, circuits, (endPoints, endPointsCompared), (runs.Count, runsCompared), (newFindings.Length, resolvedFindings.Length), faults),
        };
    }

    // The counts of a comparison, and its largest rise and fall of an end point's total.
    private static ComparisonSummary Summarize(
        int projectChanges,
        List<ElementChange> equipment,
        List<ElementChange> circuits,
        (IReadOnlyList<EndPointDelta> Affected, int Compared) endPointCounts,
        (int Affected, int Compared) runCounts,
        (int New, int Resolved) findings,
        FaultDelta[] faults)
    {
        var endPoints = endPointCounts.Affected;
        var rise = endPoints.Where(e => e.TotalDropPercent.Change > ComparisonTolerance.PercentPoints)
            .OrderByDescending(e => e.TotalDropPercent.Change).ThenBy(e => e.Id, NaturalOrder.Instance).FirstOrDefault();
        var fall = endPoints.Where(e => e.TotalDropPercent.Change < -ComparisonTolerance.PercentPoints)
            .OrderBy(e => e.TotalDropPercent.Change).ThenBy(e => e.Id, NaturalOrder.Instance).FirstOrDefault();
        return new ComparisonSummary
        {
            ProjectChanges = projectChanges,
            EquipmentAdded = equipment.Count(c => c.Change == ChangeKind.Added),
            EquipmentRemoved = equipment.Count(c => c.Change == ChangeKind.Removed),
            EquipmentChanged = equipment.Count(c => c.Change == ChangeKind.Changed),
            CircuitsAdded = circuits.Count(c => c.Change == ChangeKind.Added),
            CircuitsRemoved = circuits.Count(c => c.Change == ChangeKind.Removed),
            CircuitsChanged = circuits.Count(c => c.Change == ChangeKind.Changed),
            EndPointsCompared = endPointCounts.Compared,
            EndPointsAffected = endPoints.Count,
            EndPointsNewlyFailing = endPoints.Count(e => e.Status == StatusChange.NewlyFailing),
            EndPointsNewlyPassing = endPoints.Count(e => e.Status == StatusChange.NewlyPassing),
            RunsCompared = runCounts.Compared,
            RunsAffected = runCounts.Affected,
            LargestRisePoints = rise?.TotalDropPercent.Change ?? 0,
            LargestRiseEndPoint = rise?.Id,
            LargestFallPoints = fall is null ? 0 : -fall.TotalDropPercent.Change,
            LargestFallEndPoint = fall?.Id,
            NewFindings = findings.New,
            ResolvedFindings = findings.Resolved,
            FaultsCompared = faults.Count(f => !f.IsAdded && !f.IsRemoved),
            FaultsRose = faults.Count(f => f.Rose),
            FaultsNewlyOverRating = faults.Count(f => f.OverRatingAfter && !f.OverRatingBefore),
        };
    }

    private static RevisionInfo Info(Solution s) => new(s.Project.Name, s.Project.File, s.Project.Sha256, s.Summary, s.Project.Rules.Code);

    private static List<ElementChange> CompareElements<T>(
        IEnumerable<T> before, IEnumerable<T> after, Func<T, string> id, Func<T, T, bool> same, Func<T, FieldSet> fieldsBefore, Func<T, FieldSet> fieldsAfter, UnitSystem shown)
    {
        var old = new Dictionary<string, T>(StringComparer.Ordinal);
        foreach (var item in before)
        {
            old[id(item)] = item;
        }

        var changes = new List<ElementChange>();
        var matched = new HashSet<string>(StringComparer.Ordinal);
        foreach (var item in after)
        {
            var key = id(item);
            if (old.TryGetValue(key, out var was))
            {
                matched.Add(key);
                if (same(was, item))
                {
                    continue;
                }

                var differences = FieldSet.Differences(fieldsBefore(was), fieldsAfter(item), shown);
                if (differences.Count > 0)
                {
                    changes.Add(new ElementChange(key, ChangeKind.Changed, differences));
                }
            }
            else
            {
                changes.Add(new ElementChange(key, ChangeKind.Added, fieldsAfter(item).All(added: true, shown)));
            }
        }

        foreach (var (key, was) in old)
        {
            if (!matched.Contains(key))
            {
                changes.Add(new ElementChange(key, ChangeKind.Removed, fieldsBefore(was).All(added: false, shown)));
            }
        }

        changes.Sort((a, b) => NaturalOrder.Instance.Compare(a.Id, b.Id));
        return changes;
    }

    private static string RunKey(RunResult r) => r.Kind == RunResultKind.Transformer ? r.Id + "\0transformer" : r.Id;

    private static Dictionary<string, RunResult> RunsByKey(IReadOnlyList<RunResult> runs)
    {
        var byKey = new Dictionary<string, RunResult>(runs.Count, StringComparer.Ordinal);
        foreach (var r in runs)
        {
            byKey[RunKey(r)] = r;
        }

        return byKey;
    }

    private static (IReadOnlyList<RunDelta> Deltas, int Compared) CompareRuns(Dictionary<string, RunResult> beforeRuns, IReadOnlyList<RunResult> afterRuns)
    {
        var deltas = new List<RunDelta>();
        var compared = 0;
        foreach (var a in afterRuns)
        {
            if (!beforeRuns.TryGetValue(RunKey(a), out var b))
            {
                continue;
            }

            compared++;
            var findingsBefore = Codes(b.Findings);
            var findingsAfter = Codes(a.Findings);
            var status = Status(findingsBefore, findingsAfter);
            double? marginBefore = b.AmpacityA - b.DesignCurrentA;
            double? marginAfter = a.AmpacityA - a.DesignCurrentA;
            if (status == StatusChange.None &&
                !ComparisonTolerance.PercentMoved(b.DropPercent, a.DropPercent) &&
                !ComparisonTolerance.Moved(b.CurrentA, a.CurrentA) &&
                !ComparisonTolerance.Moved(b.DesignCurrentA, a.DesignCurrentA) &&
                !ComparisonTolerance.Moved(b.AmpacityA, a.AmpacityA) &&
                !ComparisonTolerance.Moved(marginBefore, marginAfter))
            {
                continue;
            }

            deltas.Add(new RunDelta
            {
                Id = a.Id,
                Kind = a.Kind,
                From = a.From,
                DropPercent = new Delta(b.DropPercent, a.DropPercent),
                DropV = new Delta(b.DropV, a.DropV),
                CurrentA = new Delta(b.CurrentA, a.CurrentA),
                DesignCurrentA = new Delta(b.DesignCurrentA, a.DesignCurrentA),
                AmpacityA = b.AmpacityA is { } ab && a.AmpacityA is { } aa ? new Delta(ab, aa) : null,
                MarginA = marginBefore is { } mb && marginAfter is { } ma ? new Delta(mb, ma) : null,
                FindingsBefore = findingsBefore,
                FindingsAfter = findingsAfter,
                Status = status,
            });
        }

        return (deltas
            .OrderBy(d => Group(d.Status))
            .ThenByDescending(d => SortKey(d.DropPercent.Change))
            .ThenBy(d => d.Id, NaturalOrder.Instance)
            .ThenBy(d => d.Kind)
            .ToArray(), compared);
    }

    private static (IReadOnlyList<EndPointDelta> Deltas, int Compared) CompareEndPoints(
        Solution before, Solution after, Dictionary<string, RunResult> beforeRuns, Dictionary<string, RunResult> afterRuns)
    {
        var old = new Dictionary<string, EndPointResult>(before.EndPoints.Count, StringComparer.Ordinal);
        foreach (var e in before.EndPoints)
        {
            old[e.Id] = e;
        }

        var deltas = new List<EndPointDelta>();
        var compared = 0;
        foreach (var a in after.EndPoints)
        {
            if (!old.TryGetValue(a.Id, out var b))
            {
                continue;
            }

            compared++;
            var findingsBefore = EndPointCodes(b, beforeRuns);
            var findingsAfter = EndPointCodes(a, afterRuns);
            var status = Status(findingsBefore, findingsAfter);
            if (!ComparisonTolerance.PercentMoved(b.TotalDropPercent, a.TotalDropPercent) &&
                !ComparisonTolerance.PercentMoved(b.LimitPercent, a.LimitPercent) &&
                !ComparisonTolerance.Moved(b.EndVoltageV, a.EndVoltageV) &&
                status == StatusChange.None)
            {
                continue;
            }

            deltas.Add(new EndPointDelta
            {
                Id = a.Id,
                Name = a.Name,
                Panel = a.Panel,
                TotalDropPercent = new Delta(b.TotalDropPercent, a.TotalDropPercent),
                LimitPercent = new Delta(b.LimitPercent, a.LimitPercent),
                EndVoltageV = new Delta(b.EndVoltageV, a.EndVoltageV),
                FindingsBefore = findingsBefore,
                FindingsAfter = findingsAfter,
                Status = status,
            });
        }

        return (deltas
            .OrderBy(d => Group(d.Status))
            .ThenByDescending(d => SortKey(d.TotalDropPercent.Change))
            .ThenBy(d => d.Id, NaturalOrder.Instance)
            .ToArray(), compared);
    }

    // An end point's status: its own findings (the total) and its branch circuit's (same id).
    private static string[] EndPointCodes(EndPointResult e, Dictionary<string, RunResult> runs)
    {
        var branch = runs.TryGetValue(e.Id, out var run) && run.Kind == RunResultKind.Branch ? run.Findings : [];
        return e.Findings.Count + branch.Count == 0 ? [] : Codes(e.Findings.Concat(branch));
    }

    private static string[] Codes(IEnumerable<Finding> findings) =>
        findings.Select(f => f.Code).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToArray();

    private static string[] Codes(IReadOnlyList<Finding> findings) =>
        findings.Count == 0 ? [] : Codes(findings.AsEnumerable());

    private static StatusChange Status(string[] before, string[] after) => (before.Length, after.Length) switch
    {
        (0, 0) => StatusChange.None,
        (0, _) => StatusChange.NewlyFailing,
        (_, 0) => StatusChange.NewlyPassing,
        _ => before.SequenceEqual(after, StringComparer.Ordinal) ? StatusChange.None : StatusChange.FindingsChanged,
    };

    // Sorting by size of change: changes equal within the tolerance (the last bits of differently ordered sums)
    // tie, so that their order is by id rather than by rounding noise.
    private static long SortKey(double change) => (long)Math.Round(Math.Abs(change) / ComparisonTolerance.PercentPoints);

    private static int Group(StatusChange status) => status switch
    {
        StatusChange.NewlyFailing => 0,
        StatusChange.NewlyPassing => 1,
        _ => 2,
    };

    // Findings of `from` whose (kind, subject) does not occur in `other`, by subject then code (ordinal).
    private static Finding[] Unmatched(IEnumerable<Finding> from, IEnumerable<Finding> other)
    {
        var keys = new HashSet<(FindingKind, string)>();
        foreach (var f in other)
        {
            keys.Add((f.Kind, f.Subject));
        }

        return from.Where(f => !keys.Contains((f.Kind, f.Subject)))
            .OrderBy(f => f.Subject, NaturalOrder.Instance)
            .ThenBy(f => f.Code, StringComparer.Ordinal)
            .ThenBy(f => f.Value)
            .ToArray();
    }
}
