using System.Globalization;
using System.Text;
using DistTree.Diagnostics;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Diagnostics;

/// <summary>
/// DisplayText: control characters (Unicode general category Cc), the line and paragraph separators (Zl, Zp), the
/// bidirectional controls (the Bidi_Control property of Unicode's PropList.txt) and unpaired surrogates are shown as
/// <c>\uXXXX</c>; every other character is kept.
/// </summary>
public sealed class DisplayTextTests
{
    // Unicode 15.1 PropList.txt, Bidi_Control: 061C; 200E..200F; 202A..202E; 2066..2069 (12 code points).
    private static readonly int[] BidiControls = [0x061C, 0x200E, 0x200F, 0x202A, 0x202B, 0x202C, 0x202D, 0x202E, 0x2066, 0x2067, 0x2068, 0x2069];

    [Theory]
    [InlineData("\u001B[31mred", "\\u001B[31mred")] // an ANSI colour sequence (ECMA-48 CSI)
    [InlineData("a\nb\r\nc", "a\\u000Ab\\u000D\\u000Ac")]
    [InlineData("tab\there", "tab\\u0009here")]
    [InlineData("\0", "\\u0000")]
    [InlineData("del\u007F", "del\\u007F")]
    [InlineData("nel\u0085csi\u009B", "nel\\u0085csi\\u009B")] // C1: NEL, and CSI, which some terminals take as ESC [
    [InlineData("abc\u202Efed", "abc\\u202Efed")] // RIGHT-TO-LEFT OVERRIDE
    [InlineData("\u2066x\u2069", "\\u2066x\\u2069")] // LEFT-TO-RIGHT ISOLATE ... POP DIRECTIONAL ISOLATE
    [InlineData("line\u2028sep\u2029", "line\\u2028sep\\u2029")]
    public void Escape_CharactersThatAct_ShownAsUnicodeEscapes(string text, string expected)
    {
        Assert.Equal(expected, DisplayText.Escape(text));
    }

    // Not theory rows: the test runner passes a row's strings as UTF-8, which turns half a pair into U+FFFD.
    [Fact]
    public void Escape_HalfAPair_ShownAsUnicodeEscape_AWholePairKept()
    {
        Assert.Equal("x\\uD800y", DisplayText.Escape("x\uD800y")); // a high surrogate alone
        Assert.Equal("x\\uDC00", DisplayText.Escape("x\uDC00")); // a low surrogate alone
        Assert.Equal("\\uDC00\\uD800", DisplayText.Escape("\uDC00\uD800")); // a pair the wrong way round is two halves
        Assert.Equal("\\uD83D", DisplayText.Escape("\uD83D")); // a high surrogate at the end
        Assert.Equal("\\uD83D\uD83D\uDE00", DisplayText.Escape("\uD83D\uD83D\uDE00")); // half, then a whole pair
        Assert.Equal("\\u001B\\uDE00", DisplayText.Escape("\u001B\uDE00")); // an escape, then a low half
    }

    [Theory]
    [InlineData("Small office (invented example)")]
    [InlineData("Kältemaschine 2 · 400 V, 75 °C … ≥ 3")]
    [InlineData("\U0001F600 a pair is a character")]
    [InlineData("C:\\projects\\a.yaml and \\u001B written out")] // a backslash is kept
    [InlineData("")]
    public void Escape_TextWithoutSuch_ReturnedUnchanged(string text)
    {
        Assert.Same(text, DisplayText.Escape(text));
        Assert.False(DisplayText.NeedsEscape(text));
    }

    [Fact]
    public void Escape_Null_IsEmpty()
    {
        Assert.Equal("", DisplayText.Escape(null));
    }

    // Every UTF-16 code unit on its own, against the categories the .NET runtime reports and the PropList list above.
    [Fact]
    public void Escape_EveryCodeUnit_EscapedExactlyWhenCcZlZpBidiControlOrSurrogate()
    {
        var wrong = new List<string>();
        for (var c = 0; c <= 0xFFFF; c++)
        {
            var category = CharUnicodeInfo.GetUnicodeCategory((char)c);
            var expected = category is UnicodeCategory.Control or UnicodeCategory.LineSeparator or UnicodeCategory.ParagraphSeparator
                or UnicodeCategory.Surrogate || BidiControls.Contains(c);
            var text = ((char)c).ToString();
            var escaped = DisplayText.Escape(text);
            if (expected != (escaped != text) || (expected && escaped != $"\\u{c:X4}"))
            {
                wrong.Add($"U+{c:X4} -> {escaped}");
            }
        }

        Assert.Empty(wrong);
    }

    [Property(MaxTest = 2000)]
    public Property Escape_AnyText_LeavesNothingToEscapeAndIsIdempotent(string? text)
    {
        var once = DisplayText.Escape(text);
        return (!DisplayText.NeedsEscape(once) && DisplayText.Escape(once) == once).ToProperty();
    }

    // Undoing the escapes gives the text back, except where the text itself held a backslash followed by u and four hex
    // digits (then it reads as an escape): for text without a backslash the escape loses nothing.
    [Property(MaxTest = 2000)]
    public Property Escape_TextWithoutBackslash_UndoneGivesItBack(string? text)
    {
        var original = (text ?? "").Replace("\\", "", StringComparison.Ordinal);
        return (Unescape(DisplayText.Escape(original)) == original).ToProperty();
    }

    [Theory]
    [InlineData("abcdef", 3, "abc")]
    [InlineData("ab\U0001F600", 3, "ab")] // the cut would fall between the halves of the pair
    [InlineData("ab\U0001F600", 4, "ab\U0001F600")]
    [InlineData("ab", 5, "ab")]
    public void Prefix_CutInsideAPair_StopsBeforeIt(string text, int length, string expected)
    {
        Assert.Equal(expected, DisplayText.Prefix(text, length));
    }

    private static string Unescape(string text)
    {
        var b = new StringBuilder();
        for (var i = 0; i < text.Length; i++)
        {
            if (text[i] == '\\' && i + 5 < text.Length && text[i + 1] == 'u')
            {
                b.Append((char)int.Parse(text.AsSpan(i + 2, 4), NumberStyles.HexNumber, CultureInfo.InvariantCulture));
                i += 5;
            }
            else
            {
                b.Append(text[i]);
            }
        }

        return b.ToString();
    }
}
