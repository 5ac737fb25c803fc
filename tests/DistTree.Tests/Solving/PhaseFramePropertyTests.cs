using System.Globalization;
using System.Text;
using DistTree.Tests.Solving.Reference;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Solving;

/// <summary>
/// Issue 17's property tests over random trees with every connection kind (<see cref="PhaseFrameTree"/>): the percent
/// sum against the load flow, the load flow against an independent nodal solution of the same circuit
/// (<see cref="ProjectCircuit"/>, MathNet.Numerics' LU), and the shares of a path against its total.
/// </summary>
public sealed class PhaseFramePropertyTests
{
    private const double PercentSumRelative = 0.03;
    private const double PercentSumFloorPoints = 0.01;
    private const double LoadFlowTolerancePoints = 1e-4;

    // The lightly loaded rule of the percent sum's comparison: every end point within 0.5 % of its no-load voltage (its
    // reference figure less the taps' offset on its path). The percent sum is the load flow's linearisation, so their
    // difference is second order in the tree's drops; where an end point's own figure is small beside them (a lightly
    // loaded line whose voltage the neutral current of the other lines lifts or lowers: a reduced neutral, 120/240) it
    // reaches about 0.03·W² points at a tree's worst drop W in percent, which passes the 0.01-point floor above 0.58 %.
    // Measured on the generator's trees: about 3 % of them fail at W = 2.5 %, 11 in 6000 at 1.25 %, 1 in 6000 at 1 %,
    // none in 10,000 at 0.5 %; in each failure the difference falls as the square of the loads.
    private const double LightDropPercent = 0.5;

    // The load flow's and the shares' comparisons hold at any load the load flow solves: their trees go to 5 %.
    private const double LoadedDropPercent = 5;

    // Percent sum vs load flow (issue 17, item 3): on a lightly loaded tree every end point's percent sum is within 3 %
    // of its load-flow figure, or 0.01 points.
    [Property(MaxTest = 250)]
    public Property PercentSum_LightlyLoadedTree_WithinThreePercentOfLoadFlow() => Prop.ForAll(PhaseFrameTree.Arbitrary, tree =>
    {
        var loaded = Loaded(tree, LightDropPercent);
        var failures = new StringBuilder();
        foreach (var end in loaded.Analysis.Solution.EndPoints)
        {
            var actual = end.PercentSumTotalDropPercent;
            if (end.LoadFlowTotalDropPercent is not { } expected || Math.Abs(actual - expected) > Math.Max(PercentSumRelative * Math.Abs(expected), PercentSumFloorPoints))
            {
                failures.AppendLine(CultureInfo.InvariantCulture, $"{end.Id}: percent sum {actual:F6} %, load flow {end.LoadFlowTotalDropPercent:F6} %");
            }
        }

        return (failures.Length == 0).Label($"{failures}\n{loaded.Yaml}");
    });

    // Load flow vs an independent nodal solution of the same circuit equations (ProjectCircuit on NodalCircuit,
    // MathNet.Numerics' LU): every end point within 1e-4 points, on the same random trees loaded up to 5 %.
    [Property(MaxTest = 250)]
    public Property LoadFlow_RandomTree_EqualsNodalReference() => Prop.ForAll(PhaseFrameTree.Arbitrary, tree =>
    {
        var loaded = Loaded(tree, LoadedDropPercent);
        var ends = loaded.Analysis.Solution.EndPoints;
        var failures = new StringBuilder();
        foreach (var end in ends)
        {
            var expected = loaded.Reference[end.Id];
            if (end.LoadFlowTotalDropPercent is not { } actual || Math.Abs(actual - expected) > LoadFlowTolerancePoints)
            {
                failures.AppendLine(CultureInfo.InvariantCulture, $"{end.Id}: load flow {end.LoadFlowTotalDropPercent:F6} %, reference {expected:F6} %");
            }
        }

        return (failures.Length == 0 && loaded.Reference.Count == ends.Count).Label($"{failures}\n{loaded.Yaml}");
    });

    // The total's own arithmetic (EndPointResult: the utility's share and the runs' shares make the total): the shares
    // of an end point's path plus its source share add up to its total within 1e-9, by either method and either rule for
    // the transformers' drop (counted, or a new origin), on the same random trees loaded up to 5 %.
    [Property(MaxTest = 250)]
    public Property Shares_RandomTree_AddUpToTheTotal() => Prop.ForAll(PhaseFrameTree.Arbitrary, Arb.From(Gen.Choose(0, 3)), (tree, pick) =>
    {
        var rules = $"method: {(pick % 2 == 0 ? "percent_sum" : "load_flow")}, transformer_drop: {(pick < 2 ? "count" : "new_origin")}";
        var yaml = tree.ToYaml(Loaded(tree, LoadedDropPercent).Scale, rules);
        var failures = new StringBuilder();
        foreach (var end in SolverHarness.Solve(yaml).EndPoints)
        {
            var sum = end.RunSharesPercent.Sum() + end.SourceDropPercent;
            if (Math.Abs(sum - end.TotalDropPercent) > 1e-9)
            {
                failures.AppendLine(CultureInfo.InvariantCulture, $"{end.Id}: shares {sum:R} %, total {end.TotalDropPercent:R} %");
            }
        }

        return (failures.Length == 0).Label($"{failures}\n{yaml}");
    });

