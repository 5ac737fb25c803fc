using DistTree.Conductors;

namespace DistTree.Tests.Conductors;

public sealed class ConductorTemperatureTests
{
    // T = Ta + (Tr − Ta)·(I/Iz)² (REFERENCES.md: derived from the Neher–McGrath relation, NEC 310.14(B)).
    [Theory]
    [InlineData(30, 75, 0, 100, 30)]
    [InlineData(30, 75, 50, 100, 41.25)]
    [InlineData(30, 75, 100, 100, 75)]
    [InlineData(40, 90, 70.7106781, 100, 65)]
    public void Estimate_UpToTheAmpacity_FollowsSquareLaw(double ta, double tr, double i, double iz, double expected) =>
        Assert.Equal(expected, ConductorTemperature.Estimate(ta, tr, i, iz), 4);

    // Past the ampacity the same law: 120 % of Iz on a 75 °C conductor at 30 °C is 30 + 45 · 1.44 = 94.8 °C, not 75 °C;
    // 150 % is 131.25 °C. The ampacity check flags the overload; the drop takes the resistance at this temperature.
    [Theory]
    [InlineData(30, 75, 120, 100, 94.8)]
    [InlineData(30, 75, 150, 100, 131.25)]
    [InlineData(30, 90, 200, 100, 270)]
    public void Estimate_PastTheAmpacity_GoesOnAboveTheRating(double ta, double tr, double i, double iz, double expected) =>
        Assert.Equal(expected, ConductorTemperature.Estimate(ta, tr, i, iz), 9);

    [Fact]
    public void Estimate_Overloaded_ResistanceRisesWithTheSquareLaw()
    {
        // R(T) = R20·(1 + α(T − 20)), α = 0.00393 /°C for copper (REFERENCES.md, IEC 60287-1-1 Table 1, memory): at 94.8 °C
        // against 75 °C the resistance is (1 + 0.00393·74.8)/(1 + 0.00393·55) = 1.0640 times as large.
        var r20 = ConductorPhysics.DcResistance20OhmPerKm(13.3, Material.Copper);
        var hot = ConductorPhysics.AtTemperature(r20, Material.Copper, ConductorTemperature.Estimate(30, 75, 120, 100));
        var rated = ConductorPhysics.AtTemperature(r20, Material.Copper, 75);
        Assert.Equal(1.0640, hot / rated, 3);
    }

    [Fact]
    public void Estimate_NoAmpacity_GivesRated() => Assert.Equal(75, ConductorTemperature.Estimate(30, 75, 10, null));
}
