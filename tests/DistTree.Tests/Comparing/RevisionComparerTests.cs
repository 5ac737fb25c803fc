using DistTree.Comparing;
using DistTree.Solving;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Comparing;

public sealed class RevisionComparerTests
{
    private static Comparison Compare(string before, string after) =>
        RevisionComparer.Compare(SolverHarness.Solve(before, "old.yaml"), SolverHarness.Solve(after, "new.yaml"));

    // Hand calculation, independent of the solver's current and drop code: a sub-panel carrying 12 kVA at
    // pf 0.9 adds ΔI = S/(√3·V_LL) = 12000/(√3·208) A to every feeder above it (all loads at pf 0.9, so the
    // phasors add arithmetically and θ does not change). Each shared feeder's drop rises by
    // ΔV = √3·ΔI·L·(R cos θ + X sin θ) (the effective-impedance formula, NEC Chapter 9 Table 9 note 2; common
    // practice), with R and X per km as the solution reports them (fixed: conductor_temperature rated). Every
    // sibling circuit's own branch drop is unchanged, so its total rises by exactly the sum over the shared
    // feeders: MSB and LP1 for LP1's circuits, MSB alone for LP2's. The siblings are 1-pole 120 V circuits:
    // the sub-panel's balanced current adds ΔI to each line without moving the neutral, so each sibling sees its
    // line-to-neutral share ΔV/√3 in percent of its own 120 V.
    [Fact]
    public void Compare_SubPanelUnderSharedFeeder_SiblingsRiseByTheSharedFeedersDropIncrease()
    {
        var before = SolverHarness.Solve(ComparisonProjects.Shared(), "old.yaml");
        var after = SolverHarness.Solve(ComparisonProjects.Shared(ComparisonProjects.SubPanel), "new.yaml");
        var c = RevisionComparer.Compare(before, after);

        var deltaI = 12000 / (Math.Sqrt(3) * 208);
        var cos = 0.9;
        var sin = Math.Sqrt(1 - (cos * cos));
        // The rise in volts line to neutral; in percent of the line-to-neutral base of the phase frame, 208/√3 V,
        // for the 1-pole circuits and per line for the 3-pole one (the source a balanced set at 208 V).
        double FeederRiseV(string id)
        {
            var run = after.Runs.Single(r => r.Id == id && r.Kind == RunResultKind.Feeder);
            var old = before.Runs.Single(r => r.Id == id && r.Kind == RunResultKind.Feeder);
            Assert.Equal(old.ResistanceOhmPerKm!.Value, run.ResistanceOhmPerKm!.Value, 12);
            Assert.Equal(deltaI, run.CurrentA - old.CurrentA, 9);
            var deltaV = Math.Sqrt(3) * deltaI * (run.LengthM / 1000) * ((run.ResistanceOhmPerKm!.Value * cos) + (run.ReactanceOhmPerKm!.Value * sin)) / run.Sets;
            return deltaV / Math.Sqrt(3);
        }

        var msb = FeederRiseV("MSB");
        var lp1 = FeederRiseV("LP1");
        Assert.True(msb > 0.01 && lp1 > 0.01, "the sub-panel's load must move the shared feeders measurably");
        foreach (var (id, volts) in new[] { ("LP1/1", 208 / Math.Sqrt(3)), ("LP1/2", 208 / Math.Sqrt(3)), ("LP1/3", 208 / Math.Sqrt(3)) })
        {
            Assert.Equal((msb + lp1) / volts * 100, c.EndPoints.Single(e => e.Id == id).TotalDropPercent.Change, 9);
        }

        Assert.Equal(msb / (208 / Math.Sqrt(3)) * 100, c.EndPoints.Single(e => e.Id == "LP2/1").TotalDropPercent.Change, 9);
        Assert.True(c.UpstreamRuns.Single(r => r.Id == "MSB").DropPercent.Change > 0);
        Assert.Equal(-deltaI, c.UpstreamRuns.Single(r => r.Id == "LP1").MarginA!.Value.Change, 9);
        Assert.Equal(["LP1", "MSB"], c.UpstreamRuns.Select(r => r.Id).Order(StringComparer.Ordinal));
        Assert.DoesNotContain(c.Runs, r => r.Id is "LP1/1" or "LP1/2" or "LP1/3" or "LP2/1");
        Assert.Equal([("SUB", ChangeKind.Added)], c.Equipment.Select(e => (e.Id, e.Change)));
        Assert.Equal([("SUB/1", ChangeKind.Added)], c.Circuits.Select(e => (e.Id, e.Change)));
        Assert.Equal(4, c.Summary.EndPointsCompared);
        Assert.Equal(4, c.Summary.EndPointsAffected);
    }

