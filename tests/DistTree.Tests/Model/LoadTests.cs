using DistTree.Model;

namespace DistTree.Tests.Model;

/// <summary>Load: the one place a stated quantity becomes apparent power, and loads along a run summed as one.</summary>
public sealed class LoadTests
{
    private static readonly CircuitSupply OnePhase120 = new(120, 1);
    private static readonly CircuitSupply ThreePhase208 = new(208, 3);
    private static readonly CircuitSupply ThreePhase480 = new(480, 3);

    // Worked by hand: S = V·I single-phase, √3·V·I three-phase; P = S·pf.
    [Theory]
    [InlineData(LoadKind.Va, 1200, 0.9, 120, 1, 1200)]
    [InlineData(LoadKind.Kva, 2.5, 0.9, 120, 1, 2500)]
    [InlineData(LoadKind.Kw, 3, 0.8, 120, 1, 3750)]
    [InlineData(LoadKind.Amps, 10, 0.9, 120, 1, 1200)]
    [InlineData(LoadKind.Amps, 10, 0.9, 208, 3, 3602.665680)]
    [InlineData(LoadKind.Fla, 20, 0.85, 230, 1, 4600)]
    public void VoltAmperes_StatedQuantity_ApparentPowerAtNominalVoltage(LoadKind kind, double value, double pf, double volts, int phases, double expected)
    {
        Assert.Equal(expected, new Load(kind, value, pf).VoltAmperes(new CircuitSupply(volts, phases)), 6);
    }

    // NEC Table 430.250 (from memory, as MotorTables states): 10 hp at 460 V draws 14 A; on a 480 V system √3·480·14.
    [Fact]
    public void VoltAmperes_TenHorsepowerOn480_FromTheFullLoadCurrentTable()
    {
        Assert.Equal(Math.Sqrt(3) * 480 * 14, new Load(LoadKind.Hp, 10, 0.85).VoltAmperes(ThreePhase480), 9);
    }

    [Fact]
    public void VoltAmperes_UnlistedHorsepower_Throws()
    {
        var e = Assert.Throws<ArgumentException>(() => new Load(LoadKind.Hp, 7, 0.85).VoltAmperes(ThreePhase480));
        Assert.Contains("no full-load current is listed for a 7 hp motor", e.Message, StringComparison.Ordinal);
    }

    // A motor's full-load current: the table's for hp (NEC Table 430.250, memory: 10 hp at 460 V, 14 A), the stated
    // amperes for fla; none for a load that is not a motor.
    [Theory]
    [InlineData(LoadKind.Hp, 10, 14.0)]
    [InlineData(LoadKind.Fla, 22, 22.0)]
    [InlineData(LoadKind.Amps, 22, null)]
    [InlineData(LoadKind.Kva, 5, null)]
    public void FullLoadCurrentA_MotorsOnly(LoadKind kind, double value, double? expected)
    {
        Assert.Equal(expected, new Load(kind, value, 0.85).FullLoadCurrentA(ThreePhase480));
    }

    [Theory]
    [InlineData(LoadKind.Hp, true)]
    [InlineData(LoadKind.Fla, true)]
    [InlineData(LoadKind.Va, false)]
    [InlineData(LoadKind.Amps, false)]
    public void IsMotorKind_Kind_TrueForMotorsOnly(LoadKind kind, bool motor)
    {
        Assert.Equal(motor, Load.IsMotorKind(kind));
        Assert.Equal(motor, new Load(kind, 1, 0.9).IsMotor);
    }

    // Two 500 VA loads at 0.8: P = 800 W, Q = 600 var, |S| = 1000 VA at 0.8 (a 3-4-5 triangle).
    [Fact]
    public void Combined_TwoPointsAtOnePowerFactor_AddAsPhasors()
    {
        var sum = Load.Combined([new LoadPoint(10, new Load(LoadKind.Va, 500, 0.8)), new LoadPoint(20, new Load(LoadKind.Kva, 0.5, 0.8))], OnePhase120);
        Assert.Equal(LoadKind.Va, sum.Kind);
        Assert.Equal(1000, sum.Value, 9);
        Assert.Equal(0.8, sum.PowerFactor, 12);
    }

    // 1 kW at unity and 1 kW at 0.7071 (1 kW + j1 kvar): 2 kW + j1 kvar, |S| = √5 kVA at 2/√5.
    [Fact]
    public void Combined_DifferentPowerFactors_SumOfRealAndReactiveParts()
    {
        var pf = Math.Sqrt(0.5);
        var sum = Load.Combined([new LoadPoint(5, new Load(LoadKind.Kw, 1, 1)), new LoadPoint(9, new Load(LoadKind.Kw, 1, pf))], ThreePhase208);
        Assert.Equal(Math.Sqrt(5) * 1000, sum.Value, 6);
        Assert.Equal(2 / Math.Sqrt(5), sum.PowerFactor, 9);
    }

    [Fact]
    public void Combined_NoPoints_NoLoadAtUnity()
    {
        var sum = Load.Combined([], OnePhase120);
        Assert.Equal((0.0, 1.0), (sum.Value, sum.PowerFactor));
    }
}
