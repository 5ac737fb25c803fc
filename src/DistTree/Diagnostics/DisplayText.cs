using System.Buffers;
using System.Globalization;
using System.Text;

namespace DistTree.Diagnostics;

/// <summary>
/// Text from a project file or the command line (a name, a description, a path, a value a message repeats) as a
/// person reads it on a terminal, in Markdown or on a page: every character that would act rather than show is
/// written as a visible escape, <c>\u001B</c>. Those are the control characters (C0, U+007F and C1: an escape
/// sequence could recolour or retitle a terminal, a line break forge a line of output), the line and paragraph
/// separators U+2028 and U+2029, the bidirectional controls (U+061C, U+200E, U+200F, U+202A to U+202E, U+2066 to
/// U+2069, which can make text read in another order than it is stored), and a surrogate that is not half of a
/// pair. Everything else, a backslash too, is kept as it is, so text without those characters is returned unchanged
/// (the same instance). JSON and SARIF carry the exact text instead, with their own escapes.
/// </summary>
public static class DisplayText
{
    // Every character Escape may replace; a surrogate is replaced only when it is not half of a pair.
    private static readonly SearchValues<char> Suspects = SearchValues.Create(
        "\u0000\u0001\u0002\u0003\u0004\u0005\u0006\u0007\u0008\u0009\u000A\u000B\u000C\u000D\u000E\u000F" +
        "\u0010\u0011\u0012\u0013\u0014\u0015\u0016\u0017\u0018\u0019\u001A\u001B\u001C\u001D\u001E\u001F" +
        "\u007F\u0080\u0081\u0082\u0083\u0084\u0085\u0086\u0087\u0088\u0089\u008A\u008B\u008C\u008D\u008E\u008F" +
        "\u0090\u0091\u0092\u0093\u0094\u0095\u0096\u0097\u0098\u0099\u009A\u009B\u009C\u009D\u009E\u009F" +
        "\u061C\u200E\u200F\u2028\u2029\u202A\u202B\u202C\u202D\u202E\u2066\u2067\u2068\u2069" +
        string.Concat(Enumerable.Range(0xD800, 0x800).Select(c => (char)c)));

    /// <summary>
    /// <paramref name="text"/> with every control character, line or paragraph separator, bidirectional control
    /// and unpaired surrogate written as <c>\uXXXX</c> (four upper-case hex digits); the same instance when there is
    /// none, and the empty string for null. Escaping escaped text changes nothing.
    /// </summary>
    public static string Escape(string? text)
    {
        if (string.IsNullOrEmpty(text))
        {
            return "";
        }

        var first = FirstEscaped(text, 0);
        if (first < 0)
        {
            return text;
        }

        var b = new StringBuilder(text.Length + 16);
        var start = 0;
        for (var at = first; at >= 0; at = FirstEscaped(text, start))
        {
            b.Append(text, start, at - start).Append(CultureInfo.InvariantCulture, $"\\u{(int)text[at]:X4}");
            start = at + 1;
        }

        return b.Append(text, start, text.Length - start).ToString();
    }

    /// <summary>True when <see cref="Escape"/> would change <paramref name="text"/>.</summary>
    public static bool NeedsEscape(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        return FirstEscaped(text, 0) >= 0;
    }

    /// <summary>
    /// The first <paramref name="length"/> characters of <paramref name="text"/> or fewer, so that the cut does not
    /// split a surrogate pair (which would leave half a character); the whole text when it is no longer.
    /// </summary>
    public static string Prefix(string text, int length)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (text.Length <= length)
        {
            return text;
        }

        return length > 0 && char.IsHighSurrogate(text[length - 1]) ? text[..(length - 1)] : text[..length];
    }

    // The index of the first character at or after start that Escape replaces, or -1.
    private static int FirstEscaped(string text, int start)
    {
        // Printable ASCII, most of any text, is passed over first with the fastest search.
        var printable = text.AsSpan(start).IndexOfAnyExceptInRange(' ', '~');
        if (printable < 0)
        {
            return -1;
        }

        var at = start + printable;
        while (at < text.Length)
        {
            var found = text.AsSpan(at).IndexOfAny(Suspects);
            if (found < 0)
            {
                return -1;
            }

            at += found;

            // A pair is stepped over whole, and no scan starts inside one: a low surrogate found here has no high one before it.
            if (!char.IsHighSurrogate(text[at]) || at + 1 == text.Length || !char.IsLowSurrogate(text[at + 1]))
            {
                return at;
            }

            at += 2;
        }

        return -1;
    }
}
