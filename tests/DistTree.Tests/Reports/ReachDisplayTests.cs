using System.Globalization;
using System.Text.Json;
using DistTree.Reports;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Tests.Reports;

/// <summary>
/// The reach (the longest run that meets its limit; issue 19) in the console's worst paths and the HTML panel tables:
/// in the project's length unit, equal to the JSON's figure (metres) converted at 0.3048 m per foot (the international
/// foot), and below the run's length where the run is over its limit.
/// </summary>
public sealed class ReachDisplayTests
{
    // Circuit 1 well within its 3 % limit; circuit 2, a long 12 AWG run at 16 A, far over it.
    private static string Project(string units) => $$"""
        disttree: 1
        project: { name: Reach, units: {{units}} }
        service: { id: SVC, system: 208Y/120 }
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            circuits:
              - { id: "1", poles: 1, load: { va: 600, pf: 1.0 }, run: { length: 20, size: 10 AWG } }
              - { id: "2", poles: 1, load: { va: 1900, pf: 1.0 }, run: { length: 90, size: 12 AWG } }
        """;

    [Theory]
    [InlineData("imperial", "ft", 1 / UnitFactors.MetresPerFoot, 0.5)]
    [InlineData("metric", "m", 1.0, 0.05)]
    public void Console_Reach_InTheProjectsUnitEqualToTheJsonFigure(string units, string unit, double perMetre, double rounding)
    {
        var s = ReportFixtures.SolveText(Project(units));
        var json = JsonFigures(s);
        var text = new StringWriter();
        ConsoleReport.WriteAnalysis(text, s, 10);
        var lines = text.ToString().Split('\n');

        foreach (var id in new[] { "P/1", "P/2" })
        {
            var line = lines.First(l => l.TrimStart().StartsWith($"reach {unit}  ", StringComparison.Ordinal) && l.Contains($" {id} ", StringComparison.Ordinal));
            var entry = line[(line.IndexOf($" {id} ", StringComparison.Ordinal) + id.Length + 2)..].Split("  +  ")[0].Split(' ');
            var reach = entry[0].Split('/');
            Assert.Equal(json[id].Own * perMetre, Number(reach[0]), Slack(rounding, perMetre));
            Assert.Equal(json[id].Total * perMetre, Number(reach[1]), Slack(rounding, perMetre));
            Assert.Equal(json[id].Length * perMetre, Number(entry[2]), Slack(rounding, perMetre));
            Assert.Equal(Number(reach[0]) < Number(entry[2]), entry.Length > 3 && entry[3] == "over");
        }
    }

    [Theory]
    [InlineData("imperial", "ft", 1 / UnitFactors.MetresPerFoot, 0.5)]
    [InlineData("metric", "m", 1.0, 0.05)]
    public void Html_PanelTable_ReachInTheProjectsUnitEqualToTheJsonFigure(string units, string unit, double perMetre, double rounding)
    {
        var s = ReportFixtures.SolveText(Project(units));
        var json = JsonFigures(s);
        var doc = ReportFixtures.Parse(HtmlReport.Render(s, HtmlReportOptions.Default));
        var table = doc.QuerySelector("#panels table.circuits")!;
        var heads = table.QuerySelectorAll("thead th").Select(h => h.TextContent).ToList();
        var (own, total, length) = (heads.IndexOf($"Reach {unit}"), heads.IndexOf($"to total {unit}"), heads.IndexOf("Length m"));
        Assert.True(own > 0 && total == own + 1, string.Join("|", heads));

        foreach (var row in table.QuerySelectorAll("tbody tr"))
        {
            var cells = row.QuerySelectorAll("td");
            var id = $"P/{cells[0].TextContent}";
            Assert.Equal(json[id].Own * perMetre, Number(cells[own].TextContent), Slack(rounding, perMetre));
            Assert.Equal(json[id].Total * perMetre, Number(cells[total].TextContent), Slack(rounding, perMetre));
            var over = json[id].Own < json[id].Length;
            Assert.Equal(over, cells[own].ClassList.Contains("cell-over"));
            Assert.Equal(over, Number(cells[own].TextContent) / perMetre < Number(cells[length].TextContent));
        }

        Assert.Contains($"\"Reach {unit}\" is the length at which", doc.QuerySelector("#panels")!.TextContent, StringComparison.Ordinal);
    }

    // A run over its own limit: its reach (L·limit/drop, Reach.cs) is below its length, and the console marks it.
    [Fact]
    public void Reach_RunOverItsLimit_BelowItsLength()
    {
        var s = ReportFixtures.SolveText(Project("metric"));
        var over = s.Runs.Single(r => r.Id == "P/2");
        var within = s.Runs.Single(r => r.Id == "P/1");

        Assert.True(over.DropPercent > over.LimitPercent, $"{over.DropPercent} %");
        Assert.True(over.MaxLengthM < over.LengthM);
        Assert.Equal(over.LengthM * over.LimitPercent!.Value / over.DropPercent, over.MaxLengthM!.Value, 9);
        Assert.True(within.MaxLengthM > within.LengthM);
        var text = new StringWriter();
        ConsoleReport.WriteAnalysis(text, s, 10);
        Assert.Contains(string.Create(CultureInfo.InvariantCulture, $" P/2 {over.MaxLengthM:0.0}/"), text.ToString(), StringComparison.Ordinal);
        Assert.Matches(@"P/2 [0-9.]+/[0-9.]+ of 90\.0 over", text.ToString());
    }

    // Each run's reach and length as the JSON gives them (metres).
    private static Dictionary<string, (double Own, double Total, double Length)> JsonFigures(Solution s)
    {
        using var json = JsonDocument.Parse(JsonResults.Write(s));
        return json.RootElement.GetProperty("runs").EnumerateArray().Where(r => r.GetProperty("max_length_m").ValueKind == JsonValueKind.Number).ToDictionary(
            r => r.GetProperty("id").GetString()!,
            r => (r.GetProperty("max_length_m").GetDouble(), r.GetProperty("max_length_total_m").GetDouble(), r.GetProperty("length_m").GetDouble()));
    }

    // The shown figure's rounding plus the JSON's (0.01 m) in the shown unit.
    private static double Slack(double rounding, double perMetre) => rounding + (0.005 * perMetre) + 1e-9;

    private static double Number(string text) => double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);
}
