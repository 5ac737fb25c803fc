using System.Globalization;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Finds the least-material (or least-price) set of conductor upsizes that brings every run and end point
/// within its limits, and proves it by re-solving the tree with the plan applied. Runs never get smaller;
/// pinned runs (<c>fixed: true</c>) keep their size; feeders may take more parallel sets up to
/// <c>sizing: max_sets</c>. Drops are budgeted on a grid of <c>sizing: resolution_percent</c> (0.001
/// percentage points by default), each rounded up, so the plan is safe and optimal on that grid.
/// </summary>
public sealed class Upsizer
{
    private readonly ConductorCatalog _catalog;

    /// <summary>Creates an upsizer on <paramref name="catalog"/>.</summary>
    public Upsizer(ConductorCatalog catalog) => _catalog = catalog;

    /// <summary>An upsizer on the embedded catalogue.</summary>
    public static Upsizer Standard { get; } = new(ConductorCatalog.Standard);

    /// <summary>The plan for <paramref name="before"/>; its <see cref="UpsizePlan.After"/> is the re-solved proof.</summary>
    public UpsizePlan Plan(Solution before) => Plan(before, maxSteps: null);

    internal UpsizePlan Plan(Solution before, int? maxSteps)
    {
        var problem = SizingProblem.Build(before, _catalog, maxSteps);
        var (choice, cost) = FrontierSolver.Solve(problem);
        if (double.IsInfinity(cost))
        {
            throw new InvalidOperationException("the sizing problem has no solution although every end point was fixable on its own");
        }

        var unresolvable = problem.Unresolvable.ToList();
        foreach (var f in before.AllFindings.Where(f => f.Kind == FindingKind.TransformerOverload))
        {
            unresolvable.Add(new UnresolvableLimit(f.Subject, $"{f.Message}: conductor sizes cannot fix this; it needs a larger transformer or less load"));
        }

        var picks = Picks(problem, choice);
        var after = new DropSolver(_catalog).Solve(NetworkBuilder.Build(Apply(before.Project, before.Network, picks)));
        Verify(after, unresolvable);
        var changes = Changes(before, after, picks);
        return new UpsizePlan
        {
            Changes = changes,
            TotalCostAdded = changes.Sum(c => c.CostAdded),
            CostUnit = before.Project.Sizing.Prices.Count == 0 ? "mm2·m" : (before.Project.Sizing.Currency.Length > 0 ? before.Project.Sizing.Currency : "price"),
            Unresolvable = unresolvable,
            Before = before,
            After = after,
        };
    }

    // The chosen size and sets per node, where they differ from the present ones.
    private static Dictionary<int, RunOption> Picks(SizingProblem problem, int[] choice)
    {
        var picks = new Dictionary<int, RunOption>();
        var nodes = problem.Network.Nodes;
        for (var i = 0; i < nodes.Count; i++)
        {
            if (choice[i] < 0)
            {
                continue;
            }

            var option = problem.Options[i]![choice[i]];
            var present = nodes[i].Incoming!.Conductors;
            if (option.Size != present.Size || option.Sets != present.Sets)
            {
                picks[i] = option;
            }
        }

        return picks;
    }

    /// <summary>The project with the picked sizes and sets on their runs; everything else as it was.</summary>
    private static Project Apply(Project project, DistributionNetwork network, Dictionary<int, RunOption> picks)
    {
        var feeders = new Dictionary<string, RunOption>(StringComparer.Ordinal);
        var branches = new Dictionary<string, RunOption>(StringComparer.Ordinal);
        foreach (var (index, option) in picks)
        {
            var node = network.Nodes[index];
            (node.Circuit is not null ? branches : feeders)[node.Id] = option;
        }

        Run With(Run run, RunOption o) => run with { Size = o.Size, Sets = o.Sets };
        var equipment = project.Equipment.Select(e => e with
        {
            Feeder = e.Feeder is { } f && feeders.TryGetValue(e.Id, out var fo) ? With(f, fo) : e.Feeder,
            Circuits = e.Circuits.Select(c => branches.TryGetValue(c.FullId, out var co) ? c with { Run = With(c.Run, co) } : c).ToArray(),
        }).ToArray();
        return project with { Equipment = equipment };
    }

    // The proof: re-solved, nothing a conductor choice can fix is left over a limit.
    private static void Verify(Solution after, List<UnresolvableLimit> unresolvable)
    {
        var known = new HashSet<string>(unresolvable.Select(u => u.Subject), StringComparer.Ordinal);
        var left = after.AllFindings.FirstOrDefault(f => f.Kind != FindingKind.TransformerOverload && !known.Contains(f.Subject));
        if (left is not null)
        {
            throw new InvalidOperationException($"the upsize plan failed its proof: {left.Message}");
        }
    }

    private static List<UpsizeChange> Changes(Solution before, Solution after, Dictionary<int, RunOption> picks)
    {
        var beforeRows = before.Runs.Where(r => r.Kind != RunResultKind.Transformer).ToDictionary(r => r.NodeIndex);
        var afterRows = after.Runs.Where(r => r.Kind != RunResultKind.Transformer).ToDictionary(r => r.NodeIndex);
        var changes = new List<UpsizeChange>();
        foreach (var index in picks.Keys.Order())
        {
            var option = picks[index];
            var run = before.Network.Nodes[index].Incoming!;
            var was = beforeRows[index];
            changes.Add(new UpsizeChange
            {
                RunId = was.Id,
                Kind = was.Kind,
                SizeBefore = run.Conductors.Size.Text,
                SizeAfter = option.Size.Text,
                SetsBefore = run.Conductors.Sets,
                SetsAfter = option.Sets,
                DropPercentBefore = was.DropPercent,
                DropPercentAfter = afterRows[index].DropPercent,
                CostAdded = option.Cost,
                GroundingNote = GroundingNote(run.Conductors, option),
                SizeLocation = run.Conductors.SizeLocation,
            });
        }

        return changes;
    }

    // NEC 250.122(B) (memory; verify against the edition in force): where ungrounded conductors are increased
    // in size, a wire-type equipment grounding conductor grows in proportion to their circular-mil area.
    private static string? GroundingNote(Run present, RunOption option)
    {
        var ratio = option.Size.AreaCmil * option.Sets / (present.Size.AreaCmil * present.Sets);
        return ratio <= 1 + 1e-9
            ? null
            : string.Create(CultureInfo.InvariantCulture, $"increase a wire-type equipment grounding conductor in proportion to the circular-mil area (×{ratio:0.00}), NEC 250.122(B)");
    }
}
