using System.Text.Json;
using DistTree.Reports;
using DistTree.Sizing;
using DistTree.Tests.Sizing;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Reports;

/// <summary>
/// A stated tap over the light-load limit (−5 %: 100/95 − 1 = 5.26 % above nominal at no load, over ANSI C84.1's +5 %,
/// recalled) is named in every output of the plan; a plan without one writes no caution at all.
/// </summary>
public sealed class PlanCautionReportTests
{
    private static readonly Lazy<UpsizePlan> Plan = new(() => Upsizer.Standard.Plan(SolverHarness.Solve(UpsizerRemedyTests.Transformer("tap_percent: -5"))));

    private static readonly Lazy<UpsizePlan> Without = new(() => Upsizer.Standard.Plan(SolverHarness.Solve(UpsizerRemedyTests.Transformer())));

    private static string Console(UpsizePlan plan)
    {
        var o = new StringWriter();
        PlanReport.WriteConsole(o, plan);
        return o.ToString().ReplaceLineEndings("\n");
    }

    private static JsonElement Json(UpsizePlan plan)
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream))
        {
            w.WriteStartObject();
            PlanReport.WriteJson(w, plan);
            w.WriteEndObject();
        }

        using var doc = JsonDocument.Parse(stream.ToArray());
        return doc.RootElement.GetProperty("upsize_plan").Clone();
    }

    [Fact]
    public void WriteConsole_StatedTapOverTheLimit_NamesIt()
    {
        Assert.Contains("Stated taps over the light-load limit (kept as stated):\n  transformer T1: at its stated tap_percent -5, its secondary stands 5.26 % above nominal", Console(Plan.Value), StringComparison.Ordinal);
        Assert.DoesNotContain("light-load", Console(Without.Value), StringComparison.Ordinal);
    }

    [Fact]
    public void WriteJson_StatedTapOverTheLimit_Cautions()
    {
        var caution = Assert.Single(Json(Plan.Value).GetProperty("cautions").EnumerateArray());
        Assert.Equal("T1", caution.GetProperty("subject").GetString());
        Assert.Contains("5.26 % above nominal", caution.GetProperty("message").GetString(), StringComparison.Ordinal);
        Assert.False(Json(Without.Value).TryGetProperty("cautions", out _));
    }

    [Fact]
    public void Render_StatedTapOverTheLimit_ListedInThePlan()
    {
        var doc = ReportFixtures.Parse(HtmlReport.Render(Plan.Value.Before, new HtmlReportOptions { Plan = Plan.Value }));
        var heading = Assert.Single(doc.QuerySelectorAll("#plan h3"), h => h.TextContent == "Stated taps over the light-load limit");
        Assert.Contains("5.26 % above nominal", heading.NextElementSibling!.TextContent, StringComparison.Ordinal);
    }
}
