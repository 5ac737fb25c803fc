using System.Text.RegularExpressions;
using DistTree.Diagnostics;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace DistTree.ProjectFiles.Yaml;

/// <summary>
/// Reads YAML text into a <see cref="SourceNode"/> tree with YamlDotNet's event parser, keeping every
/// node's start mark: the reference the fast path must match, the path for anything outside its subset,
/// and the source of every YAML error message. Iterative (an explicit stack), so deep nesting cannot
/// overflow the call stack; and nesting deeper than <see cref="ProjectLimits.MaxDepth"/> stops the read,
/// since YamlDotNet's scanner spends time in proportion to the depth on every token (100,000 nested '['
/// take it about a minute).
/// </summary>
internal static partial class YamlDotNetReader
{
    private const string StringTag = "tag:yaml.org,2002:str";

    /// <summary>The document's root node, or null when the text holds none or cannot be parsed (reported).</summary>
    public static SourceNode? Read(string text, string file, DiagnosticBag bag)
    {
        (text, var guard) = LineBreakGuard.Protect(text);
        var events = new EventReader(text, file, bag, guard);
        try
        {
            return events.ReadAll(new Parser(new StringReader(text)));
        }
        catch (YamlException e) when (e.Message.Contains("tab", StringComparison.Ordinal) && TabIndent(text, file, e.Start) is { } tab)
        {
            // YamlDotNet marks where the block began, which may be lines earlier; name the tab itself.
            bag.Error(tab, ProjectMessages.TabIndent());
            return null;
        }
        catch (YamlException e)
        {
            bag.Error(At(file, e.Start), ProjectMessages.InvalidYaml(MarkPrefix().Replace(e.Message, "").Trim()));
            return null;
        }
        catch (ArgumentOutOfRangeException) when (HugeEscape(text, file) is { } escape)
        {
            // YamlDotNet reads "\U80000000" and above as a negative code and throws without a mark.
            bag.Error(escape, ProjectMessages.InvalidEscape());
            return null;
        }
        catch (InvalidOperationException)
        {
            // YamlDotNet's scanner throws this (without a mark) for some unclosed flow collections.
            bag.Error(events.Last is null ? new SourceLocation(file, 1, 1) : At(file, events.Last.Value), ProjectMessages.UnclosedFlow());
            return null;
        }
    }

    /// <summary>YamlDotNet marks are 1-based and <see cref="long"/>; diagnostics use <see cref="int"/>.</summary>
    public static SourceLocation At(string file, Mark mark) =>
        new(file, (int)Math.Min(mark.Line, int.MaxValue), (int)Math.Min(mark.Column, int.MaxValue));

    /// <summary>The first tab in the leading white space of a line, from the line of <paramref name="from"/> on.</summary>
    private static SourceLocation? TabIndent(string text, string file, Mark from)
    {
        var line = 1;
        var start = 0;
        while (start <= text.Length)
        {
            var end = text.IndexOf('\n', start);
            if (end < 0)
            {
                end = text.Length;
            }

            if (line >= from.Line)
            {
                for (var i = start; i < end && text[i] is ' ' or '\t'; i++)
                {
                    if (text[i] == '\t')
                    {
                        return new SourceLocation(file, line, i - start + 1);
                    }
                }
            }

            line++;
            start = end + 1;
        }

        return null;
    }

    /// <summary>
    /// The opening quote of the first double-quoted scalar holding a "\U" escape of 0x80000000 or more (a backslash
    /// preceded by an even number of backslashes), or null when there is none.
    /// </summary>
    private static SourceLocation? HugeEscape(string text, string file)
    {
        for (var at = text.IndexOf("\\U", StringComparison.Ordinal); at >= 0; at = text.IndexOf("\\U", at + 1, StringComparison.Ordinal))
        {
            var backslashes = 0;
            while (at - backslashes - 1 >= 0 && text[at - backslashes - 1] == '\\')
            {
                backslashes++;
            }

            if (backslashes % 2 == 1 || at + 10 > text.Length
                || !uint.TryParse(text.AsSpan(at + 2, 8), System.Globalization.NumberStyles.AllowHexSpecifier, System.Globalization.CultureInfo.InvariantCulture, out var code)
                || code < 0x80000000)
            {
                continue;
            }

            var lineStart = text.LastIndexOf('\n', at) + 1;
            var quote = at;
            while (quote > lineStart && !(text[quote] == '"' && text[quote - 1] != '\\'))
            {
                quote--;
            }

            var line = 1 + text.AsSpan(0, lineStart).Count('\n');
            return new SourceLocation(file, line, quote - lineStart + 1);
        }

        return null;
    }

