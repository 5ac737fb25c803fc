using DistTree.Conductors;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Conductors;

public sealed class ConductorSizeTests
{
    [Theory]
    [InlineData("12 AWG", "12 AWG")]
    [InlineData("#12", "12 AWG")]
    [InlineData("12", "12 AWG")]
    [InlineData("12awg", "12 AWG")]
    [InlineData("1/0", "1/0 AWG")]
    [InlineData("1/0 AWG", "1/0 AWG")]
    [InlineData("4/0 awg", "4/0 AWG")]
    [InlineData("250 kcmil", "250 kcmil")]
    [InlineData("250 MCM", "250 kcmil")]
    [InlineData("250kcmil", "250 kcmil")]
    [InlineData("95 mm2", "95 mm2")]
    [InlineData("95 mm²", "95 mm2")]
    [InlineData("1.5 mm2", "1.5 mm2")]
    [InlineData("630 mm2", "630 mm2")]
    public void Parse_FormsPeopleType_GiveCanonicalText(string text, string canonical) =>
        Assert.Equal(canonical, ConductorSize.Parse(text).Text);

    [Theory]
    [InlineData("13 AWG", "nearest: 14 AWG or 12 AWG")]
    [InlineData("5000 kcmil", "nearest: 2000 kcmil (the largest)")]
    [InlineData("100 kcmil", "nearest: 250 kcmil (the smallest)")]
    [InlineData("96 mm2", "nearest: 95 mm2 or 120 mm2")]
    [InlineData("95 mm3", "unknown size unit 'mm3'")]
    [InlineData("5/0", "nearest: 4/0 AWG (the largest)")]
    [InlineData("1/2 AWG", "not a conductor size")]
    [InlineData("", "empty")]
    public void TryParse_UnknownSize_FailsNamingTheNearest(string text, string expected)
    {
        Assert.False(ConductorSize.TryParse(text, out _, out var error));
        Assert.Contains(expected, error, StringComparison.Ordinal);
    }

    // NEC Chapter 9 Table 8, area in circular mils (REFERENCES.md, read); ours come from the ASTM B258
    // diameter formula, so this is a check of the formula against the published table.
    [Theory]
    [InlineData("14 AWG", 4110)]
    [InlineData("12 AWG", 6530)]
    [InlineData("10 AWG", 10380)]
    [InlineData("8 AWG", 16510)]
    [InlineData("6 AWG", 26240)]
    [InlineData("4 AWG", 41740)]
    [InlineData("3 AWG", 52620)]
    [InlineData("2 AWG", 66360)]
    [InlineData("1 AWG", 83690)]
    [InlineData("1/0 AWG", 105600)]
    [InlineData("2/0 AWG", 133100)]
    [InlineData("3/0 AWG", 167800)]
    [InlineData("4/0 AWG", 211600)]
    public void AreaCmil_Awg_WithinHalfPercentOfTable8(string size, double tableCmil) =>
        Assert.InRange(ConductorSize.Parse(size).AreaCmil / tableCmil, 0.995, 1.005);

    [Fact]
    public void AreaMm2_Kcmil_IsByDefinition() =>
        Assert.Equal(506.7075, ConductorSize.Parse("1000 kcmil").AreaMm2, 2);

    [Fact]
    public void NextLarger_WalksTheLadder_AwgIntoKcmil()
    {
        Assert.Equal("250 kcmil", ConductorSize.Parse("4/0").NextLarger?.Text);
        Assert.Equal("1/0 AWG", ConductorSize.Parse("1 AWG").NextLarger?.Text);
        Assert.Null(ConductorSize.Parse("2000 kcmil").NextLarger);
        Assert.Null(ConductorSize.Parse("630 mm2").NextLarger);
        Assert.Equal("120 mm2", ConductorSize.Parse("95 mm2").NextLarger?.Text);
    }

    [Fact]
    public void All_HasEveryStandardSize()
    {
        Assert.Equal(28, ConductorSize.InSeries(SizeSeries.NorthAmerican).Count);
        Assert.Equal(19, ConductorSize.InSeries(SizeSeries.Metric).Count);
    }

    [Property]
    public Property CanonicalText_ParsesBackToItself() =>
        Prop.ForAll(Arb.From(Gen.Elements(ConductorSize.All.ToArray())), size => ConductorSize.Parse(size.Text) == size);

    [Property]
    public Property Ordering_FollowsTheLadder() =>
        Prop.ForAll(Arb.From(Gen.Elements(ConductorSize.All.ToArray())), size => size.NextLarger is not { } next || next > size);
}
