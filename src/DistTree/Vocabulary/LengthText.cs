using System.Globalization;
using DistTree.Model;

namespace DistTree.Vocabulary;

/// <summary>
/// A length as a person reads it: in the project's units (feet for an imperial project, metres for a metric one),
/// with its unit written, the factor from <see cref="UnitFactors"/>. It formats itself only when shown, so a
/// sentence written later (a finding's) carries it unformatted: <c>$"over {new LengthText(lengthM, units)} of 12 AWG"</c>
/// gives "over 54.9 m of 12 AWG" or "over 180 ft of 12 AWG". The short form (metres to 0.1 m, feet to 1 ft, as the
/// reports' tables show them) is for sentences and tables; the <see cref="Precise"/> form (metres as stated, to ten
/// significant digits; feet to 0.01 ft) is for a change that must be seen, as a comparison's.
/// </summary>
/// <param name="Metres">The length, m.</param>
/// <param name="Units">The project's unit system.</param>
public readonly record struct LengthText(double Metres, UnitSystem Units) : IFormattable
{
    /// <summary>The format string of the precise form: <c>{length:P}</c>.</summary>
    public const string PreciseFormat = "P";

    /// <summary>The length in the unit system's unit: feet for imperial, metres for metric.</summary>
    public double InUnits => InUnitsOf(Metres, Units);

    /// <summary>The unit symbol of <paramref name="units"/>: <c>ft</c> or <c>m</c>.</summary>
    public static string Unit(UnitSystem units) => units switch
    {
        UnitSystem.Imperial => "ft",
        UnitSystem.Metric => "m",
    };

    /// <summary><paramref name="metres"/> in the unit of <paramref name="units"/> (feet: metres / 0.3048).</summary>
    public static double InUnitsOf(double metres, UnitSystem units) => units switch
    {
        UnitSystem.Imperial => metres / UnitFactors.MetresPerFoot,
        UnitSystem.Metric => metres,
    };

    /// <summary>The short form of <paramref name="metres"/>: <c>54.9 m</c>, <c>180 ft</c>.</summary>
    public static string Of(double metres, UnitSystem units) => new LengthText(metres, units).ToString();

    /// <summary>The precise form of <paramref name="metres"/>: <c>54.864 m</c>, <c>180 ft</c>, <c>45.93 ft</c>.</summary>
    public static string Precise(double metres, UnitSystem units) => new LengthText(metres, units).ToString(PreciseFormat, CultureInfo.InvariantCulture);

    /// <summary>The short form, in the invariant culture.</summary>
    public override string ToString() => ToString(null, CultureInfo.InvariantCulture);

    /// <summary>The short form, or with <see cref="PreciseFormat"/> the precise form; always in the invariant culture.</summary>
    /// <param name="format">Null or empty for the short form, <c>P</c> for the precise form.</param>
    /// <param name="formatProvider">Not used: lengths are written in the invariant culture.</param>
    public string ToString(string? format, IFormatProvider? formatProvider)
    {
        var precise = format == PreciseFormat;
        var number = Units switch
        {
            UnitSystem.Imperial => InUnits.ToString(precise ? "0.##" : "0", CultureInfo.InvariantCulture),
            UnitSystem.Metric => Metres.ToString(precise ? "G10" : "0.0", CultureInfo.InvariantCulture),
        };
        return number + " " + Unit(Units);
    }
}
