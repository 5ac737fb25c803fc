using System.Numerics;
using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

public sealed class LineVoltagesTests
{
    // A wye's line-to-neutral base is V_LL/√3 (480/√3 = 277.13, 208/√3 = 120.09); a centre-tapped single-phase
    // system's is half its line-to-line voltage (240/2 = 120); a delta has no neutral, and its balanced per-line
    // figure is V_LL/√3 too; a one-line system's is its nominal (common practice).
    [Theory]
    [InlineData("480Y/277", 277.128129)]
    [InlineData("208Y/120", 120.088856)]
    [InlineData("120/240", 120)]
    [InlineData("480D", 277.128129)]
    [InlineData("230", 230)]
    public void LineToNeutralV_OfASystem(string name, double expected) =>
        Assert.Equal(expected, LineVoltages.LineToNeutralV(ElectricalSystem.Find(name)!), 5);

    // Three lines are 120° apart, so two of them are √3 apart; two lines are opposite, 2 apart.
    [Theory]
    [InlineData(3, 0, 1, 1.7320508075688772)]
    [InlineData(3, 1, 2, 1.7320508075688772)]
    [InlineData(3, 2, 0, 1.7320508075688772)]
    [InlineData(2, 0, 1, 2)]
    public void Unit_TwoLines_AreTheirDistanceApart(int lines, int a, int b, double expected) =>
        Assert.Equal(expected, (LineVoltages.Unit(a, lines) - LineVoltages.Unit(b, lines)).Magnitude, 12);

    [Fact]
    public void Unit_ThreeLines_Are120DegreesApart()
    {
        Assert.Equal(0, LineVoltages.Unit(0, 3).Phase, 12);
        Assert.Equal(-2 * Math.PI / 3, LineVoltages.Unit(1, 3).Phase, 12);
        Assert.Equal(2 * Math.PI / 3, LineVoltages.Unit(2, 3).Phase, 12);
        Assert.Equal(-Complex.One, LineVoltages.Unit(1, 2));
        Assert.Equal(Complex.One, LineVoltages.Unit(0, 1));
    }
}