    // Matching is by id: the order of equipment, circuits and keys, and comments, are not design.
    [Fact]
    public void Compare_ReorderedKeysAndComments_IsUnchanged()
    {
        var c = Compare(ComparisonProjects.Ordered, ComparisonProjects.Reordered);

        Assert.True(c.IsUnchanged, string.Join("; ", c.Equipment.Select(e => e.Id).Concat(c.Runs.Select(r => r.Id)).Concat(c.ProjectChanges.Select(p => p.Field))));
        Assert.Equal(0, c.Summary.EndPointsAffected);
        Assert.Equal(4, c.Summary.EndPointsCompared);
        Assert.False(c.HasNewFindings);
    }

    // 120 ft is 36.576 m exactly (1 ft = 0.3048 m, the international foot); the figures in metres differ in
    // their last bits at most, which is within the tolerance.
    [Fact]
    public void Compare_SameLengthWrittenInMetres_IsUnchanged()
    {
        var metres = ComparisonProjects.Ordered.Replace("length: 120,", "length: 36.576 m,", StringComparison.Ordinal);
        Assert.NotEqual(ComparisonProjects.Ordered, metres);

        Assert.True(Compare(ComparisonProjects.Ordered, metres).IsUnchanged);
    }

    [Fact]
    public void Compare_SameFile_IsUnchanged()
    {
        var path = Path.Combine(TestPaths.RepoRoot, "projects", "quillfeather-medical.yaml");
        var text = File.ReadAllText(path);

        var c = Compare(text, text + "\n# a comment added at the end\n");

        Assert.True(c.IsUnchanged);
        Assert.NotEqual(c.Before.Sha256, c.After.Sha256);
    }

    [Fact]
    public void Compare_FeederLengthened_ListsTheFieldWithBeforeAndAfter()
    {
        var after = ComparisonProjects.Shared().Replace("length: 40, size: 1/0 AWG", "length: 55, size: 1/0 AWG", StringComparison.Ordinal);

        var c = Compare(ComparisonProjects.Shared(), after);

        var change = Assert.Single(c.Equipment);
        Assert.Equal(("LP1", ChangeKind.Changed), (change.Id, change.Change));
        // The JSON's field and values stay in metres; people read the length with its unit (a metric project: m).
        Assert.Equal([new FieldChange("feeder.length_m", "40", "55") { Label = "feeder.length", BeforeText = "40 m", AfterText = "55 m" }], change.Fields);
        Assert.Empty(c.Circuits);
        // Only the drop moved: LP1's current and margin did not, so it is not an upstream run whose loading moved.
        Assert.True(c.Runs.Single(r => r.Id == "LP1").DropPercent.Change > 0);
        Assert.Empty(c.UpstreamRuns);
        Assert.DoesNotContain(c.EndPoints, e => e.Id == "LP2/1");
    }

    [Fact]
    public void Compare_CircuitRemoved_ListsEveryFieldAsRemoved()
    {
        var before = ComparisonProjects.Shared();
        var after = before.Replace("      - { id: \"2\", name: Lighting, poles: 1, ocpd: 20, load: { va: 1200, pf: 0.9 }, run: { length: 18, size: 12 AWG } }\n", "", StringComparison.Ordinal);
        Assert.NotEqual(before, after);

        var c = Compare(before, after);

        var removed = Assert.Single(c.Circuits);
        Assert.Equal(("LP1/2", ChangeKind.Removed), (removed.Id, removed.Change));
        Assert.Contains(new FieldChange("run.size", "12 AWG", null), removed.Fields);
        Assert.Contains(new FieldChange("load.value", "1200", null) { BeforeText = "1200 VA" }, removed.Fields);
        Assert.All(removed.Fields, f => Assert.Null(f.After));
        Assert.Equal([new FieldChange("circuits", "3", "2")], Assert.Single(c.Equipment).Fields);
        Assert.Equal(3, c.Summary.EndPointsCompared);
    }

