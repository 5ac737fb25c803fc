using DistTree.Solving;
using DistTree.Solving.Passes;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Solving;

public sealed class DropSolverPropertyTests
{
    // Percent-sum method (DESIGN.md section 4): an end point's total is the sum of its path's drops, each
    // run's share being the drop on the end point's own lines, never more than the run's worst-line drop.
    [Property(MaxTest = 60)]
    public Property Total_EqualsSumOfPathDrops() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var s = SolverHarness.Solve(tree.ToYaml());
        return s.EndPoints.All(e =>
        {
            var onPath = new HashSet<string>(e.Path.Skip(1), StringComparer.Ordinal);
            var runsOnPath = s.Runs.Select((r, i) => (r, i)).Where(p => onPath.Contains(p.r.To)).Select(p => p.i).Order().ToArray();
            var shares = e.RunSharesPercent.Sum();
            return runsOnPath.SequenceEqual(e.RunIndices.Order())
                && Math.Abs(shares - e.TotalDropPercent) < 1e-9
                && e.RunIndices.Zip(e.RunSharesPercent).All(p => p.Second <= s.Runs[p.First].DropPercent + 1e-9);
        });
    });

    // A branch circuit's drop is the worst of its own voltages (one for a 1- or 2-pole circuit, three line pairs for a
    // 3-pole one); the figure must be, to the bit, the one that the run's unit drops (what the sizer prices, from the
    // result's current and conductor figures) give, and its end point's share of it the same figure (1 or 2 poles) or
    // no more (3 poles: the end point reads its worst pair by total; internal consistency of the solve and the view).
    [Property(MaxTest = 60)]
    public Property BranchDrop_IsItsOwnLinesFigureOfTheFullUnitDrops() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var s = SolverHarness.Solve(tree.ToYaml());
        Span<double> unitR = stackalloc double[Slots.Count];
        Span<double> unitX = stackalloc double[Slots.Count];
        foreach (var run in s.Runs.Where(r => r.Kind == RunResultKind.Branch))
        {
            var own = run.UnitDrops(unitR, unitX);
            var full = RunDrops.OwnDrop(unitR, unitX, run.ResistanceOhmPerKm!.Value, run.ReactanceOhmPerKm!.Value, own);
            var endPoint = s.EndPoints.Single(e => e.NodeIndex == run.NodeIndex);
            var threePole = System.Numerics.BitOperations.PopCount((uint)own) == 3;
            if (own == 0 || run.PercentSumDropPercent != full || (threePole ? endPoint.RunSharesPercent[^1] > full + 1e-12 : endPoint.RunSharesPercent[^1] != full))
            {
                return false;
            }
        }

        return true;
    });

    // A perfectly balanced tree (3-pole loads only) gives the balanced result: each end point's total is the
    // sum of its path's drops by the three-phase effective-impedance formula, √3·I·L·(R cos θ + X sin θ)/V_LL.
    [Property(MaxTest = 40)]
    public Property BalancedTree_GivesTheBalancedResult() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var balanced = tree with { Panels = tree.Panels.Select(p => p with { Circuits = p.Circuits.Select(c => c with { Poles = 3 }).ToArray() }).ToArray() };
        var s = SolverHarness.Solve(balanced.ToYaml());
        return s.EndPoints.All(e =>
        {
            var sum = e.RunIndices.Select(i => s.Runs[i]).Sum(r =>
            {
                var sin = Math.Sqrt(1 - (r.PowerFactor * r.PowerFactor));
                var amps = r.ApparentPowerVa / (Math.Sqrt(3) * 208);
                return Math.Sqrt(3) * amps * r.LengthM / 1000 * ((r.ResistanceOhmPerKm!.Value * r.PowerFactor) + (r.ReactanceOhmPerKm!.Value * sin)) / r.Sets / 208 * 100;
            });
            return Math.Abs(sum - e.TotalDropPercent) < 1e-9;
        });
    });

    // A larger conductor on any run never raises any end point's total (estimated temperature, so the
    // temperature falls too). This holds for balanced loads; on a shared neutral an unbalanced load lifts the
    // voltage of a lightly loaded line, and a larger conductor lifts it less, so there the law does not hold
    // (physics, not a defect): the trees here carry 3-pole loads.
    [Property(MaxTest = 60)]
    public Property LargerConductor_NeverRaisesATotal() => Prop.ForAll(RandomTree.Arbitrary, Arb.From(Gen.Choose(0, 100)), (tree, pick) =>
    {
        var balanced = tree with { Panels = tree.Panels.Select(p => p with { Circuits = p.Circuits.Select(c => c with { Poles = 3 }).ToArray() }).ToArray() };
        var rules = "conductor_temperature: estimated";
        var before = SolverHarness.Solve(balanced.ToYaml(rules: rules));
        var after = SolverHarness.Solve(balanced.ToYaml(rules: rules, bumpRun: pick % balanced.RunCount));
        return before.EndPoints.Zip(after.EndPoints).All(p => p.Second.TotalDropPercent <= p.First.TotalDropPercent + 1e-12);
    });

    // With unbalanced loads too, a larger conductor never raises that run's own (worst-line) drop.
    [Property(MaxTest = 60)]
    public Property LargerConductor_NeverRaisesARunsOwnDrop() => Prop.ForAll(RandomTree.Arbitrary, Arb.From(Gen.Choose(0, 100)), (tree, pick) =>
    {
        var rules = "conductor_temperature: estimated";
        var run = pick % tree.RunCount;
        var before = SolverHarness.Solve(tree.ToYaml(rules: rules));
        var after = SolverHarness.Solve(tree.ToYaml(rules: rules, bumpRun: run));
        return before.Runs.Zip(after.Runs).All(p => p.First.Size == p.Second.Size || p.Second.DropPercent <= p.First.DropPercent + 1e-12);
    });

    // At a fixed temperature, doubling every length doubles every drop (ΔV ∝ L).
    [Property(MaxTest = 40)]
    public Property DoublingLength_DoublesDrop() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var one = SolverHarness.Solve(tree.ToYaml());
        var two = SolverHarness.Solve(tree.ToYaml(lengthScale: 2));
        return one.Runs.Zip(two.Runs).All(p => Math.Abs((2 * p.First.DropV) - p.Second.DropV) < 1e-9 * Math.Max(1, p.Second.DropV));
    });

    // The same design in metric and imperial lengths gives the same figures (1 ft = 0.3048 m).
    [Property(MaxTest = 40)]
    public Property MetricAndImperial_GiveTheSameFigures() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var feet = SolverHarness.Solve(tree.ToYaml(units: "imperial"));
        var metres = SolverHarness.Solve(tree.ToYaml(units: "metric", lengthScale: 0.3048));
        return feet.EndPoints.Zip(metres.EndPoints).All(p => Math.Abs(p.First.TotalDropPercent - p.Second.TotalDropPercent) < 1e-9);
    });

    // Demand factor 1 everywhere: a feeder carries the plain phasor sum of the loads below it.
    [Property(MaxTest = 40)]
    public Property DemandFactorOne_IsThePlainPhasorSum() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var plain = tree with { Panels = tree.Panels.Select(p => p with { DemandFactor = 1.0 }).ToArray() };
        var s = SolverHarness.Solve(plain.ToYaml());
        return s.Runs.Where(r => r.Kind == RunResultKind.Feeder).All(feeder =>
        {
            var below = s.EndPoints.Where(e => e.Path.Contains(feeder.To)).Select(e => s.Network.Nodes[e.NodeIndex].Circuit!.Load);
            var p = below.Sum(l => l.Value * l.PowerFactor);
            var q = below.Sum(l => l.Value * Math.Sqrt(1 - (l.PowerFactor * l.PowerFactor)));
            return Math.Abs(Math.Sqrt((p * p) + (q * q)) - feeder.ApparentPowerVa) < 1e-6;
        });
    });
}
