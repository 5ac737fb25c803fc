using System.Globalization;
using System.Text.RegularExpressions;
using DistTree.Model;
using DistTree.ProjectFiles.Yaml;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Sections;

/// <summary>
/// Typed values from scalars, following the YAML 1.2 core schema for plain scalars (a quoted
/// <c>"20"</c> is text, not a number). Each method reports what is wrong and returns null.
/// </summary>
internal sealed partial class ValueReader(DiagnosticBag bag)
{
    /// <summary>A finite number.</summary>
    public double? Number(SourceNode node, Subject what)
    {
        if (node is not SourceScalar scalar || !scalar.IsPlain || !IsNumberText(scalar.Value))
        {
            if (!node.IsInvalid)
            {
                var hint = node is SourceScalar { IsPlain: false } quoted && IsNumberText(quoted.Value)
                    ? " (write numbers without quotes)"
                    : "";
                bag.Error(node.Location, ProjectMessages.NotANumber(what, node, hint));
            }

            return null;
        }

        return Finite(scalar, what);
    }

    /// <summary>A number in <paramref name="range"/> (see <see cref="ValueRanges"/>); outside it, an error naming the range.</summary>
    public double? InRange(SourceNode node, Subject what, NumberRange range)
    {
        if (Number(node, what) is not { } value)
        {
            return null;
        }

        if (range.Whole && value != Math.Floor(value))
        {
            bag.Error(node.Location, ProjectMessages.NotWhole(what, value));
            return null;
        }

        if (!range.Contains(value))
        {
            bag.Error(node.Location, ProjectMessages.OutOfRange(what, range, ((SourceScalar)node).Echo()));
            return null;
        }

        return value;
    }

    /// <summary>A whole number in <paramref name="range"/>, a range of whole numbers.</summary>
    public int? WholeInRange(SourceNode node, Subject what, NumberRange range) =>
        InRange(node, what, range) is { } value ? (int)value : null;

    /// <summary>A whole number.</summary>
    public int? Integer(SourceNode node, Subject what)
    {
        var value = Number(node, what);
        if (value is null)
        {
            return null;
        }

        if (value.Value != Math.Floor(value.Value) || Math.Abs(value.Value) > int.MaxValue)
        {
            bag.Error(node.Location, ProjectMessages.NotWhole(what, value.Value));
            return null;
        }

        return (int)value.Value;
    }

    /// <summary>One of a few whole numbers (60, 75, 90).</summary>
    public int? IntegerOf(SourceNode node, Subject what, IReadOnlyList<int> allowed)
    {
        var value = Integer(node, what);
        if (value is { } v && !allowed.Contains(v))
        {
            bag.Error(node.Location, ProjectMessages.NotOneOf(what, allowed, v));
            return null;
        }

        return value;
    }

    /// <summary><c>true</c> or <c>false</c>.</summary>
    public bool? Bool(SourceNode node, Subject what)
    {
        if (node is SourceScalar { IsPlain: true } scalar)
        {
            switch (scalar.Value)
            {
                case "true" or "True" or "TRUE":
                    return true;
                case "false" or "False" or "FALSE":
                    return false;
            }
        }

        if (!node.IsInvalid)
        {
            bag.Error(node.Location, ProjectMessages.NotBool(what, node));
        }

        return null;
    }

    /// <summary>Text: a string, or a plain number or word taken as its text (ids, names, sizes, systems).</summary>
    public string? Text(SourceNode node, Subject what)
    {
        if (node is SourceScalar { IsNull: false } scalar && (!scalar.IsPlain || !IsBoolText(scalar.Value)))
        {
            if (scalar.Value.Trim().Length == 0)
            {
                bag.Error(node.Location, ProjectMessages.EmptyText(what));
                return null;
            }

            return scalar.Value.Trim();
        }

        if (!node.IsInvalid)
        {
            bag.Error(node.Location, ProjectMessages.NotText(what, node));
        }

        return null;
    }

    /// <summary>One word of a fixed list, with a "did you mean" hint.</summary>
    public T? Choice<T>(SourceNode node, Subject what, string noun, IReadOnlyList<(string Word, T Value)> options)
        where T : struct
    {
        var text = Text(node, what);
        if (text is null)
        {
            return null;
        }

        foreach (var (word, value) in options)
        {
            if (string.Equals(word, text, StringComparison.Ordinal))
            {
                return value;
            }
        }

        bag.Error(node.Location, ProjectMessages.UnknownWord(noun, text, Suggestions.Hint(text, options.Select(o => o.Word).ToArray())));
        return null;
    }

