using DistTree.Conductors;
using DistTree.Sizing;
using DistTree.Solving;
using DistTree.Tests.Solving;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Sizing;

/// <summary>
/// The optimiser prices a feeder, for the end points hung on its far bus, in each end point's own voltage (SizingProblem.
/// StepsIn). Checked against the solver's own reading of the same drop by another road: the share of that feeder in
/// each such end point's total (PathShares, which reads the end point's voltage on the feeder's line and neutral
/// currents). By the percent sum the two must agree for an end point on one voltage (a line to neutral, or one pair), and
/// the price must be at least the share for one on three pairs (the worst of them).
/// </summary>
public sealed class SlotPricingTests
{
    [Property(MaxTest = 40)]
    public Property Price_RandomTree_IsTheSolversShareInTheEndPointsOwnVoltage() => Prop.ForAll(RandomTree.Arbitrary, tree =>
    {
        var (mismatch, _) = Mismatch(SolverHarness.Solve(tree.ToYaml(lengthScale: 4)));
        return (mismatch is null).Label(mismatch ?? "");
    });

    [Theory]
    [MemberData(nameof(UpsizerMinimalityTests.Examples), MemberType = typeof(UpsizerMinimalityTests))]
    public void Price_Example_IsTheSolversShareInTheEndPointsOwnVoltage(string example)
    {
        var (mismatch, priced) = Mismatch(Analysis.Run(Path.Combine(TestPaths.RepoRoot, "projects", example)).Solution);
        Assert.Null(mismatch);
        Assert.True(priced > 0, "no end point hangs on a feeder priced per voltage");
    }

    // The first end point whose price for its feeder differs from the solver's share, in words (null where none does), and
    // how many end points were compared.
    private static (string? Mismatch, int Priced) Mismatch(Solution solution)
    {
        var problem = SizingProblem.Build(solution, ConductorCatalog.Standard);
        var nodes = solution.Network.Nodes;
        var priced = 0;
        foreach (var e in solution.EndPoints)
        {
            var feeder = nodes[e.NodeIndex].ParentIndex;
            if (problem.Options[feeder] is not [{ SlotDrops: not null }, ..] options || solution.IncomingRun(feeder) is not { } row)
            {
                continue;
            }

            // The feeder's choice as it stands, where the problem holds it (it may have been left out as too small).
            var present = options.Where(o => o.Size.ToString() == row.Size && o.Sets == row.Sets).ToArray();
            var at = e.RunIndices.ToList().FindIndex(r => solution.Runs[r].NodeIndex == feeder);
            if (present.Length == 0 || at < 0)
            {
                continue;
            }

            var own = problem.SlotsBelow[e.NodeIndex];
            var price = SizingProblem.DropIn(present[0], own);
            var share = e.RunSharesPercent[at];
            var single = (own & (own - 1)) == 0;
            priced++;
            if (single ? Math.Abs(price - share) > 1e-9 * Math.Max(1, Math.Abs(share)) : price < share - 1e-9)
            {
                return (FormattableString.Invariant($"{e.Id} under {nodes[feeder].Id}: priced {price} %, the solver's share {share} % (voltages {Convert.ToString(own, 2)})"), priced);
            }
        }

        return (null, priced);
    }
}
