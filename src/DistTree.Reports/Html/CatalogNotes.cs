using System.Text.RegularExpressions;

namespace DistTree.Reports.Html;

/// <summary>
/// What a conductor catalogue's header says of where its values come from, for a reviewer: each column whose note marks
/// some of its values recalled (<c>memory</c>) rather than read from the source, with those words, once. The header's
/// layout is the embedded catalogue's (DEVELOPERS.md, Conductor data): a line <c># column unit source</c>, then a line a
/// column (its name at the start), continued on indented lines.
/// </summary>
internal static partial class CatalogNotes
{
    /// <summary>A column and the parts of its note that say which of its values are recalled.</summary>
    internal sealed record RecalledColumn(string Column, string What);

    /// <summary>The columns of <paramref name="header"/> (its lines as written, without the leading <c>#</c> or with it) with values recalled.</summary>
    public static IReadOnlyList<RecalledColumn> Recalled(IReadOnlyList<string> header)
    {
        var columns = new List<(string Name, string Text)>();
        var started = false;
        foreach (var raw in header)
        {
            var line = raw.TrimStart('#');
            if (!started)
            {
                started = line.TrimStart().StartsWith("column ", StringComparison.Ordinal);
                continue;
            }

            if (ColumnLine().Match(line) is { Success: true } m)
            {
                columns.Add((m.Groups["name"].Value, m.Groups["text"].Value.Trim()));
            }
            else if (columns.Count > 0 && line.Trim().Length > 0)
            {
                columns[^1] = (columns[^1].Name, columns[^1].Text + " " + line.Trim());
            }
        }

        var recalled = new List<RecalledColumn>();
        foreach (var (name, text) in columns)
        {
            var parts = Clauses().Split(text).Where(p => p.Contains("memory", StringComparison.Ordinal)).Select(Clean).Where(p => p.Length > 0).ToArray();
            if (parts.Length > 0)
            {
                recalled.Add(new RecalledColumn(name, string.Join("; ", parts)));
            }
            else if (SameStatus().Match(text) is { Success: true } same && recalled.Any(r => r.Column == same.Groups["as"].Value))
            {
                recalled.Add(new RecalledColumn(name, $"as {same.Groups["as"].Value}"));
            }
        }

        return recalled;
    }

    // A clause in the page's words: "recalled" for the header's "memory", without the parentheses it was cut from.
    private static string Clean(string clause)
    {
        var text = clause.Replace("memory", "recalled", StringComparison.Ordinal).Replace("(", "", StringComparison.Ordinal).Replace(")", "", StringComparison.Ordinal);
        return text.Trim().TrimEnd('.', ';', ',').Trim();
    }

    // A column's first line: its name at the start (after the '#' and a space, where they are kept), its unit, its note.
    [GeneratedRegex(@"^ ?(?<name>[a-z][a-z0-9_.]*)\s{2,}\S+\s{2,}(?<text>.*)$")]
    private static partial Regex ColumnLine();

    // A note that takes another column's status.
    [GeneratedRegex(@"same status as (?<as>[a-z][a-z0-9_.]*)")]
    private static partial Regex SameStatus();

    // The note's clauses: sentences and the parts between semicolons.
    [GeneratedRegex(@"(?<=[.;])\s+")]
    private static partial Regex Clauses();
}
