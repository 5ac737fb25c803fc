namespace DistTree.ProjectFiles.Yaml;

/// <summary>Scalars: plain ones in block context, the checks every plain scalar passes, quoted ones and their escapes.</summary>
internal sealed partial class FastYamlReader
{
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

        // Parsed unsigned: "\U80000000" and above read as negative in an int. Anything not a Unicode scalar
        // value (a surrogate, above 0x10FFFF) is declined, and YamlDotNet's path reports it.
        var code = 0u;
        if (_pos + length > _text.Length
            || !uint.TryParse(_text.AsSpan(_pos + 2, length - 2), System.Globalization.NumberStyles.AllowHexSpecifier, System.Globalization.CultureInfo.InvariantCulture, out code)
            || !System.Text.Rune.IsValid(code))
        {
            Fail();
        }

        return char.ConvertFromUtf32((int)code);
    }
}
