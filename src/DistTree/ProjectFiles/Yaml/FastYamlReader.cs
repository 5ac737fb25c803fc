using System.Diagnostics.CodeAnalysis;
using System.Text;
using DistTree.Diagnostics;

namespace DistTree.ProjectFiles.Yaml;

/// <summary>
/// A fast reader for the small YAML subset that project files use: block mappings and sequences by
/// indentation, flow mappings and sequences (on one line or several), plain and quoted scalars on one
/// line, comments, and an optional '---'. It builds the same <see cref="SourceNode"/> tree, with the same
/// locations, as <see cref="YamlDotNetReader"/>, several times faster. Anything outside
/// the subset, or anything wrong, makes it decline, and the caller reads the whole file with YamlDotNet,
/// so every error message comes from that one path. Iterative: an explicit stack, no recursion. The reading
/// is split by what it reads: this file the document and its lines, then block collections, flow collections,
/// scalars, and the frames of open collections, each in a file of its own.
/// </summary>
internal sealed partial class FastYamlReader
{
    private const int MaxKeyLength = 1000; // YamlDotNet refuses a simple key longer than 1024 characters

    // Values up to this many characters are shared (sizes, numbers, words); longer ones rarely repeat.
    private const int MaxSharedLength = 64;

    private readonly string _text;
    private readonly string _file;
    private readonly List<Frame> _blocks = [];
    private readonly List<Frame> _flows = [];

    // Frames of closed collections, used again for the next ones: a file opens a few per line.
    private readonly Stack<Frame> _spareFrames = new();
    private readonly Dictionary<string, string> _strings = new(StringComparer.Ordinal);
    private readonly StringBuilder _buffer = new();
    private int _pos;
    private int _line = 1;
    private int _lineStart;

    private FastYamlReader(string text, string file)
    {
        _text = text;
        _file = file;
    }

    private enum FlowState
    {
        Entry,
        Value,
        AfterValue,
    }

    /// <summary>The document's tree, or null when the text is outside the subset (the caller then uses YamlDotNet).</summary>
    public static SourceNode? TryRead(string text, string file)
    {
        if (!OnlySimpleCharacters(text))
        {
            return null;
        }

        try
        {
            return new FastYamlReader(text, file).Document();
        }
        catch (NotInSubsetException)
        {
            // Thrown at most once per file: the text needs the full parser.
            return null;
        }
    }

    /// <summary>
    /// True when the text holds no tab, lone carriage return, byte-order mark, control character,
    /// or surrogate: these the fast path leaves to YamlDotNet.
    /// </summary>
    private static bool OnlySimpleCharacters(string text)
    {
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            if (c >= ' ' && c < '\u007f')
            {
                continue;
            }

            // NEL, LS and PS are characters like any other (YAML 1.2 breaks lines at LF and CR LF only).
            var allowed = c == '\n'
                || (c == '\r' && i + 1 < text.Length && text[i + 1] == '\n')
                || (c >= '\u00a0' && c < '\ud800') || c == '\u0085'
                || (c >= '\ue000' && c < '\ufffe' && c != '\ufeff');
            if (!allowed)
            {
                return false;
            }
        }

