using DistTree.Reports.Schedules;

namespace DistTree.Tests.Reports.Schedules;

/// <summary>The natural order of ids: numbers by value, as a person counts (1, 2 … 10, 11, never 1, 10, 11, 2).</summary>
public sealed class NaturalOrderTests
{
    [Fact]
    public void Compare_Numbers_SortsByValue()
    {
        string[] ids = ["10", "2", "1", "11", "3", "20", "100"];
        Assert.Equal(["1", "2", "3", "10", "11", "20", "100"], ids.Order(NaturalOrder.Instance));
    }

    [Fact]
    public void Compare_TextWithNumbers_SortsTheNumberPartsByValue()
    {
        string[] ids = ["L10", "L2", "EV", "L1", "2", "K-3b", "K-3a"];
        // Digits (0x30…) come before letters in ordinal order, so whole numbers lead.
        Assert.Equal(["2", "EV", "K-3a", "K-3b", "L1", "L2", "L10"], ids.Order(NaturalOrder.Instance));
    }

    [Fact]
    public void Compare_LeadingZeros_EqualValueFallsBackToOrdinal()
    {
        Assert.True(NaturalOrder.Instance.Compare("01", "1") < 0, "'0' before '1' ordinally: the order stays total");
        Assert.True(NaturalOrder.Instance.Compare("02", "10") < 0);
        Assert.Equal(0, NaturalOrder.Instance.Compare("7", "7"));
    }

    [Fact]
    public void Compare_NumbersLongerThanALong_StillByValue()
    {
        Assert.True(NaturalOrder.Instance.Compare("99999999999999999999999", "100000000000000000000000") < 0);
    }
}
