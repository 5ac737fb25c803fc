using System.Text.Json;
using DistTree.Reports;
using DistTree.Sizing;
using DistTree.Solving;
using DistTree.Tests.Cli;
using DistTree.Tests.ProjectFiles;

namespace DistTree.Tests;

/// <summary>
/// A project's own tables carried through the pipeline: the catalogue judges the design, sizes the plan and proves it,
/// and each side of a comparison; the grounding table sets the minimum; the outputs name both. The project: 80 A on
/// 10 m of 3 AWG copper under a 100 A device (OwnTablesFolder). Under the embedded catalogue 3 AWG carries 100 A at 75 °C
/// (NEC Table 310.16, read), so nothing is found; under the project's (80 A) the 100 A device is above the ampacity and
/// is not the next standard rating above it (NEC 240.4(B), 240.6(A): 80 A is itself standard).
/// </summary>
public sealed class OwnTablesAnalysisTests : IDisposable
{
    private readonly OwnTablesFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Solve_OwnCatalogue_ItsAmpacityChangesAFinding()
    {
        var standard = Feeder(Solve(""));
        var own = Solve(", conductor_catalog: tables/own.tsv");

        Assert.Equal(100, standard.AmpacityA);
        Assert.Empty(standard.Findings);
        Assert.Equal(80, Feeder(own).AmpacityA);
        var finding = Assert.Single(Feeder(own).Findings);
        Assert.Equal(("ocpd_above_ampacity", "NEC 240.4(B)"), (finding.Code, finding.Reference));
        Assert.EndsWith("tables/own.tsv", own.CatalogName, StringComparison.Ordinal);
        Assert.Same(own.Project.Rules.ConductorCatalog, own.Code.Catalog);
    }

    // The project's table gives 6 AWG up to 100 A: the stated 8 AWG (the NEC table's size at 100 A, so no finding without
    // it) is now below the minimum; 3 AWG is at or below the smallest size the load needs, so no increase applies.
    [Fact]
    public void Solve_OwnGroundingTable_RaisesTheMinimum()
    {
        var standard = Feeder(Solve(""));
        var own = Feeder(Solve(", grounding_table: tables/ground.tsv"));

        Assert.Equal("8 AWG", standard.GroundMinSize);
        Assert.Empty(standard.Findings);
        Assert.Equal("6 AWG", own.GroundMinSize);
        var finding = Assert.Single(own.Findings);
        Assert.Equal(("grounding_conductor", "NEC 250.122"), (finding.Code, finding.Reference));
        Assert.Contains("the stated 8 AWG equipment grounding conductor is smaller than the 6 AWG it needs (the project's table's size for a 100 A device)", finding.Message, StringComparison.Ordinal);
    }

    // The sizer and its proof use the project's catalogue: under it 3 AWG (80 A) cannot sit under the 100 A device, 2 AWG
    // (115 A, unchanged from NEC Table 310.16) can; under the embedded one nothing needs to change.
    [Fact]
    public void Plan_OwnCatalogue_SizerAndProofUseIt()
    {
        Assert.Empty(Upsizer.Standard.Plan(Solve("")).Changes);
        var plan = Upsizer.Standard.Plan(Solve(", conductor_catalog: tables/own.tsv"));

        var change = Assert.Single(plan.Changes);
        Assert.Equal(("P", "3 AWG", "2 AWG"), (change.RunId, change.SizeBefore, change.SizeAfter));
        Assert.False(plan.After.HasFindings);
        Assert.Same(plan.Before.Project.Rules.ConductorCatalog, plan.After.Code.Catalog);
    }

    // compare: each revision is solved with its own tables, so bringing the catalogue is a change that adds a finding.
    [Fact]
    public void Compare_NewRevisionBringsACatalogue_ItsFindingIsNew()
    {
        var old = _folder.Write("old.yaml", OwnTablesFolder.Project());
        var @new = _folder.Write("new.yaml", OwnTablesFolder.Project(", conductor_catalog: tables/own.tsv"));

        var result = CliRunner.Run("compare", old, @new);

        Assert.Equal(1, result.ExitCode);
        Assert.Contains("ocpd_above_ampacity", result.Out, StringComparison.Ordinal);
        Assert.Contains("rules.conductor_catalog", result.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Json_OwnTables_NamedInTheRulesAndValid()
    {
        using var doc = JsonDocument.Parse(JsonResults.Write(Solve(", conductor_catalog: tables/own.tsv, grounding_table: tables/ground.tsv")));

        Assert.True(Reports.JsonResultsTests.Schema.Evaluate(doc.RootElement).IsValid);
        var rules = doc.RootElement.GetProperty("rules");
        var catalog = rules.GetProperty("conductor_catalog");
        Assert.EndsWith("tables/own.tsv", catalog.GetProperty("file").GetString(), StringComparison.Ordinal);
        Assert.Equal(OwnTablesFolder.CatalogueSource, catalog.GetProperty("header")[0].GetString());
        var table = rules.GetProperty("grounding_table");
        Assert.EndsWith("tables/ground.tsv", table.GetProperty("file").GetString(), StringComparison.Ordinal);
        Assert.Equal(["Invented test table, not a code's."], table.GetProperty("header").EnumerateArray().Select(h => h.GetString()));
    }

    [Fact]
    public void Json_NoTables_NoneInTheRules()
    {
        using var doc = JsonDocument.Parse(JsonResults.Write(Solve("")));
        var rules = doc.RootElement.GetProperty("rules");
        Assert.False(rules.TryGetProperty("conductor_catalog", out _));
        Assert.False(rules.TryGetProperty("grounding_table", out _));
    }

    [Fact]
    public void Html_OwnTables_MethodSectionNamesThem()
    {
        var html = HtmlReport.Render(Solve(", conductor_catalog: tables/own.tsv, grounding_table: tables/ground.tsv"), new HtmlReportOptions());

        Assert.Contains("This project brings its own conductor data (<code>rules: conductor_catalog</code>)", html, StringComparison.Ordinal);
        Assert.Contains(OwnTablesFolder.CatalogueSource, html, StringComparison.Ordinal);
        Assert.Contains("<h3>Grounding conductor table</h3>", html, StringComparison.Ordinal);
        Assert.Contains("in place of NEC Table 250.122", html, StringComparison.Ordinal);
        Assert.Contains("<td><code>grounding_table</code></td>", html, StringComparison.Ordinal);
    }

    private static RunResult Feeder(Solution s) => s.Runs.Single(r => r.Id == "P");

    private Solution Solve(string rules) => Analysis.Run(_folder.Write("p.yaml", OwnTablesFolder.Project(rules))).Solution;
}