    /// <summary>A system designation such as <c>208Y/120</c>.</summary>
    public ElectricalSystem? SystemOf(SourceNode node, Subject what)
    {
        var text = Text(node, what);
        if (text is null)
        {
            return null;
        }

        var system = ElectricalSystem.Find(text);
        if (system is null)
        {
            bag.Error(node.Location, ProjectMessages.UnknownWord("system", text, Suggestions.Hint(text, ElectricalSystem.Names)));
        }

        return system;
    }

    /// <summary>
    /// A one-way length in metres, in <see cref="ValueRanges.LengthM"/>: a bare number in the project's unit, or text
    /// with its unit (<c>28 m</c>, <c>92 ft</c>). A length in feet is held to the same bound in feet, so that the
    /// schema can state both.
    /// </summary>
    public double? LengthM(SourceNode node, Subject what, UnitSystem units)
    {
        double? metres;
        bool inFeet;
        if (node is SourceScalar { IsPlain: true } plain && IsNumberText(plain.Value))
        {
            inFeet = units == UnitSystem.Imperial;
            metres = Finite(plain, what) * (inFeet ? UnitFactors.MetresPerFoot : 1.0);
        }
        else if (node is SourceScalar { IsNull: false } scalar && !IsBoolText(scalar.Value))
        {
            metres = LengthText(scalar, what, out inFeet);
        }
        else
        {
            if (!node.IsInvalid)
            {
                bag.Error(node.Location, ProjectMessages.NotALength(what, node));
            }

            return null;
        }

        if (metres is { } m && (m <= 0 || m > (inFeet ? ValueRanges.MaxLengthFt * UnitFactors.MetresPerFoot : ValueRanges.MaxLengthM)))
        {
            bag.Error(node.Location, ProjectMessages.LengthOutOfRange(what, ((SourceScalar)node).Echo().Trim()));
            return null;
        }

        return metres;
    }

    /// <summary>True when plain text reads as a YAML 1.2 core-schema number (including .inf and .nan).</summary>
    public static bool IsNumberText(string text) => NumberPattern().IsMatch(text);

    /// <summary>True when plain text reads as a YAML 1.2 core-schema boolean.</summary>
    public static bool IsBoolText(string text) =>
        text is "true" or "True" or "TRUE" or "false" or "False" or "FALSE";

    private double? LengthText(SourceScalar scalar, Subject what, out bool inFeet)
    {
        inFeet = false;
        var match = LengthPattern().Match(scalar.Value);
        if (!match.Success)
        {
            bag.Error(scalar.Location, ProjectMessages.LengthUnreadable(what, scalar.Value.Trim()));
            return null;
        }

        var number = double.Parse(match.Groups["number"].Value, NumberStyles.Float, CultureInfo.InvariantCulture);
        if (!double.IsFinite(number))
        {
            bag.Error(scalar.Location, ProjectMessages.LengthNotFinite(what, scalar.Value.Trim()));
            return null;
        }

        var unit = match.Groups["unit"].Value;
        switch (unit)
        {
            case "m":
                return number;
            case "ft":
                inFeet = true;
                return number * UnitFactors.MetresPerFoot;
            default:
                bag.Error(scalar.Location, ProjectMessages.NotALengthUnit(what, scalar.Value.Trim(), unit));
                return null;
        }
    }

    private double? Finite(SourceScalar scalar, Subject what)
    {
        var text = scalar.Value;
        double value;
        if (text.StartsWith("0x", StringComparison.Ordinal))
        {
            value = long.Parse(text[2..], NumberStyles.AllowHexSpecifier, CultureInfo.InvariantCulture);
        }
        else if (text.StartsWith("0o", StringComparison.Ordinal))
        {
            value = Convert.ToInt64(text[2..], 8);
        }
        else if (text.Contains(".inf", StringComparison.OrdinalIgnoreCase) || text.Contains(".nan", StringComparison.OrdinalIgnoreCase))
        {
            value = double.NaN;
        }
        else
        {
            value = double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);
        }

        if (!double.IsFinite(value))
        {
            bag.Error(scalar.Location, ProjectMessages.NotFinite(what, text));
            return null;
        }

        return value;
    }

    // YAML 1.2 core schema: int (decimal, 0o octal, 0x hex) and float (including .inf, .nan).
    [GeneratedRegex(@"^(?:[-+]?[0-9]+|0o[0-7]{1,20}|0x[0-9a-fA-F]{1,15}|[-+]?(?:\.[0-9]+|[0-9]+(?:\.[0-9]*)?)(?:[eE][-+]?[0-9]+)?|[-+]?\.(?:inf|Inf|INF)|\.(?:nan|NaN|NAN))$")]
    private static partial Regex NumberPattern();

    [GeneratedRegex(@"^\s*(?<number>[-+]?(?:\.[0-9]+|[0-9]+(?:\.[0-9]*)?)(?:[eE][-+]?[0-9]+)?)\s*(?<unit>[A-Za-z]+)\s*$")]
    private static partial Regex LengthPattern();
}
