using System.Globalization;
using DistTree.Diagnostics;

namespace DistTree.Conductors;

/// <summary>One row of a terminal table: a band of device ratings, the conductors per terminal, and the largest size of each series.</summary>
/// <param name="DeviceA">The band's largest rating, amperes: it covers devices above the band before it, up to this.</param>
/// <param name="Sets">The conductors per terminal (parallel sets) the row's sizes are for.</param>
/// <param name="LargestAwg">The largest size of the AWG/kcmil series.</param>
/// <param name="LargestMetric">The largest metric size.</param>
public readonly record struct TerminalRow(double DeviceA, int Sets, ConductorSize LargestAwg, ConductorSize LargestMetric);

/// <summary>
/// The largest conductor a device's terminals accept, by the device's rating and the conductors per terminal: the
/// upsizer proposes no size beyond it (<c>Data/terminal-limits.tsv</c>, embedded, recalled common practice; a project
/// brings its own with <c>sizing: terminal_table</c>). A device takes the band of the smallest rating at or above its
/// own; in it, the row of its sets, else of the fewest sets above them, else none (not accepted). Above the last band,
/// no limit.
/// </summary>
public sealed class TerminalTable
{
    /// <summary>The column line of a terminal table file, tab-separated.</summary>
    public const string ColumnLine = "device_a\tsets\tawg\tmm2";

    private TerminalTable(string sourceName, IReadOnlyList<TerminalRow> rows)
    {
        SourceName = sourceName;
        Rows = rows;
    }

    /// <summary>The embedded table.</summary>
    public static TerminalTable Standard { get; } = LoadEmbedded();

    /// <summary>Where the table comes from: the embedded file or the file the project named.</summary>
    public string SourceName { get; }

    /// <summary>The rows, ascending by rating, then by sets.</summary>
    public IReadOnlyList<TerminalRow> Rows { get; }

    /// <summary>
    /// The largest size of <paramref name="series"/> the terminals of a <paramref name="deviceA"/> device accept
    /// with <paramref name="sets"/> conductors each: null when the table sets no limit (above its last band); false in
    /// <c>Accepted</c> when no size is accepted at that many sets.
    /// </summary>
    public (bool Accepted, ConductorSize? Largest) LargestFor(double deviceA, int sets, SizeSeries series)
    {
        var band = Rows.FirstOrDefault(r => deviceA <= r.DeviceA + 1e-9);
        if (band.Sets == 0)
        {
            return (true, null);
        }

        var row = Rows.Where(r => r.DeviceA == band.DeviceA && r.Sets >= sets).OrderBy(r => r.Sets).FirstOrDefault();
        return row.Sets == 0 ? (false, null) : (true, series == SizeSeries.Metric ? row.LargestMetric : row.LargestAwg);
    }

    /// <summary>True when a <paramref name="deviceA"/> device's terminals accept <paramref name="sets"/> conductors of <paramref name="size"/> each.</summary>
    public bool Accepts(double deviceA, ConductorSize size, int sets) =>
        LargestFor(deviceA, sets, size.Series) is var (accepted, largest) && accepted && (largest is not { } most || size <= most);

    /// <summary>The smallest band whose terminals accept <paramref name="sets"/> × <paramref name="size"/>, amperes; null where none in the table does but its top (no limit above it).</summary>
    public double? SmallestBandAccepting(ConductorSize size, int sets) =>
        Rows.Select(r => r.DeviceA).Distinct().Where(a => Accepts(a, size, sets)).Cast<double?>().FirstOrDefault();

    /// <summary>
    /// Reads a table file: <c>#</c> lines stating its source, the column line <c>device_a	sets	awg	mm2</c>, then a row a
    /// band and a number of sets (ratings ascending; within a band, sets ascending), each size in the catalogue's size text.
    /// </summary>
    /// <exception cref="DataFileException">A line is wrong: its line and column, and why.</exception>
    public static TerminalTable Load(TextReader reader, string sourceName)
    {
        ArgumentNullException.ThrowIfNull(reader);
        var rows = new List<TerminalRow>();
        var sawSource = false;
        var sawColumns = false;
        var line = 0;
        while (reader.ReadLine() is { } text)
        {
            line++;
            if (text.StartsWith('#'))
            {
                sawSource |= text[1..].Trim().Length > 0;
                continue;
            }

            if (text.Trim().Length == 0)
            {
                continue;
            }

            if (!sawColumns)
            {
                sawColumns = text.TrimEnd() == ColumnLine
                    ? true
                    : throw new DataFileException(sourceName, line, 1, "expected the column line 'device_a', 'sets', 'awg', 'mm2' (separated by tabs) after the '#' lines that state the table's source");
                if (!sawSource)
                {
                    throw new DataFileException(sourceName, 1, 1, "the table states no source: begin it with '#' lines saying where its sizes come from");
                }

                continue;
            }

            rows.Add(ReadRow(text, sourceName, line, rows.Count == 0 ? null : rows[^1]));
        }

        return !sawColumns
            ? throw new DataFileException(sourceName, Math.Max(line, 1), 1, "the column line 'device_a', 'sets', 'awg', 'mm2' (separated by tabs) is missing")
            : rows.Count == 0
                ? throw new DataFileException(sourceName, line, 1, "the table has no rows; give a row a device rating")
                : new TerminalTable(sourceName, rows);
    }

    private static TerminalRow ReadRow(string text, string sourceName, int line, TerminalRow? previous)
    {
        var cells = text.Split('\t');
        if (cells.Length != 4)
        {
            throw new DataFileException(sourceName, line, 1, $"expected 4 cells separated by tabs (device_a, sets, awg, mm2), found {cells.Length}");
        }

        int At(int i) => 1 + cells.Take(i).Sum(c => c.Length + 1);
        var rating = cells[0].Trim();
        if (!double.TryParse(rating, NumberStyles.Float, CultureInfo.InvariantCulture, out var deviceA) || !double.IsFinite(deviceA) || deviceA <= 0)
        {
            throw new DataFileException(sourceName, line, 1, $"column device_a: '{rating}' is not a positive number of amperes");
        }

        if (!int.TryParse(cells[1].Trim(), NumberStyles.None, CultureInfo.InvariantCulture, out var sets) || sets is < 1 or > 99)
        {
            throw new DataFileException(sourceName, line, At(1), $"column sets: '{cells[1].Trim()}' is not a whole number of sets from 1 to 99");
        }

        if (previous is { } before && (deviceA < before.DeviceA || (deviceA == before.DeviceA && sets <= before.Sets)))
        {
            throw new DataFileException(sourceName, line, 1, "the rows ascend by device_a, and within one device_a by sets");
        }

        return new TerminalRow(deviceA, sets, Size(2, "awg", SizeSeries.NorthAmerican), Size(3, "mm2", SizeSeries.Metric));

        ConductorSize Size(int i, string column, SizeSeries series)
        {
            var cell = cells[i].Trim();
            if (!ConductorSize.TryParse(cell, out var size, out var error))
            {
                throw new DataFileException(sourceName, line, At(i), $"column {column}: {error}");
            }

            return size.Series == series ? size : throw new DataFileException(sourceName, line, At(i), $"column {column}: {size} is not a size of this column's series");
        }
    }

    private static TerminalTable LoadEmbedded()
    {
        const string name = "DistTree.Conductors.Data.terminal-limits.tsv";
        using var stream = typeof(TerminalTable).Assembly.GetManifestResourceStream(name)
            ?? throw new InvalidOperationException($"embedded resource {name} is missing");
        using var reader = new StreamReader(stream);
        return Load(reader, "terminal-limits.tsv (embedded)");
    }
}
