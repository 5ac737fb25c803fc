using System.Globalization;
using DistTree.Diagnostics;
using DistTree.ProjectFiles.Yaml;
using DistTree.Sizing;

namespace DistTree.ProjectFiles.Writing;

/// <summary>
/// The taps of an upsize plan. Each is set in its transformer's equipment mapping, found where the loader read it
/// (<see cref="TapChange.Location"/>, the mapping's first character): a written <c>tap_percent</c> value is replaced
/// in place, in the form it is written in (plain, quoted, after a tag); where none is written, one is added after the
/// mapping's last entry whose value is a scalar on one line: in a flow mapping as <c>, tap_percent: X</c> right after
/// that value, in a block mapping as a line of its own at the keys' indentation below that value's line, ended as that
/// line is. Nothing else changes.
/// </summary>
public static partial class ProjectFileEditor
{
    private const string TapKey = "tap_percent";

    // The taps, each of which must be in this file.
    private static List<TapChange> TapsIn(string file, IEnumerable<TapChange> taps)
    {
        ArgumentNullException.ThrowIfNull(taps);
        var list = taps.ToList();
        if (list.Find(t => t.Location.File != file) is { } other)
        {
            throw new ArgumentException($"transformer {other.TransformerId} is in {other.Location.File}, not in {file}", nameof(taps));
        }

        return list;
    }

    // Each tap's edit: the value replaced, or an entry added.
    private static void PlanTaps(string text, string file, List<int> lines, List<TapChange> taps, List<Edit> edits)
    {
        if (taps.Count == 0)
        {
            return;
        }

        var mappings = MappingsAt(text, file, taps);
        foreach (var tap in taps)
        {
            if (!mappings.TryGetValue((tap.Location.Line, tap.Location.Column), out var mapping)
                || mapping.Entries.Find(e => e.Key.Value == "id").Value is not SourceScalar { Value: var id } || id != tap.TransformerId)
            {
                throw ProjectException.At(tap.Location, $"no equipment entry of transformer '{tap.TransformerId}' here; nothing written");
            }

            PlanTap(text, file, lines, tap, mapping, edits);
        }
    }

    private static void PlanTap(string text, string file, List<int> lines, TapChange tap, SourceMapping mapping, List<Edit> edits)
    {
        var (before, after) = (TapText(tap.TapPercentBefore), TapText(tap.TapPercentAfter));
        var written = mapping.Entries.Find(e => e.Key.Value == TapKey);
        if (written.Value is SourceScalar value)
        {
            var what = $"the {TapKey} of transformer '{tap.TransformerId}'";
            var span = ScalarSpan(text, lines, value, file, what, $"'{TapKey}: {before}'");
            if (!double.TryParse(value.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var found) || Math.Abs(found - tap.TapPercentBefore) > 1e-9)
            {
                throw ProjectException.At(value.Location, $"expected {what}, {before}, here, found '{value.Echo()}'; nothing written");
            }

            edits.Add(new Edit(span.Start, span.End - span.Start, span.Quote + after + span.Quote));
            return;
        }

        if (written.Key is not null || Math.Abs(tap.TapPercentBefore) > 1e-9)
        {
            throw ProjectException.At(tap.Location, $"expected the {TapKey} of transformer '{tap.TransformerId}', {before}, in its entry; nothing written");
        }

        var anchor = mapping.Entries.LastOrDefault(e => e.Value is SourceScalar s && OnOneLine(text, lines, s));
        if (anchor.Value is not SourceScalar last)
        {
            throw ProjectException.At(tap.Location, $"transformer '{tap.TransformerId}' has no value on one line to add '{TapKey}: {after}' after; add it by hand");
        }

        if (text[Position(lines, mapping.Line, mapping.Column)] == '{')
        {
            var span = ScalarSpan(text, lines, last, file, $"the {anchor.Key.Value} of transformer '{tap.TransformerId}'", $"'{anchor.Key.Value}: {last.Value}'");
            edits.Add(new Edit(span.End, 0, $", {TapKey}: {after}"));
            return;
        }

        // A block mapping: a line of its own below the value's line, at the keys' indentation, ended as that line is.
        var next = last.Line < lines.Count ? lines[last.Line] : text.Length;
        var end = LineContentEnd(text, lines[last.Line - 1]);
        var lineBreak = end < next ? text[end..next] : FirstLineBreak(text);
        var added = new string(' ', anchor.Key.Column - 1) + $"{TapKey}: {after}";
        edits.Add(end < next ? new Edit(next, 0, added + lineBreak) : new Edit(next, 0, lineBreak + added));
    }

    // True for a scalar written on one line after its key (not a block scalar, not an empty value).
    private static bool OnOneLine(string text, List<int> lines, SourceScalar scalar)
    {
        var at = Position(lines, scalar.Line, scalar.Column);
        return scalar.FirstLineLength is null && at < text.Length && text[at] is not ('|' or '>' or '\n' or '\r');
    }

    private static string TapText(double percent) => percent.ToString("0.#", CultureInfo.InvariantCulture);

    // Every mapping that starts at one of the taps' locations.
    private static Dictionary<(int Line, int Column), SourceMapping> MappingsAt(string text, string file, List<TapChange> taps)
    {
        var wanted = taps.Select(t => (t.Location.Line, t.Location.Column)).ToHashSet();
        var found = new Dictionary<(int Line, int Column), SourceMapping>();
        foreach (var mapping in Mappings(text, file).Where(m => wanted.Contains((m.Line, m.Column))))
        {
            found.TryAdd((mapping.Line, mapping.Column), mapping);
        }

        return found;
    }
}
