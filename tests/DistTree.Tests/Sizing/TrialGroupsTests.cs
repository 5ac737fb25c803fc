using DistTree.Conductors;
using DistTree.Sizing;
using DistTree.Tests.Solving;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Sizing;

/// <summary>
/// The step-down's and the pruner's single trials, solved together where their subtrees lie apart (TrialGroups). Checked
/// against the definition of a subtree (the walk up the parents) and against the same trials solved one at a time: by the
/// percent sum a load's current is its nominal one, so a run's choice moves only its own subtree's figures, and the plan
/// must come out the same.
/// </summary>
public sealed class TrialGroupsTests
{
    private static Arbitrary<RandomTree> Trees => Arb.From(RandomTree.Arbitrary.Generator.Where(t => t.RunCount <= 10));

    [Property(MaxTest = 50)]
    public Property Contains_RandomTree_IsTheWalkUpTheParents() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var network = SolverHarness.Solve(tree.ToYaml()).Network;
        var groups = new TrialGroups(network, independent: true);
        var nodes = network.Nodes;
        for (var above = 0; above < nodes.Count; above++)
        {
            for (var node = 0; node < nodes.Count; node++)
            {
                var walk = false;
                for (var i = node; i >= 0 && !walk; i = nodes[i].ParentIndex)
                {
                    walk = i == above;
                }

                if (groups.Contains(above, node) != walk)
                {
                    return false.Label($"{nodes[above].Id} above {nodes[node].Id}: {!walk}, the walk says {walk}");
                }
            }
        }

        return true.ToProperty();
    });

    [Property(MaxTest = 25)]
    public Property Plan_RandomTree_TogetherIsOneAtATime() => Prop.ForAll(Trees, tree =>
    {
        var before = SolverHarness.Solve(tree.ToYaml(lengthScale: 4, rules: "conductor_temperature: estimated"));
        var together = Describe(Upsizer.Standard.Plan(before));
        var alone = Describe(new Upsizer(ConductorCatalog.Standard) { SolvesTrialsTogether = false }.Plan(before));
        return (together == alone).Label($"together: {together}; one at a time: {alone}");
    });

    [Theory]
    [MemberData(nameof(UpsizerMinimalityTests.Examples), MemberType = typeof(UpsizerMinimalityTests))]
    public void Plan_Example_TogetherIsOneAtATime(string example)
    {
        var before = Analysis.Run(Path.Combine(TestPaths.RepoRoot, "projects", example)).Solution;
        var alone = new Upsizer(ConductorCatalog.Standard) { SolvesTrialsTogether = false }.Plan(before);
        Assert.Equal(Describe(alone), Describe(Upsizer.Standard.Plan(before)));
    }

    private static string Describe(UpsizePlan plan) => string.Join(
        "; ",
        plan.Changes.Select(c => $"{c.RunId} {c.SetsAfter}×{c.SizeAfter} {c.GroundSizeAfter}").Concat(plan.TapChanges.Select(t => $"{t.TransformerId} {t.TapPercentAfter}")));
}
