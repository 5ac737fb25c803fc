using DistTree.Comparing;

namespace DistTree.Tests.Comparing;

public sealed class NaturalOrderTests
{
    // The order people count in: numbers by value, a circuit by its panel's id first (the ordinal order, which
    // puts 10 before 2, is what it replaces).
    [Theory]
    [InlineData(new[] { "LP1/10", "LP1/2", "LP1/1", "LP1/11" }, new[] { "LP1/1", "LP1/2", "LP1/10", "LP1/11" })]
    [InlineData(new[] { "LP10", "LP2", "LP1" }, new[] { "LP1", "LP2", "LP10" })]
    [InlineData(new[] { "LP10/1", "LP2/10", "LP2/9", "LP1-A/1", "LP1/3" }, new[] { "LP1/3", "LP1-A/1", "LP2/9", "LP2/10", "LP10/1" })]
    [InlineData(new[] { "1", "01", "001" }, new[] { "001", "01", "1" })]
    [InlineData(new[] { "B", "A10", "A9", "A" }, new[] { "A", "A9", "A10", "B" })]
    [InlineData(new[] { "P/99999999999999999999999", "P/100000000000000000000000" }, new[] { "P/99999999999999999999999", "P/100000000000000000000000" })]
    public void Compare_Ids_SortsNumbersByValueAndPanelsFirst(string[] ids, string[] expected) =>
        Assert.Equal(expected, ids.Order(NaturalOrder.Instance).ToArray());

    [Fact]
    public void Compare_EveryPairOfASample_IsATotalOrder()
    {
        string[] ids = ["", "1", "01", "2", "10", "a", "A", "a1", "a01", "a/1", "a/01", "a-1", "a1/2", "a1/10", "a10/1", "a/b", "ab", "9z", "z9"];
        foreach (var x in ids)
        {
            Assert.Equal(0, NaturalOrder.Instance.Compare(x, x));
            foreach (var y in ids)
            {
                var xy = NaturalOrder.Instance.Compare(x, y);
                Assert.Equal(Math.Sign(xy), -Math.Sign(NaturalOrder.Instance.Compare(y, x)));
                Assert.True(x == y || xy != 0, $"{x} and {y} tie");
                foreach (var z in ids)
                {
                    if (xy < 0 && NaturalOrder.Instance.Compare(y, z) < 0)
                    {
                        Assert.True(NaturalOrder.Instance.Compare(x, z) < 0, $"{x} < {y} < {z} but not {x} < {z}");
                    }
                }
            }
        }
    }
}
