namespace DistTree.Conductors;

/// <summary>Corrections to a tabulated ampacity (30 °C ambient, not more than three current-carrying conductors).</summary>
public static class Ampacity
{
    /// <summary>
    /// Ambient correction factor by NEC 310.15(B)(1)'s relation √((Tc − Ta)/(Tc − 30)), with Ta taken at the
    /// upper end of its 5 °C band (10 °C or less, 11–15, 16–20, …) exactly as the published table does, so
    /// the factor, rounded to two decimals as printed, equals the table's (read: 75 °C at 31–35 °C: 0.94;
    /// 90 °C at 36–40 °C: 0.91). IEC 60364-5-52 Table B.52.14 follows the same relation for PVC (Tc 70 °C)
    /// and XLPE (Tc 90 °C). Zero when the ambient reaches the rating.
    /// </summary>
    /// <param name="ratedC">The conductor's temperature rating Tc in °C.</param>
    /// <param name="ambientC">Ambient temperature Ta in °C.</param>
    public static double AmbientFactor(double ratedC, double ambientC)
    {
        var bandTop = Math.Max(10.0, 5.0 * Math.Ceiling(ambientC / 5.0));
        return bandTop >= ratedC ? 0.0 : Math.Round(Math.Sqrt((ratedC - bandTop) / (ratedC - 30.0)), 2);
    }

    /// <summary>
    /// Adjustment for more than three current-carrying conductors in a raceway or cable, NEC 310.15(C)(1)
    /// (read): 4–6: 80 %, 7–9: 70 %, 10–20: 50 %, 21–30: 45 %, 31–40: 40 %, 41 and more: 35 %.
    /// </summary>
    /// <param name="currentCarryingConductors">How many current-carrying conductors share the raceway.</param>
    public static double AdjustmentFactor(int currentCarryingConductors) => currentCarryingConductors switch
    {
        < 1 => throw new ArgumentOutOfRangeException(nameof(currentCarryingConductors), "at least one conductor"),
        <= 3 => 1.0,
        <= 6 => 0.80,
        <= 9 => 0.70,
        <= 20 => 0.50,
        <= 30 => 0.45,
        <= 40 => 0.40,
        _ => 0.35,
    };

    // IEC 60364-5-52 Table B.52.17, row 1 (memory): the largest number of circuits of each column, and its factor.
    private static readonly (int Circuits, double Factor)[] GroupingRows =
        [(1, 1.00), (2, 0.80), (3, 0.70), (4, 0.65), (5, 0.60), (6, 0.57), (7, 0.54), (8, 0.52), (9, 0.50), (12, 0.45), (16, 0.41), (20, 0.38)];

    /// <summary>
    /// Reduction for grouping, IEC 60364-5-52 Table B.52.17 row 1 (bunched in air, on a surface, embedded or enclosed;
    /// memory, verify before relying) by the number of circuits: 1: 1.00, 2: 0.80, 3: 0.70, 4: 0.65, 5: 0.60, 6: 0.57,
    /// 7: 0.54, 8: 0.52, 9: 0.50, 12: 0.45, 16: 0.41, 20: 0.38. A count between two columns takes the next column up
    /// (10 and 11 circuits: 0.45), the safe side; above 20, the table's last factor, 0.38 (the table goes no further).
    /// </summary>
    /// <param name="circuits">How many circuits (each parallel set one) are grouped.</param>
    public static double GroupingFactor(int circuits)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(circuits, 1);
        foreach (var (most, factor) in GroupingRows)
        {
            if (circuits <= most)
            {
                return factor;
            }
        }

        return GroupingRows[^1].Factor;
    }
}
