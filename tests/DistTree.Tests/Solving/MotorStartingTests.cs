using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

public sealed class MotorStartingTests
{
    // NEC Table 430.7(B) (memory): code letter G is 5.6 to 6.29 kVA per hp; DistTree takes the upper end.
    [Fact]
    public void LockedRotor_CodeLetter_UpperEndOfItsRange()
    {
        var load = new Load(LoadKind.Hp, 10, 0.85) { Start = new MotorStart("G", null, 0.3) };
        Assert.Equal(62_900, MotorStarting.LockedRotor(load, ComplexPower.FromApparent(11_000, 0.85)).VoltAmperes, 6);
    }

    [Fact]
    public void LockedRotor_Default_SixTimesRunning() =>
        Assert.Equal(6 * 11_000, MotorStarting.LockedRotor(new Load(LoadKind.Fla, 14, 0.85), ComplexPower.FromApparent(11_000, 0.85)).VoltAmperes, 6);
}
