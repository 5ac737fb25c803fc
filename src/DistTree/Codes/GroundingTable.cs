using System.Globalization;
using DistTree.Conductors;
using DistTree.Diagnostics;

namespace DistTree.Codes;

/// <summary>A size a grounding table names: its text as the table gives it, and its area in circular mils.</summary>
/// <param name="Text">The size as the table names it (<c>6 AWG</c>, <c>1200 kcmil</c>).</param>
/// <param name="AreaCmil">Its area, circular mils.</param>
public readonly record struct GroundingTableSize(string Text, double AreaCmil)
{
    /// <summary>A size on DistTree's ladder, by its own area.</summary>
    public static GroundingTableSize Of(ConductorSize size) => new(size.Text, size.AreaCmil);
}

/// <summary>One row of a grounding table: the largest device rating it covers, and the copper and aluminium sizes (null where it gives none).</summary>
/// <param name="DeviceA">The row's device rating, amperes: it covers devices above the row before it, up to this.</param>
/// <param name="Copper">The copper size, or null.</param>
/// <param name="Aluminum">The aluminium size, or null.</param>
public readonly record struct GroundingTableRow(double DeviceA, GroundingTableSize? Copper, GroundingTableSize? Aluminum);

/// <summary>
/// A table of the smallest equipment grounding (bonding) conductor by the rating of the overcurrent device ahead of it:
/// a rule set's own (<see cref="CodeRules.OwnGroundingTable"/>) or one a project brings (<c>rules: grounding_table:</c>),
/// which replaces it. Its rows ascend by rating; a device takes the row of the smallest rating at or above it (each row
/// reads "not exceeding", as NEC Table 250.122 is read). Above the last row, or where the row gives no size for the
/// conductors' metal, the table gives none.
/// </summary>
public sealed class GroundingTable
{
    /// <summary>The column line of a grounding table file, tab-separated.</summary>
    public const string ColumnLine = "device_a\tcu\tal";

    // The rows in an array, which SizeFor walks without compiling a generic enumerator at start (DEVELOPERS.md, Start-up).
    private readonly GroundingTableRow[] _rows;

    /// <summary>A table named <paramref name="sourceName"/> with its <paramref name="header"/> lines and its <paramref name="rows"/> (ascending by rating).</summary>
    public GroundingTable(string sourceName, IReadOnlyList<string> header, IReadOnlyList<GroundingTableRow> rows)
    {
        SourceName = sourceName;
        Header = header;
        _rows = rows as GroundingTableRow[] ?? [.. rows];
    }

    /// <summary>Where the table comes from: the rule set's table or the file the project named.</summary>
    public string SourceName { get; }

    /// <summary>The file's header comment (its source), without the leading '#'; for a rule set's own, a line naming it.</summary>
    public IReadOnlyList<string> Header { get; }

    /// <summary>The rows, ascending by <see cref="GroundingTableRow.DeviceA"/>.</summary>
    public IReadOnlyList<GroundingTableRow> Rows => _rows;

    /// <summary>
    /// The size the table names for a device of <paramref name="deviceA"/> amperes ahead of <paramref name="material"/>
    /// conductors: the row of the smallest rating at or above it; null above the last row or where that row gives none.
    /// </summary>
    public GroundingTableSize? SizeFor(double deviceA, Material material)
    {
        foreach (var row in _rows)
        {
            if (deviceA <= row.DeviceA + 1e-9)
            {
                return material == Material.Copper ? row.Copper : row.Aluminum;
            }
        }

        return null;
    }

    /// <summary>
    /// Reads a table file: <c>#</c> lines stating its source, the column line <c>device_a	cu	al</c>, then a row a device
    /// rating (amperes, ascending), each size in the catalogue's size text or blank where the table gives none.
    /// </summary>
    /// <exception cref="DataFileException">A line is wrong: its line and column, and why.</exception>
    public static GroundingTable Load(TextReader reader, string sourceName)
    {
        ArgumentNullException.ThrowIfNull(reader);
        var header = new List<string>();
        var rows = new List<GroundingTableRow>();
        var sawColumns = false;
        var line = 0;
        while (reader.ReadLine() is { } text)
        {
            line++;
            if (text.StartsWith('#'))
            {
                var comment = text[1..];
                header.Add(comment.StartsWith(' ') ? comment[1..] : comment);
                continue;
            }

            if (text.Trim().Length == 0)
            {
                continue;
            }

            if (!sawColumns)
            {
                if (text.TrimEnd() != ColumnLine)
                {
                    throw new DataFileException(sourceName, line, 1, "expected the column line 'device_a', 'cu', 'al' (separated by tabs) after the '#' lines that state the table's source");
                }

                if (!header.Any(h => h.Trim().Length > 0))
                {
                    throw new DataFileException(sourceName, 1, 1, "the table states no source: begin it with '#' lines saying where its sizes come from");
                }

                sawColumns = true;
                continue;
            }

            rows.Add(ReadRow(text, sourceName, line, rows.Count == 0 ? null : rows[^1].DeviceA));
        }

        return !sawColumns
            ? throw new DataFileException(sourceName, Math.Max(line, 1), 1, "the column line 'device_a', 'cu', 'al' (separated by tabs) is missing")
            : rows.Count == 0
                ? throw new DataFileException(sourceName, line, 1, "the table has no rows; give a row a device rating")
                : new GroundingTable(sourceName, header, rows);
    }

    // One row: the rating above the row before it's, each size blank or one the catalogue names.
    private static GroundingTableRow ReadRow(string text, string sourceName, int line, double? previousA)
    {
        var cells = text.Split('\t');
        if (cells.Length is < 2 or > 3)
        {
            throw new DataFileException(sourceName, line, 1, $"expected 3 cells separated by tabs (device_a, cu, al), found {cells.Length}");
        }

        var rating = cells[0].Trim();
        if (!double.TryParse(rating, NumberStyles.Float, CultureInfo.InvariantCulture, out var deviceA) || !double.IsFinite(deviceA) || deviceA <= 0)
        {
            throw new DataFileException(sourceName, line, 1, $"column device_a: '{rating}' is not a positive number of amperes");
        }

        if (previousA is { } before && deviceA <= before)
        {
            throw new DataFileException(sourceName, line, 1, string.Create(CultureInfo.InvariantCulture, $"column device_a: {deviceA:0.###} A is not above the row before it ({before:0.###} A); the rows ascend by rating"));
        }

        return new GroundingTableRow(deviceA, Size(cells, 1, "cu"), cells.Length > 2 ? Size(cells, 2, "al") : null);

        GroundingTableSize? Size(string[] all, int i, string column)
        {
            var cell = all[i].Trim();
            if (cell.Length == 0)
            {
                return null;
            }

            var at = 1 + all.Take(i).Sum(c => c.Length + 1);
            return ConductorSize.TryParse(cell, out var size, out var error)
                ? GroundingTableSize.Of(size)
                : throw new DataFileException(sourceName, line, at, $"column {column}: {error}");
        }
    }
}
