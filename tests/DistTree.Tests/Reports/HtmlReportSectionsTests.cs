using System.Globalization;
using DistTree.Comparing;
using DistTree.Model;
using DistTree.Reports;
using DistTree.Sizing;
using DistTree.Solving;
using DistTree.Tests.Comparing;

namespace DistTree.Tests.Reports;

/// <summary>The report's sections beyond the solution's own: the plan's outcome, a comparison, motor starting, the load flow, points.</summary>
public sealed class HtmlReportSectionsTests
{
    private static string P(double value) => value.ToString("0.00", CultureInfo.InvariantCulture);

    private static Comparison SharedComparison(out Solution after)
    {
        var before = ReportFixtures.SolveText(ComparisonProjects.Shared(), "old.yaml");
        // The new revision adds a sub-panel (equipment and a circuit) and lengthens LP1/2 to 210 m of 12 AWG,
        // far past the 3 % branch limit (about 2 % per 40 m at 10 A on 12 AWG copper; common practice, memory).
        after = ReportFixtures.SolveText(
            ComparisonProjects.Shared(ComparisonProjects.SubPanel).Replace("length: 18, size: 12 AWG", "length: 210, size: 12 AWG", StringComparison.Ordinal),
            "new.yaml");
        return RevisionComparer.Compare(before, after);
    }

