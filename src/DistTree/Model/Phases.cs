namespace DistTree.Model;

/// <summary>The lines a circuit is connected to: one, two or all three of A, B and C.</summary>
[Flags]
public enum Phases
{
    /// <summary>No line (not assigned yet).</summary>
    None = 0,

    /// <summary>Line A.</summary>
    A = 1,

    /// <summary>Line B.</summary>
    B = 2,

    /// <summary>Line C.</summary>
    C = 4,

    /// <summary>Lines A and B.</summary>
    AB = A | B,

    /// <summary>Lines B and C.</summary>
    BC = B | C,

    /// <summary>Lines C and A.</summary>
    CA = C | A,

    /// <summary>All three lines.</summary>
    ABC = A | B | C,
}

/// <summary>Where a circuit's phases come from.</summary>
public enum PhaseSource
{
    /// <summary>The project file names them (<c>phase: B</c>).</summary>
    Stated,

    /// <summary>From the circuit number under the usual panelboard numbering.</summary>
    Numbered,

    /// <summary>Assigned by DistTree to balance the panel.</summary>
    Balanced,
}

/// <summary>Phase arithmetic: names, counts, the usual panelboard numbering.</summary>
public static class PhaseRules
{
    private static readonly Phases[] Single = [Phases.A, Phases.B, Phases.C];

    /// <summary>How many lines a system has: 3 for three-phase, 2 for single-phase three-wire (and 240 V two-wire), else 1.</summary>
    public static int Lines(ElectricalSystem system) => system.Phases == 3 ? 3 : (system.LineToLineV is not null ? 2 : 1);

    /// <summary>The number of lines in a set.</summary>
    public static int Count(Phases phases) => ((phases & Phases.A) != 0 ? 1 : 0) + ((phases & Phases.B) != 0 ? 1 : 0) + ((phases & Phases.C) != 0 ? 1 : 0);

    /// <summary>The set's text: <c>A</c>, <c>AB</c>, <c>CA</c>, <c>ABC</c>.</summary>
    public static string Text(Phases phases) => phases switch
    {
        Phases.CA => "CA",
        _ => phases.ToString().Replace(", ", "", StringComparison.Ordinal),
    };

    /// <summary>Parses A, B, C, AB, BC, CA (also BA, CB, AC), ABC; null when not a phase set.</summary>
    public static Phases? Parse(string text)
    {
        var set = Phases.None;
        foreach (var c in text.Trim().ToUpperInvariant())
        {
            var one = c switch { 'A' => Phases.A, 'B' => Phases.B, 'C' => Phases.C, _ => (Phases?)null };
            if (one is null || (set & one.Value) != 0)
            {
                return null;
            }

            set |= one.Value;
        }

        return set == Phases.None ? null : set;
    }

    /// <summary>
    /// The usual panelboard numbering (common practice): odd numbers down the left, even down the right, each
    /// row on the next line in A-B-C rotation (rows 1-2 on A, 3-4 on B, 5-6 on C, 7-8 on A …); a circuit of p
    /// poles numbered n takes n's line and the next p − 1 in rotation. Null when the id is not a whole number.
    /// </summary>
    public static Phases? FromNumber(string id, int poles, int lines)
    {
        if (!int.TryParse(id, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out var n) || n < 1)
        {
            return null;
        }

        var first = (n - 1) / 2 % lines;
        var set = Phases.None;
        for (var k = 0; k < Math.Min(poles, lines); k++)
        {
            set |= Single[(first + k) % lines];
        }

        return set;
    }

    /// <summary>True when a circuit of <paramref name="poles"/> poles on a system of <paramref name="lines"/> lines may take <paramref name="phases"/>.</summary>
    public static bool Fits(Phases phases, int poles, int lines)
    {
        var allowed = lines switch { 3 => Phases.ABC, 2 => Phases.AB, _ => Phases.A };
        return (phases & ~allowed) == 0 && Count(phases) == Math.Min(poles, lines);
    }
}
