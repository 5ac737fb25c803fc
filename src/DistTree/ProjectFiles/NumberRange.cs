using System.Globalization;

namespace DistTree.ProjectFiles;

/// <summary>
/// The values a numeric key may take: an interval, each end closed or open, of any number or of whole numbers,
/// in the unit the key is written in. <see cref="ValueRanges"/> holds one per key.
/// </summary>
/// <param name="Min">The lower end.</param>
/// <param name="MinExclusive">True when <paramref name="Min"/> itself is not allowed.</param>
/// <param name="Max">The upper end.</param>
/// <param name="MaxExclusive">True when <paramref name="Max"/> itself is not allowed.</param>
/// <param name="Unit">The unit a message names after the ends ("°C", "%", "A"), or empty.</param>
/// <param name="Whole">True when only whole numbers are allowed.</param>
public readonly record struct NumberRange(double Min, bool MinExclusive, double Max, bool MaxExclusive, string Unit, bool Whole = false)
{
    /// <summary>Both ends allowed: [min, max].</summary>
    public static NumberRange Closed(double min, double max, string unit) => new(min, false, max, false, unit);

    /// <summary>Above <paramref name="min"/>, up to and including <paramref name="max"/>: (min, max].</summary>
    public static NumberRange AboveUpTo(double min, double max, string unit) => new(min, true, max, false, unit);

    /// <summary>Strictly between the ends: (min, max).</summary>
    public static NumberRange Open(double min, double max, string unit) => new(min, true, max, true, unit);

    /// <summary>Whole numbers from <paramref name="min"/> to <paramref name="max"/>, both included.</summary>
    public static NumberRange WholeNumbers(int min, int max) => new(min, false, max, false, "", true);

    /// <summary>True when <paramref name="value"/> lies in the range (whole, when it must be).</summary>
    public bool Contains(double value) =>
        (MinExclusive ? value > Min : value >= Min) && (MaxExclusive ? value < Max : value <= Max) && (!Whole || value == Math.Floor(value));

    /// <summary>
    /// The range as a message and the docs say it: "between -60 and 90 °C", "greater than 0 and less than 100 %",
    /// "greater than 0 and at most 6000 A", "a whole number from 1 to 40".
    /// </summary>
    public override string ToString()
    {
        var unit = Unit.Length == 0 ? "" : " " + Unit;
        if (Whole)
        {
            return $"a whole number from {Text(Min)} to {Text(Max)}{unit}";
        }

        if (!MinExclusive && !MaxExclusive)
        {
            return $"between {Text(Min)} and {Text(Max)}{unit}";
        }

        var low = MinExclusive ? $"greater than {Text(Min)}" : $"at least {Text(Min)}";
        var high = MaxExclusive ? $"less than {Text(Max)}" : $"at most {Text(Max)}";
        return $"{low} and {high}{unit}";
    }

    /// <summary>A number as the range writes it: thousands grouped, no trailing zeros, invariant culture ("100,000", "0.05").</summary>
    public static string Text(double value) => value.ToString("#,0.###############", CultureInfo.InvariantCulture);
}