    [Fact]
    public void Render_DemoWithItsUpsizePlan_ShowsTheOutcomeAfterThePlan()
    {
        var plan = Upsizer.Standard.Plan(ReportFixtures.Demo);
        var doc = ReportFixtures.RenderDemo(new HtmlReportOptions { Plan = plan });
        var after = doc.QuerySelector("#plan .after-plan")!;
        var tiles = after.QuerySelectorAll(".tile-value").Select(t => t.TextContent).ToArray();
        Assert.Equal($"{plan.Before.Summary.Findings} → {plan.After.Summary.Findings}", tiles[0]);
        Assert.Equal($"{P(plan.Before.Summary.WorstTotalDropPercent)} → {P(plan.After.Summary.WorstTotalDropPercent)} %", tiles[1]);
        Assert.Contains(plan.After.Summary.WorstEndPoint!, after.QuerySelectorAll(".tile-label")[1].TextContent, StringComparison.Ordinal);
        var verdict = after.QuerySelector(".verdict")!;
        Assert.Equal(plan.After.HasFindings ? "verdict verdict-fail" : "verdict verdict-pass", verdict.ClassName);
        // Every change of the plan has its row, with its sizes before and after.
        var rows = doc.QuerySelectorAll("#plan table.plan tr.plan-change").ToArray();
        Assert.Equal(plan.Changes.Count + plan.TapChanges.Count, rows.Length);
        for (var i = 0; i < plan.Changes.Count; i++)
        {
            Assert.Equal(plan.Changes[i].RunId, rows[i].QuerySelector("td")!.TextContent);
            Assert.Contains($"{plan.Changes[i].SizeBefore} → {plan.Changes[i].SizeAfter}", rows[i].TextContent, StringComparison.Ordinal);

            // A table row, not the comparison's inline badge (.change is display: inline-block, which collapses a row).
            Assert.DoesNotContain("change", rows[i].ClassList);
        }

        // The total names its unit.
        var total = doc.QuerySelector("#plan table.plan tr.row-total")!.QuerySelectorAll("td")[1].TextContent;
        Assert.EndsWith(" mm2·m", total, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_WithComparison_ListsTheAddedCircuitAndTheNewlyFailingEndPoint()
    {
        var comparison = SharedComparison(out var after);
        Assert.Contains(comparison.Circuits, c => c.Id == "SUB/1" && c.Change == ChangeKind.Added);
        var doc = ReportFixtures.Parse(HtmlReport.Render(after, new HtmlReportOptions { Comparison = comparison }));
        var section = doc.QuerySelector("#comparison")!;
        Assert.Equal("2", section.QuerySelector("h2 .num")!.TextContent);
        Assert.Equal("comparison", doc.QuerySelector("#summary")!.NextElementSibling!.Id);

        var elements = section.QuerySelectorAll("table.elements tbody tr")
            .ToDictionary(r => r.QuerySelector("td")!.TextContent, r => r.QuerySelectorAll("td")[1].TextContent);
        Assert.Equal("added", elements["SUB/1"]);
        Assert.Equal("added", elements["SUB"]);
        Assert.Equal("changed", elements["LP1/2"]);
        Assert.Contains("run.length 18 m → 210 m", section.QuerySelectorAll("table.elements tbody tr").Single(r => r.QuerySelector("td")!.TextContent == "LP1/2").TextContent, StringComparison.Ordinal);

        var failing = section.QuerySelectorAll("#cmp-newly-failing tbody tr").ToArray();
        var row = Assert.Single(failing, r => r.QuerySelector("td")!.TextContent == "LP1/2");
        var delta = comparison.EndPoints.Single(e => e.Id == "LP1/2");
        Assert.Equal(StatusChange.NewlyFailing, delta.Status);
        Assert.Equal($"{P(delta.TotalDropPercent.Before)} → {P(delta.TotalDropPercent.After)}", row.QuerySelectorAll("td")[2].TextContent);
        Assert.Equal(ComparisonText.Signed(delta.TotalDropPercent.Change, 2), row.QuerySelectorAll("td")[3].TextContent);
        Assert.StartsWith("newly failing", row.QuerySelectorAll("td")[4].TextContent, StringComparison.Ordinal);
        // The end point links to its panel table in the same page.
        var href = row.QuerySelector("a")!.GetAttribute("href")!;
        Assert.NotNull(doc.GetElementById(href[1..]));

        // The largest change is LP1/2's, and the feeders it loads more are listed upstream.
        Assert.Equal("LP1/2", section.QuerySelector("#cmp-largest tbody tr td")!.TextContent);
        var upstream = section.QuerySelectorAll("table.upstream tbody tr td:first-child").Select(td => td.TextContent).ToArray();
        Assert.Contains("LP1", upstream);
        Assert.Contains("MSB", upstream);
        var newFindings = section.QuerySelectorAll("#cmp-new-findings tbody tr td:first-child").Select(td => td.TextContent).ToArray();
        Assert.Equal(comparison.NewFindings.Select(f => f.Subject), newFindings);
        Assert.Contains("LP1/2", newFindings);
        Assert.Equal("verdict verdict-fail", section.QuerySelector(".verdict")!.ClassName);
        Assert.Null(ReportFixtures.RenderDemo().QuerySelector("#comparison"));
    }

    [Fact]
    public void Render_Demo_MotorTableListsEveryMotorWithItsStartingFigures()
    {
        var s = ReportFixtures.Demo;
        var doc = ReportFixtures.RenderDemo();
        var rows = doc.QuerySelectorAll("#motors table.motors tbody tr").ToArray();
        var hp = s.EndPoints.Where(e => s.Network.Nodes[e.NodeIndex].Circuit!.Load.Kind == LoadKind.Hp).Select(e => e.Id).ToArray();
        Assert.True(hp.Length >= 10, "the demo has motors given in hp");
        var listed = rows.Select(r => r.QuerySelector("td")!.TextContent).ToArray();
        Assert.Equal(s.EndPoints.Where(e => e.MotorStart is not null).Select(e => e.Id).Order(StringComparer.Ordinal), listed.Order(StringComparer.Ordinal));
        Assert.Subset(listed.ToHashSet(), hp.ToHashSet());

        foreach (var r in rows)
        {
            var cells = r.QuerySelectorAll("td").Select(c => c.TextContent).ToArray();
            var m = s.EndPoints.Single(e => e.Id == cells[0]).MotorStart!;
            Assert.Equal((m.LockedRotorVa / 1000).ToString("0.0", CultureInfo.InvariantCulture), cells[2]);
            Assert.Equal(P(m.TerminalDipPercent), cells[3]);
            Assert.Equal(P(m.PanelDipPercent), cells[4]);
            Assert.Equal(m.LimitPercent.ToString("0.##", CultureInfo.InvariantCulture), cells[5]);
            Assert.Equal(m.TerminalDipPercent > m.LimitPercent ? "fail" : "pass", cells[6]);
        }

        // DP/1 is 40 hp with code letter G: 5.6 to 6.29 kVA per hp locked rotor (NEC Table 430.7(B); recalled from memory),
        // so 224 to 251.6 kVA.
        var elevator = rows.Single(r => r.QuerySelector("td")!.TextContent == "DP/1").QuerySelectorAll("td")[2].TextContent;
        Assert.InRange(double.Parse(elevator, CultureInfo.InvariantCulture), 224, 251.6);
        Assert.Contains(doc.QuerySelectorAll("table.limits tbody tr"), tr => tr.TextContent.Contains("Motor starting dip", StringComparison.Ordinal));
    }

    [Fact]
    public void Render_Demo_ShowsTheLoadFlowBesideThePercentSum()
    {
        var s = ReportFixtures.Demo;
        Assert.Equal(SolutionMethod.PercentSum, s.Project.Rules.Method);
        Assert.True(s.LoadFlow.Converged);
        var doc = ReportFixtures.RenderDemo();
        var line = doc.QuerySelector("#summary .method-line")!.TextContent;
        Assert.Contains("percent sum", line, StringComparison.Ordinal);
        Assert.Contains($"converged in {s.LoadFlow.Iterations} sweeps (tolerance 1e-6 pu)", line, StringComparison.Ordinal);
        Assert.Equal("load flow %", doc.QuerySelector("section.panel table.circuits th.other")!.TextContent);

        // Beside the table, one line says what each method is: the load flow is unbalanced, not "exact".
        var lede = string.Concat(doc.QuerySelectorAll("#panels .lede").Select(p => p.TextContent));
        Assert.Contains("The percent sum adds each run's drop by the effective-impedance formula", lede, StringComparison.Ordinal);
        Assert.Contains("the load flow solves every line and neutral of the tree together, unbalanced", lede, StringComparison.Ordinal);
        Assert.DoesNotContain("exact", doc.QuerySelector("#panels")!.TextContent, StringComparison.OrdinalIgnoreCase);

        var checkedRows = 0;
        foreach (var panel in doc.QuerySelectorAll("section.panel"))
        {
            var panelId = panel.QuerySelector("h3 .id")!.TextContent;
            foreach (var row in panel.QuerySelectorAll("table.circuits tbody tr:not(.row-more)"))
            {
                var e = s.EndPoints.Single(x => x.Id == $"{panelId}/{row.QuerySelector("td")!.TextContent}");
                Assert.Equal(P(e.TotalDropPercent), row.QuerySelector("td.total")!.TextContent);
                Assert.Equal(P(e.LoadFlowTotalDropPercent!.Value), row.QuerySelector("td.other")!.TextContent);
                checkedRows++;
            }
        }

        Assert.Equal(s.EndPoints.Count, checkedRows);
        Assert.Contains("backward/forward sweep", doc.QuerySelector("#method .formulas")!.TextContent, StringComparison.Ordinal);
        Assert.Contains("S = S₀·|V|²", doc.QuerySelector("#method .formulas")!.TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_LoadFlowInForce_ShowsThePercentSumAsTheOtherMethod()
    {
        var yaml = ReportFixtures.OnePanel("Flow", ["{ id: '1', name: Heater, poles: 1, ocpd: 20, load: { va: 1800 }, run: { length: 30, size: 12 AWG } }"])
            .Replace("service:", "rules:\n  method: load_flow\nservice:", StringComparison.Ordinal);
        var s = ReportFixtures.SolveText(yaml);
        Assert.Equal(SolutionMethod.LoadFlow, s.Project.Rules.Method);
        var doc = ReportFixtures.Parse(HtmlReport.Render(s, HtmlReportOptions.Default));
        Assert.Contains("load flow", doc.QuerySelector("#summary .method-line strong")!.TextContent, StringComparison.Ordinal);
        Assert.Equal("percent sum %", doc.QuerySelector("section.panel th.other")!.TextContent);
        Assert.Equal(P(s.EndPoints[0].PercentSumTotalDropPercent), doc.QuerySelector("section.panel td.other")!.TextContent);
        Assert.Null(doc.QuerySelector("#motors"));
    }

    [Fact]
    public void Render_Demo_MarksCircuitsWithLoadsAlongTheRun()
    {
        var s = ReportFixtures.Demo;
        var withPoints = s.EndPoints.Where(e => s.Network.Nodes[e.NodeIndex].Circuit!.Points.Count > 0).ToArray();
        Assert.NotEmpty(withPoints);
        var doc = ReportFixtures.RenderDemo();
        var tagged = new List<string>();
        foreach (var panel in doc.QuerySelectorAll("section.panel"))
        {
            var panelId = panel.QuerySelector("h3 .id")!.TextContent;
            foreach (var row in panel.QuerySelectorAll("table.circuits tbody tr").Where(r => r.QuerySelector(".tag") is not null))
            {
                var id = $"{panelId}/{row.QuerySelector("td")!.TextContent}";
                tagged.Add(id);
                var count = s.Network.Nodes[s.EndPoints.Single(e => e.Id == id).NodeIndex].Circuit!.Points.Count;
                Assert.Equal($"{count} points", row.QuerySelector(".tag")!.TextContent);
            }
        }

        Assert.Equal(withPoints.Select(e => e.Id).Order(StringComparer.Ordinal), tagged.Order(StringComparer.Ordinal));
    }

    [Fact]
    public void Render_HostileNamesInComparisonAndMotors_ShowAsText()
    {
        const string hostile = "<script>alert(1)</script>";
        var motor = "{ id: 'M<1>', name: '<script>alert(1)</script>', poles: 3, ocpd: 20, load: { hp: 2, pf: 0.8 }, run: { length: 10, size: 12 AWG } }";
        var added = "{ id: '<img src=x>', name: 'a \"quoted\" & <b>bold</b> name', poles: 1, ocpd: 20, load: { va: 500 }, run: { length: 5, size: 12 AWG } }";
        var before = ReportFixtures.SolveText(ReportFixtures.OnePanel("Odd", [motor]), "old <a>.yaml");
        var after = ReportFixtures.SolveText(ReportFixtures.OnePanel("Odd", [motor, added]), "new <a>.yaml");
        var html = HtmlReport.Render(after, new HtmlReportOptions { Comparison = RevisionComparer.Compare(before, after) });
        var doc = ReportFixtures.Parse(html);

        Assert.Empty(doc.QuerySelectorAll("script, img, b, a[href^='x']"));
        Assert.DoesNotContain(hostile, html, StringComparison.Ordinal);
        Assert.Contains(doc.QuerySelectorAll("#motors td"), td => td.TextContent == hostile);
        Assert.Contains(doc.QuerySelectorAll("#motors td"), td => td.TextContent == "P/M<1>");
        Assert.Contains(doc.QuerySelectorAll("#comparison table.elements td"), td => td.TextContent == "P/<img src=x>");
        Assert.Contains(doc.QuerySelectorAll("#comparison ul.fields li"), li => li.TextContent == "name a \"quoted\" & <b>bold</b> name");
        Assert.Contains(doc.QuerySelectorAll("#comparison code"), c => c.TextContent == "old <a>.yaml");
    }

    [Fact]
    public void Render_WithPlanAndComparisonTwice_GivesIdenticalBytes()
    {
        var first = Render();
        var second = Render();
        Assert.Equal(System.Text.Encoding.UTF8.GetBytes(first), System.Text.Encoding.UTF8.GetBytes(second));

        static string Render()
        {
            var comparison = SharedComparison(out var after);
            var plan = Upsizer.Standard.Plan(after);
            return HtmlReport.Render(after, new HtmlReportOptions { Comparison = comparison, Plan = plan, Date = "2031-04-05" });
        }
    }

    [Fact]
    public void Render_WithEverySection_NumbersThemInOrder()
    {
        var comparison = SharedComparison(out var after);
        var doc = ReportFixtures.Parse(HtmlReport.Render(after, new HtmlReportOptions { Comparison = comparison, Plan = Upsizer.Standard.Plan(after) }));
        var ids = doc.QuerySelectorAll("main > section").Select(s => s.Id!).ToArray();
        Assert.Equal(new[] { "summary", "comparison", "tree", "worst", "panels", "faults", "findings", "plan", "method" }, ids);
        var numbers = doc.QuerySelectorAll("main > section > h2 .num").Select(n => n.TextContent).ToArray();
        Assert.Equal(Enumerable.Range(1, ids.Length).Select(i => i.ToString(CultureInfo.InvariantCulture)), numbers);
        var toc = doc.QuerySelectorAll("nav.toc a").Select(a => a.GetAttribute("href")![1..]).ToArray();
        Assert.Equal(ids, toc);
    }
}
