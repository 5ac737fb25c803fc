using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>ParallelRanges: every index once, and an error as a plain loop in index order would throw it.</summary>
public sealed class ParallelRangesTests
{
    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(4095)]
    [InlineData(4096)]
    [InlineData(4097)]
    [InlineData(100_003)]
    public void For_AnyCount_VisitsEveryIndexOnce(int count)
    {
        var visits = new int[count];

        ParallelRanges.For(count, (start, end) =>
        {
            for (var i = start; i < end; i++)
            {
                Interlocked.Increment(ref visits[i]);
            }
        });

        Assert.All(visits, v => Assert.Equal(1, v));
    }

    [Fact]
    public void For_SeveralRangesThrow_ThrowsTheFirstInIndexOrder()
    {
        // Indices 10,000 and 90,000 lie in different ranges; a plain loop meets 10,000 first.
        var error = Assert.Throws<InvalidOperationException>(() => ParallelRanges.For(100_000, (start, end) =>
        {
            for (var i = start; i < end; i++)
            {
                if (i is 10_000 or 90_000)
                {
                    throw new InvalidOperationException($"index {i}");
                }
            }
        }));

        Assert.Equal("index 10000", error.Message);
    }
}
