using System.Text.Json;
using DistTree.Reports;
using DistTree.Sizing;
using DistTree.Tests.Sizing;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Reports;

/// <summary>A plan that sets a transformer's tap says so in every output: the console, the JSON and the HTML report.</summary>
public sealed class PlanTapReportTests
{
    private static readonly Lazy<UpsizePlan> Plan = new(() => Upsizer.Standard.Plan(SolverHarness.Solve(UpsizerRemedyTests.Transformer())));

    [Fact]
    public void WriteConsole_TapPlan_NamesTheTapToSet()
    {
        var o = new StringWriter();
        PlanReport.WriteConsole(o, Plan.Value);
        var text = o.ToString().ReplaceLineEndings("\n");
        Assert.Contains("No run needs a larger size.\n\nTransformer taps to set:\n  T1: tap_percent 0 → -2.5 (regulation ", text, StringComparison.Ordinal);
        Assert.Contains("), free\n", text, StringComparison.Ordinal);
    }

    [Fact]
    public void WriteJson_TapPlan_HasTheTapChange()
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream))
        {
            w.WriteStartObject();
            PlanReport.WriteJson(w, Plan.Value);
            w.WriteEndObject();
        }

        using var doc = JsonDocument.Parse(stream.ToArray());
        var tap = Assert.Single(doc.RootElement.GetProperty("upsize_plan").GetProperty("tap_changes").EnumerateArray());
        Assert.Equal("T1", tap.GetProperty("transformer").GetString());
        Assert.Equal((0.0, -2.5), (tap.GetProperty("tap_percent_before").GetDouble(), tap.GetProperty("tap_percent_after").GetDouble()));
        Assert.Equal(Plan.Value.TapChanges[0].Location.Line, tap.GetProperty("line").GetInt32());
    }

    [Fact]
    public void Render_TapPlan_ListsTheTapBelowTheChanges()
    {
        var doc = ReportFixtures.Parse(HtmlReport.Render(Plan.Value.Before, new HtmlReportOptions { Plan = Plan.Value }));
        var tables = doc.QuerySelectorAll("#plan table.plan").ToArray();
        Assert.Equal(2, tables.Length);
        var row = Assert.Single(tables[1].QuerySelectorAll("tbody tr.plan-change"));
        Assert.Equal("T1", row.QuerySelector("td")!.TextContent);
        Assert.Contains("0 → -2.5", row.TextContent, StringComparison.Ordinal);
        Assert.Contains("with the taps below", tables[0].QuerySelector("tr.row-total")!.TextContent, StringComparison.Ordinal);
    }
}
