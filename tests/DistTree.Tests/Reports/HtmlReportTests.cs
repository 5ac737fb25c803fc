using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using DistTree.Network;
using DistTree.Reports;
using DistTree.Sizing;
using DistTree.Solving;

namespace DistTree.Tests.Reports;

public sealed class HtmlReportTests
{
    [Fact]
    public void Render_Demo_EveryEndPointAppearsInItsPanelTable()
    {
        var s = ReportFixtures.Demo;
        var doc = ReportFixtures.RenderDemo();
        var listed = new HashSet<string>(StringComparer.Ordinal);
        foreach (var panel in doc.QuerySelectorAll("section.panel"))
        {
            var panelId = panel.QuerySelector("h3 .id")!.TextContent;
            foreach (var row in panel.QuerySelectorAll("table.circuits tbody tr:not(.row-more)"))
            {
                var cells = row.QuerySelectorAll("td");
                // The name cell holds the name, and a tag for a circuit with loads along its run.
                listed.Add($"{panelId}/{cells[0].TextContent}\n{cells[1].QuerySelector(".cname")!.TextContent}");
            }
        }

        Assert.True(s.EndPoints.Count > 200, "the demo has about 215 circuits");
        foreach (var e in s.EndPoints)
        {
            Assert.Contains($"{e.Id}\n{e.Name}", listed);
        }

        Assert.Equal(s.EndPoints.Count, listed.Count);
    }

    [Fact]
    public void Render_Demo_FirstWorstPathIsTheJsonWorstEndPoint()
    {
        using var json = JsonDocument.Parse(JsonResults.Write(ReportFixtures.Demo));
        var worst = json.RootElement.GetProperty("summary").GetProperty("worst_end_point").GetString();
        var doc = ReportFixtures.RenderDemo();
        var first = doc.QuerySelector("#worst article.path .path-id")!.TextContent;
        Assert.Equal(worst, first);
        Assert.Equal(worst, doc.QuerySelector(".worst-line .id")!.TextContent);
    }

    [Fact]
    public void Render_Demo_WorstPathsAreInDescendingOrderAndNumberAsAsked()
    {
        var doc = ReportFixtures.RenderDemo(new HtmlReportOptions { Worst = 4 });
        var totals = doc.QuerySelectorAll("#worst article.path .chip")
            .Select(c => double.Parse(c.TextContent.Split(' ')[0], CultureInfo.InvariantCulture)).ToArray();
        Assert.Equal(4, totals.Length);
        Assert.Equal(totals.OrderByDescending(t => t), totals);
        var expected = ReportFixtures.Demo.WorstEndPoints(4).Select(e => Math.Round(e.TotalDropPercent, 2)).ToArray();
        Assert.Equal(expected, totals);
    }

    [Fact]
    public void Render_Demo_BarSegmentsAreInProportionToTheRunsDrops()
    {
        var s = ReportFixtures.Demo;
        var worst = s.WorstEndPoints(1)[0];
        var doc = ReportFixtures.RenderDemo();
        var widths = doc.QuerySelector("#worst article.path svg.bar")!.QuerySelectorAll("rect.seg")
            .Select(r => double.Parse(r.GetAttribute("width")!, CultureInfo.InvariantCulture)).ToArray();
        var drops = worst.RunIndices.Select(i => Math.Max(0, s.Runs[i].DropPercent)).ToArray();
        Assert.Equal(drops.Length, widths.Length);
        var scale = widths.Sum() / drops.Sum();
        for (var i = 0; i < drops.Length; i++)
        {
            // Coordinates are rounded to 0.1 px.
            Assert.InRange(widths[i], (drops[i] * scale) - 0.15, (drops[i] * scale) + 0.15);
        }

        // The limit line stands at the limit on the same scale: total limit / (sum of drops) × (sum of widths).
        var limitX = double.Parse(doc.QuerySelector("svg.bar line.limit")!.GetAttribute("x1")!, CultureInfo.InvariantCulture);
        Assert.InRange(limitX, (s.Project.Rules.TotalLimitPercent * scale) - 0.15, (s.Project.Rules.TotalLimitPercent * scale) + 0.15);
    }

