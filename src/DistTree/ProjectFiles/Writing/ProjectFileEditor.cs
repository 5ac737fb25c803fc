using DistTree.Diagnostics;
using DistTree.Sizing;

namespace DistTree.ProjectFiles.Writing;

/// <summary>
/// Applies an upsize plan to the text of a project file, editing only the values that change: each changed
/// run's <c>size</c> scalar in place, and its <c>sets</c> value (replaced where written, else added right
/// after the size). Comments, key order and the formatting of every other line stay as they were.
/// </summary>
public static class ProjectFileEditor
{
    /// <summary>The edited text. Throws <see cref="InvalidOperationException"/> when a location does not hold the expected size.</summary>
    public static string Apply(string text, IEnumerable<UpsizeChange> changes)
    {
        var newline = text.Contains("\r\n", StringComparison.Ordinal) ? "\r\n" : "\n";
        var lines = text.Split(newline).ToList();
        // Edit from the bottom up so that an added line does not move the places still to edit.
        foreach (var change in changes.OrderByDescending(c => c.SizeLocation.Line).ThenByDescending(c => c.SizeLocation.Column))
        {
            EditRun(lines, change);
        }

        return string.Join(newline, lines);
    }

    private static void EditRun(List<string> lines, UpsizeChange change)
    {
        var at = change.SizeLocation;
        if (at.Line < 1 || at.Line > lines.Count)
        {
            throw new InvalidOperationException($"no size value at {at} for run {change.RunId}");
        }

        var line = lines[at.Line - 1];
        var start = at.Column - 1;
        var end = ScalarEnd(line, start);
        var old = line[start..end];
        if (!Conductors.ConductorSize.TryParse(old.Trim('"', '\''), out var size, out _) || size.Text != change.SizeBefore)
        {
            throw new InvalidOperationException($"{at}: expected the size {change.SizeBefore} of run {change.RunId}, found '{old}'");
        }

        var quote = old.Length > 0 && old[0] is '"' or '\'' ? old[0].ToString() : "";
        line = line[..start] + quote + change.SizeAfter + quote + line[end..];
        lines[at.Line - 1] = line;
        if (change.SetsAfter != change.SetsBefore)
        {
            EditSets(lines, at, start + quote.Length + change.SizeAfter.Length + quote.Length, change.SetsAfter);
        }
    }

    // A plain scalar ends at a flow indicator, a comment or the end of the line; a quoted one at its closing quote.
    private static int ScalarEnd(string line, int start)
    {
        if (start < line.Length && line[start] is '"' or '\'')
        {
            var close = line.IndexOf(line[start], start + 1);
            return close < 0 ? line.Length : close + 1;
        }

        var end = start;
        while (end < line.Length && line[end] is not (',' or '}' or ']' or '#'))
        {
            end++;
        }

        while (end > start && line[end - 1] == ' ')
        {
            end--;
        }

        return end;
    }

    private static void EditSets(List<string> lines, SourceLocation sizeAt, int afterSize, int sets)
    {
        var line = lines[sizeAt.Line - 1];
        var flow = line.LastIndexOf('{', sizeAt.Column - 1) >= 0 && line.IndexOf('}', afterSize) >= 0;
        if (flow)
        {
            var open = line.LastIndexOf('{', sizeAt.Column - 1);
            var close = line.IndexOf('}', afterSize);
            var inner = line[open..close];
            var m = System.Text.RegularExpressions.Regex.Match(inner, @"\bsets:\s*(\d+)");
            lines[sizeAt.Line - 1] = m.Success
                ? line[..(open + m.Groups[1].Index)] + sets + line[(open + m.Groups[1].Index + m.Groups[1].Length)..]
                : line[..afterSize] + $", sets: {sets}" + line[afterSize..];
            return;
        }

        // Block style: the run's keys share the size key's indentation.
        var indent = line.Length - line.TrimStart().Length;
        for (var i = sizeAt.Line - 2; i >= 0 && Indent(lines[i]) >= indent; i--)
        {
            if (TryReplaceSets(lines, i, indent, sets))
            {
                return;
            }
        }

        for (var i = sizeAt.Line; i < lines.Count && (lines[i].Trim().Length == 0 || Indent(lines[i]) >= indent); i++)
        {
            if (TryReplaceSets(lines, i, indent, sets))
            {
                return;
            }
        }

        lines.Insert(sizeAt.Line, new string(' ', indent) + $"sets: {sets}");
    }

    private static bool TryReplaceSets(List<string> lines, int i, int indent, int sets)
    {
        var m = System.Text.RegularExpressions.Regex.Match(lines[i], @"^(\s*)sets:\s*(\d+)");
        if (!m.Success || m.Groups[1].Length != indent)
        {
            return false;
        }

        lines[i] = lines[i][..m.Groups[2].Index] + sets + lines[i][(m.Groups[2].Index + m.Groups[2].Length)..];
        return true;
    }

    private static int Indent(string line) => line.Trim().Length == 0 ? int.MaxValue : line.Length - line.TrimStart().Length;
}
