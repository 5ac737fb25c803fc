using DistTree.Conductors;

namespace DistTree.Tests.Conductors;

public sealed class ConductorTemperatureTests
{
    // T = Ta + (Tr − Ta)·(I/Iz)² (REFERENCES.md: derived from the Neher–McGrath relation, NEC 310.14(B)).
    [Theory]
    [InlineData(30, 75, 0, 100, 30)]
    [InlineData(30, 75, 50, 100, 41.25)]
    [InlineData(30, 75, 100, 100, 75)]
    [InlineData(30, 75, 150, 100, 75)]
    [InlineData(40, 90, 70.7106781, 100, 65)]
    public void Estimate_FollowsSquareLaw_Clamped(double ta, double tr, double i, double iz, double expected) =>
        Assert.Equal(expected, ConductorTemperature.Estimate(ta, tr, i, iz), 4);

    [Fact]
    public void Estimate_NoAmpacity_GivesRated() => Assert.Equal(75, ConductorTemperature.Estimate(30, 75, 10, null));
}
