using System.Globalization;
using DistTree.Reports.Html;
using DistTree.Solving;

namespace DistTree.Tests.Reports;

/// <summary>The band of an end point: one circuit solved once for its total, then again under total limits placed around it.</summary>
public sealed class BandsTests
{
    private static readonly string[] Circuit = ["{ id: '1', name: Heater, poles: 1, ocpd: 20, load: { va: 1800 }, run: { length: 30, size: 12 AWG } }"];

    private static EndPointResult Solved(double? totalLimitPercent)
    {
        var yaml = ReportFixtures.OnePanel("Bands", Circuit);
        if (totalLimitPercent is { } limit)
        {
            yaml = yaml.Replace("service:", $"rules:\n  total_limit_percent: {limit.ToString("R", CultureInfo.InvariantCulture)}\nservice:", StringComparison.Ordinal);
        }

        return ReportFixtures.SolveText(yaml).EndPoints[0];
    }

    [Theory]
    [InlineData(0.5, (int)Band.Ok)]
    [InlineData(0.79, (int)Band.Ok)]
    [InlineData(0.81, (int)Band.Near)]
    [InlineData(0.99, (int)Band.Near)]
    [InlineData(1.5, (int)Band.Over)]
    public void Of_TotalAsAShareOfTheLimit_IsItsBand(double share, int band)
    {
        var expected = (Band)band;
        var total = Solved(null).TotalDropPercent;

        var e = Solved(total / share);

        Assert.Equal(total, e.TotalDropPercent);
        Assert.Equal(expected == Band.Over, e.Findings.Any(f => f.Kind == FindingKind.TotalDrop));
        Assert.Equal(expected, Bands.Of(e));
    }

    [Theory]
    [InlineData((int)Band.None, (int)Band.Ok, (int)Band.Ok)]
    [InlineData((int)Band.Near, (int)Band.Ok, (int)Band.Near)]
    [InlineData((int)Band.Near, (int)Band.Over, (int)Band.Over)]
    [InlineData((int)Band.None, (int)Band.None, (int)Band.None)]
    public void Worse_TwoBands_IsTheNearerToFailing(int a, int b, int expected)
    {
        Assert.Equal((Band)expected, Bands.Worse((Band)a, (Band)b));
        Assert.Equal((Band)expected, Bands.Worse((Band)b, (Band)a));
    }

    [Theory]
    [InlineData((int)Band.Over, "over", "over limit")]
    [InlineData((int)Band.Near, "near", "near limit")]
    [InlineData((int)Band.Ok, "ok", "within limit")]
    [InlineData((int)Band.None, "none", "no circuits")]
    public void ClassAndText_EachBand_AreItsOwn(int band, string cssClass, string text)
    {
        Assert.Equal(cssClass, Bands.Class((Band)band));
        Assert.Equal(text, Bands.Text((Band)band));
    }
}
