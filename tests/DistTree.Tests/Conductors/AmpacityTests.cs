using DistTree.Conductors;

namespace DistTree.Tests.Conductors;

public sealed class AmpacityTests
{
    // NEC 310.15(B)(1) ambient correction factors (REFERENCES.md, read): the relation reproduces the table.
    [Theory]
    [InlineData(75, 33, 0.94)]
    [InlineData(75, 35, 0.94)]
    [InlineData(90, 38, 0.91)]
    [InlineData(90, 40, 0.91)]
    [InlineData(75, 30, 1.00)]
    [InlineData(60, 45, 0.71)]
    public void AmbientFactor_MatchesPublishedBands(double rated, double ambient, double table) =>
        Assert.Equal(table, Ampacity.AmbientFactor(rated, ambient), 2);

    [Fact]
    public void AmbientFactor_AtOrAboveRating_IsZero() => Assert.Equal(0, Ampacity.AmbientFactor(60, 58));

    // NEC 310.15(C)(1) (REFERENCES.md, read).
    [Theory]
    [InlineData(3, 1.0)]
    [InlineData(4, 0.8)]
    [InlineData(6, 0.8)]
    [InlineData(7, 0.7)]
    [InlineData(9, 0.7)]
    [InlineData(10, 0.5)]
    [InlineData(20, 0.5)]
    [InlineData(21, 0.45)]
    [InlineData(31, 0.40)]
    [InlineData(41, 0.35)]
    public void AdjustmentFactor_MatchesPublishedSteps(int conductors, double factor) =>
        Assert.Equal(factor, Ampacity.AdjustmentFactor(conductors));
}