    [Fact]
    public void Render_Demo_DrawsEveryPieceOfEquipmentOnce()
    {
        var s = ReportFixtures.Demo;
        var doc = ReportFixtures.RenderDemo();
        var drawn = doc.QuerySelectorAll("svg.tree g.node .n-id").Select(t => t.TextContent).ToArray();
        var equipment = s.Network.Nodes.Where(n => n.Kind != NodeKind.EndPoint).Select(n => n.Id).ToArray();
        Assert.Equal(equipment.Order(StringComparer.Ordinal), drawn.Order(StringComparer.Ordinal));
        Assert.Equal(drawn.Length - 1, doc.QuerySelectorAll("svg.tree .edges path").Length);
    }

    [Fact]
    public void Render_Demo_MarksEachNodeByTheWorstTotalBelowIt()
    {
        var s = ReportFixtures.Demo;
        var doc = ReportFixtures.RenderDemo();
        var worstPath = s.WorstEndPoints(1)[0].Path.ToHashSet(StringComparer.Ordinal);
        foreach (var node in doc.QuerySelectorAll("svg.tree g.node"))
        {
            var id = node.QuerySelector(".n-id")!.TextContent;
            if (worstPath.Contains(id))
            {
                // The demo's worst end point is over the total limit, so every node on its path is "over".
                Assert.Contains("band-over", node.ClassName, StringComparison.Ordinal);
            }
        }

        Assert.Contains(doc.QuerySelectorAll("svg.tree g.node"), n => n.ClassList.Contains("band-ok"));
    }

