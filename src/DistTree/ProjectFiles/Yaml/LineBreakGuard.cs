namespace DistTree.ProjectFiles.Yaml;

/// <summary>
/// YAML 1.2 breaks lines at LF, CR and CR LF only; YamlDotNet also breaks them at NEL (U+0085), LS (U+2028) and
/// PS (U+2029), as YAML 1.1 did, which shifts every later line number and splits a value or a comment in two. Before
/// YamlDotNet reads a text, each of the three is swapped for a private-use character the text does not hold (same
/// length, so every mark stays right); each scalar read gets its own characters back.
/// </summary>
internal sealed class LineBreakGuard
{
    private static readonly char[] Breaks = ['\u0085', '\u2028', '\u2029'];

    private readonly char[] _stand = new char[Breaks.Length];

    private LineBreakGuard()
    {
    }

    /// <summary>
    /// <paramref name="text"/> with NEL, LS and PS swapped for characters no line break, and the guard that swaps
    /// them back; null for the guard when the text holds none of them (then the text is returned as it is).
    /// </summary>
    public static (string Text, LineBreakGuard? Guard) Protect(string text)
    {
        if (text.AsSpan().IndexOfAny(Breaks) < 0)
        {
            return (text, null);
        }

        // Private-use characters (U+E000 to U+F8FF) the text already holds cannot stand in.
        const char First = '\ue000';
        const char Last = '\uf8ff';
        var used = new bool[Last - First + 1];
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            if (c is >= First and <= Last)
            {
                used[c - First] = true;
            }

            // An escape ("\uE000") makes one a value may hold, too.
            var digits = i + 1 < text.Length && text[i + 1] == 'U' ? 8 : 4;
            if (c == '\\' && i + 1 + digits < text.Length && text[i + 1] is 'u' or 'U'
                && uint.TryParse(text.AsSpan(i + 2, digits), System.Globalization.NumberStyles.AllowHexSpecifier, System.Globalization.CultureInfo.InvariantCulture, out var code)
                && code is >= First and <= Last)
            {
                used[code - First] = true;
            }
        }

        var guard = new LineBreakGuard();
        var next = 0;
        for (var i = 0; i < Breaks.Length; i++)
        {
            while (next < used.Length && used[next])
            {
                next++;
            }

            if (next == used.Length)
            {
                return (text, null); // every private-use character taken: read as YamlDotNet reads it
            }

            guard._stand[i] = (char)(First + next++);
        }

        var swapped = text.ToCharArray();
        for (var i = 0; i < swapped.Length; i++)
        {
            var k = Array.IndexOf(Breaks, swapped[i]);
            if (k >= 0)
            {
                swapped[i] = guard._stand[k];
            }
        }

        return (new string(swapped), guard);
    }

    /// <summary><paramref name="value"/> (read from the protected text) with NEL, LS and PS back in place.</summary>
    public string Restore(string value)
    {
        if (value.AsSpan().IndexOfAny(_stand) < 0)
        {
            return value;
        }

        var chars = value.ToCharArray();
        for (var i = 0; i < chars.Length; i++)
        {
            var k = Array.IndexOf(_stand, chars[i]);
            if (k >= 0)
            {
                chars[i] = Breaks[k];
            }
        }

        return new string(chars);
    }
}
