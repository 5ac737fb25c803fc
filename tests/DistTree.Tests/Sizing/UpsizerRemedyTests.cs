using System.Globalization;
using System.Text.RegularExpressions;
using DistTree.Conductors;
using DistTree.Sizing;
using DistTree.Solving;
using DistTree.Tests.Cli;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Sizing;

/// <summary>What a plan may propose beside conductors, and what it will not: terminal limits, transformer taps, and what it names where no allowed change clears a path.</summary>
public sealed partial class UpsizerRemedyTests
{
    private static UpsizePlan PlanFor(string yaml) => Upsizer.Standard.Plan(SolverHarness.Solve(yaml));

    // A 45 kVA transformer whose regulation (about 2.7 %) puts one long 20 A circuit over the 5 % total; the runs meet
    // their own limits. Invented demo data; the keys given are added to the transformer's mapping and to the top level.
    internal static string Transformer(string transformerKeys = "", string top = "") => $$"""
        disttree: 1
        project: { name: Tap, units: imperial }
        {{top}}
        service: { id: SVC, system: 480Y/277 }
        equipment:
          - id: T1
            kind: transformer
            from: SVC
            kva: 45
            secondary: 208Y/120
            impedance_percent: 5
            x_r: 2
            {{transformerKeys}}
            feeder: { length: 50, size: 6 AWG, ocpd: 60 }
          - id: P
            kind: panelboard
            from: T1
            feeder: { length: 60, size: 1/0 AWG, ocpd: 150 }
            circuits:
              - { id: "1", poles: 3, ocpd: 100, load: { amps: 75, pf: 0.9 }, run: { length: 40, size: 1 AWG } }
              - { id: "2", poles: 1, ocpd: 20, load: { amps: 16 }, run: { length: 60, size: 12 AWG } }
        """;

    // A −2.5 % tap raises the secondary by 2.5/97.5 = 2.56 % of its voltage (the turns ratio over (1 + tap), IEEE C57.12.80's
    // definition of a tap as a change of turns): the transformer's regulation falls by that, and no conductor is needed.
    [Fact]
    public void Plan_BoostTapClearsTheTotal_SetsTheTapAndNoConductor()
    {
        var plan = PlanFor(Transformer());
        Assert.Contains(plan.Before.AllFindings, f => f.Code == "total_drop");
        Assert.Empty(plan.Changes);
        var tap = Assert.Single(plan.TapChanges);
        Assert.Equal(("T1", 0.0, -2.5, 0.0), (tap.TransformerId, tap.TapPercentBefore, tap.TapPercentAfter, tap.CostAdded));
        Assert.Equal(100 * 2.5 / 97.5, tap.RegulationPercentBefore - tap.RegulationPercentAfter, 1);
        Assert.False(plan.After.HasFindings);
        Assert.Equal(0, plan.TotalCostAdded);
    }

    [Fact]
    public void Plan_TapCostAboveTheConductors_TakesTheConductor()
    {
        var plan = PlanFor(Transformer(top: "sizing: { tap_cost: 1000000 }"));
        Assert.Empty(plan.TapChanges);
        Assert.Contains(plan.Changes, c => c.RunId == "P/2");
        Assert.False(plan.After.HasFindings);
    }

    [Fact]
    public void Plan_TapCostBelowTheConductors_TakesTheTapAtItsCost()
    {
        var plan = PlanFor(Transformer(top: "sizing: { tap_cost: 1 }"));
        Assert.Equal(1.0, Assert.Single(plan.TapChanges).CostAdded);
        Assert.Equal(1.0, plan.TotalCostAdded);
    }

    [Theory]
    [InlineData("tap_range_percent: 0", "")]
    [InlineData("", "rules: { transformer_drop: new_origin }")]
    public void Plan_TapNotAChoice_KeepsTheTap(string transformerKeys, string top)
    {
        var plan = PlanFor(Transformer(transformerKeys, top));
        Assert.Empty(plan.TapChanges);
    }