    [Fact]
    public void Render_Demo_ReferencesNothingOutsideThePage()
    {
        var html = HtmlReport.Render(ReportFixtures.Demo, HtmlReportOptions.Default);
        var doc = ReportFixtures.Parse(html);
        foreach (var element in doc.All)
        {
            foreach (var name in new[] { "src", "href", "xlink:href", "srcset", "action", "data" })
            {
                var value = element.GetAttribute(name);
                if (value is null)
                {
                    continue;
                }

                Assert.DoesNotContain("http:", value, StringComparison.OrdinalIgnoreCase);
                Assert.DoesNotContain("https:", value, StringComparison.OrdinalIgnoreCase);
                Assert.DoesNotContain("//", value, StringComparison.Ordinal);
                Assert.StartsWith("#", value, StringComparison.Ordinal);
            }
        }

        foreach (var url in Regex.Matches(html, @"url\(([^)]*)\)").Select(m => m.Groups[1].Value))
        {
            Assert.DoesNotContain("//", url, StringComparison.Ordinal);
            Assert.DoesNotContain("http", url, StringComparison.OrdinalIgnoreCase);
        }

        Assert.DoesNotContain("@import", html, StringComparison.Ordinal);
        Assert.DoesNotContain("http:", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("https:", html, StringComparison.OrdinalIgnoreCase);
        Assert.Empty(doc.QuerySelectorAll("script, link, img, iframe, object, embed, image, font-face"));
        Assert.DoesNotContain("@font-face", html, StringComparison.Ordinal);
        Assert.Contains("@media print", html, StringComparison.Ordinal);
        Assert.Contains("@page", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_HostileNames_ShowAsTextAndAddNoScript()
    {
        const string hostile = "<script>alert(1)</script>";
        var yaml = ReportFixtures.OnePanel(
            "'Tom & \"Jerry\" <b>clinic</b>'",
            [
                "{ id: '1', name: '<script>alert(1)</script>', poles: 1, ocpd: 20, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }",
                "{ id: '<img src=x>', name: 'onload=\"x\" '' quote', poles: 1, ocpd: 20, load: { va: 500 }, run: { length: 5, size: 12 AWG } }",
            ],
            panel: "P<1>");
        var s = ReportFixtures.SolveText(yaml, "odd <file>.yaml");
        var html = HtmlReport.Render(s, new HtmlReportOptions { Date = "<i>today</i>" });
        var doc = ReportFixtures.Parse(html);

        Assert.Empty(doc.QuerySelectorAll("script, img, b, i"));
        Assert.Contains(doc.QuerySelectorAll("section.panel td"), td => td.TextContent == hostile);
        Assert.Contains(doc.QuerySelectorAll("section.panel td"), td => td.TextContent == "<img src=x>");
        Assert.Contains(doc.QuerySelectorAll("section.panel td"), td => td.TextContent == "onload=\"x\" ' quote");
        Assert.Equal("Tom & \"Jerry\" <b>clinic</b>", doc.QuerySelector("h1")!.TextContent);
        Assert.Equal("Tom & \"Jerry\" <b>clinic</b> · voltage-drop review", doc.Title);
        Assert.Contains(doc.QuerySelectorAll(".meta dd"), dd => dd.TextContent == "<i>today</i>");
        Assert.Contains(doc.QuerySelectorAll("svg.tree .n-id"), t => t.TextContent == "P<1>");
        Assert.DoesNotContain(hostile, html, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_Twice_GivesIdenticalBytes()
    {
        var first = HtmlReport.Render(ReportFixtures.Demo, HtmlReportOptions.Default);
        var second = HtmlReport.Render(ReportFixtures.SolveFile(ReportFixtures.DemoPath), HtmlReportOptions.Default);
        Assert.Equal(System.Text.Encoding.UTF8.GetBytes(first), System.Text.Encoding.UTF8.GetBytes(second));
    }

    [Fact]
    public void Render_WithoutDate_ShowsNoDate_WithDate_ShowsIt()
    {
        var plain = ReportFixtures.RenderDemo();
        Assert.DoesNotContain(plain.QuerySelectorAll(".meta dt"), dt => dt.TextContent == "Date");
        Assert.DoesNotMatch(new Regex(@"20\d\d-\d\d-\d\d"), plain.Body!.TextContent);

        var dated = ReportFixtures.RenderDemo(new HtmlReportOptions { Date = "2031-04-05" });
        Assert.Contains(dated.QuerySelectorAll(".meta dd"), dd => dd.TextContent == "2031-04-05");
    }

    [Fact]
    public void Render_Demo_HeaderCarriesFileHashRulesAndCaution()
    {
        var s = ReportFixtures.Demo;
        var doc = ReportFixtures.RenderDemo(new HtmlReportOptions { Title = "Review set B" });
        Assert.Equal("Review set B", doc.Title);
        var meta = doc.QuerySelector(".meta")!.TextContent;
        Assert.Contains(s.Project.File, meta, StringComparison.Ordinal);
        Assert.Contains(s.Project.Sha256, meta, StringComparison.Ordinal);
        Assert.Contains(RuleText.Summary(s.Project.Rules), meta, StringComparison.Ordinal);
        Assert.Equal(Caution.For(DistTree.Model.ElectricalCode.Nec), doc.QuerySelector("aside.caution p")!.TextContent);
    }

    [Fact]
    public void Render_Demo_SummaryCountsMatchTheSolution()
    {
        var s = ReportFixtures.Demo;
        var doc = ReportFixtures.RenderDemo();
        var tiles = doc.QuerySelectorAll(".tile").ToDictionary(t => t.QuerySelector(".tile-label")!.TextContent, t => t.QuerySelector(".tile-value")!.TextContent);
        Assert.Equal(s.Summary.EndPoints.ToString(CultureInfo.InvariantCulture), tiles["end points"]);
        Assert.Equal(s.Summary.Runs.ToString(CultureInfo.InvariantCulture), tiles["runs"]);
        Assert.Equal(s.Summary.Findings.ToString(CultureInfo.InvariantCulture), tiles["findings"]);

        var rows = doc.QuerySelectorAll("table.limits tbody tr").Select(r => r.QuerySelectorAll("td").Select(c => c.TextContent).ToArray()).ToArray();
        Assert.Equal(13, rows.Length);
        // The demo states no equipment rating (interrupting_ka): nothing to check there.
        Assert.Equal(["Interrupting rating", "stated rating", "0", "0", "–", "nothing to check"], rows.Single(r => r[0] == "Interrupting rating"));
        foreach (var (name, kind) in new[] { ("Fault clearing at the far end", FindingKind.FaultClearing), ("Feeder drop", FindingKind.FeederDrop), ("Branch-circuit drop", FindingKind.BranchDrop), ("Total drop to each point of use", FindingKind.TotalDrop), ("Ampacity (design current)", FindingKind.Ampacity), ("Overcurrent device", FindingKind.OcpdAboveAmpacity), ("Transformer loading", FindingKind.TransformerOverload), ("Motor starting dip at the terminals", FindingKind.MotorStart), ("Neutral ampacity", FindingKind.NeutralAmpacity), ("Overcurrent device rating (load)", FindingKind.DeviceBelowLoad), ("Equipment grounding conductor", FindingKind.GroundingConductor), ("No-load voltage under raising taps", FindingKind.NoLoadRise) })
        {
            var row = rows.Single(r => r[0] == name);
            var over = s.AllFindings.Count(f => f.Kind == kind);
            Assert.Equal(over.ToString(CultureInfo.InvariantCulture), row[3]);
            Assert.Equal(over > 0 ? "fail" : row[2] == "0" ? "nothing to check" : "pass", row[5]);
        }

        // Every finding is listed with the clause it cites and its location.
        var cells = doc.QuerySelectorAll("#findings table.finding-list tbody tr").Select(r => r.QuerySelectorAll("td")).ToArray();
        Assert.Equal(s.AllFindings.Select(f => f.Location.ToString()).Order(StringComparer.Ordinal), cells.Select(c => c[3].TextContent).Order(StringComparer.Ordinal));
        Assert.Equal(s.AllFindings.Select(f => f.Reference).Order(StringComparer.Ordinal), cells.Select(c => c[2].TextContent).Order(StringComparer.Ordinal));
    }

    [Fact]
    public void Render_LargeProject_ListsTheTenWorstCircuitsPerPanelAndCountsTheRest()
    {
        // 2,002 end points: above the 2,000 at which panel tables are cut to their worst ten.
        var circuits = Enumerable.Range(1, 1001).Select(i =>
            $"{{ id: '{i}', name: 'Load {i}', poles: 1, ocpd: 20, load: {{ va: 600 }}, run: {{ length: {(i == 1001 ? 90 : 5 + (i % 20))}, size: 12 AWG }} }}").ToArray();
        var yaml = ReportFixtures.OnePanel("Large", circuits, panel: "A").TrimEnd() + "\n" + $"""
              - id: B
                kind: panelboard
                from: SVC
                circuits:
            {string.Join("\n", circuits.Select(c => "          - " + c))}
            """;
        var s = ReportFixtures.SolveText(yaml);
        Assert.Equal(2002, s.EndPoints.Count);
        var doc = ReportFixtures.Parse(HtmlReport.Render(s, HtmlReportOptions.Default));
        var panels = doc.QuerySelectorAll("section.panel").ToArray();
        Assert.Equal(2, panels.Length);
        foreach (var panel in panels)
        {
            var rows = panel.QuerySelectorAll("table.circuits tbody tr:not(.row-more)").ToArray();
            Assert.Equal(10, rows.Length);
            Assert.Equal("1001", rows[0].QuerySelector("td")!.TextContent);
            var more = panel.QuerySelector("tr.row-more")!.TextContent;
            var overInRest = s.EndPoints.Where(e => e.Panel == panel.QuerySelector("h3 .id")!.TextContent)
                .OrderByDescending(e => e.TotalDropPercent).Skip(10).Count(e => e.Findings.Count > 0);
            Assert.Equal(0, overInRest);
            Assert.Equal("991 more, all within limits", more);
        }

        Assert.Contains("2002 end points", doc.QuerySelector("#panels .rule-note")!.TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_WithPlan_ShowsEveryChangeAndTheTotal()
    {
        var s = ReportFixtures.Demo;
        var plan = new UpsizePlan
        {
            Changes =
            [
                new UpsizeChange { RunId = "HG", Kind = RunResultKind.Feeder, SizeBefore = "8 AWG", SizeAfter = "3 AWG", SetsBefore = 1, SetsAfter = 1, DropPercentBefore = 6.49, DropPercentAfter = 2.1, CostAdded = 1234.5, GroundingNote = "grow the EGC in proportion" },
                new UpsizeChange { RunId = "LP4/32", Kind = RunResultKind.Branch, SizeBefore = "12 AWG", SizeAfter = "6 AWG", SetsBefore = 1, SetsAfter = 2, DropPercentBefore = 8.65, DropPercentAfter = 1.9, CostAdded = 99 },
            ],
            TotalCostAdded = 1333.5,
            CostUnit = "mm2·m",
            Unresolvable = [new UnresolvableLimit("X/1", "even 2000 kcmil leaves 5.2 %")],
            Before = s,
            After = s,
        };
        var doc = ReportFixtures.RenderDemo(new HtmlReportOptions { Plan = plan });
        var rows = doc.QuerySelectorAll("#plan table.plan tbody tr:not(.note-row)").ToArray();
        Assert.Equal(3, rows.Length);
        Assert.Equal("HG", rows[0].QuerySelector("td")!.TextContent);
        Assert.Contains("8 AWG → 3 AWG", rows[0].TextContent, StringComparison.Ordinal);
        Assert.Contains("1 → 2", rows[1].TextContent, StringComparison.Ordinal);
        Assert.Contains("grow the EGC in proportion", doc.QuerySelector("#plan tr.note-row")!.TextContent, StringComparison.Ordinal);
        Assert.Contains("1333.5", rows[2].TextContent, StringComparison.Ordinal);
        Assert.Contains("even 2000 kcmil leaves 5.2 %", doc.QuerySelector("#plan .unresolvable")!.TextContent, StringComparison.Ordinal);
        Assert.Null(ReportFixtures.RenderDemo().QuerySelector("#plan"));
    }

    [Fact]
    public void Render_DemoWithItsUpsizePlan_ListsEveryChangeOfThePlan()
    {
        var plan = Upsizer.Standard.Plan(ReportFixtures.Demo);
        Assert.NotEmpty(plan.Changes);
        var doc = ReportFixtures.RenderDemo(new HtmlReportOptions { Plan = plan });
        var runs = doc.QuerySelectorAll("#plan table.plan tbody tr.plan-change td:first-child").Select(td => td.TextContent).ToArray();
        Assert.Equal(plan.Changes.Select(c => c.RunId).Concat(plan.TapChanges.Select(t => t.TransformerId)), runs);
        Assert.Equal(plan.Unresolvable.Count, doc.QuerySelectorAll("#plan .unresolvable li").Length);
    }

    [Fact]
    public void Render_Demo_MethodSectionNamesEveryConductorDataSource()
    {
        var doc = ReportFixtures.RenderDemo();
        var sources = doc.QuerySelector("#method pre.sources")!.TextContent;
        foreach (var line in DistTree.Conductors.ConductorCatalog.Standard.Header.Where(l => l.Length > 0))
        {
            Assert.Contains(line, sources, StringComparison.Ordinal);
        }

        Assert.Contains("√3", doc.QuerySelector("#method .formulas")!.TextContent, StringComparison.Ordinal);
    }
}
