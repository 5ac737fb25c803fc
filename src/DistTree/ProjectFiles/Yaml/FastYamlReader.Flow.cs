namespace DistTree.ProjectFiles.Yaml;

/// <summary>Flow collections ('[...]' and '{...}', on one line or several) and the plain scalars inside them.</summary>
internal sealed partial class FastYamlReader
{
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
                if (CloseFlow(stack) is { } closed)
                {
                    return closed;
                }
            }
            else if (top.State == FlowState.AfterValue)
            {
                if (c != ',')
                {
                    Fail();
                }

                _pos++;
                top.State = FlowState.Entry;
            }
            else if (top.State == FlowState.Entry && top.Node is SourceMapping)
            {
                top.Key = FlowPlain(out var isKey);
                if (!isKey)
                {
                    Fail();
                }

                _pos++;
                top.State = FlowState.Value;
            }
            else if (c is '[' or '{')
            {
                OpenFlow(stack);
            }
            else
            {
                top.Add(FlowScalar());
                top.State = FlowState.AfterValue;
            }
        }
    }

    /// <summary>Closes the innermost flow collection, its bracket passed; returns it when it was the outermost.</summary>
    private SourceNode? CloseFlow(List<Frame> stack)
    {
        var top = stack[^1];
        stack.RemoveAt(stack.Count - 1);
        var closed = top.Finish();
        _spareFrames.Push(top);
        if (stack.Count == 0)
        {
            return closed;
        }

        stack[^1].Add(closed);
        stack[^1].State = FlowState.AfterValue;
        return null;
    }

    /// <summary>A scalar value inside a flow collection: quoted, or plain; never a key there.</summary>
    private SourceScalar FlowScalar()
    {
        if (Cur is '"' or '\'')
        {
            var quoted = Quoted();
            SkipSpaces();
            if (Cur == ':')
            {
                Fail();
            }

            return quoted;
        }

        var plain = FlowPlain(out var isKey);
        if (isKey)
        {
            Fail(); // a single-pair mapping in a sequence, or "a: b: c"
        }

        return plain;
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
}