    // Keeps the generator honest: its trees hold every connection kind of issue 17 (what the loader made of them).
    [Fact]
    public void Generator_Trees_CoverEveryConnectionKind()
    {
        var seen = new HashSet<string>(StringComparer.Ordinal);
        // A fixed seed: the same trees every run, so coverage is a fact of the generator, not of the draw (30 unseeded
        // trees missed a connection kind about one run in twenty).
        foreach (var tree in PhaseFrameTree.Arbitrary.Generator.Sample(300, new Rnd(20261205UL), 60))
        {
            var project = Analysis.Parse(tree.ToYaml(), "test.yaml").Project;
            seen.Add($"service {project.Service.System.Name}{(project.Service.AvailableFaultCurrentKa is null ? "" : " with fault level")}");
            foreach (var e in project.Equipment)
            {
                if (e.Transformer is { } t)
                {
                    var across = t.Secondary.Phases == 1 ? $" across {t.PrimaryPhases}" : "";
                    seen.UnionWith([$"transformer {e.System.Name} to {t.Secondary.Name}", $"transformer{across}", $"tap {t.TapPercent}"]);
                }

                seen.Add(e.Feeder is { NeutralSize: not null } ? "feeder neutral smaller" : "feeder");
                foreach (var c in e.Circuits)
                {
                    seen.UnionWith([$"{c.Poles} poles {c.PhaseSource}", $"model {c.Load.Model}", c.Points.Count > 0 ? "points" : "load"]);
                }
            }
        }

        string[] expected =
        [
            "service 208Y/120", "service 480Y/277", "service 120/240", "service 240D", "service 480D", "service 208Y/120 with fault level",
            "transformer 480Y/277 to 208Y/120", "transformer 480D to 208Y/120", "transformer 480Y/277 to 120/240", "transformer 208Y/120 to 240",
            "transformer 480D to 120", "transformer across AB", "transformer across BC", "transformer across CA",
            "tap -5", "tap -2.5", "tap 0", "tap 2.5", "tap 5", "feeder", "feeder neutral smaller",
            "1 poles Stated", "1 poles Numbered", "1 poles Balanced", "2 poles Stated", "2 poles Numbered", "2 poles Balanced",
            "3 poles Stated", "3 poles Numbered", "3 poles Balanced", "model ConstantPower", "model ConstantCurrent", "model ConstantImpedance",
            "points", "load",
        ];
        Assert.Empty(expected.Except(seen));
    }

    // The tree at a scale of its loads that keeps every end point within its loading (LoadingPercent of dropPercent) of
    // its no-load voltage, by the reference: from the figures at a thousandth of its loads (the drops are linear there),
    // then down until it holds; never above its own loads. Its analysis and reference figures with it.
    private static LoadedTree Loaded(PhaseFrameTree tree, double dropPercent)
    {
        var target = dropPercent * tree.LoadingPercent / 100;
        var scale = 1e-3;
        var (yaml, analysis, reference, worst) = Solve(tree, scale);
        scale = Math.Min(1, scale * target / worst);
        for (var attempt = 0; attempt < 5; attempt++)
        {
            (yaml, analysis, reference, worst) = Solve(tree, scale);
            if (worst <= dropPercent)
            {
                return new LoadedTree(yaml, scale, analysis, reference);
            }

            scale *= target / worst;
        }

        throw new InvalidOperationException($"not within {dropPercent} % at scale {scale}: {worst} %\n{yaml}");
    }

    private static (string Yaml, AnalysisResult Analysis, IReadOnlyDictionary<string, double> Reference, double Worst) Solve(PhaseFrameTree tree, double scale)
    {
        var yaml = tree.ToYaml(scale);
        var analysis = ReferenceHarness.Analyse(yaml);
        var reference = ProjectCircuit.Of(analysis).EndPointDropsPercent();
        return (yaml, analysis, reference, WorstDropFromNoLoadPercent(analysis, reference));
    }

    // As PhaseFrameNodalTests: each end point's reference figure less the taps' no-load offset, 1 − Π 1/(1 + tap/100);
    // the largest in size (a lifted voltage counts as much as a lowered one).
    private static double WorstDropFromNoLoadPercent(AnalysisResult analysis, IReadOnlyDictionary<string, double> reference)
    {
        var transformers = analysis.Project.Equipment.Where(e => e.Transformer is not null).ToDictionary(e => e.Id, e => e.Transformer!, StringComparer.Ordinal);
        return analysis.Solution.EndPoints.Max(end =>
        {
            var noLoad = end.Path.Aggregate(1.0, (v, id) => transformers.TryGetValue(id, out var t) ? v / (1 + (t.TapPercent / 100)) : v);
            return Math.Abs(reference[end.Id] - ((1 - noLoad) * 100));
        });
    }

    private sealed record LoadedTree(string Yaml, double Scale, AnalysisResult Analysis, IReadOnlyDictionary<string, double> Reference);
}
