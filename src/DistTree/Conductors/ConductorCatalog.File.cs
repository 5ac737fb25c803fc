using System.Globalization;
using DistTree.Diagnostics;

namespace DistTree.Conductors;

/// <summary>The catalogue's data file: its column line, and the reading of each row (see conductors.tsv's header).</summary>
public sealed partial class ConductorCatalog
{
    internal sealed record RawRow(
        bool PerKft, double? XPvc, double? XSteel, double? RpvcCu, double? RsteelCu, double? RpvcAl, double? RsteelAl,
        double? RalCu, double? RalAl, double? R20Cu, double? R20Al, double? Cu60, double? Cu75, double? Cu90, double? Al60, double? Al75, double? Al90,
        double InsulationMm, double? OcpdCu, double? OcpdAl);

    private static class CatalogFile
    {
        private static readonly string[] Columns =
        [
            "size", "per", "x_pvc", "x_steel", "rpvc_cu", "rsteel_cu", "rpvc_al", "rsteel_al", "ral_cu", "ral_al", "r20_cu", "r20_al",
            "cu60", "cu75", "cu90", "al60", "al75", "al90", "ins_mm", "ocpd_cu", "ocpd_al",
        ];

        // The earlier layout, before the aluminium-conduit columns: refused with a hint, not read with a guess.
        private static readonly string[] EarlierColumns = [.. Columns.Where(c => c is not ("ral_cu" or "ral_al"))];

        public static ConductorCatalog Read(TextReader reader, string sourceName, Func<IReadOnlyList<string>, RawRow?[], ConductorCatalog> make)
        {
            var header = new List<string>();
            var rows = new RawRow?[ConductorSize.All.Count];
            var sawColumns = false;
            var lineNumber = 0;
            while (reader.ReadLine() is { } line)
            {
                lineNumber++;
                if (line.StartsWith('#'))
                {
                    header.Add(line.Length > 1 ? line[2..] : "");
                    continue;
                }

                if (line.Length == 0)
                {
                    continue;
                }

                var cells = line.Split('\t');
                if (!sawColumns)
                {
                    if (!cells.SequenceEqual(Columns))
                    {
                        var hint = cells.SequenceEqual(EarlierColumns)
                            ? "; this is the earlier layout: add the aluminium-conduit columns ral_cu and ral_al after rsteel_al (see the embedded catalogue's header)"
                            : "";
                        throw Bad(sourceName, lineNumber, 1, $"expected the columns {string.Join(", ", Columns)}{hint}");
                    }

                    sawColumns = true;
                    continue;
                }

                if (cells.Length != Columns.Length)
                {
                    throw Bad(sourceName, lineNumber, 1, $"expected {Columns.Length} cells, found {cells.Length}");
                }

                if (!ConductorSize.TryParse(cells[0], out var size, out var error))
                {
                    throw Bad(sourceName, lineNumber, 1, error);
                }

                rows[size.Index] = ParseRow(cells, sourceName, lineNumber);
            }

            return make(header, rows);
        }

        private static RawRow ParseRow(string[] c, string sourceName, int lineNumber)
        {
            double? N(int i)
            {
                if (c[i].Length == 0)
                {
                    return null;
                }

                return double.TryParse(c[i], NumberStyles.Float, CultureInfo.InvariantCulture, out var v) && double.IsFinite(v) && v > 0
                    ? v
                    : throw Bad(sourceName, lineNumber, ColumnOf(c, i), $"column {Columns[i]}: '{c[i]}' is not a positive number");
            }

            var perKft = c[1] switch
            {
                "kft" => true,
                "km" => false,
                _ => throw Bad(sourceName, lineNumber, ColumnOf(c, 1), $"column per: expected kft or km, found '{c[1]}'"),
            };
            return new RawRow(
                perKft, N(2), N(3), N(4), N(5), N(6), N(7), N(8), N(9), N(10), N(11), N(12), N(13), N(14), N(15), N(16), N(17),
                N(18) ?? throw Bad(sourceName, lineNumber, ColumnOf(c, 18), "column ins_mm is required"), N(19), N(20));
        }

        // A bad line: its message names the file and line as before ('name:line: reason'); the exception holds the column too.
        private static DataFileException Bad(string sourceName, int line, int column, string reason) =>
            new(sourceName, line, column, reason, $"{sourceName}:{line}: {reason}");

        // The column (from 1, in characters) where cell i of a tab-separated line starts.
        private static int ColumnOf(string[] cells, int i) => 1 + cells.Take(i).Sum(cell => cell.Length + 1);
    }
}
