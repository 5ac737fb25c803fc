using DistTree.Vocabulary;

namespace DistTree.Conductors;

/// <summary>
/// The conductor data DistTree computes with: resistance at temperature (physics, and IEC 60228 maxima for
/// metric sizes), AC resistance with skin, proximity and raceway effects, reactance, and ampacity with its
/// corrections. The numbers that are data come from a tab-separated file whose header names every column's
/// source; <see cref="Standard"/> is the one embedded in the library.
/// </summary>
public sealed partial class ConductorCatalog
{
    // A power of two: the AC resistance cache's length (see AcResistanceOhmPerKm).
    private const int AcResistanceCacheLength = 1 << 14;

    private readonly CatalogRow?[] _rows;

    // AC resistances already worked out, one per slot by a hash of the inputs (see AcResistanceOhmPerKm).
    private readonly AcResistance?[] _acResistances = new AcResistance?[AcResistanceCacheLength];

    private ConductorCatalog(string sourceName, IReadOnlyList<string> header, CatalogRow?[] rows)
    {
        SourceName = sourceName;
        Header = header;
        _rows = rows;
    }

    /// <summary>The catalogue embedded in the library (<c>Conductors/Data/conductors.tsv</c>).</summary>
    public static ConductorCatalog Standard { get; } = LoadEmbedded();

    /// <summary>Where the data came from: the embedded resource's name or the file the project named.</summary>
    public string SourceName { get; }

    /// <summary>The data file's header comment: what each column is and where it comes from.</summary>
    public IReadOnlyList<string> Header { get; }

    /// <summary>The sizes the catalogue has data for, in <see cref="ConductorSize.All"/> order.</summary>
    public IEnumerable<ConductorSize> Sizes => ConductorSize.All.Where(s => _rows[s.Index] is not null);

    /// <summary>Reads a catalogue in the embedded file's layout; throws <see cref="Diagnostics.DataFileException"/> (a <see cref="FormatException"/>) naming the line and column of a bad cell.</summary>
    public static ConductorCatalog Load(TextReader reader, string sourceName) =>
        CatalogFile.Read(reader, sourceName, (header, rows) => new ConductorCatalog(sourceName, header, Interpolate(rows)));

    /// <summary>True when the catalogue has data for <paramref name="size"/>.</summary>
    public bool Contains(ConductorSize size) => _rows[size.Index] is not null;

    /// <summary>
    /// DC resistance at 20 °C, ohm/km: the IEC 60228 maximum for metric sizes that have one, else
    /// ρ20/A × stranding factor.
    /// </summary>
    public double DcResistance20OhmPerKm(ConductorSize size, Material material)
    {
        var row = Row(size);
        return material == Material.Copper ? row.Rdc20CuOhmPerKm : row.Rdc20AlOhmPerKm;
    }

    /// <summary>Where the 20 °C resistance of <paramref name="size"/> comes from, in words.</summary>
    public string DcResistanceBasis(ConductorSize size, Material material)
    {
        var row = Row(size);
        var tabulated = material == Material.Copper ? row.R20CuTabulated : row.R20AlTabulated;
        return tabulated ? "IEC 60228 maximum" : "area × resistivity × stranding";
    }

    /// <summary>DC resistance at <paramref name="temperatureC"/>, ohm/km.</summary>
    public double DcResistanceOhmPerKm(ConductorSize size, Material material, double temperatureC) =>
        ConductorPhysics.AtTemperature(DcResistance20OhmPerKm(size, material), material, temperatureC);

