using System.Numerics;
using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

public sealed class LineVoltagesTests
{
    // A wye's line-to-neutral voltage is V_LL/√3 (480/√3 = 277.13, 208/√3 = 120.09); a centre-tapped single-phase
    // system's is half its line-to-line voltage (240/2 = 120); a delta has no neutral, and its balanced per-line
    // figure is V_LL/√3 too (common practice). A 1-pole circuit is rated at the nameplate's line-to-neutral voltage.
    [Theory]
    [InlineData("480Y/277", 3, 277, 480, 277.128129, true)]
    [InlineData("208Y/120", 3, 120, 208, 120.088856, true)]
    [InlineData("120/240", 2, 120, 240, 120, true)]
    [InlineData("480D", 3, 277.128129, 480, 277.128129, false)]
    public void Voltages_OfASystem(string name, int lines, double singleV, double pairV, double perLineV, bool neutral)
    {
        var v = LineVoltages.Voltages(ElectricalSystem.Find(name)!);
        Assert.Equal(lines, v.Lines);
        Assert.Equal(singleV, v.SingleV, 5);
        Assert.Equal(pairV, v.PairV, 5);
        Assert.Equal(perLineV, v.PerLineV, 5);
        Assert.Equal(neutral, v.HasNeutral);
        Assert.Equal(v, LineVoltages.Of(ElectricalSystem.Find(name)!));
    }

    // Three lines are 120° apart, so two of them are √3 apart; two lines are opposite, 2 apart.
    [Theory]
    [InlineData(3, Phases.AB, 1.7320508075688772)]
    [InlineData(3, Phases.BC, 1.7320508075688772)]
    [InlineData(3, Phases.CA, 1.7320508075688772)]
    [InlineData(2, Phases.AB, 2)]
    public void PairMagnitude_IsTheDistanceBetweenTheLines(int lines, Phases pair, double expected) =>
        Assert.Equal(expected, LineVoltages.PairMagnitude[(lines * 8) + (int)pair], 12);

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
