using DistTree.Conductors;

namespace DistTree.ProjectFiles.Sections;

/// <summary>
/// The project file's sizes are written with their unit: a bare number (<c>4</c>, <c>12</c>, <c>2.5</c>) is refused,
/// since <c>4</c> is 4 AWG to one designer and 4 mm2 to another. <c>#12</c> (AWG) and <c>1/0</c> (only AWG is
/// written so) say their series and are read. The conductor catalogue reads its own rows without this rule.
/// </summary>
internal static class SizeText
{
    /// <summary>Parses a size as the project file gives it; a bare number is an error naming its standard readings.</summary>
    public static bool TryParse(string text, Subject what, out ConductorSize size, out string error)
    {
        if (BareNumberError(text, what) is { } bare)
        {
            size = default;
            error = bare;
            return false;
        }

        return ConductorSize.TryParse(text, out size, out error);
    }

    /// <summary>
    /// The error for a number with no unit and no <c>#</c> (digits with at most one decimal point), naming the
    /// standard sizes it would be in AWG, kcmil and mm2; null for any other text.
    /// </summary>
    public static string? BareNumberError(string text, Subject what)
    {
        var s = text.Trim();
        var digits = 0;
        var points = 0;
        foreach (var c in s)
        {
            if (char.IsAsciiDigit(c))
            {
                digits++;
            }
            else if (c == '.')
            {
                points++;
            }
            else
            {
                return null;
            }
        }

        return digits > 0 && points <= 1 ? ProjectMessages.BareSize(what, s, Readings(s)) : null;
    }

    // The standard sizes the number is in AWG, kcmil and mm2, in that order.
    private static List<ConductorSize> Readings(string number)
    {
        var readings = new List<ConductorSize>(3);
        foreach (var unit in (ReadOnlySpan<string>)["AWG", "kcmil", "mm2"])
        {
            if (ConductorSize.TryParse($"{number} {unit}", out var size, out _))
            {
                readings.Add(size);
            }
        }

        return readings;
    }
}