        return true;
    }

    [DoesNotReturn]
    private static void Fail() => throw new NotInSubsetException();

    private char Cur => _pos < _text.Length ? _text[_pos] : '\0';

    private bool IsEol(int i) => i >= _text.Length || _text[i] is '\n' or '\r';

    private bool IsBlankOrEol(int i) => IsEol(i) || _text[i] == ' ';

    private bool IsSequenceEntry() => Cur == '-' && IsBlankOrEol(_pos + 1);

    private bool IsComment() => Cur == '#' && (_pos == _lineStart || _text[_pos - 1] == ' ');

    private SourceLocation At(int index) => new(_file, _line, index - _lineStart + 1);

    private SourceNode Document()
    {
        SourceNode? root = null;
        var first = true;
        while (NextContentLine(out var indent))
        {
            if (indent == 0 && DocumentMarker() is { } marker)
            {
                if (marker != "---" || !first)
                {
                    Fail();
                }

                _pos += 3;
                EndLine();
                first = false;
                continue;
            }

            first = false;
            if (_blocks.Count == 0)
            {
                if (root is not null)
                {
                    Fail();
                }

                Node(ownLine: true);
                continue;
            }

            if (!PendingValue(indent))
            {
                CloseLeftOf(indent);
                Entry(_blocks[^1]);
            }
        }

        root = CloseAll() ?? root;
        if (root is null)
        {
            Fail();
        }

        return root!;
    }

    /// <summary>
    /// When the innermost collection's last key or item has no value on its own line, reads the line at the
    /// cursor as that value if it is indented past it (or is an item of an indentless sequence) and returns true;
    /// else the value is empty, and the line is for the collections to read.
    /// </summary>
    private bool PendingValue(int indent)
    {
        var top = _blocks[^1];
        if (top.EmptyAt is not { } emptyAt)
        {
            return false;
        }

        top.EmptyAt = null;
        if (indent > top.Indent || (indent == top.Indent && top.Node is SourceMapping && IsSequenceEntry()))
        {
            Node(ownLine: true);
            return true;
        }

        top.Add(Empty(emptyAt));
        return false;
    }

    /// <summary>
    /// Closes the collections the line at the cursor is left of; an indentless sequence (items at its key's
    /// column) also closes at its own column on a line that is not an item. The line must then be at the
    /// indentation of a collection still open.
    /// </summary>
    private void CloseLeftOf(int indent)
    {
        while (_blocks.Count > 0
            && (_blocks[^1].Indent > indent || (_blocks[^1].Indentless && _blocks[^1].Indent == indent && !IsSequenceEntry())))
        {
            Close();
        }

        if (_blocks.Count == 0 || _blocks[^1].Indent != indent)
        {
            Fail();
        }
    }

    /// <summary>The next item of the sequence <paramref name="top"/>, or the next key of the mapping.</summary>
    private void Entry(Frame top)
    {
        if (top.Node is SourceSequence)
        {
            if (!IsSequenceEntry())
            {
                Fail();
            }

            SequenceItem(top);
            return;
        }

        if (IsSequenceEntry())
        {
            Fail();
        }

        var key = BlockPlain(out var isKey);
        if (!isKey)
        {
            Fail();
        }

        MappingValue(top, key);
    }

    /// <summary>At the end of the text: an empty last value, then every collection closed; returns the root.</summary>
    private SourceNode? CloseAll()
    {
        if (_blocks.Count > 0 && _blocks[^1].EmptyAt is { } last)
        {
            _blocks[^1].Add(Empty(last));
            _blocks[^1].EmptyAt = null;
        }

        SourceNode? root = null;
        while (_blocks.Count > 0)
        {
            root = Close() ?? root;
        }

        return root;
    }

    /// <summary>"---" or "..." at the start of the line, followed by a blank or the line's end; else null.</summary>
    private string? DocumentMarker()
    {
        if (_pos + 3 > _text.Length || !IsBlankOrEol(_pos + 3))
        {
            return null;
        }

        var marker = _text.AsSpan(_pos, 3);
        return marker is "---" ? "---" : marker is "..." ? "..." : null;
    }

    private void SkipSpaces()
    {
        while (Cur == ' ')
        {
            _pos++;
        }
    }

    private void SkipToEol()
    {
        while (!IsEol(_pos))
        {
            _pos++;
        }
    }

    private void NewLine()
    {
        _pos += _text[_pos] == '\r' ? 2 : 1;
        _line++;
        _lineStart = _pos;
    }

    /// <summary>After a node: only spaces and a comment may follow on its line; steps to the next line.</summary>
    private void EndLine()
    {
        SkipSpaces();
        if (IsComment())
        {
            SkipToEol();
        }

        if (_pos >= _text.Length)
        {
            return;
        }

        if (!IsEol(_pos))
        {
            Fail();
        }

        NewLine();
    }

    /// <summary>Skips blank and comment lines; leaves the cursor on the first character of the next content line.</summary>
    private bool NextContentLine(out int indent)
    {
        while (true)
        {
            SkipSpaces();
            indent = _pos - _lineStart;
            if (_pos >= _text.Length)
            {
                return false;
            }

            if (IsComment())
            {
                SkipToEol();
            }

            if (_pos >= _text.Length)
            {
                return false;
            }

            if (!IsEol(_pos))
            {
                return true;
            }

            NewLine();
        }
    }
}
