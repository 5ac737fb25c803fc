using DistTree.Diagnostics;
using DistTree.ProjectFiles.Yaml;
using DistTree.Sizing;

namespace DistTree.ProjectFiles.Writing;

/// <summary>Where a scalar's characters are in the text, and the lines as the loader counts them.</summary>
public static partial class ProjectFileEditor
{
    /// <summary>
    /// The characters of <paramref name="scalar"/> in <paramref name="text"/>: from its first character (after a tag)
    /// to just past its last (its closing quote), and the quote it is written with ("" when plain).
    /// </summary>
    /// <exception cref="ProjectException">A block scalar, or a value written over several lines: it is not rewritten.</exception>
    private static (int Start, int End, string Quote) ScalarSpan(string text, List<int> lines, SourceScalar scalar, UpsizeChange change, string key) =>
        ScalarSpan(text, lines, scalar, change.SizeLocation.File, $"the {key} of run '{change.RunId}'",
            $"'{key}: {key switch { SizeKey => change.SizeBefore, GroundKey => change.GroundSize, _ => Number(change.SetsBefore) }}'");

    /// <summary>As the overload for a run's value, for <paramref name="what"/> in <paramref name="file"/>, written as <paramref name="example"/> on one line.</summary>
    private static (int Start, int End, string Quote) ScalarSpan(string text, List<int> lines, SourceScalar scalar, string file, string what, string example)
    {
        var at = new SourceLocation(file, scalar.Line, scalar.Column);
        var start = Position(lines, scalar.Line, scalar.Column);
        if (start < text.Length && text[start] == '!')
        {
            // A tag ('!!str', '!') stands before the value on its line: it is kept, and the value after it edited.
            while (start < text.Length && text[start] is not (' ' or '\t' or '\n' or '\r'))
            {
                start++;
            }

            while (start < text.Length && text[start] is ' ' or '\t')
            {
                start++;
            }
        }

        var first = start < text.Length ? text[start] : '\n';
        if (first is '|' or '>')
        {
            throw ProjectException.At(at, $"{what} is written as a block scalar ('{first}'); --apply cannot rewrite it in that form: write it on one line, as {example}; nothing written");
        }

        if (scalar.FirstLineLength is not null || first is '\n' or '\r')
        {
            throw ProjectException.At(at, $"{what} is written over several lines; --apply cannot rewrite it in that form: write it on one line, as {example}; nothing written");
        }

        var end = first switch
        {
            '"' => DoubleQuotedEnd(text, start),
            '\'' => SingleQuotedEnd(text, start),
            _ => string.CompareOrdinal(text, start, scalar.Value, 0, scalar.Value.Length) == 0 ? start + scalar.Value.Length : -1,
        };
        if (end < 0)
        {
            throw ProjectException.At(at, $"{what} is not written here as it was read; nothing written");
        }

        return (start, end, first is '"' or '\'' ? first.ToString() : "");
    }

    // Just past the closing quote of a double-quoted scalar on one line (a backslash escapes the next character), or -1.
    private static int DoubleQuotedEnd(string text, int start)
    {
        for (var i = start + 1; i < text.Length && text[i] is not ('\n' or '\r'); i++)
        {
            if (text[i] == '\\')
            {
                i++;
            }
            else if (text[i] == '"')
            {
                return i + 1;
            }
        }

        return -1;
    }

    // Just past the closing quote of a single-quoted scalar on one line ('' is a quote inside it), or -1.
    private static int SingleQuotedEnd(string text, int start)
    {
        for (var i = start + 1; i < text.Length && text[i] is not ('\n' or '\r'); i++)
        {
            if (text[i] != '\'')
            {
                continue;
            }

            if (i + 1 < text.Length && text[i + 1] == '\'')
            {
                i++;
                continue;
            }

            return i + 1;
        }

        return -1;
    }

    // Where each line starts: lines end at LF, CR LF or CR, as the loader counts them (YAML 1.2); NEL, LS and PS
    // are characters of a line.
    private static List<int> LineStarts(string text)
    {
        var starts = new List<int> { 0 };
        for (var i = 0; i < text.Length; i++)
        {
            if (text[i] == '\r' && i + 1 < text.Length && text[i + 1] == '\n')
            {
                i++;
            }

            if (text[i] is '\n' or '\r')
            {
                starts.Add(i + 1);
            }
        }

        return starts;
    }

    // The index of 1-based (line, column), columns counted in UTF-16 code units as the loader counts them.
    private static int Position(List<int> lines, int line, int column) => lines[line - 1] + column - 1;

    // Where the line starting at start ends, before its line break.
    private static int LineContentEnd(string text, int start)
    {
        var end = text.AsSpan(start).IndexOfAny('\n', '\r');
        return end < 0 ? text.Length : start + end;
    }

    // The file's first line break, for a line added after a last line that has none.
    private static string FirstLineBreak(string text)
    {
        var at = text.AsSpan().IndexOfAny('\n', '\r');
        return at < 0 ? "\n" : text[at] == '\r' && at + 1 < text.Length && text[at + 1] == '\n' ? "\r\n" : text[at].ToString();
    }
}
