using DistTree.Conductors;
using DistTree.Generating;
using DistTree.Model;
using DistTree.Sizing;
using DistTree.Solving;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Sizing;

public sealed class UpsizerTests
{
    private static string Demo => Path.Combine(TestPaths.RepoRoot, "projects", "quillfeather-medical.yaml");

    private static UpsizePlan PlanFor(string yaml) => Upsizer.Standard.Plan(SolverHarness.Solve(yaml));

    [Fact]
    public void Plan_Demo_ClearsEveryFindingAndNeverDownsizes()
    {
        var before = SolverHarness.Solve(File.ReadAllText(Demo), Demo);
        var plan = Upsizer.Standard.Plan(before);
        Assert.True(before.HasFindings);
        // Two runs need more than their devices' terminals take (terminal-limits.tsv): a 50 A feeder 2 AWG, a 20 A branch 6 AWG.
        Assert.Equal(["HG", "LP4/32"], plan.Unresolvable.Select(u => u.Subject).Distinct().Order(StringComparer.Ordinal));
        Assert.All(["HG", "LP4/32"], id => Assert.Contains(plan.Unresolvable, u => u.Subject == id && u.Message.Contains("beyond the terminal limit of its", StringComparison.Ordinal)));

        // HG held to 4 AWG by its terminals would leave its far end too small to trip its 50 A breaker through the 6 AWG
        // grounding conductor that follows; a 4 AWG grounding conductor clears it, and the plan names it.
        var hg = Assert.Single(plan.Changes, c => c.RunId == "HG");
        Assert.Equal(("4 AWG", "4 AWG"), (hg.SizeAfter, hg.GroundSizeAfter));
        Assert.DoesNotContain(plan.After.AllFindings, f => f.Kind == FindingKind.FaultClearing);
        Assert.All(plan.After.AllFindings, f => Assert.Contains(f.Subject, plan.Unresolvable.Select(u => u.Subject)));
        Assert.NotEmpty(plan.Changes);
        Assert.All(plan.Changes, c => Assert.True(ConductorSize.Parse(c.SizeAfter) >= ConductorSize.Parse(c.SizeBefore) && c.SetsAfter >= c.SetsBefore));
        Assert.All(plan.Changes, c => Assert.True(c.CostAdded > 0));
        Assert.Equal(plan.Changes.Sum(c => c.CostAdded), plan.TotalCostAdded, 9);
    }

    // Upsizing one shared feeder fixes many circuits at once: the optimiser never costs more than the greedy
    // fix that upsizes each failing end point's own branch circuit first. On the demo without terminal limits (its own
    // table limits no device), where every limit is fixable, so both fix the same limits.
    [Fact]
    public void Plan_Demo_CostsNoMoreThanTheGreedyFix()
    {
        using var folder = new Cli.TempFolder();
        var copy = folder.CopyProject("quillfeather-medical.yaml");
        Cli.TempFolder.OpenTerminals(copy);
        var before = Analysis.Run(copy).Solution;
        var plan = Upsizer.Standard.Plan(before);
        // The optimum on the drop grid against the greedy fix of the same limits; the far-end fault repair comes on top.
        Assert.True(plan.TotalCostAdded - plan.FarEndRepairCostAdded <= GreedyBaseline.CostAdded(before, ConductorCatalog.Standard) + 1e-6);
    }