    // Order: newly failing first, then newly passing, then by the largest absolute change. LP1/1 goes from
    // 20 m to 200 m of 12 AWG at 12.5 A (fails its 3 % branch limit); the ordering test turns it back while
    // another change makes LP1/2 fail.
    [Fact]
    public void Compare_StatusChanges_NewlyFailingFirstThenNewlyPassingThenLargestChange()
    {
        var passing = ComparisonProjects.Shared();
        var failing1 = ComparisonProjects.Shared(lp1Circuit1Length: "200");
        var failing2 = ComparisonProjects.Shared().Replace("length: 18, size: 12 AWG", "length: 210, size: 12 AWG", StringComparison.Ordinal);

        var c = Compare(failing1, failing2);

        Assert.Equal(("LP1/2", StatusChange.NewlyFailing), (c.EndPoints[0].Id, c.EndPoints[0].Status));
        Assert.Equal(("LP1/1", StatusChange.NewlyPassing), (c.EndPoints[1].Id, c.EndPoints[1].Status));
        var rest = c.EndPoints.Skip(2).Select(e => Math.Abs(e.TotalDropPercent.Change)).ToArray();
        Assert.Equal(rest.OrderDescending(), rest);
        Assert.Contains("branch_drop", c.EndPoints[0].FindingsAfter);
        Assert.Empty(c.EndPoints[0].FindingsBefore);
        Assert.Contains(c.NewFindings, f => f.Subject == "LP1/2" && f.Kind == FindingKind.BranchDrop);
        Assert.Contains(c.ResolvedFindings, f => f.Subject == "LP1/1" && f.Kind == FindingKind.BranchDrop);
        Assert.True(c.HasNewFindings);

        var fixedOnly = Compare(failing1, passing);
        Assert.False(fixedOnly.HasNewFindings);
        Assert.Equal(StatusChange.NewlyPassing, fixedOnly.EndPoints[0].Status);
    }

    // A transformer's regulation row and its primary feeder share the id T1; they are matched separately.
    [Fact]
    public void Compare_TransformerRatingChanged_TransformerRowMovesAndItsFeederDoesNot()
    {
        var after = ComparisonProjects.Ordered.Replace("kva: 45", "kva: 75", StringComparison.Ordinal);

        var c = Compare(ComparisonProjects.Ordered, after);

        Assert.Equal([new FieldChange("transformer.kva", "45", "75")], Assert.Single(c.Equipment).Fields);
        var row = Assert.Single(c.UpstreamRuns);
        Assert.Equal(("T1", RunResultKind.Transformer), (row.Id, row.Kind));
        Assert.True(row.AmpacityA!.Value.Change > 0 && row.DropPercent.Change < 0);
        Assert.All(c.EndPoints, e => Assert.StartsWith("LP1/", e.Id, StringComparison.Ordinal));
        Assert.Equal(2, c.EndPoints.Count);
    }

    [Fact]
    public void Compare_RulesChanged_ListsProjectChange()
    {
        var after = ComparisonProjects.Ordered.Replace("total_limit_percent: 5", "total_limit_percent: 4", StringComparison.Ordinal);

        var c = Compare(ComparisonProjects.Ordered, after);

        Assert.Equal([new FieldChange("rules.total_limit_percent", "5", "4")], c.ProjectChanges);
        Assert.All(c.EndPoints, e => Assert.Equal(-1, e.LimitPercent.Change, 12));
        Assert.Equal(4, c.EndPoints.Count);
    }

    // A single-phase transformer across two lines of a three-phase primary (invented).
    private const string SinglePhaseTransformer = """
        disttree: 1
        project: { name: Single-phase transformer }
        service: { id: SVC, system: 480Y/277 }
        equipment:
          - { id: T1, kind: transformer, from: SVC, kva: 25, secondary: 120/240, impedance_percent: 3, x_r: 2, phase: BC,
              feeder: { length: 20, size: 8 AWG, ocpd: 60 } }
          - id: LP1
            kind: panelboard
            from: T1
            feeder: { length: 3, size: 1/0 AWG, ocpd: 125 }
            circuits:
              - { id: "1", poles: 1, ocpd: 20, load: { va: 1000 }, run: { length: 20, size: 12 AWG } }
        """;

    [Fact]
    public void Compare_NeutralSizeStated_ListsTheRunFieldFromNone()
    {
        var after = ComparisonProjects.Shared().Replace("length: 18, size: 12 AWG", "length: 18, size: 12 AWG, neutral_size: 10 AWG", StringComparison.Ordinal);

        var c = Compare(ComparisonProjects.Shared(), after);

        var change = Assert.Single(c.Circuits);
        Assert.Equal(("LP1/2", ChangeKind.Changed), (change.Id, change.Change));
        Assert.Equal([new FieldChange("run.neutral_size", null, "10 AWG")], change.Fields);
    }

