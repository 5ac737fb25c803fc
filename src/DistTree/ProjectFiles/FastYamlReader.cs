using System.Diagnostics.CodeAnalysis;
using System.Text;
using DistTree.Diagnostics;

namespace DistTree.ProjectFiles;

/// <summary>
/// A fast reader for the small YAML subset that project files use: block mappings and sequences by
/// indentation, flow mappings and sequences (on one line or several), plain and quoted scalars on one
/// line, comments, and an optional '---'. It builds the same <see cref="SourceNode"/> tree, with the same
/// locations, as <see cref="SourceTreeReader"/>'s YamlDotNet path, several times faster. Anything outside
/// the subset, or anything wrong, makes it decline, and the caller reads the whole file with YamlDotNet,
/// so every error message comes from that one path. Iterative: an explicit stack, no recursion.
/// </summary>
internal sealed class FastYamlReader
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
    /// surrogate or YAML line break other than LF and CR LF: these the fast path leaves to YamlDotNet.
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

            var allowed = c == '\n'
                || (c == '\r' && i + 1 < text.Length && text[i + 1] == '\n')
                || (c >= '\u00a0' && c < '\ud800' && c is not '\u2028' and not '\u2029')
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

            var top = _blocks[^1];
            if (top.EmptyAt is { } emptyAt)
            {
                top.EmptyAt = null;
                if (indent > top.Indent || (indent == top.Indent && top.Node is SourceMapping && IsSequenceEntry()))
                {
                    Node(ownLine: true);
                    continue;
                }

                top.Add(Empty(emptyAt));
            }

            // Close the collections this line is left of; an indentless sequence (items at its key's
            // column) also closes at its own column on a line that is not an item.
            while (_blocks.Count > 0
                && (_blocks[^1].Indent > indent || (_blocks[^1].Indentless && _blocks[^1].Indent == indent && !IsSequenceEntry())))
            {
                root = Close() ?? root;
            }

            if (_blocks.Count == 0 || _blocks[^1].Indent != indent)
            {
                Fail();
            }

            top = _blocks[^1];
            if (top.Node is SourceSequence)
            {
                if (!IsSequenceEntry())
                {
                    Fail();
                }

                SequenceItem(top);
            }
            else
            {
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
        }

        if (_blocks.Count > 0 && _blocks[^1].EmptyAt is { } last)
        {
            _blocks[^1].Add(Empty(last));
            _blocks[^1].EmptyAt = null;
        }

        while (_blocks.Count > 0)
        {
            root = Close() ?? root;
        }

        if (root is null)
        {
            Fail();
        }

        return root!;
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

    /// <summary>
    /// Reads the node that starts at the cursor and belongs to the innermost open block collection (or is the
    /// root). A block collection is opened and left on the stack; any other node is added to its parent.
    /// <paramref name="ownLine"/> is true when the node starts a line, where only a collection may start.
    /// </summary>
    private void Node(bool ownLine)
    {
        var parent = _blocks.Count > 0 ? _blocks[^1] : null;
        while (true)
        {
            var column = _pos - _lineStart;
            if (IsSequenceEntry())
            {
                if (!ownLine && parent?.Node is SourceMapping)
                {
                    Fail(); // "key: - item"
                }

                var indentless = ownLine && parent is { Node: SourceMapping } && parent.Indent == column;
                var sequence = Open(new SourceSequence(_file, _line, column + 1), column, indentless);
                if (IndicatorOpensNode(sequence))
                {
                    parent = sequence;
                    ownLine = false;
                    continue;
                }

                return;
            }

            if (Cur is '[' or '{')
            {
                if (ownLine || parent is null)
                {
                    Fail();
                }

                parent!.Add(Flow());
                EndLine();
                return;
            }

            if (Cur is '"' or '\'')
            {
                if (ownLine || parent is null)
                {
                    Fail();
                }

                var quoted = Quoted();
                SkipSpaces();
                if (Cur == ':')
                {
                    Fail(); // a quoted key
                }

                parent!.Add(quoted);
                EndLine();
                return;
            }

            var scalar = BlockPlain(out var isKey);
            if (!isKey)
            {
                if (ownLine || parent is null)
                {
                    Fail(); // a scalar on a line of its own: perhaps a continued plain scalar
                }

                parent!.Add(scalar);
                EndLine();
                return;
            }

            if (!ownLine && parent?.Node is SourceMapping)
            {
                Fail(); // "a: b: c"
            }

            var mapping = Open(new SourceMapping(_file, scalar.Line, scalar.Column), column, indentless: false);
            if (MappingValueOpensNode(mapping, scalar))
            {
                parent = mapping;
                ownLine = false;
                continue;
            }

            return;
        }
    }

    /// <summary>Reads "- item" at the cursor for <paramref name="sequence"/>.</summary>
    private void SequenceItem(Frame sequence)
    {
        if (IndicatorOpensNode(sequence))
        {
            Node(ownLine: false);
        }
    }

    /// <summary>Reads the value after "key:" for <paramref name="mapping"/>.</summary>
    private void MappingValue(Frame mapping, SourceScalar key)
    {
        if (MappingValueOpensNode(mapping, key))
        {
            Node(ownLine: false);
        }
    }

    /// <summary>Steps over the ':' after a key; true when the value follows on the same line, else marks it empty so far.</summary>
    private bool MappingValueOpensNode(Frame mapping, SourceScalar key)
    {
        mapping.Key = key;
        return IndicatorOpensNode(mapping);
    }

    // Steps over a '-' or ':' indicator; true when what it introduces follows on the same line, else records
    // where that empty value or item stands and moves to the next line.
    private bool IndicatorOpensNode(Frame frame)
    {
        _pos++;
        var emptyAt = _pos;
        SkipSpaces();
        if (IsEol(_pos) || IsComment())
        {
            frame.EmptyAt = At(emptyAt);
            EndLine();
            return false;
        }

        return true;
    }

    private Frame Open(SourceNode node, int indent, bool indentless)
    {
        if (_blocks.Count >= ProjectLimits.MaxDepth)
        {
            Fail();
        }

        var frame = NewFrame(node, indent, indentless);
        _blocks.Add(frame);
        return frame;
    }

    /// <summary>Closes the innermost block collection; returns it when it was the root.</summary>
    private SourceNode? Close()
    {
        var frame = _blocks[^1];
        _blocks.RemoveAt(_blocks.Count - 1);
        var node = frame.Finish();
        _spareFrames.Push(frame);
        if (_blocks.Count == 0)
        {
            return node;
        }

        _blocks[^1].Add(node);
        return null;
    }

    private Frame NewFrame(SourceNode node, int indent, bool indentless)
    {
        var frame = _spareFrames.Count > 0 ? _spareFrames.Pop() : new Frame();
        frame.Open(node, indent, indentless);
        return frame;
    }

    private SourceScalar Empty(SourceLocation at) => new(at, "", true);

    /// <summary>Reads a flow collection from its '[' or '{' to its closing bracket, over as many lines as it takes.</summary>
    private SourceNode Flow()
    {
        var minIndent = _blocks[^1].Indent + 1;
        var stack = _flows;
        stack.Clear();
        OpenFlow(stack);
        while (true)
        {
            SkipFlowSpace(minIndent);
            var top = stack[^1];
            var c = Cur;
            if (c == (top.Node is SourceMapping ? '}' : ']') && top.State != FlowState.Value)
            {
                _pos++;
                stack.RemoveAt(stack.Count - 1);
                var closed = top.Finish();
                _spareFrames.Push(top);
                if (stack.Count == 0)
                {
                    return closed;
                }

                stack[^1].Add(closed);
                stack[^1].State = FlowState.AfterValue;
                continue;
            }

            if (top.State == FlowState.AfterValue)
            {
                if (c != ',')
                {
                    Fail();
                }

                _pos++;
                top.State = FlowState.Entry;
                continue;
            }

            if (top.State == FlowState.Entry && top.Node is SourceMapping)
            {
                top.Key = FlowPlain(out var isKey);
                if (!isKey)
                {
                    Fail();
                }

                _pos++;
                top.State = FlowState.Value;
                continue;
            }

            if (c is '[' or '{')
            {
                OpenFlow(stack);
                continue;
            }

            SourceScalar value;
            if (c is '"' or '\'')
            {
                value = Quoted();
                SkipSpaces();
                if (Cur == ':')
                {
                    Fail();
                }
            }
            else
            {
                value = FlowPlain(out var isKey);
                if (isKey)
                {
                    Fail(); // a single-pair mapping in a sequence, or "a: b: c"
                }
            }

            top.Add(value);
            top.State = FlowState.AfterValue;
        }
    }

    private void OpenFlow(List<Frame> stack)
    {
        if (_blocks.Count + stack.Count >= ProjectLimits.MaxDepth)
        {
            Fail();
        }

        var column = _pos - _lineStart + 1;
        SourceNode node = Cur == '{' ? new SourceMapping(_file, _line, column) : new SourceSequence(_file, _line, column);
        stack.Add(NewFrame(node, 0, indentless: false));
        _pos++;
    }

    /// <summary>Skips spaces, line breaks and comments inside a flow collection; a continued line must be indented past its block.</summary>
    private void SkipFlowSpace(int minIndent)
    {
        var newLine = false;
        while (true)
        {
            if (_pos >= _text.Length)
            {
                Fail();
            }

            var c = _text[_pos];
            if (c == ' ')
            {
                _pos++;
            }
            else if (c is '\n' or '\r')
            {
                NewLine();
                newLine = true;
            }
            else if (IsComment())
            {
                SkipToEol();
            }
            else
            {
                if (newLine && _pos - _lineStart < minIndent)
                {
                    Fail();
                }

                return;
            }
        }
    }

    /// <summary>
    /// A plain scalar in block context, ending at the line's end, at " #", or at ": " (then
    /// <paramref name="isKey"/> is true and the cursor is on the ':').
    /// </summary>
    private SourceScalar BlockPlain(out bool isKey)
    {
        var start = _pos;
        CheckPlainStart();
        isKey = false;
        var i = start;
        while (!IsEol(i))
        {
            var c = _text[i];
            if (c == ':' && IsBlankOrEol(i + 1))
            {
                isKey = true;
                break;
            }

            if (c == '#' && _text[i - 1] == ' ')
            {
                break;
            }

            i++;
        }

        return Plain(start, i, isKey);
    }

    /// <summary>
    /// A plain scalar in flow context, ending at a flow indicator, at " #", at the line's end, or at ": "
    /// (then <paramref name="isKey"/> is true and the cursor is on the ':').
    /// </summary>
    private SourceScalar FlowPlain(out bool isKey)
    {
        var start = _pos;
        CheckPlainStart();
        isKey = false;
        var i = start;
        while (!IsEol(i))
        {
            var c = _text[i];
            if (c is ',' or '[' or ']' or '{' or '}')
            {
                break;
            }

            if (c == ':')
            {
                if (!IsBlankOrEol(i + 1))
                {
                    Fail();
                }

                isKey = true;
                break;
            }

            if (c == '?' || (c == '#' && _text[i - 1] == ' '))
            {
                Fail();
            }

            i++;
        }

        if (IsEol(i) && !isKey && !FlowContinuesWithIndicator(i))
        {
            Fail(); // a plain scalar continued on the next line
        }

        return Plain(start, i, isKey);
    }

    /// <summary>True when the next thing after the line break at <paramref name="i"/> is ',', ']', '}' or a comment.</summary>
    private bool FlowContinuesWithIndicator(int i)
    {
        while (i < _text.Length && _text[i] is ' ' or '\n' or '\r')
        {
            i++;
        }

        return i < _text.Length && _text[i] is ',' or ']' or '}' or '#';
    }

    private void CheckPlainStart()
    {
        var c = Cur;
        var indicator = c is '-' or '?' or ':' or ',' or '[' or ']' or '{' or '}' or '#' or '&' or '*' or '!' or '|' or '>'
            or '\'' or '"' or '%' or '@' or '`' or ' ';
        if (IsEol(_pos) || (indicator && !(c == '-' && !IsBlankOrEol(_pos + 1) && _text[_pos + 1] is not (',' or '[' or ']' or '{' or '}' or '#'))))
        {
            Fail();
        }
    }

    private SourceScalar Plain(int start, int end, bool isKey)
    {
        var span = _text.AsSpan(start, end - start).TrimEnd(' ');

        // YamlDotNet reads "a *b: 1" as one scalar, not as a key: a '*' inside is left to it.
        if (span.Length > (isKey ? MaxKeyLength : ProjectLimits.MaxScalarLength) || span.Contains('*'))
        {
            Fail();
        }

        var column = start - _lineStart + 1;
        _pos = end;
        return new SourceScalar(_file, _line, column, isKey || span.Length <= MaxSharedLength ? Shared(span) : span.ToString(), true);
    }

    /// <summary>Keys and short values repeat on every item ("run", "20", "12 AWG"), so one string serves each.</summary>
    private string Shared(ReadOnlySpan<char> span)
    {
        var lookup = _strings.GetAlternateLookup<ReadOnlySpan<char>>();
        if (!lookup.TryGetValue(span, out var text))
        {
            text = span.ToString();
            _strings.Add(text, text);
        }

        return text;
    }

    /// <summary>A single- or double-quoted scalar closed on its own line.</summary>
    private SourceScalar Quoted()
    {
        var column = _pos - _lineStart + 1;
        var quote = Cur;
        _pos++;
        var start = _pos;
        var escaped = false;
        _buffer.Clear();
        while (true)
        {
            if (IsEol(_pos))
            {
                Fail(); // a quoted scalar over several lines
            }

            var c = _text[_pos];
            if (c == quote)
            {
                if (quote == '\'' && _pos + 1 < _text.Length && _text[_pos + 1] == '\'')
                {
                    Escape(ref escaped, start, "'", 2);
                    continue;
                }

                break;
            }

            if (c == '\\' && quote == '"')
            {
                Escape(ref escaped, start, DoubleQuotedEscape(out var length), length);
                continue;
            }

            if (escaped)
            {
                _buffer.Append(c);
            }

            _pos++;
        }

        var value = escaped ? _buffer.ToString()
            : _pos - start <= MaxSharedLength ? Shared(_text.AsSpan(start, _pos - start))
            : _text[start.._pos];
        _pos++;
        if (value.Length > ProjectLimits.MaxScalarLength)
        {
            Fail();
        }

        return new SourceScalar(_file, _line, column, value, false);
    }

    /// <summary>Appends an escape's text; the first escape copies what came before it into the buffer.</summary>
    private void Escape(ref bool escaped, int start, string text, int length)
    {
        if (!escaped)
        {
            _buffer.Append(_text, start, _pos - start);
            escaped = true;
        }

        _buffer.Append(text);
        _pos += length;
    }

    /// <summary>The text of the double-quoted escape at the cursor (a backslash) and its length in the source.</summary>
    private string DoubleQuotedEscape(out int length)
    {
        length = 2;
        var next = _pos + 1 < _text.Length ? _text[_pos + 1] : '\0';
        switch (next)
        {
            case '0': return "\0";
            case 'a': return "\a";
            case 'b': return "\b";
            case 't': return "\t";
            case 'n': return "\n";
            case 'v': return "\v";
            case 'f': return "\f";
            case 'r': return "\r";
            case 'e': return "\u001b";
            case ' ': return " ";
            case '"': return "\"";
            case '/': return "/";
            case '\\': return "\\";
            case 'N': return "\u0085";
            case '_': return "\u00a0";
            case 'L': return "\u2028";
            case 'P': return "\u2029";
            case 'x': length = 4; break;
            case 'u': length = 6; break;
            case 'U': length = 10; break;
            default: Fail(); break;
        }

        var code = 0;
        if (_pos + length > _text.Length
            || !int.TryParse(_text.AsSpan(_pos + 2, length - 2), System.Globalization.NumberStyles.AllowHexSpecifier, System.Globalization.CultureInfo.InvariantCulture, out code)
            || code > 0x10FFFF
            || code is >= 0xD800 and <= 0xDFFF)
        {
            Fail();
        }

        return char.ConvertFromUtf32(code);
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

    /// <summary>An open collection: block (with its indentation) or flow (with what it expects next).</summary>
    private sealed class Frame
    {
        // A mapping's entries while it is open: a frame is reused, so this list grows once, and each mapping
        // gets a list of exactly its size when it closes.
        private readonly List<KeyValuePair<SourceScalar, SourceNode>> _entries = [];

        public SourceNode Node { get; private set; } = null!;

        public int Indent { get; private set; }

        public bool Indentless { get; private set; }

        /// <summary>A mapping's key whose value is still to come.</summary>
        public SourceScalar? Key { get; set; }

        /// <summary>Where an empty value would be, when the value or item has not started on its indicator's line.</summary>
        public SourceLocation? EmptyAt { get; set; }

        public FlowState State { get; set; }

        /// <summary>Makes the frame stand for a newly opened collection.</summary>
        public void Open(SourceNode node, int indent, bool indentless)
        {
            _entries.Clear();
            Node = node;
            Indent = indent;
            Indentless = indentless;
            Key = null;
            EmptyAt = null;
            State = FlowState.Entry;
        }

        public void Add(SourceNode value)
        {
            if (Node is SourceSequence sequence)
            {
                sequence.Items.Add(value);
                return;
            }

            _entries.Add(new KeyValuePair<SourceScalar, SourceNode>(Key!, value));
            Key = null;
        }

        /// <summary>The closed collection, a mapping's entries moved in at their exact number.</summary>
        public SourceNode Finish()
        {
            if (Node is SourceMapping mapping && _entries.Count > 0)
            {
                mapping.Entries.Capacity = _entries.Count;
                mapping.Entries.AddRange(_entries);
                _entries.Clear();
            }

            return Node;
        }
    }

    /// <summary>The text needs the full parser; never leaves this class.</summary>
    private sealed class NotInSubsetException : Exception
    {
    }
}
