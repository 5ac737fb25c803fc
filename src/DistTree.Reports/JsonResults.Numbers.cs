using System.Text.Json;

namespace DistTree.Reports;

/// <summary>The results' numbers and nullable values, rounded as written (see <see cref="TryFormatRounded"/>).</summary>
public static partial class JsonResults
{
    /// <summary>Writes a rounded number, or null.</summary>
    public static void Number(Utf8JsonWriter w, string name, double? value, int decimals)
    {
        ArgumentNullException.ThrowIfNull(w);
        w.WritePropertyName(name);
        NumberValue(w, value, decimals);
    }

    // As Number, with the property name as UTF-8 bytes (the results' own names: no transcoding per value).
    private static void Number(Utf8JsonWriter w, ReadOnlySpan<byte> name, double? value, int decimals)
    {
        w.WritePropertyName(name);
        NumberValue(w, value, decimals);
    }

    // A property's rounded number, or null, after its name.
    private static void NumberValue(Utf8JsonWriter w, double? value, int decimals)
    {
        if (value is not { } v || !double.IsFinite(v))
        {
            w.WriteNullValue();
            return;
        }

        Span<byte> text = stackalloc byte[24];
        if (TryFormatRounded(v, decimals, text, out var length))
        {
            w.WriteRawValue(text[..length], skipInputValidation: true);
        }
        else
        {
            w.WriteNumberValue(Math.Round(v, decimals, MidpointRounding.AwayFromZero) + 0.0);
        }
    }

    // The text Utf8JsonWriter writes for Math.Round(v, decimals, AwayFromZero), made from the scaled integer k of
    // that rounding: the rounded double is the double nearest k/10^decimals, and while |k| < 10^15 that decimal
    // has at most 15 significant digits, so it is the shortest text that reads back as the double (no two
    // decimals of 15 digits share a double). Outside 10^-4 ≤ |v| < 10^15 the writer may choose exponent
    // notation: false, and the caller writes the number the general way.
    internal static bool TryFormatRounded(double v, int decimals, Span<byte> text, out int length)
    {
        length = 0;
        if (decimals < 0 || decimals >= Pow10.Length)
        {
            return false;
        }

        var power = Pow10[decimals];
        var scaled = v * power;
        if (!(Math.Abs(scaled) < 1e15))
        {
            return false;
        }

        // Math.Round(double, int, MidpointRounding.AwayFromZero): scale, round half away from zero, unscale.
        var k = (long)Math.Round(scaled, MidpointRounding.AwayFromZero);
        if (k != 0 && Math.Abs(k / power) < 1e-4)
        {
            return false;
        }

        if (k < 0)
        {
            text[length++] = (byte)'-';
            k = -k;
        }

        var whole = k / (long)power;
        var fraction = k % (long)power;
        whole.TryFormat(text[length..], out var written, default, System.Globalization.CultureInfo.InvariantCulture);
        length += written;
        if (fraction != 0)
        {
            var digits = decimals;
            while (fraction % 10 == 0)
            {
                fraction /= 10;
                digits--;
            }

            text[length++] = (byte)'.';
            for (var i = digits - 1; i >= 0; i--)
            {
                text[length + i] = (byte)('0' + (fraction % 10));
                fraction /= 10;
            }

            length += digits;
        }

        return true;
    }

    // An array of rounded numbers; a non-finite one is written as null.
    private static void Numbers(Utf8JsonWriter w, ReadOnlySpan<byte> name, IReadOnlyList<double> values, int decimals)
    {
        w.WriteStartArray(name);
        for (var i = 0; i < values.Count; i++)
        {
            var v = values[i];
            if (double.IsFinite(v))
            {
                // (Raw values in an array are written without the indentation, so arrays take the general way.)
                w.WriteNumberValue(Math.Round(v, decimals, MidpointRounding.AwayFromZero) + 0.0);
            }
            else
            {
                w.WriteNullValue();
            }
        }

        w.WriteEndArray();
    }

    private static void NullableString(Utf8JsonWriter w, ReadOnlySpan<byte> name, string? value)
    {
        if (value is null)
        {
            w.WriteNull(name);
        }
        else
        {
            w.WriteString(name, value);
        }
    }

    private static void NullableInteger(Utf8JsonWriter w, ReadOnlySpan<byte> name, int? value)
    {
        if (value is { } v)
        {
            w.WriteNumber(name, v);
        }
        else
        {
            w.WriteNull(name);
        }
    }
}
