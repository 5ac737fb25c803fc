using System.Globalization;

namespace DistTree.Conductors;

/// <summary>
/// A standard conductor size: AWG, kcmil or metric. Only sizes in the standard ladders exist;
/// an invalid size cannot be made. Ordering is by cross-section within a <see cref="SizeSeries"/>.
/// </summary>
public readonly record struct ConductorSize : IComparable<ConductorSize>
{
    // AWG numbers as gauge values (1/0 = 0, 2/0 = -1, 3/0 = -2, 4/0 = -3); common practice ladder
    // (odd gauges above 3 AWG are not used for building wire).
    private static readonly int[] AwgGauges = [14, 12, 10, 8, 6, 4, 3, 2, 1, 0, -1, -2, -3];

    private static readonly int[] KcmilValues =
        [250, 300, 350, 400, 500, 600, 700, 750, 800, 900, 1000, 1250, 1500, 1750, 2000];

    // IEC 60228 nominal cross-sections, class 2, from 1.5 to 630 mm².
    private static readonly double[] MetricMm2 =
        [1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300, 400, 500, 630];

    /// <summary>Square millimetres per circular mil: (π/4)·(0.0254 mm)² (by definition).</summary>
    public const double Mm2PerCmil = 5.067074790975e-4;

    private static readonly Entry[] Table = BuildTable();

    private readonly int _index;

    private ConductorSize(int index) => _index = index;

    /// <summary>Position in <see cref="All"/>: a dense key for per-size arrays.</summary>
    internal int Index => _index;

    /// <summary>Every size DistTree knows, North American first, each series ascending.</summary>
    public static IReadOnlyList<ConductorSize> All => AllSizes;

    // Every size, in a plain array: loops over it compile no generic code of the base library (see DEVELOPERS.md, Start-up).
    private static readonly ConductorSize[] AllSizes = MakeAll();

    /// <summary>How the size is named.</summary>
    public SizeKind Kind => Table[_index].Kind;

    /// <summary>The upsizing ladder this size belongs to.</summary>
    public SizeSeries Series => Kind == SizeKind.Metric ? SizeSeries.Metric : SizeSeries.NorthAmerican;

    /// <summary>Cross-section in circular mils (AWG: ASTM B258 diameter formula; kcmil: by definition).</summary>
    public double AreaCmil => Table[_index].AreaCmil;

    /// <summary>Cross-section in mm² (metric: nominal; others: converted from circular mils).</summary>
    public double AreaMm2 => Table[_index].AreaMm2;

    /// <summary>The canonical text: <c>12 AWG</c>, <c>1/0 AWG</c>, <c>250 kcmil</c>, <c>95 mm2</c>.</summary>
    public string Text => Table[_index].Text;

    /// <summary>The next larger size in the same series, or null for the largest.</summary>
    public ConductorSize? NextLarger
    {
        get
        {
            var next = _index + 1;
            return next < Table.Length && Table[next].Series == Series ? new ConductorSize(next) : null;
        }
    }

    /// <summary>The sizes of a series, smallest first.</summary>
    public static IReadOnlyList<ConductorSize> InSeries(SizeSeries series) => SeriesArray(series);

    /// <summary>The sizes of a series, smallest first, as a new array.</summary>
    internal static ConductorSize[] SeriesArray(SizeSeries series)
    {
        var count = 0;
        foreach (var size in AllSizes)
        {
            count += size.Series == series ? 1 : 0;
        }

        var sizes = new ConductorSize[count];
        count = 0;
        foreach (var size in AllSizes)
        {
            if (size.Series == series)
            {
                sizes[count++] = size;
            }
        }

        return sizes;
    }

    private static ConductorSize[] MakeAll()
    {
        var all = new ConductorSize[Table.Length];
        for (var i = 0; i < all.Length; i++)
        {
            all[i] = new ConductorSize(i);
        }

        return all;
    }

    /// <summary>Parses the forms people type; throws <see cref="FormatException"/> with a helpful message.</summary>
    public static ConductorSize Parse(string text) =>
        TryParse(text, out var size, out var error) ? size : throw new FormatException(error);

    /// <summary>
    /// Parses <c>12 AWG</c>, <c>#12</c>, <c>12</c>, <c>1/0</c>, <c>1/0 AWG</c>, <c>250 kcmil</c>,
    /// <c>250 MCM</c>, <c>95 mm2</c>, <c>95 mm²</c> (case and spacing free).
    /// On failure <paramref name="error"/> says why and names the nearest valid sizes. A bare number is read as AWG
    /// here (the catalogue's rows); a project file's sizes are read through the loader, which refuses one.
    /// </summary>
    public static bool TryParse(string? text, out ConductorSize size, out string error)
    {
        size = default;
        var raw = (text ?? "").Trim();
        if (raw.Length == 0)
        {
            error = "a conductor size is empty; expected e.g. '12 AWG', '250 kcmil' or '95 mm2'";
            return false;
        }

        var (number, unit) = SplitNumberAndUnit(raw);
        SizeKind kind;
        switch (unit)
        {
            case "" or "awg" or "#" or "ga":
                kind = SizeKind.Awg;
                break;
            case "kcmil" or "mcm":
                kind = SizeKind.Kcmil;
                break;
            case "mm2" or "mm²" or "sqmm":
                kind = SizeKind.Metric;
                break;
            default:
                error = $"'{raw}' has an unknown size unit '{unit}'; expected AWG, kcmil (or MCM) or mm2";
                return false;
        }

        if (!TryNumber(number, kind, out var value))
        {
            error = $"'{raw}' is not a conductor size; expected e.g. '12 AWG', '1/0 AWG', '250 kcmil' or '95 mm2'";
            return false;
        }

        for (var i = 0; i < Table.Length; i++)
        {
            if (Table[i].Kind == kind && Table[i].Value == value)
            {
                size = new ConductorSize(i);
                error = "";
                return true;
            }
        }

        error = $"'{raw}' is not a standard size; nearest: {Nearest(kind, value)}";
        return false;
    }

    /// <summary>Compares by cross-section; sizes of different series compare by area as well.</summary>
    public int CompareTo(ConductorSize other) => AreaMm2.CompareTo(other.AreaMm2);

    /// <summary>True when this size is smaller in cross-section than <paramref name="right"/>'s.</summary>
    public static bool operator <(ConductorSize left, ConductorSize right) => left.CompareTo(right) < 0;

    /// <summary>True when this size is larger in cross-section than <paramref name="right"/>'s.</summary>
    public static bool operator >(ConductorSize left, ConductorSize right) => left.CompareTo(right) > 0;

    /// <summary>True when not larger.</summary>
    public static bool operator <=(ConductorSize left, ConductorSize right) => left.CompareTo(right) <= 0;

    /// <summary>True when not smaller.</summary>
    public static bool operator >=(ConductorSize left, ConductorSize right) => left.CompareTo(right) >= 0;

    /// <inheritdoc />
    public override string ToString() => Text;

    private static (string Number, string Unit) SplitNumberAndUnit(string raw)
    {
        var s = raw.ToLowerInvariant().Replace(" ", "", StringComparison.Ordinal);
        if (s.StartsWith('#'))
        {
            return (s[1..], "#");
        }

        var end = 0;
        while (end < s.Length && (char.IsAsciiDigit(s[end]) || s[end] is '.' or '/'))
        {
            end++;
        }

        return (s[..end], s[end..]);
    }

    private static bool TryNumber(string number, SizeKind kind, out double value)
    {
        value = 0;
        if (kind == SizeKind.Awg && number.EndsWith("/0", StringComparison.Ordinal))
        {
            // n/0 is gauge 1 - n: 1/0 -> 0, 4/0 -> -3.
            if (int.TryParse(number[..^2], NumberStyles.None, CultureInfo.InvariantCulture, out var aughts)
                && aughts is >= 1 and <= 9)
            {
                value = 1 - aughts;
                return true;
            }

            return false;
        }

        if (number.Contains('/', StringComparison.Ordinal))
        {
            return false;
        }

        return double.TryParse(number, NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out value);
    }

    private static string Nearest(SizeKind kind, double value)
    {
        // AWG gauge numbers run backwards (a larger number is a smaller wire); order by area instead.
        var candidates = Table.Where(e => e.Kind == kind).ToArray();
        var key = kind == SizeKind.Awg ? -value : value;
        var below = candidates.LastOrDefault(e => (kind == SizeKind.Awg ? -e.Value : e.Value) < key);
        var above = candidates.FirstOrDefault(e => (kind == SizeKind.Awg ? -e.Value : e.Value) > key);
        return (below, above) switch
        {
            (null, not null) => $"{above.Text} (the smallest)",
            (not null, null) => $"{below.Text} (the largest)",
            (not null, not null) => $"{below.Text} or {above.Text}",
            _ => "none",
        };
    }

    private static Entry[] BuildTable()
    {
        var entries = new List<Entry>();
        foreach (var gauge in AwgGauges)
        {
            // ASTM B258: d = 0.005 in × 92^((36 − n)/39); area in cmil = (d in mils)².
            var diameterMils = 5.0 * Math.Pow(92.0, (36.0 - gauge) / 39.0);
            var cmil = diameterMils * diameterMils;
            var text = gauge > 0 ? $"{gauge} AWG" : $"{1 - gauge}/0 AWG";
            entries.Add(new Entry(SizeKind.Awg, SizeSeries.NorthAmerican, gauge, text, cmil, cmil * Mm2PerCmil));
        }

        foreach (var kcmil in KcmilValues)
        {
            var cmil = kcmil * 1000.0;
            entries.Add(new Entry(SizeKind.Kcmil, SizeSeries.NorthAmerican, kcmil, $"{kcmil} kcmil", cmil, cmil * Mm2PerCmil));
        }

        foreach (var mm2 in MetricMm2)
        {
            var text = mm2.ToString(CultureInfo.InvariantCulture) + " mm2";
            entries.Add(new Entry(SizeKind.Metric, SizeSeries.Metric, mm2, text, mm2 / Mm2PerCmil, mm2));
        }

        return [.. entries];
    }

    private sealed record Entry(SizeKind Kind, SizeSeries Series, double Value, string Text, double AreaCmil, double AreaMm2);
}