    // A 20 A device's terminals take up to 8 AWG (terminal-limits.tsv, recalled); 16 A over 180 ft at 120 V needs 6 AWG
    // for 3 % (2 × 16 A × 54.9 m × 1.31 Ω/km = 2.3 V at 6 AWG; 3.6 V at 8 AWG, over the 3.6 V limit: NEC Chapter 9 Table 8
    // resistances, read): the plan proposes nothing beyond 8 AWG and says what it would take.
    [Fact]
    public void Plan_OwnLimitNeedsMoreThanTheTerminalsTake_NothingBeyondThemAndTheReasonGiven()
    {
        var plan = PlanFor(SolverHarness.OneCircuit("120/240", "imperial", "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 16 }, run: { length: 180, size: 12 AWG } }"));
        Assert.All(plan.Changes, c => Assert.True(ConductorSize.Parse(c.SizeAfter) <= ConductorSize.Parse("8 AWG"), c.SizeAfter));
        var u = Assert.Single(plan.Unresolvable, u => u.Subject == "P/1" && u.Message.StartsWith("branch circuit", StringComparison.Ordinal));
        Assert.Contains("1×6 AWG, is beyond the terminal limit of its 20 A device (1×8 AWG; terminal-limits.tsv (embedded))", u.Message, StringComparison.Ordinal);
        Assert.Contains("a device of 60 A takes it", u.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Plan_ProjectsOwnTerminalTable_TakesTheLargerSize()
    {
        using var folder = new TempFolder();
        var project = folder.File("p.yaml");
        File.WriteAllText(project, SolverHarness.OneCircuit("120/240", "imperial", "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 16 }, run: { length: 180, size: 12 AWG } }"));
        TempFolder.OpenTerminals(project);
        var plan = Upsizer.Standard.Plan(Analysis.Run(project).Solution);
        Assert.Equal("6 AWG", Assert.Single(plan.Changes).SizeAfter);
        Assert.False(plan.After.HasFindings);
    }

    // A feeder held to 1/0 AWG by its 100 A device and a branch circuit held to 8 AWG by its 20 A device: each meets its own
    // 3 % at those sizes, the total of both does not. The plan names the run whose shortening clears it; the test shortens
    // that run by the length stated and plans again: the solver, not the remedy's arithmetic, judges it.
    [Fact]
    public void Plan_NoAllowedChangeClearsAPath_NamesAShorteningThatDoes()
    {
        static string Project(double branchFt, double feederFt) => SolverHarness.PanelOnFeeder(
            FormattableString.Invariant($"length: {feederFt}, size: 3 AWG, ocpd: 100"),
            FormattableString.Invariant($"{{ id: \"1\", poles: 1, ocpd: 20, load: {{ amps: 16 }}, run: {{ length: {branchFt}, size: 12 AWG }} }}"))
            .Replace("units: metric", "units: imperial", StringComparison.Ordinal);
        var plan = PlanFor(Project(130, 800));
        var u = Assert.Single(plan.Unresolvable, u => u.Subject == "P/1");
        var m = Shortening().Match(u.Message);
        Assert.True(m.Success, u.Message);
        var by = double.Parse(m.Groups["by"].Value, CultureInfo.InvariantCulture);
        var shorter = m.Groups["run"].Value == "P/1" ? Project(130 - by, 800) : Project(130, 800 - by);
        var again = PlanFor(shorter);
        Assert.DoesNotContain(again.Unresolvable, x => x.Subject == "P/1");

        // The path's drops all clear; the far-end fault of a long run on its held size is its own check (issue 23).
        Assert.DoesNotContain(again.After.AllFindings, f => f.Kind is FindingKind.TotalDrop or FindingKind.BranchDrop or FindingKind.FeederDrop);
    }

    [GeneratedRegex(@"(?:feeder|branch circuit) (?<run>\S+) at .+? shortened by about (?<by>[0-9.]+) ft")]
    private static partial Regex Shortening();
}
