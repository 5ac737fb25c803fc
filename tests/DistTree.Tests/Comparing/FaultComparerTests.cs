using DistTree.Comparing;
using DistTree.Model;
using DistTree.Solving;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Comparing;

/// <summary>
/// The comparison's fault currents: each revision's figures are its own study's, paired by id. The direction is the
/// ohmic method's (IEC 60909-0, 2016, 6.1: I″k = c·U_n/(√3·|Z_k|)): a shorter feeder or a larger transformer has
/// the smaller series impedance, so every bus below it sees the larger current; a bus not below the change keeps its
/// impedance and its current (no motors in these projects).
/// </summary>
public sealed class FaultComparerTests
{
    private static (Solution Before, Solution After, Comparison Comparison) Compare(string before, string after)
    {
        var b = SolverHarness.Solve(before, "old.yaml");
        var a = SolverHarness.Solve(after, "new.yaml");
        return (b, a, RevisionComparer.Compare(b, a));
    }

    private static string ShorterLp1Feeder(string project) =>
        project.Replace("feeder: { length: 40, size: 1/0 AWG, ocpd: 150 }", "feeder: { length: 10, size: 1/0 AWG, ocpd: 150 }", StringComparison.Ordinal);

    [Fact]
    public void Compare_FeederShortened_FaultCurrentRisesAtItsPanelAndBelowOnly()
    {
        var old = ComparisonProjects.Shared(ComparisonProjects.SubPanel);
        var (before, after, c) = Compare(old, ShorterLp1Feeder(old));

        foreach (var id in new[] { "LP1", "SUB" })
        {
            var f = c.Faults.Single(d => d.Id == id);
            Assert.True(f.Rose, id);
            Assert.True(f.ChangeKa > 0 && f.ChangeLgKa > 0, id);
            Assert.Equal(before.Faults!.Equipment.Single(e => e.Id == id).AvailableFaultCurrentKa, f.Before!.AvailableFaultCurrentKa);
            Assert.Equal(after.Faults!.Equipment.Single(e => e.Id == id).AvailableFaultCurrentKa, f.After!.AvailableFaultCurrentKa);
            Assert.Equal(after.Faults.Equipment.Single(e => e.Id == id).AvailableFaultCurrentLgKa, f.After.AvailableFaultCurrentLgKa);
            Assert.Equal((f.After.AvailableFaultCurrentKa!.Value / f.Before.AvailableFaultCurrentKa!.Value - 1) * 100, f.ChangePercent!.Value, 9);
        }

        foreach (var id in new[] { "MSB", "LP2" })
        {
            var f = c.Faults.Single(d => d.Id == id);
            Assert.False(f.Moved, id);
            Assert.False(f.Changed, id);
        }

        Assert.Equal(["LP1", "SUB"], c.Faults.Where(f => f.Rose).Select(f => f.Id).Order(StringComparer.Ordinal));
        Assert.Equal(4, c.Summary.FaultsCompared);
        Assert.Equal(2, c.Summary.FaultsRose);
        Assert.Equal(["LP1", "SUB"], c.Faults.Take(2).Select(f => f.Id).Order(StringComparer.Ordinal));
    }

    // A larger transformer (45 → 112.5 kVA at the same %Z) has the smaller impedance %Z·V²/S: the panel it feeds rises.
    [Fact]
    public void Compare_LargerTransformer_FaultCurrentRisesAtThePanelItFeeds()
    {
        var larger = ComparisonProjects.Ordered.Replace("kva: 45", "kva: 112.5", StringComparison.Ordinal);
        var (_, after, c) = Compare(ComparisonProjects.Ordered, larger);

        Assert.True(c.Faults.Single(f => f.Id == "T1").Rose);
        Assert.True(c.Faults.Single(f => f.Id == "LP1").Rose);
        Assert.False(c.Faults.Single(f => f.Id == "HP1").Moved);
        Assert.Same(after.Faults!.Equipment.Single(e => e.Id == "LP1"), c.Faults.Single(f => f.Id == "LP1").After);
        Assert.False(c.IsUnchanged);
    }

