using System.Globalization;
using DistTree.Conductors;

namespace DistTree.Codes.Nec;

/// <summary>
/// NEC 2020 Table 250.122, the minimum size of an equipment grounding conductor for raceway and equipment, by the
/// rating of the automatic overcurrent device ahead of it (recalled from memory, not read: verify against the edition
/// in force). A device between two rows takes the row above (the table's rows are "not exceeding"); the aluminium
/// column is for aluminium and copper-clad aluminium. Two of its aluminium sizes (1200 kcmil, at 5000 and 6000 A) are
/// not on DistTree's ladder of sizes: they are held as their area, and the next standard size at or above names them
/// (1250 kcmil). The table's note (a larger conductor where needed to clear a fault: 250.4(A)(5)) is not applied.
/// </summary>
internal static class NecGroundingTable
{
    /// <summary>The rows: the largest device rating of the row (amperes), the copper size, the aluminium size.</summary>
    internal static readonly (double DeviceA, string Copper, string Aluminum)[] Rows =
    [
        (15, "14 AWG", "12 AWG"),
        (20, "12 AWG", "10 AWG"),
        (60, "10 AWG", "8 AWG"),
        (100, "8 AWG", "6 AWG"),
        (200, "6 AWG", "4 AWG"),
        (300, "4 AWG", "2 AWG"),
        (400, "3 AWG", "1 AWG"),
        (500, "2 AWG", "1/0 AWG"),
        (600, "1 AWG", "2/0 AWG"),
        (800, "1/0 AWG", "3/0 AWG"),
        (1000, "2/0 AWG", "4/0 AWG"),
        (1200, "3/0 AWG", "250 kcmil"),
        (1600, "4/0 AWG", "350 kcmil"),
        (2000, "250 kcmil", "400 kcmil"),
        (2500, "350 kcmil", "600 kcmil"),
        (3000, "400 kcmil", "600 kcmil"),
        (4000, "500 kcmil", "750 kcmil"),
        (5000, "700 kcmil", "1200 kcmil"),
        (6000, "800 kcmil", "1200 kcmil"),
    ];

    // Per row, the copper and the aluminium areas in circular mils.
    private static readonly (double Copper, double Aluminum)[] Areas = MakeAreas();

    /// <summary>The table as the rule set's own grounding table (<see cref="CodeRules.OwnGroundingTable"/>): the same rows and areas.</summary>
    internal static GroundingTable Table { get; } = new(
        "NEC Table 250.122",
        ["NEC 2020 Table 250.122, minimum size of equipment grounding conductors (recalled from memory, not read: verify against the edition in force)"],
        MakeRows());

    // Plain loops over arrays, here and in MakeRows: the table is made on every run, and LINQ over these tuples and rows
    // (value types) is compiled at start (DEVELOPERS.md, Start-up).
    private static (double Copper, double Aluminum)[] MakeAreas()
    {
        var areas = new (double Copper, double Aluminum)[Rows.Length];
        for (var i = 0; i < Rows.Length; i++)
        {
            areas[i] = (AreaCmil(Rows[i].Copper), AreaCmil(Rows[i].Aluminum));
        }

        return areas;
    }

    private static GroundingTableRow[] MakeRows()
    {
        var rows = new GroundingTableRow[Rows.Length];
        for (var i = 0; i < Rows.Length; i++)
        {
            var (deviceA, copper, aluminum) = Rows[i];
            rows[i] = new GroundingTableRow(deviceA, new GroundingTableSize(copper, Areas[i].Copper), new GroundingTableSize(aluminum, Areas[i].Aluminum));
        }

        return rows;
    }

    /// <summary>
    /// The row of a device of <paramref name="deviceA"/> amperes: the first whose rating is not below it, or -1 above
    /// the last row (6000 A).
    /// </summary>
    public static int RowOf(double deviceA)
    {
        for (var i = 0; i < Rows.Length; i++)
        {
            if (deviceA <= Rows[i].DeviceA + 1e-9)
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>The size the table names in row <paramref name="row"/> for <paramref name="material"/>, as text.</summary>
    public static string SizeText(int row, Material material) => material == Material.Copper ? Rows[row].Copper : Rows[row].Aluminum;

    /// <summary>The area of the size the table names in row <paramref name="row"/> for <paramref name="material"/>, circular mils.</summary>
    public static double AreaCmil(int row, Material material) => material == Material.Copper ? Areas[row].Copper : Areas[row].Aluminum;

    // A size's area: a size on the ladder by its own area (ASTM B258 for AWG), a kcmil size off the ladder by definition.
    private static double AreaCmil(string text) =>
        ConductorSize.TryParse(text, out var size, out _)
            ? size.AreaCmil
            : double.Parse(text.Replace(" kcmil", "", StringComparison.Ordinal), CultureInfo.InvariantCulture) * 1000.0;
}