    // A fuse stated where a breaker was the default: the run's device_type is listed, from none.
    [Fact]
    public void Compare_DeviceTypeStated_ListsTheRunFieldFromNone()
    {
        var after = ComparisonProjects.Shared().Replace("length: 18, size: 12 AWG", "length: 18, size: 12 AWG, device_type: fuse", StringComparison.Ordinal);

        var change = Assert.Single(Compare(ComparisonProjects.Shared(), after).Circuits);
        Assert.Equal([new FieldChange("run.device_type", null, "fuse")], change.Fields);
    }

    // A stated category where there was none: the field moves from its default (other, for a load not a motor).
    [Fact]
    public void Compare_CategoryStated_ListsTheCircuitField()
    {
        var after = ComparisonProjects.Shared().Replace("name: Lighting, poles: 1", "name: Lighting, category: lighting, poles: 1", StringComparison.Ordinal);
        Assert.NotEqual(ComparisonProjects.Shared(), after);

        var c = Compare(ComparisonProjects.Shared(), after);

        var change = Assert.Single(c.Circuits);
        Assert.Equal(("LP1/2", ChangeKind.Changed), (change.Id, change.Change));
        Assert.Equal([new FieldChange("category", "other", "lighting")], change.Fields);
    }

    [Fact]
    public void Compare_FeederNeutralSizeChanged_ListsTheFeederField()
    {
        var before = ComparisonProjects.Shared().Replace("size: 1/0 AWG, ocpd: 150", "size: 1/0 AWG, neutral_size: 2 AWG, ocpd: 150", StringComparison.Ordinal);
        var after = before.Replace("neutral_size: 2 AWG", "neutral_size: 1/0 AWG", StringComparison.Ordinal);

        var c = Compare(before, after);

        Assert.Equal([new FieldChange("feeder.neutral_size", "2 AWG", "1/0 AWG")], Assert.Single(c.Equipment).Fields);
    }

    [Fact]
    public void Compare_MainRatingChanged_ListsTheField()
    {
        var before = ComparisonProjects.Shared().Replace("    from: MSB\n    feeder: { length: 40", "    from: MSB\n    main_a: 100\n    feeder: { length: 40", StringComparison.Ordinal);
        Assert.NotEqual(ComparisonProjects.Shared(), before);

        var c = Compare(before, before.Replace("main_a: 100", "main_a: 200", StringComparison.Ordinal));

        Assert.Equal([new FieldChange("main_a", "100", "200")], Assert.Single(c.Equipment).Fields);
    }

    [Fact]
    public void Compare_TransformerPhaseChanged_ListsTheField()
    {
        var after = SinglePhaseTransformer.Replace("phase: BC", "phase: CA", StringComparison.Ordinal);

        var c = Compare(SinglePhaseTransformer, after);

        Assert.Equal([new FieldChange("transformer.phase", "BC", "CA")], Assert.Single(c.Equipment).Fields);
    }

    // The fields an element always had: a run without a neutral size and a three-phase transformer add none.
    [Fact]
    public void Compare_AddedWithoutTheNewKeys_ListsNoNeutralSizeOrPhase()
    {
        var renamed = ComparisonProjects.Ordered.Replace("  - id: T1\n", "  - id: T9\n", StringComparison.Ordinal).Replace("from: T1", "from: T9", StringComparison.Ordinal);

        var c = Compare(ComparisonProjects.Ordered, renamed);

        var added = c.Equipment.Single(e => e.Change == ChangeKind.Added);
        Assert.Contains(added.Fields, f => f.Field == "transformer.tap_percent");
        Assert.DoesNotContain(added.Fields, f => f.Field is "transformer.phase" or "feeder.neutral_size");
    }

    [Fact]
    public void Compare_ServiceSourceStated_ListsBothProjectFields()
    {
        var after = ComparisonProjects.Ordered.Replace("  system: 480Y/277\n", "  system: 480Y/277\n  available_fault_current_ka: 35\n  fault_x_r: 8\n", StringComparison.Ordinal);
        Assert.NotEqual(ComparisonProjects.Ordered, after);

        var c = Compare(ComparisonProjects.Ordered, after);

        Assert.Equal(
            [new FieldChange("service.available_fault_current_ka", "none", "35"), new FieldChange("service.fault_x_r", "none", "8")],
            c.ProjectChanges);
        Assert.Empty(c.Equipment);
    }
}