    private static SourceScalar MakeScalar(Scalar scalar, string text, string file, DiagnosticBag bag, LineBreakGuard? guard)
    {
        var firstLine = FirstLineLength(scalar, text);
        var value = guard is null ? scalar.Value : guard.Restore(scalar.Value);
        var location = At(file, scalar.Start);
        var plain = scalar.Style == ScalarStyle.Plain;
        if (value.Length > ProjectLimits.MaxScalarLength)
        {
            bag.Error(location, ProjectMessages.ScalarTooLong(value.Length));
            return new SourceScalar(location, value[..16] + "...", plain) { IsInvalid = true };
        }

        if (!scalar.Tag.IsEmpty)
        {
            if (scalar.Tag.Value == StringTag || scalar.Tag.IsNonSpecific)
            {
                plain = false;
            }
            else
            {
                bag.Error(location, ProjectMessages.TagNotSupported(scalar.Tag.Value));
                return new SourceScalar(location, value, plain) { IsInvalid = true, FirstLineLength = firstLine };
            }
        }

        return new SourceScalar(location, value, plain) { FirstLineLength = firstLine };
    }

    /// <summary>How many characters of a scalar spanning several lines stand on its first line (its quote or indicator not counted); null for one line.</summary>
    private static int? FirstLineLength(Scalar scalar, string text)
    {
        if (scalar.End.Line == scalar.Start.Line || scalar.Start.Index >= text.Length)
        {
            return null;
        }

        var start = (int)scalar.Start.Index + (scalar.Style == ScalarStyle.Plain ? 0 : 1);
        var end = text.IndexOfAny(['\n', '\r'], Math.Min(start, text.Length));
        return end < 0 ? null : text.AsSpan(start, end - start).TrimEnd(' ').Length;
    }

    private static void CheckTag(NodeEvent node, string file, DiagnosticBag bag)
    {
        if (!node.Tag.IsEmpty && !node.Tag.IsNonSpecific)
        {
            bag.Error(At(file, node.Start), ProjectMessages.TagNotSupported(node.Tag.Value));
        }
    }

    // YamlDotNet prefixes its messages with "(Line: 3, Col: 5, Idx: 20) - (Line: 3, Col: 6, Idx: 21): ".
    [GeneratedRegex(@"^\(Line: \d+, Col: \d+, Idx: \d+\) - \(Line: \d+, Col: \d+, Idx: \d+\):\s*")]
    private static partial Regex MarkPrefix();

    /// <summary>Builds the tree from the parser's events; the parser's exceptions are left to the caller.</summary>
    private sealed class EventReader(string text, string file, DiagnosticBag bag, LineBreakGuard? guard)
    {
        private readonly Stack<Frame> _stack = new();

        /// <summary>Where the last event read starts, for an error YamlDotNet throws without a mark.</summary>
        public Mark? Last { get; private set; }

        /// <summary>The root; the root read so far at a second document; null when nesting is too deep (reported).</summary>
        public SourceNode? ReadAll(Parser parser)
        {
            SourceNode? root = null;
            var documents = 0;
            while (parser.MoveNext())
            {
                var current = parser.Current!;
                Last = current.Start;
                SourceNode completed;
                switch (current)
                {
                    case DocumentStart start:
                        documents++;
                        if (documents > 1)
                        {
                            bag.Error(At(file, start.Start), ProjectMessages.SecondDocument());
                            return root;
                        }

                        continue;
                    case Scalar scalar:
                        completed = MakeScalar(scalar, text, file, bag, guard);
                        break;
                    case SequenceStart or MappingStart when _stack.Count >= ProjectLimits.MaxDepth:
                        bag.Error(At(file, current.Start), ProjectMessages.TooDeep());
                        return null;
                    case SequenceStart or MappingStart:
                        Open((NodeEvent)current);
                        continue;
                    case SequenceEnd or MappingEnd:
                        completed = _stack.Pop().Node;
                        break;
                    case AnchorAlias alias:
                        bag.Error(At(file, alias.Start), ProjectMessages.AliasNotSupported(alias.Value.ToString()));
                        completed = new SourceScalar(At(file, alias.Start), "*" + alias.Value, false) { IsInvalid = true };
                        break;
                    default:
                        continue;
                }

                if (_stack.Count == 0)
                {
                    root = completed;
                    continue;
                }

                _stack.Peek().Add(completed, bag);
            }

            return root;
        }

        private void Open(NodeEvent start)
        {
            CheckTag(start, file, bag);
            var at = At(file, start.Start);
            _stack.Push(new Frame(start is SequenceStart ? new SourceSequence(at) : new SourceMapping(at)));
        }
    }

    private sealed class Frame(SourceNode node)
    {
        private SourceScalar? _pendingKey;

        public SourceNode Node { get; } = node;

        public void Add(SourceNode child, DiagnosticBag bag)
        {
            if (Node is SourceSequence sequence)
            {
                sequence.Items.Add(child);
                return;
            }

            var mapping = (SourceMapping)Node;
            if (_pendingKey is null)
            {
                if (child is SourceScalar key)
                {
                    _pendingKey = key;
                }
                else
                {
                    bag.Error(child.Location, ProjectMessages.KeyNotPlain(child));
                    _pendingKey = new SourceScalar(child.Location, "?", false) { IsInvalid = true };
                }

                return;
            }

            mapping.Entries.Add(new KeyValuePair<SourceScalar, SourceNode>(_pendingKey, child));
            _pendingKey = null;
        }
    }
}
