using System.Globalization;
using System.Text;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.ProjectFiles.Yaml;
using DistTree.Sizing;

namespace DistTree.ProjectFiles.Writing;

/// <summary>
/// Applies an upsize plan to one project file, editing only the values that change: each changed run's
/// <c>size</c> scalar in place, in the form it is written in (plain, single- or double-quoted, after a tag),
/// its <c>sets</c> value (replaced where written, else added right after the size), and its <c>ground_size</c> where
/// the plan names one (<see cref="UpsizeChange.GroundSizeAfter"/>: replaced where written, else added after the size). Every other byte stays
/// as it was: comments, key order, line endings (LF, CR LF or CR, mixed as they are), characters such as NEL
/// inside a value, and a UTF-8 byte-order mark. The file is read as the loader reads it, so each size is found
/// as the loader found it; a size the editor cannot rewrite (a block scalar, a value over several lines) is a
/// located error, and nothing is edited.
/// </summary>
public static partial class ProjectFileEditor
{
    private const string SizeKey = "size";
    private const string SetsKey = "sets";
    private const string GroundKey = "ground_size";
    private static readonly UTF8Encoding StrictUtf8 = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);

    /// <summary>
    /// The bytes of the file named <paramref name="file"/> (UTF-8, as read by the loader) with
    /// <paramref name="changes"/> applied; each change's <see cref="UpsizeChange.SizeLocation"/> must be in it.
    /// A byte-order mark is kept.
    /// </summary>
    /// <exception cref="ProjectException">A size is not where the plan says, or is written in a form that cannot be rewritten.</exception>
    public static byte[] Apply(byte[] bytes, string file, IEnumerable<UpsizeChange> changes) => Apply(bytes, file, changes, []);

    /// <summary>As <see cref="Apply(byte[], string, IEnumerable{UpsizeChange})"/>, with the transformers' taps <paramref name="taps"/> set too (see <c>ProjectFileEditor.Taps.cs</c>).</summary>
    /// <exception cref="ProjectException">A size or tap is not where the plan says, or is written in a form that cannot be rewritten.</exception>
    public static byte[] Apply(byte[] bytes, string file, IEnumerable<UpsizeChange> changes, IEnumerable<TapChange> taps)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        var bom = bytes is [0xEF, 0xBB, 0xBF, ..];
        string text;
        try
        {
            text = StrictUtf8.GetString(bytes, bom ? 3 : 0, bytes.Length - (bom ? 3 : 0));
        }
        catch (DecoderFallbackException)
        {
            throw ProjectException.At(new SourceLocation(file, 1, 1), "the file is not UTF-8 text; nothing written");
        }

        var edited = Encoding.UTF8.GetBytes(Apply(text, file, changes, taps));
        return bom ? [0xEF, 0xBB, 0xBF, .. edited] : edited;
    }

    /// <summary>
    /// The text of the file named <paramref name="file"/> (without a byte-order mark) with <paramref name="changes"/>
    /// applied; each change's <see cref="UpsizeChange.SizeLocation"/> must be in it.
    /// </summary>
    /// <exception cref="ProjectException">A size is not where the plan says, or is written in a form that cannot be rewritten.</exception>
    public static string Apply(string text, string file, IEnumerable<UpsizeChange> changes) => Apply(text, file, changes, []);

    /// <summary>As <see cref="Apply(string, string, IEnumerable{UpsizeChange})"/>, with the transformers' taps <paramref name="taps"/> set too.</summary>
    /// <exception cref="ProjectException">A size or tap is not where the plan says, or is written in a form that cannot be rewritten.</exception>
    public static string Apply(string text, string file, IEnumerable<UpsizeChange> changes, IEnumerable<TapChange> taps)
    {
        ArgumentNullException.ThrowIfNull(text);
        ArgumentNullException.ThrowIfNull(changes);
        var tapList = TapsIn(file, taps);
        var list = changes.ToList();
        if (list.Find(c => c.SizeLocation.File != file) is { } other)
        {
            throw new ArgumentException($"the size of run {other.RunId} is in {other.SizeLocation.File}, not in {file}", nameof(changes));
        }

        if (list.Count == 0 && tapList.Count == 0)
        {
            return text;
        }

        var lines = LineStarts(text);
        var sizes = SizeEntries(text, file, list);
        var edits = new List<Edit>();
        foreach (var change in list)
        {
            if (!sizes.TryGetValue((change.SizeLocation.Line, change.SizeLocation.Column), out var entry))
            {
                throw ProjectException.At(change.SizeLocation, $"no size value of run '{change.RunId}' here; nothing written");
            }

            PlanRun(text, lines, change, entry, edits);
        }

        PlanTaps(text, file, lines, tapList, edits);

        var result = new StringBuilder(text);
        foreach (var edit in edits.OrderByDescending(e => e.Position))
        {
            result.Remove(edit.Position, edit.Length).Insert(edit.Position, edit.Replacement);
        }

        return result.ToString();
    }

    // The size's edit, and the sets' (replaced, added to a flow mapping, or added as a line below the size).
    private static void PlanRun(string text, List<int> lines, UpsizeChange change, SizeEntry entry, List<Edit> edits)
    {
        var size = ScalarSpan(text, lines, entry.Value, change, SizeKey);
        if (!ConductorSize.TryParse(entry.Value.Value, out var found, out _) || found.Text != change.SizeBefore)
        {
            throw ProjectException.At(change.SizeLocation, $"expected the size {change.SizeBefore} of run '{change.RunId}' here, found '{entry.Value.Echo()}'; nothing written");
        }

        edits.Add(new Edit(size.Start, size.End - size.Start, size.Quote + change.SizeAfter + size.Quote));
        var added = new List<(string Key, string Value)>();
        if (change.SetsAfter != change.SetsBefore)
        {
            SetOrAdd(text, lines, change, entry, SetsKey, Number(change.SetsAfter), edits, added);
        }

        if (change.GroundSizeAfter is { } ground)
        {
            SetOrAdd(text, lines, change, entry, GroundKey, ground, edits, added);
        }

        if (added.Count == 0)
        {
            return;
        }

        if (text[Position(lines, entry.Mapping.Line, entry.Mapping.Column)] == '{')
        {
            edits.Add(new Edit(size.End, 0, string.Concat(added.Select(a => $", {a.Key}: {a.Value}"))));
            return;
        }

        // A block mapping: a line of its own for each, after the size's line, at the size key's indentation, ended as that line is.
        var next = entry.Value.Line < lines.Count ? lines[entry.Value.Line] : text.Length;
        var end = LineContentEnd(text, lines[entry.Value.Line - 1]);
        var lineBreak = end < next ? text[end..next] : FirstLineBreak(text);
        var indent = new string(' ', entry.Key.Column - 1);
        var written = added.Select(a => $"{indent}{a.Key}: {a.Value}");
        edits.Add(end < next
            ? new Edit(next, 0, string.Concat(written.Select(w => w + lineBreak)))
            : new Edit(next, 0, string.Concat(written.Select(w => lineBreak + w))));
    }

    // The value of key in the run's mapping replaced in place where written (the loader read it there); else the key is
    // left to be added after the size.
    private static void SetOrAdd(string text, List<int> lines, UpsizeChange change, SizeEntry entry, string key, string value, List<Edit> edits, List<(string, string)> added)
    {
        if (entry.Mapping.Entries.Find(e => e.Key.Value == key).Value is SourceScalar written)
        {
            var span = ScalarSpan(text, lines, written, change, key);
            edits.Add(new Edit(span.Start, span.End - span.Start, span.Quote + value + span.Quote));
        }
        else
        {
            added.Add((key, value));
        }
    }

    private static string Number(int value) => value.ToString(CultureInfo.InvariantCulture);

    // Every mapping entry whose key is 'size' and whose value is a scalar at one of the changes' locations.
    private static Dictionary<(int Line, int Column), SizeEntry> SizeEntries(string text, string file, List<UpsizeChange> changes)
    {
        var wanted = changes.Select(c => (c.SizeLocation.Line, c.SizeLocation.Column)).ToHashSet();
        var found = new Dictionary<(int Line, int Column), SizeEntry>();
        foreach (var mapping in Mappings(text, file))
        {
            foreach (var (key, value) in mapping.Entries)
            {
                if (key.Value == SizeKey && value is SourceScalar scalar && wanted.Contains((scalar.Line, scalar.Column)))
                {
                    found[(scalar.Line, scalar.Column)] = new SizeEntry(mapping, key, scalar);
                }
            }
        }

        return found;
    }

    // Every mapping of the file as the loader reads it, depth first (iterative: a deep file cannot overflow the stack).
    private static IEnumerable<SourceMapping> Mappings(string text, string file)
    {
        var bag = new DiagnosticBag();
        bag.AddFile(file);
        var pending = new Stack<SourceNode>();
        if (SourceTreeReader.Read(text, file, bag) is { } root)
        {
            pending.Push(root);
        }

        while (pending.Count > 0)
        {
            switch (pending.Pop())
            {
                case SourceMapping mapping:
                    yield return mapping;
                    mapping.Entries.ForEach(e => pending.Push(e.Value));
                    break;
                case SourceSequence sequence:
                    sequence.Items.ForEach(pending.Push);
                    break;
            }
        }
    }

    // A size value found: the run's mapping, the size key, and the value.
    private sealed record SizeEntry(SourceMapping Mapping, SourceScalar Key, SourceScalar Value);

    // Replace Length characters at Position with Replacement (Length 0: insert).
    private sealed record Edit(int Position, int Length, string Replacement);
}
