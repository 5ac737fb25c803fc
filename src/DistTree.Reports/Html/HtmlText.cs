using System.Globalization;
using System.Text;
using DistTree.Diagnostics;
using DistTree.Vocabulary;

namespace DistTree.Reports.Html;

/// <summary>Escaping and invariant number formatting for the HTML report: every string the template prints comes from here.</summary>
internal static class HtmlText
{
    /// <summary>
    /// Escapes text for HTML element content only (never an attribute): the characters that would act
    /// (<see cref="DisplayText"/>), then <c>&amp;</c>, <c>&lt;</c> and <c>&gt;</c>; quotes stay as written.
    /// </summary>
    public static string Content(string? text)
    {
        text = DisplayText.Escape(text);
        return text.AsSpan().IndexOfAny("&<>") < 0 ? text : text.Replace("&", "&amp;", StringComparison.Ordinal).Replace("<", "&lt;", StringComparison.Ordinal).Replace(">", "&gt;", StringComparison.Ordinal);
    }

    /// <summary>A formula for element content (<see cref="Content"/>), each subscript written <c>_{…}</c> set as <c>&lt;sub&gt;</c>.</summary>
    public static string Formula(string text)
    {
        var escaped = Content(text);
        var sb = new StringBuilder(escaped.Length + 16);
        var at = 0;
        while (escaped.IndexOf("_{", at, StringComparison.Ordinal) is var open and >= 0 && escaped.IndexOf('}', open) is var close and >= 0)
        {
            sb.Append(escaped, at, open - at).Append("<sub>").Append(escaped, open + 2, close - open - 2).Append("</sub>");
            at = close + 1;
        }

        return sb.Append(escaped, at, escaped.Length - at).ToString();
    }

    /// <summary>
    /// Escapes text for HTML element content and quoted attribute values: first the characters that would act rather
    /// than show (control characters, separators, direction marks, unpaired surrogates) as visible <c>\u001B</c>
    /// (<see cref="DisplayText"/>), then HTML's own.
    /// </summary>
    public static string Escape(string? text)
    {
        text = DisplayText.Escape(text);
        if (text.Length == 0)
        {
            return "";
        }

        if (text.AsSpan().IndexOfAny("&<>\"'") < 0)
        {
            return text;
        }

        var sb = new StringBuilder(text.Length + 16);
        foreach (var c in text)
        {
            sb.Append(c switch
            {
                '&' => "&amp;",
                '<' => "&lt;",
                '>' => "&gt;",
                '"' => "&quot;",
                '\'' => "&#39;",
                _ => null,
            } ?? c.ToString());
        }

        return sb.ToString();
    }

    /// <summary>A percentage with two decimals, e.g. <c>4.21</c>.</summary>
    public static string Percent(double value) => Number(value, "0.00");

    /// <summary>A limit as the rules state it, e.g. <c>5</c> or <c>2.5</c>.</summary>
    public static string Limit(double? value) => value is { } v ? Number(v, "0.##") : "–";

    /// <summary>A current in amperes, one decimal.</summary>
    public static string Amperes(double? value) => value is { } v ? Number(v, "0.0") : "–";

    /// <summary>A length in metres, one decimal.</summary>
    public static string Metres(double? value) => value is { } v ? Number(v, "0.0") : "–";

    /// <summary>A length given in metres, shown in feet (whole feet).</summary>
    public static string Feet(double? metres) => metres is { } v ? Number(v / UnitFactors.MetresPerFoot, "0") : "–";

    /// <summary>Volt-amperes, whole, with thousands separated by a thin space.</summary>
    public static string VoltAmperes(double value) => Number(value, "#,0").Replace(",", "\u2009", StringComparison.Ordinal);

    /// <summary>Volt-amperes shown in kilovolt-amperes, one decimal.</summary>
    public static string Kva(double va) => Number(va / 1000, "0.0");

    /// <summary>A layout coordinate for SVG, at most one decimal.</summary>
    public static string Coordinate(double value) => Number(Math.Round(value, 1), "0.#");

    /// <summary>A place in the project file (<c>FILE:LINE:COL</c>), or words saying there is none; not escaped.</summary>
    public static string Where(SourceLocation location) =>
        location.Line == 0 ? "(no source location)" : location.ToString();

    /// <summary>An integer.</summary>
    public static string Count(int value) => value.ToString(CultureInfo.InvariantCulture);

    /// <summary>A number in the invariant culture with <paramref name="format"/>.</summary>
    public static string Number(double value, string format)
    {
        var text = value.ToString(format, CultureInfo.InvariantCulture);
        return text is "-0" or "-0.0" or "-0.00" ? text[1..] : text;
    }
}
