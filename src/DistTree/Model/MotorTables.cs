namespace DistTree.Model;

/// <summary>
/// Motor full-load currents in amperes. Source: NEC Table 430.248 (single-phase AC motors, to 10 hp) and Table
/// 430.250 (three-phase induction motors, to 500 hp), recalled from memory, not read; verify against the edition in
/// force. Where the circuit's voltage has no column (e.g. 277 V, 400 V, 120 V single-phase uses the 115 V column),
/// the nearest column's current is scaled by the ratio of voltages (constant power; common practice). Table 430.250's
/// 200 V and 208 V columns stop at 200 hp: where the nearest column lists no current for the rating, none is given
/// (no column is invented; the motor's nameplate current is then asked for as <c>fla</c>).
/// </summary>
public static class MotorTables
{
    // A cell the table leaves empty.
    private const double NaN = double.NaN;

    private static readonly double[] SinglePhaseHp = [1.0 / 6, 0.25, 1.0 / 3, 0.5, 0.75, 1, 1.5, 2, 3, 5, 7.5, 10];
    private static readonly double[] SinglePhaseVolts = [115, 200, 208, 230];

    // Rows: horsepower above; columns: 115, 200, 208, 230 V.
    private static readonly double[][] SinglePhaseAmps =
    [
        [4.4, 2.5, 2.4, 2.2], [5.8, 3.3, 3.2, 2.9], [7.2, 4.1, 4.0, 3.6], [9.8, 5.6, 5.4, 4.9],
        [13.8, 7.9, 7.6, 6.9], [16, 9.2, 8.8, 8.0], [20, 11.5, 11, 10], [24, 13.8, 13.2, 12],
        [34, 19.6, 18.7, 17], [56, 32.2, 30.8, 28], [80, 46, 44, 40], [100, 57.5, 55, 50],
    ];

    private static readonly double[] ThreePhaseHp = [0.5, 0.75, 1, 1.5, 2, 3, 5, 7.5, 10, 15, 20, 25, 30, 40, 50, 60, 75, 100, 125, 150, 200, 250, 300, 350, 400, 450, 500];
    private static readonly double[] ThreePhaseVolts = [200, 208, 230, 460, 575];

    // Rows: horsepower above; columns: 200, 208, 230, 460, 575 V. Above 200 hp the table lists 230, 460 and 575 V
    // only (NaN: no current listed).
    private static readonly double[][] ThreePhaseAmps =
    [
        [2.5, 2.4, 2.2, 1.1, 0.9], [3.7, 3.5, 3.2, 1.6, 1.3], [4.8, 4.6, 4.2, 2.1, 1.7], [6.9, 6.6, 6.0, 3.0, 2.4],
        [7.8, 7.5, 6.8, 3.4, 2.7], [11.0, 10.6, 9.6, 4.8, 3.9], [17.5, 16.7, 15.2, 7.6, 6.1], [25.3, 24.2, 22, 11, 9],
        [32.2, 30.8, 28, 14, 11], [48.3, 46.2, 42, 21, 17], [62.1, 59.4, 54, 27, 22], [78.2, 74.8, 68, 34, 27],
        [92, 88, 80, 40, 32], [120, 114, 104, 52, 41], [150, 143, 130, 65, 52], [177, 169, 154, 77, 62],
        [221, 211, 192, 96, 77], [285, 273, 248, 124, 99], [359, 343, 312, 156, 125], [414, 396, 360, 180, 144],
        [552, 528, 480, 240, 192], [NaN, NaN, 604, 302, 242], [NaN, NaN, 722, 361, 289], [NaN, NaN, 828, 414, 336],
        [NaN, NaN, 954, 477, 382], [NaN, NaN, 1030, 515, 412], [NaN, NaN, 1180, 590, 472],
    ];

    /// <summary>Every horsepower rating the tables list for a supply of <paramref name="phases"/> phases.</summary>
    public static IReadOnlyList<double> Ratings(int phases) => phases == 3 ? ThreePhaseHp : SinglePhaseHp;

    /// <summary>
    /// The full-load current in amperes of a motor of <paramref name="hp"/> on <paramref name="supply"/>,
    /// or null when the table does not list that rating, or lists no current for it in the column of the supply's voltage.
    /// </summary>
    public static double? FullLoadCurrentA(double hp, CircuitSupply supply)
    {
        var (ratings, volts, amps) = supply.Phases == 3
            ? (ThreePhaseHp, ThreePhaseVolts, ThreePhaseAmps)
            : (SinglePhaseHp, SinglePhaseVolts, SinglePhaseAmps);
        var row = 0;
        while (row < ratings.Length && Math.Abs(ratings[row] - hp) >= 1e-6)
        {
            row++;
        }

        if (row == ratings.Length)
        {
            return null;
        }

        // The column for the motor's nameplate voltage: 115 V on 120 V systems, 230 on 240, 460 on 480, 575 on 600.
        var nameplate = NameplateVoltage(supply.VoltageV);
        var column = 0;
        for (var i = 1; i < volts.Length; i++)
        {
            if (Math.Abs(volts[i] - nameplate) < Math.Abs(volts[column] - nameplate))
            {
                column = i;
            }
        }

        var listed = amps[row][column];
        return double.IsNaN(listed) ? null : listed * volts[column] / nameplate;
    }

    // Motors are rated a little below the system nominal (common practice): 120 -> 115, 240 -> 230, 480 -> 460, 600 -> 575.
    private static double NameplateVoltage(double systemV) => systemV switch
    {
        120 => 115,
        240 => 230,
        480 => 460,
        600 => 575,
        _ => systemV,
    };
}
