using DistTree.Model;

namespace DistTree.Tests.Model;

/// <summary>
/// MotorTables: transcription tests (the tables give NEC Table 430.248 and 430.250 as recalled; these rows are read
/// from the same recollection) and the voltage scaling, worked by hand.
/// </summary>
public sealed class MotorTablesTests
{
    [Theory]
    [InlineData(10, 480, 3, 14)]   // Table 430.250, 460 V column
    [InlineData(10, 208, 3, 30.8)] // Table 430.250, 208 V column
    [InlineData(1, 120, 1, 16)]    // Table 430.248, 115 V column
    public void FullLoadCurrentA_ListedRating_TheTableRow(double hp, double volts, int phases, double expected)
    {
        Assert.Equal(expected, MotorTables.FullLoadCurrentA(hp, new CircuitSupply(volts, phases))!.Value, 9);
    }

    // 277 V has no column: the 230 V column's 8.0 A for 1 hp at constant power, 8.0 × 230 / 277.
    [Fact]
    public void FullLoadCurrentA_VoltageWithoutAColumn_ScaledFromTheNearest()
    {
        Assert.Equal(8.0 * 230 / 277, MotorTables.FullLoadCurrentA(1, new CircuitSupply(277, 1))!.Value, 9);
    }

    [Fact]
    public void FullLoadCurrentA_UnlistedRating_Null()
    {
        Assert.Null(MotorTables.FullLoadCurrentA(7, new CircuitSupply(480, 3)));
    }

    [Fact]
    public void Ratings_ThreePhase_HalfToTwoHundredHorsepower()
    {
        var ratings = MotorTables.Ratings(3);
        Assert.Equal((0.5, 200.0), (ratings[0], ratings[^1]));
    }
}
