using System.Globalization;
using DistTree.Model;
using DistTree.Vocabulary;

namespace DistTree.Tests.Vocabulary;

public sealed class LengthTextTests
{
    // Hand conversions with the international foot, 1 ft = 0.3048 m exactly (NIST SP 811, Appendix B.8; the
    // international yard and pound agreement of 1959): 180 ft = 54.864 m, 750 ft = 228.6 m, 14 m = 45.93 ft.
    [Theory]
    [InlineData(54.864, UnitSystem.Imperial, "180 ft")]
    [InlineData(228.6, UnitSystem.Imperial, "750 ft")]
    [InlineData(14.0, UnitSystem.Imperial, "46 ft")]
    [InlineData(54.864, UnitSystem.Metric, "54.9 m")]
    [InlineData(228.6, UnitSystem.Metric, "228.6 m")]
    [InlineData(0.0, UnitSystem.Metric, "0.0 m")]
    public void Of_LengthInMetres_IsWrittenInTheProjectsUnitWithItsSymbol(double metres, UnitSystem units, string expected) =>
        Assert.Equal(expected, LengthText.Of(metres, units));

    // The precise form keeps what a comparison must show: metres as stated, feet to 0.01 ft (same source).
    [Theory]
    [InlineData(14.0, UnitSystem.Imperial, "45.93 ft")]
    [InlineData(24.384, UnitSystem.Imperial, "80 ft")]
    [InlineData(13.716, UnitSystem.Metric, "13.716 m")]
    [InlineData(22.0, UnitSystem.Metric, "22 m")]
    public void Precise_LengthInMetres_KeepsTheDigitsAChangeNeeds(double metres, UnitSystem units, string expected) =>
        Assert.Equal(expected, LengthText.Precise(metres, units));

    [Fact]
    public void ToString_InASentenceWrittenUnderAnotherCulture_StaysInvariant()
    {
        var previous = CultureInfo.CurrentCulture;
        try
        {
            CultureInfo.CurrentCulture = CultureInfo.GetCultureInfo("de-DE");
            FormattableString sentence = $"over {new LengthText(54.864, UnitSystem.Metric)} of 12 AWG";
            Assert.Equal("over 54.9 m of 12 AWG", sentence.ToString(CultureInfo.GetCultureInfo("de-DE")));
            Assert.Equal("over 45.93 ft", FormattableString.Invariant($"over {new LengthText(14, UnitSystem.Imperial):P}"));
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }
    }

    [Fact]
    public void InUnits_Imperial_DividesByTheFoot() =>
        Assert.Equal(250.0, new LengthText(76.2, UnitSystem.Imperial).InUnits, 12);
}
