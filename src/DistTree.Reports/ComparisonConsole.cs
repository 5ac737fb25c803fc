using System.Globalization;
using DistTree.Comparing;
using DistTree.Vocabulary;

namespace DistTree.Reports;

/// <summary>
/// Formats a comparison as plain text for a terminal: summary, changes, affected end points, upstream runs, findings.
/// Text from the input (names, paths) is shown with its control characters escaped (<see cref="DisplayWriter"/>).
/// </summary>
public static class ComparisonConsole
{
    /// <summary>Writes the comparison, at most <paramref name="rows"/> lines in each list of end points and runs.</summary>
    public static void Write(TextWriter o, Comparison c, int rows)
    {
        ArgumentNullException.ThrowIfNull(c);
        o = DisplayWriter.Over(o);
        o.WriteLine($"DistTree comparison: {c.After.Name}");
        WriteRevision(o, "old", c.Before);
        WriteRevision(o, "new", c.After);
        o.WriteLine();
        if (c.IsUnchanged)
        {
            o.WriteLine(F($"No change: no field, drop, current or finding differs (tolerance {ComparisonTolerance.PercentPoints:0e0} percentage points, {ComparisonTolerance.Relative:0e0} relative)."));
            o.WriteLine();
            o.WriteLine($"Caution: {Caution.For(c.Before.Code, c.After.Code)}");
            return;
        }

        WriteSummary(o, c);
        WriteElements(o, "Equipment", c.Equipment);
        WriteElements(o, "Circuits", c.Circuits);
        WriteEndPoints(o, c, rows);
        WriteUpstream(o, c, rows);
        WriteFaults(o, c, rows);
        WriteFindings(o, "New findings", c.NewFindings);
        WriteFindings(o, "Resolved findings", c.ResolvedFindings);
        o.WriteLine();
        o.WriteLine($"Caution: {Caution.For(c.Before.Code, c.After.Code)}");
    }

    private static void WriteSummary(TextWriter o, Comparison c)
    {
        o.WriteLine($"Summary: {ComparisonText.Summary(c.Summary)}");
        var s = c.Summary;
        if (s.LargestRiseEndPoint is { } rise)
        {
            o.WriteLine(F($"Largest rise: {s.LargestRisePoints:0.000} percentage points at {rise}"));
        }

        if (s.LargestFallEndPoint is { } fall)
        {
            o.WriteLine(F($"Largest fall: {s.LargestFallPoints:0.000} percentage points at {fall}"));
        }

        if (c.ProjectChanges.Count > 0)
        {
            o.WriteLine();
            o.WriteLine("Project changes:");
            foreach (var f in c.ProjectChanges)
            {
                o.WriteLine($"  {f.Label}: {f.BeforeText ?? "-"} -> {f.AfterText ?? "-"}");
            }
        }
    }

    private static void WriteEndPoints(TextWriter o, Comparison c, int rows)
    {
        if (c.EndPoints.Count == 0)
        {
            return;
        }

        o.WriteLine();
        o.WriteLine("Affected end points (total drop in percent; change in percentage points):");
        foreach (var e in c.EndPoints.Take(rows))
        {
            o.WriteLine(F($"  {e.Id,-14} {e.TotalDropPercent.Before,7:0.00} -> {e.TotalDropPercent.After,6:0.00}  {ComparisonText.Signed(e.TotalDropPercent.Change, 3),8}  {ComparisonText.StatusPhrase(e.Status, e.FindingsBefore, e.FindingsAfter)}"));
        }

        More(o, c.EndPoints.Count, rows);
    }

