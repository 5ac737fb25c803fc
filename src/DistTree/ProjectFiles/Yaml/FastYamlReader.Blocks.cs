using DistTree.Diagnostics;

namespace DistTree.ProjectFiles.Yaml;

/// <summary>Block collections: a node at the cursor, sequence items, mapping values, opening and closing by indentation.</summary>
internal sealed partial class FastYamlReader
{
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
            Frame opened;
            if (IsSequenceEntry())
            {
                if (!ownLine && parent?.Node is SourceMapping)
                {
                    Fail(); // "key: - item"
                }

                var indentless = ownLine && parent is { Node: SourceMapping } && parent.Indent == column;
                opened = Open(new SourceSequence(_file, _line, column + 1), column, indentless);
                if (!IndicatorOpensNode(opened))
                {
                    return;
                }
            }
            else if (Cur is '[' or '{' or '"' or '\'')
            {
                InlineValue(parent, ownLine);
                return;
            }
            else
            {
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

                opened = Open(new SourceMapping(_file, scalar.Line, scalar.Column), column, indentless: false);
                if (!MappingValueOpensNode(opened, scalar))
                {
                    return;
                }
            }

            // The collection just opened holds a node on the same line: read it as its first.
            parent = opened;
            ownLine = false;
        }
    }

    /// <summary>A flow collection or a quoted scalar: a value on its parent's line (never a line of its own, never a key).</summary>
    private void InlineValue(Frame? parent, bool ownLine)
    {
        if (ownLine || parent is null)
        {
            Fail();
        }

        SourceNode value;
        if (Cur is '[' or '{')
        {
            value = Flow();
        }
        else
        {
            value = Quoted();
            SkipSpaces();
            if (Cur == ':')
            {
                Fail(); // a quoted key
            }
        }

        parent!.Add(value);
        EndLine();
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
}
