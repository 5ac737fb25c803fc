using System.Globalization;
using System.Text;
using DistTree.Comparing;
using DistTree.Diagnostics;
using DistTree.Vocabulary;

namespace DistTree.Reports;

/// <summary>
/// Formats a comparison as GitHub-flavoured Markdown for a review comment: a summary line, a table of changed
/// elements, a table of affected end points, a table of upstream runs, the new and resolved findings, and the caution.
/// </summary>
public static class ComparisonMarkdown
{
    /// <summary>The Markdown text, at most <paramref name="rows"/> rows in each table, ending in a newline.</summary>
    public static string Write(Comparison c, int rows)
    {
        ArgumentNullException.ThrowIfNull(c);
        var o = new StringBuilder();
        Line(o, $"### DistTree comparison: {Escape(c.After.Name)}");
        Line(o, "");
        Line(o, F($"`{Code(c.Before.File)}` → `{Code(c.After.File)}`: worst total {c.Before.Summary.WorstTotalDropPercent:0.00} % → {c.After.Summary.WorstTotalDropPercent:0.00} %, findings {c.Before.Summary.Findings} → {c.After.Summary.Findings}."));
        Line(o, "");
        if (c.IsUnchanged)
        {
            Line(o, "**No change**: no field, drop, current or finding differs.");
        }
        else
        {
            var gate = c.HasNewFindings ? F($"**{c.Summary.NewFindings} new finding(s)**") : "No new findings";
            Line(o, $"{gate}. {Escape(ComparisonText.Summary(c.Summary))}.");
            WriteElements(o, c, rows);
            WriteEndPoints(o, c, rows);
            WriteUpstream(o, c, rows);
            WriteFaults(o, c, rows);
            WriteFindings(o, "New findings", c.NewFindings);
            WriteFindings(o, "Resolved findings", c.ResolvedFindings);
        }

        Line(o, "");
        Line(o, $"> **Caution:** {Caution.For(c.Before.Code, c.After.Code)}");
        return o.ToString();
    }

    private static void WriteElements(StringBuilder o, Comparison c, int rows)
    {
        var changes = c.ProjectChanges.Select(f => ("project", "changed", $"{f.Label}: {f.BeforeText ?? "-"} → {f.AfterText ?? "-"}"))
            .Concat(c.Equipment.Concat(c.Circuits).Select(e => (e.Id, ComparisonText.Change(e.Change), e.Change == ChangeKind.Changed
                ? string.Join("; ", e.Fields.Select(f => $"{f.Label}: {f.BeforeText ?? "-"} → {f.AfterText ?? "-"}"))
                : string.Join("; ", e.Fields.Where(f => f.Field is "kind" or "from" or "name" or "load.value" or "run.size" or "feeder.size")
                    .Select(f => $"{f.Label}: {f.AfterText ?? f.BeforeText}")))))
            .ToArray();
        if (changes.Length == 0)
        {
            return;
        }

        Line(o, "");
        Line(o, "| Element | Change | Fields |");
        Line(o, "| --- | --- | --- |");
        foreach (var (id, change, fields) in changes.Take(rows))
        {
            Line(o, $"| `{Code(id)}` | {change} | {Escape(fields)} |");
        }

        More(o, changes.Length, rows);
    }

    private static void WriteEndPoints(StringBuilder o, Comparison c, int rows)
    {
        if (c.EndPoints.Count == 0)
        {
            return;
        }

        Line(o, "");
        Line(o, "| End point | Name | Total before (%) | Total after (%) | Change (points) | Status |");
        Line(o, "| --- | --- | ---: | ---: | ---: | --- |");
        foreach (var e in c.EndPoints.Take(rows))
        {
            Line(o, F($"| `{Code(e.Id)}` | {Escape(e.Name)} | {e.TotalDropPercent.Before:0.00} | {e.TotalDropPercent.After:0.00} | {ComparisonText.Signed(e.TotalDropPercent.Change, 3)} | {Escape(ComparisonText.StatusPhrase(e.Status, e.FindingsBefore, e.FindingsAfter))} |"));
        }

        More(o, c.EndPoints.Count, rows);
    }

