using System.Text.Json;
using DistTree.Reports;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Reports;

/// <summary>
/// The reach in the JSON run objects (<c>max_length_m</c>, <c>max_length_total_m</c>, metres), against figures worked by
/// hand from the effective-impedance formula (NEC Chapter 9 Table 9, note 2): a 1-pole load of S volt-amperes at unity
/// power factor on a line and a neutral of the same size drops ΔV = 2·I·R·L with I = S/V, so its drop reaches p % of V
/// at L = p·V² / (200·S·R), whatever its own length.
/// </summary>
public sealed class JsonReachTests
{
    // A 208Y/120 panel at the service (no feeder) with one 1-pole 1000 VA load at unity power factor over 20 m of 12 AWG,
    // its conductors at their 75 °C rating. V = 208/√3 V; R is the run's own, from the JSON, checked against NEC Chapter 9
    // Table 9's 12 AWG uncoated copper in PVC, 2.0 ohm/kft = 6.56 ohm/km (read; two figures, so 6.40 to 6.73).
    [Fact]
    public void Write_OneBranch_ReachIsTheHandWorkedLength()
    {
        var yaml = SolverHarness.OneCircuit("208Y/120", "metric", "{ id: \"1\", poles: 1, ocpd: 20, load: { va: 1000, pf: 1 }, run: { length: 20, size: 12 AWG } }");
        var run = Runs(yaml).Single(r => r.GetProperty("kind").GetString() == "branch");

        var ohmPerM = run.GetProperty("resistance_ohm_per_km").GetDouble() / 1000;
        Assert.InRange(ohmPerM * 1000, 6.40, 6.73);
        var voltsSquared = 208.0 * 208.0 / 3;
        var ownReach = 3 * voltsSquared / (200 * 1000 * ohmPerM);   // about 33.5 m
        var totalReach = 5 * voltsSquared / (200 * 1000 * ohmPerM); // the only run on the path: all 5 % is its own
        Assert.Equal(ownReach, run.GetProperty("max_length_m").GetDouble(), 0.011);
        Assert.Equal(totalReach, run.GetProperty("max_length_total_m").GetDouble(), 0.011);
        Assert.InRange(ownReach, 33, 34);
    }

    // A feeder's reach by the total: the slack below it (5 % less the end point's total) added to its own drop, scaled to
    // its length; by its own limit, L·3/drop. The transformer-free path has one end point, so its slack is the one slack.
    [Fact]
    public void Write_FeederAboveABranch_TotalReachTakesTheSlackBelow()
    {
        var yaml = SolverHarness.PanelOnFeeder(
            "length: 40, size: 6 AWG",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { va: 1500, pf: 1 }, run: { length: 25, size: 12 AWG } }");
        var runs = Runs(yaml);
        var feeder = runs.Single(r => r.GetProperty("kind").GetString() == "feeder");
        var branch = runs.Single(r => r.GetProperty("kind").GetString() == "branch");

        var feederDrop = feeder.GetProperty("drop_percent").GetDouble();
        var branchDrop = branch.GetProperty("drop_percent").GetDouble();
        Assert.Equal(40 * 3 / feederDrop, feeder.GetProperty("max_length_m").GetDouble(), 0.011 + (40 * 3 / feederDrop * 1e-4));
        var total = 40 * (5 - branchDrop) / feederDrop;
        Assert.Equal(total, feeder.GetProperty("max_length_total_m").GetDouble(), 0.011 + (total * 1e-4));
    }

    // A transformer has no reach: both are null (as the console and the HTML show a dash).
    [Fact]
    public void Write_Transformer_ReachIsNull()
    {
        using var doc = JsonDocument.Parse(JsonResults.Write(Analysis.Run(Path.Combine(TestPaths.RepoRoot, "projects", "quillfeather-medical.yaml")).Solution));
        var transformer = doc.RootElement.GetProperty("runs").EnumerateArray().First(r => r.GetProperty("kind").GetString() == "transformer");
        Assert.Equal(JsonValueKind.Null, transformer.GetProperty("max_length_m").ValueKind);
        Assert.Equal(JsonValueKind.Null, transformer.GetProperty("max_length_total_m").ValueKind);
    }

    private static JsonElement[] Runs(string yaml)
    {
        using var doc = JsonDocument.Parse(JsonResults.Write(SolverHarness.Solve(yaml)));
        return [.. doc.RootElement.GetProperty("runs").EnumerateArray().Select(r => r.Clone())];
    }
}