    /// <summary>
    /// AC resistance at <paramref name="temperatureC"/>, ohm/km per conductor: DC resistance × (1 + ys + yp)
    /// (IEC 60287-1-1, conductors touching in a triangle) × the raceway's extra loss (NEC Chapter 9
    /// Table 9's steel-to-PVC or aluminium-conduit-to-PVC ratio; PVC takes none).
    /// </summary>
    public double AcResistanceOhmPerKm(ConductorSize size, Material material, Raceway raceway, double temperatureC, double frequencyHz)
    {
        // The same inputs give the same resistance: a large project repeats a few sizes at a few loads (about
        // 5,000 different inputs among 100,000 runs of a generated campus), so a resistance is worked out once
        // and then looked up. An entry is never changed, only replaced whole, so that solves on other threads
        // may share the catalogue; the inputs are compared bit for bit.
        var temperatureBits = BitConverter.DoubleToInt64Bits(temperatureC);
        var frequencyBits = BitConverter.DoubleToInt64Bits(frequencyHz);
        var slot = HashCode.Combine(size.Index, material, raceway, temperatureBits, frequencyBits) & (AcResistanceCacheLength - 1);
        if (_acResistances[slot] is { } known && known.SizeIndex == size.Index && known.Material == material && known.Raceway == raceway
            && known.TemperatureBits == temperatureBits && known.FrequencyBits == frequencyBits)
        {
            return known.OhmPerKm;
        }

        var ohmPerKm = ComputeAcResistanceOhmPerKm(size, material, raceway, temperatureC, frequencyHz);
        _acResistances[slot] = new AcResistance(size.Index, material, raceway, temperatureBits, frequencyBits, ohmPerKm);
        return ohmPerKm;
    }

    private double ComputeAcResistanceOhmPerKm(ConductorSize size, Material material, Raceway raceway, double temperatureC, double frequencyHz)
    {
        var row = Row(size);
        var rdc = ConductorPhysics.AtTemperature(material == Material.Copper ? row.Rdc20CuOhmPerKm : row.Rdc20AlOhmPerKm, material, temperatureC);
        var dc = row.StrandedDiameterMm;
        var acOverDc = ConductorPhysics.AcOverDc(rdc, frequencyHz, dc, row.AxialSpacingMm);
        var copper = material == Material.Copper;
        var racewayFactor = raceway switch
        {
            Raceway.Pvc => 1.0,
            Raceway.Steel => copper ? row.SteelRatioCu : row.SteelRatioAl,
            Raceway.Aluminum => copper ? row.AluminumRatioCu : row.AluminumRatioAl,
        };
        return rdc * acOverDc * racewayFactor;
    }

    /// <summary>Inductive reactance per conductor, ohm/km, scaled from the data's frequency to <paramref name="frequencyHz"/>.</summary>
    public double ReactanceOhmPerKm(ConductorSize size, Raceway raceway, double frequencyHz)
    {
        var row = Row(size);
        var x = raceway == Raceway.Steel ? row.XSteelOhmPerKm : row.XPvcOhmPerKm;
        return x * frequencyHz / (row.PerKft ? 60.0 : 50.0);
    }

    /// <summary>
    /// The tabulated ampacity in amperes at 30 °C for the 60, 75 or 90 °C column, or null where the table
    /// has none (14 AWG aluminium, metric 60 °C, metric 400 mm² and up).
    /// </summary>
    public double? TableAmpacityA(ConductorSize size, Material material, int columnC)
    {
        var row = Row(size);
        var column = columnC switch
        {
            60 => 0,
            75 => 1,
            90 => 2,
            _ => throw new ArgumentOutOfRangeException(nameof(columnC), columnC, "60, 75 or 90"),
        };
        return material == Material.Copper ? row.AmpacityCu[column] : row.AmpacityAl[column];
    }

    /// <summary>
    /// The temperature that a column's conductors are rated at, °C: the column itself, except the metric
    /// 75 column, which holds IEC PVC figures rated 70 °C.
    /// </summary>
    public static double RatedTemperatureC(ConductorSize size, int columnC) =>
        size.Kind == SizeKind.Metric && columnC == 75 ? 70.0 : columnC;

