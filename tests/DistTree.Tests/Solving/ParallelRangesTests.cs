using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>
/// ParallelRanges: every index once, an error as a plain loop in index order would throw it, and a pass along a
/// tree's levels meets each node after its parent (top-down) or after its children (bottom-up).
/// </summary>
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

    // The service, 3 panels, 15,000 nodes under them (a wide level), then 9,000 more (wide) and a chain of 3.
    private static int[] WideTree()
    {
        var parents = new List<int> { -1, 0, 0, 0 };
        parents.AddRange(Enumerable.Range(0, 15_000).Select(k => 1 + (k / 5_000)));
        parents.AddRange(Enumerable.Range(0, 9_000).Select(k => 4 + k));
        parents.AddRange([24_003, 24_004, 24_005]);
        return [.. parents];
    }

    [Fact]
    public void TopDown_WideLevels_EveryNodeOnceAndAfterItsParent()
    {
        var parents = WideTree();
        var levels = TreeLevels.Of(parents);
        var visits = new int[parents.Length];
        var early = 0;

        ParallelRanges.TopDown(levels.Steps, (start, end) =>
        {
            for (var i = start; i < end; i++)
            {
                if (Volatile.Read(ref visits[parents[i]]) == 0 && parents[i] != 0)
                {
                    Interlocked.Increment(ref early);
                }

                Interlocked.Increment(ref visits[i]);
            }
        });

        Assert.Equal(2, levels.Steps.Count(step => step.Wide));
        Assert.Equal(0, early);
        Assert.All(visits.Skip(1), v => Assert.Equal(1, v));
        Assert.Equal(0, visits[0]);
    }

    [Fact]
    public void BottomUp_WideLevels_EveryNodeOnceAndAfterItsChildren()
    {
        var parents = WideTree();
        var levels = TreeLevels.Of(parents);
        var visits = new int[parents.Length];
        var early = 0;

        ParallelRanges.BottomUp(levels.Steps, (start, end) =>
        {
            for (var i = end - 1; i >= start; i--)
            {
                for (var child = levels.ChildStarts[i]; child < levels.ChildStarts[i + 1]; child++)
                {
                    if (Volatile.Read(ref visits[child]) == 0)
                    {
                        Interlocked.Increment(ref early);
                    }
                }

                Interlocked.Increment(ref visits[i]);
            }
        });

        Assert.Equal(0, early);
        Assert.All(visits.Skip(1), v => Assert.Equal(1, v));
        Assert.Equal(0, visits[0]);
    }
}