    // A rating between the two revisions' currents: over after, not before, and counted as newly over; it sorts first.
    [Fact]
    public void Compare_RiseAboveStatedRating_NewlyOverRating()
    {
        var old = ComparisonProjects.Shared(ComparisonProjects.SubPanel);
        var before = SolverHarness.Solve(old, "old.yaml");
        var after = SolverHarness.Solve(ShorterLp1Feeder(old), "new.yaml");
        var between = (before.Faults!.Equipment.Single(e => e.Id == "SUB").LargestKa!.Value + after.Faults!.Equipment.Single(e => e.Id == "SUB").LargestKa!.Value) / 2;
        string Rated(string project) => project.Replace(
            "    from: LP1\n", FormattableString.Invariant($"    from: LP1\n    interrupting_ka: {between:0.000}\n"), StringComparison.Ordinal);
        Assert.NotEqual(old, Rated(old));

        var (_, _, c) = Compare(Rated(old), Rated(ShorterLp1Feeder(old)));

        var sub = c.Faults[0];
        Assert.Equal("SUB", sub.Id);
        Assert.False(sub.OverRatingBefore);
        Assert.True(sub.OverRatingAfter);
        Assert.Equal(1, c.Summary.FaultsNewlyOverRating);
        Assert.Contains(c.NewFindings, f => f.Kind == FindingKind.InterruptingRating && f.Subject == "SUB");
    }

    [Fact]
    public void Compare_SubPanelAdded_ListedAsAddedWithItsFigures()
    {
        var (_, after, c) = Compare(ComparisonProjects.Shared(), ComparisonProjects.Shared(ComparisonProjects.SubPanel));

        var sub = c.Faults.Single(f => f.Id == "SUB");
        Assert.True(sub.IsAdded);
        Assert.False(sub.Rose);
        Assert.Null(sub.ChangeKa);
        Assert.Equal(EquipmentKind.Panelboard, sub.Kind);
        Assert.Equal(after.Faults!.Equipment.Single(e => e.Id == "SUB").AvailableFaultCurrentKa, sub.After!.AvailableFaultCurrentKa);
        Assert.True(c.Faults.Single(f => f.Id == "SUB").Changed);

        var back = RevisionComparer.Compare(after, SolverHarness.Solve(ComparisonProjects.Shared(), "old.yaml"));
        Assert.True(back.Faults.Single(f => f.Id == "SUB").IsRemoved);
    }

    [Fact]
    public void Compare_SameProject_EveryFaultUnchanged()
    {
        var (_, _, c) = Compare(ComparisonProjects.Ordered, ComparisonProjects.Reordered);

        Assert.NotEmpty(c.Faults);
        Assert.DoesNotContain(c.Faults, f => f.Changed);
        Assert.True(c.IsUnchanged);
    }

    // Closed form: a panel on one feeder from an infinite bus, with no motors, sees I = c·U_n/(√3·z·L) (IEC 60909-0, 2016,
    // 6.1, with no source impedance): a feeder cut from 40 m to 10 m of the same conductor carries four times the current,
    // a change of +300 %, three-phase and line to ground alike (the loop is the same conductors, four times shorter).
    [Fact]
    public void Compare_FeederQuarterAsLongFromAnInfiniteBus_FourTimesTheCurrent()
    {
        const string Circuit = "{ id: \"1\", poles: 1, ocpd: 20, load: { amps: 4 }, run: { length: 5, size: 12 AWG } }";
        var (before, _, c) = Compare(
            SolverHarness.PanelOnFeeder("length: 40, size: 1/0 AWG, ocpd: 150", Circuit),
            SolverHarness.PanelOnFeeder("length: 10, size: 1/0 AWG, ocpd: 150", Circuit));

        Assert.Equal(FaultSourceKind.InfiniteBus, before.Faults!.Source);
        var p = c.Faults.Single(f => f.Id == "P");
        Assert.Equal(300, p.ChangePercent!.Value, 6);
        Assert.Equal(300, p.ChangeLgPercent!.Value, 6);
        Assert.Equal(3 * p.Before!.AvailableFaultCurrentKa!.Value, p.ChangeKa!.Value, 9);
    }
}