    /// <summary>
    /// The allowable ampacity, amperes, from the conductor's own (<paramref name="thermal"/>, corrected by the rule set:
    /// <c>CodeRules.ThermalAmpacityA</c>): not above the column of the terminal rating (the lower of terminal and
    /// insulation ratings; NEC 110.14(C), read). Metric sizes have no terminal column: their thermal ampacity is the
    /// allowable one. Null where the table has no figure.
    /// </summary>
    public double? AllowableAmpacityA(ConductorSize size, Material material, int insulationC, int terminalC, double? thermal)
    {
        if (thermal is null || size.Kind == SizeKind.Metric)
        {
            return thermal;
        }

        var terminal = TableAmpacityA(size, material, Math.Min(terminalC, insulationC));
        return terminal is null ? thermal : Math.Min(thermal.Value, terminal.Value);
    }

    /// <summary>
    /// The largest overcurrent device for one small conductor, amperes, from the catalogue's <c>ocpd_cu</c> and
    /// <c>ocpd_al</c> columns, or null where they have none. The rule set applies it (<c>Codes/CodeRules</c>).
    /// </summary>
    public double? SmallConductorMaxOcpdA(ConductorSize size, Material material)
    {
        var row = Row(size);
        return material == Material.Copper ? row.MaxOcpdCuA : row.MaxOcpdAlA;
    }

    internal static double ToOhmPerKm(double value, bool perKft) =>
        perKft ? value / (UnitFactors.FeetPerKft * UnitFactors.MetresPerFoot) * 1000.0 : value;

    private CatalogRow Row(ConductorSize size) =>
        _rows[size.Index] ?? throw new KeyNotFoundException($"the conductor catalogue '{SourceName}' has no data for {size}");

    private static ConductorCatalog LoadEmbedded()
    {
        const string name = "DistTree.Conductors.Data.conductors.tsv";
        using var stream = typeof(ConductorCatalog).Assembly.GetManifestResourceStream(name)
            ?? throw new InvalidOperationException($"embedded resource {name} is missing");
        using var reader = new StreamReader(stream);
        return Load(reader, "conductors.tsv (embedded)");
    }

    // Fills blank reactance cells by log-area interpolation between neighbours of the same series (held
    // beyond the last), and turns the Table 9 resistance pairs into steel and aluminium-conduit ratios (1 below
    // the first pair, interpolated between pairs, held above the last; metric sizes interpolate at equal area).
    private static CatalogRow?[] Interpolate(RawRow?[] raw)
    {
        var rows = new CatalogRow?[raw.Length];
        var northAmerican = Present(SizeSeries.NorthAmerican, raw);
        var cuPairs = Points(northAmerican, raw, r => r.RsteelCu / r.RpvcCu);
        var alPairs = Points(northAmerican, raw, r => r.RsteelAl / r.RpvcAl);
        var cuInAluminum = Points(northAmerican, raw, r => r.RalCu / r.RpvcCu);
        var alInAluminum = Points(northAmerican, raw, r => r.RalAl / r.RpvcAl);
        foreach (var series in new[] { SizeSeries.NorthAmerican, SizeSeries.Metric })
        {
            var present = Present(series, raw);
            var xPvc = Points(present, raw, r => r.XPvc);
            var xSteel = Points(present, raw, r => r.XSteel);
            foreach (var size in present)
            {
                var r = raw[size.Index]!;
                var dc = ConductorPhysics.StrandedDiameterMm(size.AreaMm2);
                rows[size.Index] = new CatalogRow(
                    r.PerKft,
                    ToOhmPerKm(r.XPvc ?? LogInterpolate(xPvc, size.AreaMm2, belowFirst: null), r.PerKft),
                    ToOhmPerKm(r.XSteel ?? LogInterpolate(xSteel, size.AreaMm2, belowFirst: null), r.PerKft),
                    LogInterpolate(cuPairs, size.AreaMm2, belowFirst: 1.0),
                    LogInterpolate(alPairs, size.AreaMm2, belowFirst: 1.0),
                    LogInterpolate(cuInAluminum, size.AreaMm2, belowFirst: 1.0),
                    LogInterpolate(alInAluminum, size.AreaMm2, belowFirst: 1.0),
                    r.R20Cu ?? ConductorPhysics.DcResistance20OhmPerKm(size.AreaMm2, Material.Copper),
                    r.R20Al ?? ConductorPhysics.DcResistance20OhmPerKm(size.AreaMm2, Material.Aluminum),
                    r.R20Cu is not null,
                    r.R20Al is not null,
                    [r.Cu60, r.Cu75, r.Cu90],
                    [r.Al60, r.Al75, r.Al90],
                    dc,
                    dc + (2.0 * r.InsulationMm),
                    r.OcpdCu,
                    r.OcpdAl);
            }
        }

        return rows;
    }