    [Fact]
    public void Plan_SharedFeeder_UpsizesTheFeederNotEveryBranch()
    {
        // Four 16 A circuits share a long 6 AWG feeder that is over its own limit; upsizing the feeder once
        // fixes every total, where upsizing the branches could not fix the feeder.
        var circuits = string.Join("\n", Enumerable.Range(1, 4).Select(i =>
            $"      - {{ id: \"{i}\", poles: 1, ocpd: 20, load: {{ amps: 16 }}, run: {{ length: 10, size: 12 AWG }} }}"));
        var yaml = $"""
            disttree: 1
            project: {"{"} name: Shared, units: metric {"}"}
            service: {"{"} id: SVC, system: 208Y/120 {"}"}
            equipment:
              - id: P
                kind: panelboard
                from: SVC
                feeder: {"{"} length: 150, size: 6 AWG {"}"}
                circuits:
            {circuits}
            """;
        var plan = PlanFor(yaml);
        Assert.Contains(plan.Before.AllFindings, f => f.Code == "feeder_drop");
        Assert.False(plan.After.HasFindings);
        Assert.Contains(plan.Changes, c => c.RunId == "P");
        Assert.True(plan.Changes.Count(c => c.Kind == RunResultKind.Branch) < 4);
    }

    [Fact]
    public void Plan_PinnedRun_KeepsItsSizeAndIsReportedWhenItFails()
    {
        var plan = PlanFor(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 16 }, run: { length: 200, size: 12 AWG, fixed: true } }"));
        Assert.Empty(plan.Changes);
        Assert.Contains(plan.Unresolvable, u => u.Subject == "P/1" && u.Message.Contains("pinned", StringComparison.Ordinal));
        Assert.True(plan.After.HasFindings);
    }

    [Fact]
    public void Plan_NoSizeBigEnough_SaysWhatItWouldTake()
    {
        // 120 V, 80 A, 3,000 ft: even 2000 kcmil drops about 4 % on one set (2 × 80 A × 0.914 km × 0.034 ohm/km).
        var plan = PlanFor(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 100, load: { amps: 80 }, run: { length: 3000, size: 2 AWG } }"));
        var u = Assert.Single(plan.Unresolvable, u => u.Subject == "P/1" && u.Message.Contains("no allowed size meets its own limits", StringComparison.Ordinal));
        Assert.Contains("parallel sets", u.Message, StringComparison.Ordinal);
    }

    // An imperial 480Y/277 panel P on a feeder whose run is the flow mapping's keys given, with one 3-pole circuit
    // drawing the amperes given under the device given, on 10 ft of the size given; the feeder may take up to four sets.
    private static string FeederWithSets(string feeder, int ocpdA, int amps, string size) => $$"""
        disttree: 1
        project: { name: Sets, units: imperial }
        sizing: { max_sets: 4 }
        service: { id: SVC, system: 480Y/277 }
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            feeder: { {{feeder}} }
            circuits:
              - { id: "1", poles: 3, ocpd: {{ocpdA}}, load: { amps: {{amps}}, pf: 0.9 }, run: { length: 10, size: {{size}} } }
        """;

    [Fact]
    public void Plan_MaxSets_LetsAFeederTakeParallelSets()
    {
        var plan = PlanFor(FeederWithSets("length: 1400, size: 500 kcmil, sets: 1, ocpd: 600", 400, 300, "500 kcmil"));

        // Every drop and current rule cleared; a far end whose fault cannot trip the 600 A breaker's default instantaneous
        // (a 1,400 ft feeder) is no conductor choice's to fix at one more size, and the plan names it as unresolved.
        Assert.DoesNotContain(plan.After.AllFindings, f => f.Kind != FindingKind.FaultClearing);
        Assert.All(plan.After.AllFindings, f => Assert.Contains(plan.Unresolvable, u => u.Subject == f.Subject));
        Assert.Contains(plan.Changes, c => c.RunId == "P" && c.SetsAfter > 1);
    }

    // NEC 310.10(G)(1) (recalled): conductors in parallel are 1/0 AWG and larger. Two sets of 2 AWG would be the least
    // copper for this long 60 A feeder, but no one may install them: the plan takes one larger set (or 1/0 AWG and up).
    [Fact]
    public void Plan_MaxSets_NeverProposesParallelSetsBelowOneOught()
    {
        var plan = PlanFor(FeederWithSets("length: 900, size: 4 AWG, sets: 1, ocpd: 70", 70, 55, "4 AWG"));
        Assert.Contains(plan.Before.AllFindings, f => f.Code == "feeder_drop");
        Assert.False(plan.After.HasFindings);
        var feeder = Assert.Single(plan.Changes, c => c.RunId == "P");
        Assert.True(feeder.SetsAfter == 1 || ConductorSize.Parse(feeder.SizeAfter) >= ConductorSize.Parse("1/0 AWG"), $"{feeder.SetsAfter} × {feeder.SizeAfter}");
    }

    // Every parallel set the demo's plan proposes is of a size the code allows in parallel.
    [Fact]
    public void Plan_Demo_ParallelSetsOnlyWhereTheCodeAllowsThem()
    {
        var before = SolverHarness.Solve(File.ReadAllText(Demo), Demo);
        var plan = Upsizer.Standard.Plan(before);
        Assert.All(plan.Changes.Where(c => c.SetsAfter > c.SetsBefore), c => Assert.True(ConductorSize.Parse(c.SizeAfter) >= ConductorSize.Parse("1/0 AWG"), c.RunId));
    }

    [Fact]
    public void Plan_PriceTable_MinimisesPriceAndNamesTheCurrency()
    {
        var yaml = SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 16 }, run: { length: 90, size: 12 AWG } }")
            .Replace("equipment:", "sizing: { currency: USD, prices: { 10 AWG: 5.0, 8 AWG: 1.0, 6 AWG: 9.0 } }\nequipment:", StringComparison.Ordinal);
        var plan = PlanFor(yaml);
        // 10 AWG would do, but the (invented) price table makes 8 AWG cheaper.
        Assert.Equal("8 AWG", Assert.Single(plan.Changes).SizeAfter);
        Assert.Equal("USD", plan.CostUnit);
        Assert.Equal(1.0 * 90 * 0.3048 * 2, plan.TotalCostAdded, 6);
    }

    [Fact]
    public void Plan_Upsize_NamesTheGroundingConductorTheNewSizeNeeds()
    {
        // 16 A under a 20 A device: 12 AWG is the smallest that will do, and Table 250.122's size (NEC, memory); on the
        // larger size the plan takes, 250.122(B)'s proportion makes it the lines' own size (12 AWG × new / 12 AWG area).
        var plan = PlanFor(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 16 }, run: { length: 90, size: 12 AWG } }"));
        var change = Assert.Single(plan.Changes);
        Assert.Equal(change.SizeAfter, change.GroundMinSize);
        Assert.Equal($"at least {change.SizeAfter} (NEC 250.122)", change.GroundingNote);
        Assert.Null(change.GroundSize);
        Assert.False(change.GroundMustIncrease);
    }

    // With the findings on the load flow, its drops come out larger than the percent sums the sizer prices (a lower
    // voltage draws more current on constant-power loads; common practice). The plan still has to pass its proof.
    [Fact]
    public void Plan_OnTheLoadFlow_PassesItsProof()
    {
        // Invented demo data (disttree generate) with the findings put on the load flow.
        var text = ProjectGenerator.Generate(2000, 3, 7).Replace("\ndefaults:", "\nrules: { method: load_flow }\ndefaults:", StringComparison.Ordinal);
        var before = SolverHarness.Solve(text);
        Assert.Equal(SolutionMethod.LoadFlow, before.Project.Rules.Method);
        Assert.True(before.HasFindings);

        var plan = Upsizer.Standard.Plan(before);

        var unresolvable = plan.Unresolvable.Select(u => u.Subject).ToHashSet(StringComparer.Ordinal);
        Assert.All(plan.After.AllFindings, f => Assert.True(f.Kind == FindingKind.TransformerOverload || unresolvable.Contains(f.Subject), f.Message));
        Assert.All(plan.After.Runs.Where(r => r.Kind != RunResultKind.Transformer && !unresolvable.Contains(r.Id)), r => Assert.True(r.DropPercent <= r.LimitPercent + 1e-9));
    }
}
