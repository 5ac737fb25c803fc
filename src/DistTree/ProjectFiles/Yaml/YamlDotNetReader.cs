using System.Globalization;
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
        var parser = new Parser(new StringReader(text));
        var stack = new Stack<Frame>();
        SourceNode? root = null;
        var documents = 0;
        Mark? last = null;
        try
        {
            while (parser.MoveNext())
            {
                var current = parser.Current!;
                last = current.Start;
                SourceNode completed;
                switch (current)
                {
                    case DocumentStart start:
                        documents++;
                        if (documents > 1)
                        {
                            bag.Error(At(file, start.Start), "a project file holds one YAML document; a second one starts here");
                            return root;
                        }

                        continue;
                    case Scalar scalar:
                        completed = MakeScalar(scalar, file, bag);
                        break;
                    case SequenceStart or MappingStart when stack.Count >= ProjectLimits.MaxDepth:
                        bag.Error(At(file, current.Start), $"the YAML nests deeper than {ProjectLimits.MaxDepth} levels here; a project needs at most 6 (see docs/limits.md)");
                        return null;
                    case SequenceStart sequence:
                        CheckTag(sequence, file, bag);
                        stack.Push(new Frame(new SourceSequence(At(file, sequence.Start))));
                        continue;
                    case MappingStart mapping:
                        CheckTag(mapping, file, bag);
                        stack.Push(new Frame(new SourceMapping(At(file, mapping.Start))));
                        continue;
                    case SequenceEnd or MappingEnd:
                        completed = stack.Pop().Node;
                        break;
                    case AnchorAlias alias:
                        bag.Error(At(file, alias.Start), $"aliases ('*{alias.Value}') are not supported; write the value out (each run's size is edited in place)");
                        completed = new SourceScalar(At(file, alias.Start), "*" + alias.Value, false) { IsInvalid = true };
                        break;
                    default:
                        continue;
                }

                if (stack.Count == 0)
                {
                    root = completed;
                    continue;
                }

                stack.Peek().Add(completed, bag);
            }
        }
        catch (YamlException e) when (e.Message.Contains("tab", StringComparison.Ordinal) && TabIndent(text, file, e.Start) is { } tab)
        {
            // YamlDotNet marks where the block began, which may be lines earlier; name the tab itself.
            bag.Error(tab, "a tab in the indentation; YAML indents with spaces only");
            return null;
        }
        catch (YamlException e)
        {
            bag.Error(At(file, e.Start), CleanMessage(e.Message));
            return null;
        }
        catch (InvalidOperationException)
        {
            // YamlDotNet's scanner throws this (without a mark) for some unclosed flow collections.
            bag.Error(last is null ? new SourceLocation(file, 1, 1) : At(file, last.Value), "invalid YAML after this point: an unclosed '[', '{' or quote?");
            return null;
        }

        return root;
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

    private static SourceScalar MakeScalar(Scalar scalar, string file, DiagnosticBag bag)
    {
        var location = At(file, scalar.Start);
        var plain = scalar.Style == ScalarStyle.Plain;
        if (scalar.Value.Length > ProjectLimits.MaxScalarLength)
        {
            bag.Error(location, string.Create(
                CultureInfo.InvariantCulture,
                $"a value of {scalar.Value.Length:N0} characters; a value may have at most {ProjectLimits.MaxScalarLength:N0} (see docs/limits.md)"));
            return new SourceScalar(location, scalar.Value[..16] + "...", plain) { IsInvalid = true };
        }

        if (!scalar.Tag.IsEmpty)
        {
            if (scalar.Tag.Value == StringTag || scalar.Tag.IsNonSpecific)
            {
                plain = false;
            }
            else
            {
                bag.Error(location, $"the tag '{scalar.Tag.Value}' is not supported; write the value without a tag");
                return new SourceScalar(location, scalar.Value, plain) { IsInvalid = true };
            }
        }

        return new SourceScalar(location, scalar.Value, plain);
    }

    private static void CheckTag(NodeEvent node, string file, DiagnosticBag bag)
    {
        if (!node.Tag.IsEmpty && !node.Tag.IsNonSpecific)
        {
            bag.Error(At(file, node.Start), $"the tag '{node.Tag.Value}' is not supported; write the value without a tag");
        }
    }

    private static string CleanMessage(string message)
    {
        var cleaned = MarkPrefix().Replace(message, "").Trim();
        if (cleaned.Length == 0)
        {
            return "the YAML cannot be read here";
        }

        return "invalid YAML: " + char.ToLowerInvariant(cleaned[0]) + cleaned[1..];
    }

    // YamlDotNet prefixes its messages with "(Line: 3, Col: 5, Idx: 20) - (Line: 3, Col: 6, Idx: 21): ".
    [GeneratedRegex(@"^\(Line: \d+, Col: \d+, Idx: \d+\) - \(Line: \d+, Col: \d+, Idx: \d+\):\s*")]
    private static partial Regex MarkPrefix();

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
                    bag.Error(child.Location, $"a key must be a plain word, not {child.Describe()}");
                    _pendingKey = new SourceScalar(child.Location, "?", false) { IsInvalid = true };
                }

                return;
            }

            mapping.Entries.Add(new KeyValuePair<SourceScalar, SourceNode>(_pendingKey, child));
            _pendingKey = null;
        }
    }
}