    // The sizes of a series the catalogue has a row for, smallest first. Plain loops over arrays, here and in Points:
    // the catalogue is read on every run, and LINQ over these value types is compiled at start (DEVELOPERS.md, Start-up).
    private static ConductorSize[] Present(SizeSeries series, RawRow?[] raw)
    {
        var sizes = ConductorSize.SeriesArray(series);
        var count = 0;
        foreach (var size in sizes)
        {
            count += raw[size.Index] is null ? 0 : 1;
        }

        var present = new ConductorSize[count];
        count = 0;
        foreach (var size in sizes)
        {
            if (raw[size.Index] is not null)
            {
                present[count++] = size;
            }
        }

        return present;
    }

    // Per size with a value in the column, its area and the value.
    private static (double AreaMm2, double Value)[] Points(ConductorSize[] sizes, RawRow?[] raw, Func<RawRow, double?> value)
    {
        var values = new double?[sizes.Length];
        var count = 0;
        for (var i = 0; i < sizes.Length; i++)
        {
            values[i] = value(raw[sizes[i].Index]!);
            count += values[i] is null ? 0 : 1;
        }

        var points = new (double AreaMm2, double Value)[count];
        count = 0;
        for (var i = 0; i < sizes.Length; i++)
        {
            if (values[i] is { } v)
            {
                points[count++] = (sizes[i].AreaMm2, v);
            }
        }

        return points;
    }

    // Below the first point: belowFirst, or the first point's value when null. Above the last: the last's.
    private static double LogInterpolate((double AreaMm2, double Value)[] points, double areaMm2, double? belowFirst)
    {
        if (points.Length == 0)
        {
            return belowFirst ?? throw new FormatException("a reactance column has no value at all");
        }

        if (areaMm2 < points[0].AreaMm2 * (1 - 1e-9))
        {
            return belowFirst ?? points[0].Value;
        }

        for (var i = 1; i < points.Length; i++)
        {
            if (areaMm2 <= points[i].AreaMm2)
            {
                var (a0, v0) = points[i - 1];
                var (a1, v1) = points[i];
                var t = Math.Log(areaMm2 / a0) / Math.Log(a1 / a0);
                return v0 + (t * (v1 - v0));
            }
        }

        return points[^1].Value;
    }

    // A worked-out AC resistance and its inputs (doubles as their bits).
    private sealed record AcResistance(int SizeIndex, Material Material, Raceway Raceway, long TemperatureBits, long FrequencyBits, double OhmPerKm);

    // Per size, the figures that do not depend on a run: reactances in ohm/km at the data's frequency, 20 °C
    // resistances (tabulated or from the area), the stranded diameter and the axial spacing of touching conductors.
    private sealed record CatalogRow(
        bool PerKft, double XPvcOhmPerKm, double XSteelOhmPerKm, double SteelRatioCu, double SteelRatioAl, double AluminumRatioCu, double AluminumRatioAl,
        double Rdc20CuOhmPerKm, double Rdc20AlOhmPerKm,
        bool R20CuTabulated, bool R20AlTabulated, double?[] AmpacityCu, double?[] AmpacityAl, double StrandedDiameterMm, double AxialSpacingMm,
        double? MaxOcpdCuA, double? MaxOcpdAlA);
}
