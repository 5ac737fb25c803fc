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
    [InlineData(25, 480, 3, 34)]   // Table 430.250, 460 V column
    [InlineData(200, 208, 3, 528)] // Table 430.250, 208 V column: its last row
    [InlineData(250, 240, 3, 604)] // Table 430.250 above 200 hp (memory): 230 V column
    [InlineData(250, 480, 3, 302)]
    [InlineData(250, 600, 3, 242)]
    [InlineData(300, 480, 3, 361)]
    [InlineData(350, 480, 3, 414)]
    [InlineData(350, 600, 3, 336)]
    [InlineData(400, 240, 3, 954)]
    [InlineData(450, 480, 3, 515)]
    [InlineData(500, 240, 3, 1180)]
    [InlineData(500, 480, 3, 590)]
    [InlineData(500, 600, 3, 472)]
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

    // Table 430.250's 200 V and 208 V columns stop at 200 hp (memory): no column is invented for 250 hp at 208 V
    // (the nearest column), though the 230 V column lists it.
    [Theory]
    [InlineData(250, 208)]
    [InlineData(500, 200)]
    public void FullLoadCurrentA_AboveTheColumnsLastRow_Null(double hp, double volts)
    {
        Assert.Null(MotorTables.FullLoadCurrentA(hp, new CircuitSupply(volts, 3)));
    }

    [Fact]
    public void Ratings_ThreePhase_HalfToFiveHundredHorsepower()
    {
        var ratings = MotorTables.Ratings(3);
        Assert.Equal((0.5, 500.0), (ratings[0], ratings[^1]));
    }
}