    private static void WriteUpstream(StringBuilder o, Comparison c, int rows)
    {
        if (c.UpstreamRuns.Count == 0)
        {
            return;
        }

        Line(o, "");
        Line(o, "| Upstream run | Kind | Current before (A) | Current after (A) | Margin before (A) | Margin after (A) | Drop change (points) |");
        Line(o, "| --- | --- | ---: | ---: | ---: | ---: | ---: |");
        foreach (var r in c.UpstreamRuns.Take(rows))
        {
            var before = r.MarginA is { } m ? F($"{m.Before:0.0}") : "-";
            var after = r.MarginA is { } n ? F($"{n.After:0.0}") : "-";
            Line(o, F($"| `{Code(r.Id)}` | {ComparisonText.RunKind(r.Kind)} | {r.CurrentA.Before:0.0} | {r.CurrentA.After:0.0} | {before} | {after} | {ComparisonText.Signed(r.DropPercent.Change, 3)} |"));
        }

        More(o, c.UpstreamRuns.Count, rows);
    }

    // The equipment whose available fault current moved, was added or removed; the rest counted.
    private static void WriteFaults(StringBuilder o, Comparison c, int rows)
    {
        var changed = c.Faults.Where(f => f.Changed).ToArray();
        if (changed.Length == 0)
        {
            return;
        }

        Line(o, "");
        Line(o, "| Equipment | Kind | Fault current | 3-phase kA before | 3-phase kA after | Change | L-G kA before | L-G kA after | Change | Rating |");
        Line(o, "| --- | --- | --- | ---: | ---: | ---: | ---: | ---: | ---: | --- |");
        foreach (var f in changed.Take(rows))
        {
            var status = ComparisonText.FaultStatus(f);
            Line(o, $"| `{Code(f.Id)}` | {Words.EquipmentKind.Of(f.Kind)} | {(f.Rose ? $"**{status}**" : status)} | {ComparisonText.Ka(f.Before?.AvailableFaultCurrentKa)} | {ComparisonText.Ka(f.After?.AvailableFaultCurrentKa)} | {ComparisonText.KaChange(f.ChangeKa, f.ChangePercent)} | {ComparisonText.Ka(f.Before?.AvailableFaultCurrentLgKa)} | {ComparisonText.Ka(f.After?.AvailableFaultCurrentLgKa)} | {ComparisonText.KaChange(f.ChangeLgKa, f.ChangeLgPercent)} | {Rating(f)} |");
        }

        More(o, changed.Length, rows);
        var same = c.Faults.Count - changed.Length;
        if (same > 0)
        {
            Line(o, "");
            Line(o, F($"Available fault current unchanged at {same} other piece{(same == 1 ? "" : "s")} of equipment."));
        }
    }

    private static string Rating(FaultDelta f)
    {
        var text = ComparisonText.FaultRating(f);
        return f.OverRatingAfter ? $"**{text}**" : text;
    }

    private static void WriteFindings(StringBuilder o, string title, IReadOnlyList<Solving.Finding> findings)
    {
        if (findings.Count == 0)
        {
            return;
        }

        Line(o, "");
        Line(o, F($"**{title} ({findings.Count})**"));
        Line(o, "");
        foreach (var f in findings)
        {
            Line(o, $"- `{Code(f.Subject)}` {f.Code}: {Escape(f.Message)} ({Escape(f.Reference)})");
        }
    }

    private static void More(StringBuilder o, int count, int rows)
    {
        if (count > rows)
        {
            Line(o, "");
            Line(o, F($"… and {count - rows} more."));
        }
    }

    // Table cells: a pipe would end the cell; markup characters are escaped. A line break, which would end the row,
    // is escaped with every other control character when the line is written (Line).
    private static string Escape(string text)
    {
        var b = new StringBuilder(text.Length);
        foreach (var ch in text)
        {
            switch (ch)
            {
                case '|' or '\\' or '*' or '_' or '`' or '<' or '>' or '[' or ']':
                    b.Append('\\').Append(ch);
                    break;
                default:
                    b.Append(ch);
                    break;
            }
        }

        return b.ToString();
    }

    // Inside a code span a backtick cannot be escaped and a pipe still splits a table cell.
    private static string Code(string text) => text.Replace("`", "'", StringComparison.Ordinal).Replace("|", "\\|", StringComparison.Ordinal);

    // Each line with the control characters of the text in it shown as \u001B (DisplayText): a line break in a name
    // would end a table's row, an escape sequence act on the terminal that shows the file.
    private static void Line(StringBuilder o, string text) => o.Append(DisplayText.Escape(text)).Append('\n');

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