    private static void WriteUpstream(TextWriter o, Comparison c, int rows)
    {
        if (c.UpstreamRuns.Count == 0)
        {
            return;
        }

        o.WriteLine();
        o.WriteLine("Upstream runs (current and ampacity margin in amperes; drop in percent):");
        foreach (var r in c.UpstreamRuns.Take(rows))
        {
            var margin = r.MarginA is { } m ? F($"margin {m.Before:0.0} -> {m.After:0.0} ({ComparisonText.Signed(m.Change, 1)})") : "margin -";
            o.WriteLine(F($"  {r.Id,-14} {ComparisonText.RunKind(r.Kind),-11} current {r.CurrentA.Before:0.0} -> {r.CurrentA.After:0.0}  {margin}  drop {r.DropPercent.Before:0.00} -> {r.DropPercent.After:0.00}  {ComparisonText.StatusPhrase(r.Status, r.FindingsBefore, r.FindingsAfter)}"));
        }

        More(o, c.UpstreamRuns.Count, rows);
    }

    // The equipment whose available fault current moved, was added or removed, one line each; the rest counted.
    private static void WriteFaults(TextWriter o, Comparison c, int rows)
    {
        var changed = c.Faults.Where(f => f.Changed).ToArray();
        if (changed.Length == 0)
        {
            return;
        }

        o.WriteLine();
        o.WriteLine("Available fault current (kA, three-phase or bolted / line-to-ground; each revision's own study):");
        foreach (var f in changed.Take(rows))
        {
            var rating = ComparisonText.FaultRating(f);
            o.WriteLine(F($"  {f.Id,-14} {Words.EquipmentKind.Of(f.Kind),-11} {ComparisonText.FaultStatus(f),-9} 3ph {ComparisonText.Ka(f.Before?.AvailableFaultCurrentKa)} -> {ComparisonText.Ka(f.After?.AvailableFaultCurrentKa)} ({ComparisonText.KaChange(f.ChangeKa, f.ChangePercent)})  L-G {ComparisonText.Ka(f.Before?.AvailableFaultCurrentLgKa)} -> {ComparisonText.Ka(f.After?.AvailableFaultCurrentLgKa)} ({ComparisonText.KaChange(f.ChangeLgKa, f.ChangeLgPercent)}){(rating.Length > 0 ? "  " + rating : "")}"));
        }

        More(o, changed.Length, rows);
        var same = c.Faults.Count - changed.Length;
        if (same > 0)
        {
            o.WriteLine(F($"  {same} other{(same == 1 ? "" : "s")} unchanged"));
        }
    }

    private static void WriteRevision(TextWriter o, string label, RevisionInfo r) =>
        o.WriteLine(F($"  {label}  {r.File} (sha256 {r.Sha256[..12]}…): {r.Summary.EndPoints} end points, {r.Summary.Findings} findings, worst total {r.Summary.WorstTotalDropPercent:0.00} % at {r.Summary.WorstEndPoint ?? "-"}"));

    private static void WriteElements(TextWriter o, string title, IReadOnlyList<ElementChange> changes)
    {
        if (changes.Count == 0)
        {
            return;
        }

        o.WriteLine();
        o.WriteLine($"{title}:");
        foreach (var e in changes)
        {
            var mark = e.Change switch { ChangeKind.Added => "+", ChangeKind.Removed => "-", _ => "~" };
            var detail = e.Change == ChangeKind.Changed
                ? string.Join("; ", e.Fields.Select(f => $"{f.Label} {f.BeforeText ?? "-"} -> {f.AfterText ?? "-"}"))
                : ComparisonText.Change(e.Change);
            o.WriteLine($"  {mark} {e.Id,-14} {detail}");
        }
    }

    private static void WriteFindings(TextWriter o, string title, IReadOnlyList<Solving.Finding> findings)
    {
        if (findings.Count == 0)
        {
            return;
        }

        o.WriteLine();
        o.WriteLine(F($"{title} ({findings.Count}):"));
        foreach (var f in findings)
        {
            o.WriteLine($"  {f.Location}: {f.Code}: {f.Message} [{f.Reference}]");
        }
    }

    private static void More(TextWriter o, int count, int rows)
    {
        if (count > rows)
        {
            o.WriteLine(F($"  … and {count - rows} more (--rows to show more, --json for all)"));
        }
    }

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
