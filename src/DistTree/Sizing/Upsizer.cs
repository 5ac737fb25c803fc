using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>
/// Finds the least-material (or least-price) set of conductor upsizes that brings every run and end point
/// within its limits, and proves it by re-solving the tree with the plan applied. Runs never get smaller;
/// pinned runs (<c>fixed: true</c>) keep their size; feeders may take more parallel sets up to
/// <c>sizing: max_sets</c>. Drops are budgeted on a grid of <c>sizing: resolution_percent</c> (0.001
/// percentage points by default), each rounded up; a feeder in the voltages the end points below it read, the worst of
/// those under each node it feeds (<see cref="SizingProblem.StepsIn"/>), so the optimum is safe and least on that grid. The proof is a full solve; after it, far ends too small to trip their devices
/// are raised (<see cref="FarEndRepair"/>), every change steps down toward its stated choice where the solver's own figures
/// allow (<see cref="PlanStepDown"/>), and every change the design does not need is undone (<see cref="PlanPruner"/>): the
/// plan is then minimal on the solver's figures (no change can be undone, or stepped one allowed choice down, with the
/// design still passing), not proved least on them.
/// </summary>
public sealed class Upsizer
{
    private readonly ConductorCatalog _catalog;

    /// <summary>Creates an upsizer on <paramref name="catalog"/>.</summary>
    public Upsizer(ConductorCatalog catalog) => _catalog = catalog;

    /// <summary>
    /// False to solve every trial of the step-down and the pruner alone (tests: the trials on subtrees apart, solved
    /// together, must give the same plan; see <see cref="TrialGroups"/>).
    /// </summary>
    internal bool SolvesTrialsTogether { get; init; } = true;

    /// <summary>An upsizer on the embedded catalogue.</summary>
    public static Upsizer Standard { get; } = new(ConductorCatalog.Standard);

    /// <summary>The plan for <paramref name="before"/>; its <see cref="UpsizePlan.After"/> is the re-solved proof.</summary>
    public UpsizePlan Plan(Solution before) => Plan(before, maxSteps: null);

    internal UpsizePlan Plan(Solution before, int? maxSteps)
    {
        var transformerOverloads = new List<UnresolvableLimit>();
        foreach (var f in before.AllFindings.Where(f => f.Kind == FindingKind.TransformerOverload))
        {
            transformerOverloads.Add(new UnresolvableLimit(f.Subject, $"{f.Message}: conductor sizes cannot fix this; it needs a larger transformer or less load"));
        }

        // The sizer prices drops by the percent sum, linear in R and X. Where the findings rest on the load flow
        // (rules: method: load_flow), a run's drop there comes out larger (a lower voltage draws more current), so
        // each run's priced drops are scaled by how much larger its load-flow drop is, and the plan is made again
        // with the factors of its own proof until the proof holds (the factors only grow: the safe side).
        var onLoadFlow = before.Project.Rules.Method == SolutionMethod.LoadFlow;
        var factors = new Dictionary<int, double>();
        if (onLoadFlow)
        {
            GrowLoadFlowFactors(factors, before);
        }

        var attempt = Attempt(before, maxSteps, factors, transformerOverloads);
        for (var round = 1; onLoadFlow && round < LoadFlowRounds && LeftOver(attempt.After, attempt.Unresolvable) is not null; round++)
        {
            GrowLoadFlowFactors(factors, attempt.After);
            attempt = Attempt(before, maxSteps, factors, transformerOverloads);
        }

        var (picks, unresolvable, after, problem) = attempt;
        var catalog = before.Project.Rules.ConductorCatalog ?? _catalog;
        Solution Solve(PlanPicks p) => Analysis.Run(PlanPicks.Apply(before, p), new AnalysisOptions { Catalog = catalog }).Solution;

        // The far ends the optimum leaves too small to trip their devices, raised; then every other change the design does
        // not need undone (a far end's repair was needed when it was made: it is not tried again).
        var optimum = picks.Runs;
        (picks, after, var shortOf) = FarEndRepair.Repair(before, picks, after, catalog, Solve);
        // A run is repaired where its lines changed, or where it was given a grounding conductor of its own (lines kept).
        var repairedRuns = picks.Runs.Keys.Where(k => !optimum.TryGetValue(k, out var was) || was != picks.Runs[k] || picks.Grounds.ContainsKey(k)).ToHashSet();
        Verify(after, unresolvable);
        var screen = new StepScreen(problem);
        var groups = new TrialGroups(before.Network, independent: !onLoadFlow && SolvesTrialsTogether);

        // Every change first one step down toward its stated choice as far as the solver's own figures allow (before any
        // undo takes the slack a large step needs), then every change the design does not need undone.
        (picks, after) = PlanStepDown.Refine(problem, catalog, picks, after, repairedRuns, screen, Solve, groups);
        var stepped = picks.Runs;
        (picks, after) = PlanPruner.Prune(before, picks, after, i => !repairedRuns.Contains(i) && MeetsAtStatedSize(problem, i), (k, a) => screen.MayUndo(k, stepped, a), Solve, groups);
        (picks, after) = PlanStepDown.StepTapsBack(problem, picks, after, screen, Solve, groups);
        var changes = Changes(before, after, picks, shortOf);
        var repairCost = changes.Where(c => repairedRuns.Contains(c.NodeIndex)).Sum(c => Math.Max(0, c.CostAdded - (optimum.TryGetValue(c.NodeIndex, out var was) ? was.Cost : 0)));
        var taps = TapChanges(before, after, picks.Taps);
        unresolvable.AddRange(GroundsLeft(after, changes));
        unresolvable.AddRange(FaultsLeft(after));
        return new UpsizePlan
        {
            Changes = changes,
            TapChanges = taps,
            TotalCostAdded = changes.Sum(c => c.CostAdded) + taps.Sum(t => t.CostAdded),
            FarEndRepairCostAdded = repairCost,
            CostUnit = before.Project.Sizing.Prices.Count == 0 ? "mm2·m" : (before.Project.Sizing.Currency.Length > 0 ? before.Project.Sizing.Currency : "price"),
            Unresolvable = unresolvable,
            Cautions = LightLoadRise.Cautions(before.Network, before.Project.Sizing.LightLoadRisePercent),
            Before = before,
            After = after,
        };
    }

    // One plan at the given drop factors, and its proof: the tree solved again with it applied.
    private Attempted Attempt(Solution before, int? maxSteps, Dictionary<int, double> factors, List<UnresolvableLimit> transformerOverloads)
    {
        // The project's own catalogue, where it brings one, is the one its solve and this proof use (see DropSolver).
        var catalog = before.Project.Rules.ConductorCatalog ?? _catalog;
        var problem = SizingProblem.Build(before, catalog, maxSteps, factors);
        var (choice, cost) = FrontierSolver.Solve(problem, out var tapChoice);
        if (double.IsInfinity(cost))
        {
            throw new InvalidOperationException("the sizing problem has no solution although every end point was fixable on its own");
        }

        var picks = new PlanPicks(Picks(problem, choice), TapPicks(problem, tapChoice));
        var after = Analysis.Run(PlanPicks.Apply(before, picks), new AnalysisOptions { Catalog = catalog }).Solution;
        return new Attempted(picks, [.. problem.Unresolvable, .. transformerOverloads], after, problem);
    }

    /// <summary>
    /// <paramref name="before"/>'s project with only <paramref name="changes"/> applied (each run's size and sets, and its stated
    /// grounding conductor raised as the plan raises it), solved again: how a plan is proved, and how a test undoes part of it.
    /// </summary>
    internal Solution Resolve(Solution before, IEnumerable<UpsizeChange> changes, IEnumerable<TapChange> taps)
    {
        var catalog = before.Project.Rules.ConductorCatalog ?? _catalog;
        var nodeOf = before.Runs.ToDictionary(r => (r.Kind == RunResultKind.Transformer, r.Id), r => r.NodeIndex);
        var runs = changes.ToDictionary(c => nodeOf[(false, c.RunId)], c => new RunOption(ConductorSize.Parse(c.SizeAfter), c.SetsAfter, c.DropPercentAfter, 0, c.CostAdded, true));
        var tapPicks = taps.ToDictionary(t => nodeOf[(true, t.TransformerId)], t => new TapOption(t.TapPercentAfter, 0, t.CostAdded));
        return Analysis.Run(PlanPicks.Apply(before, new PlanPicks(runs, tapPicks)), new AnalysisOptions { Catalog = catalog }).Solution;
    }

    // The chosen tap per transformer, where it differs from the present one.
    private static Dictionary<int, TapOption> TapPicks(SizingProblem problem, int[] tapChoice)
    {
        var picks = new Dictionary<int, TapOption>();
        for (var i = 0; i < tapChoice.Length; i++)
        {
            if (tapChoice[i] > 0 && problem.Taps[i] is { } taps)
            {
                picks[i] = taps[tapChoice[i]];
            }
        }

        return picks;
    }

    private static List<TapChange> TapChanges(Solution before, Solution after, Dictionary<int, TapOption> taps)
    {
        var beforeRows = before.Runs.Where(r => r.Kind == RunResultKind.Transformer).ToDictionary(r => r.NodeIndex);
        var afterRows = after.Runs.Where(r => r.Kind == RunResultKind.Transformer).ToDictionary(r => r.NodeIndex);
        return [.. taps.Keys.Order().Select(i =>
        {
            var node = before.Network.Nodes[i];
            return new TapChange
            {
                TransformerId = node.Id,
                TapPercentBefore = node.Equipment!.Transformer!.TapPercent,
                TapPercentAfter = taps[i].TapPercent,
                RegulationPercentBefore = beforeRows[i].DropPercent,
                RegulationPercentAfter = afterRows[i].DropPercent,
                CostAdded = taps[i].Cost,
                Location = node.Equipment.Location,
            };
        })];
    }

    // True when node i's run meets its own limits at its stated size and sets, or no allowed choice meets them (so undoing
    // its change may pass).
    private static bool MeetsAtStatedSize(SizingProblem problem, int i)
    {
        // A run no allowed choice fits keeps its own finding whatever it takes: its stated size is no worse in kind.
        var present = problem.Network.Nodes[i].Incoming!.Conductors;
        return problem.Options[i] is { } options
            && (options.Any(o => o.MeetsRunLimits && o.Size == present.Size && o.Sets == present.Sets) || options.All(o => !o.MeetsRunLimits));
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

    // How many times a plan on the load flow is made again with the factors of its proof.
    private const int LoadFlowRounds = 6;

    // Per run, the largest ratio yet of its load-flow drop to its percent-sum drop (at least 1).
    private static void GrowLoadFlowFactors(Dictionary<int, double> factors, Solution solved)
    {
        foreach (var r in solved.Runs)
        {
            if (r.Kind != RunResultKind.Transformer && r.LoadFlowDropPercent is { } flow && r.PercentSumDropPercent > 0 && flow > r.PercentSumDropPercent)
            {
                factors[r.NodeIndex] = Math.Max(factors.GetValueOrDefault(r.NodeIndex, 1.0), flow / r.PercentSumDropPercent);
            }
        }
    }

    // A finding a conductor choice could fix that the re-solved plan still has, or null. A stated grounding conductor
    // below its minimum is not one: the line sizes cannot fix it (the change says it must be increased); nor is a stated tap
    // over the light-load limit (the plan keeps it, and says so in its cautions).
    private static Finding? LeftOver(Solution after, List<UnresolvableLimit> unresolvable)
    {
        var known = new HashSet<string>(unresolvable.Select(u => u.Subject), StringComparer.Ordinal);
        return after.AllFindings.FirstOrDefault(f => f.Kind is not (FindingKind.TransformerOverload or FindingKind.GroundingConductor or FindingKind.InterruptingRating or FindingKind.FaultClearing
            or FindingKind.NoLoadRise)
            && !known.Contains(f.Subject));
    }

    // The proof: re-solved, nothing a conductor choice can fix is left over a limit. Where it is not, the user is told
    // where, not shown a crash.
    private static void Verify(Solution after, List<UnresolvableLimit> unresolvable)
    {
        if (LeftOver(after, unresolvable) is { } left)
        {
            throw ProjectException.At(left.Location, $"the upsize plan failed its proof: {left.Message}; size this run by hand, or plan with 'method: percent_sum' and check the result by the load flow");
        }
    }

    private static List<UpsizeChange> Changes(Solution before, Solution after, PlanPicks picks, Dictionary<int, FarEndRepair.ShortFall> shortOf)
    {
        var beforeRows = before.Runs.Where(r => r.Kind != RunResultKind.Transformer).ToDictionary(r => r.NodeIndex);
        var afterRows = after.Runs.Where(r => r.Kind != RunResultKind.Transformer).ToDictionary(r => r.NodeIndex);
        var changes = new List<UpsizeChange>();
        foreach (var index in picks.Runs.Keys.Order())
        {
            var option = picks.Runs[index];
            var run = before.Network.Nodes[index].Incoming!;
            var was = beforeRows[index];
            var least = afterRows[index].GroundMinimum;
            var stated = run.Conductors.GroundSize;
            var increase = stated is { } g && least is { } l && g < l;

            // A grounding conductor the repair names is written and priced beyond what the code makes follow the lines.
            var named = picks.Grounds.TryGetValue(index, out var pickedGround) && (least is null || pickedGround > least) && (stated is null || pickedGround > stated) ? pickedGround : (ConductorSize?)null;
            var follows = increase ? least : stated ?? least;
            var groundCost = named is { } n && follows is { } f ? FarEndRepair.GroundCost(run.Conductors, f, n, option.Sets, before.Project.Sizing) ?? 0.0 : 0.0;
            changes.Add(new UpsizeChange
            {
                NodeIndex = index,
                RunId = was.Id,
                Kind = was.Kind,
                SizeBefore = run.Conductors.Size.Text,
                SizeAfter = option.Size.Text,
                SetsBefore = run.Conductors.Sets,
                SetsAfter = option.Sets,
                DropPercentBefore = was.DropPercent,
                DropPercentAfter = afterRows[index].DropPercent,
                CostAdded = option.Cost + groundCost,
                GroundingNote = GroundingNote(before.Code, run.Conductors.OcpdA is not null, option.Sets, least, stated, increase, named),
                GroundMinSize = least?.Text,
                GroundSize = stated?.Text,
                GroundMustIncrease = increase,
                GroundSizeAfter = (named ?? (increase ? least : null))?.Text,
                FaultClearingNote = shortOf.TryGetValue(index, out var s) ? FaultClearingNote(run, option, s, named) : null,
                SizeLocation = run.Conductors.SizeLocation,
            });
        }

        return changes;
    }

    // What the new size needs of the grounding conductor, with the clause the code in force cites: none without a device,
    // nor where the rule set does not hold the code's table (the CEC's Table 16).
    private static string GroundingNote(CodeRules code, bool hasDevice, int sets, ConductorSize? least, ConductorSize? stated, bool increase, ConductorSize? named)
    {
        var clause = code.Cite(CodeCheck.GroundingConductor);
        var each = sets > 1 ? " in each set" : "";
        if (named is { } raised)
        {
            var codeLeast = least is { } m ? $"the code's minimum is {m.Text} ({clause})" : $"the code gives no minimum here ({clause})";
            var replaces = stated is { } s ? $"; it replaces the stated {s.Text}" : "";
            return $"{raised.Text}{each}, larger than it need be for the code alone, so that a fault at the far end trips the device ({code.Cite(CodeCheck.FaultClearing)}); {codeLeast}{replaces}";
        }

        if (least is not { } minimum)
        {
            return hasDevice
                ? $"no minimum: the table of the {code.GroundingConductorTerm}'s size is not held ({clause})"
                : $"no minimum without an overcurrent device ({clause})";
        }

        return increase
            ? $"at least {minimum.Text}{each} ({clause}); the stated {stated!.Value.Text} is too small and must be increased too"
            : $"at least {minimum.Text}{each} ({clause})";
    }

    // Why a run was raised beyond what its drops need, and the other remedy: a device that trips without delay at a lower current.
    private static string FaultClearingNote(NetworkRun run, RunOption option, FarEndRepair.ShortFall fall, ConductorSize? ground)
    {
        var (minimumA, tripA) = (fall.MinimumA, fall.TripA);
        var lines = $"{(option.Sets > 1 ? $"{option.Sets}×" : "")}{option.Size.Text}";
        var raised = option.Size != run.Conductors.Size || option.Sets != run.Conductors.Sets;
        var what = (ground, raised) switch
        {
            ({ } g, true) => $"raised to {lines} with a {g.Text} grounding conductor",
            ({ } g, false) => $"its grounding conductor alone raised to {g.Text}",
            _ => $"raised to {lines}",
        };
        if (fall.ForRun is { } below)
        {
            return FormattableString.Invariant(
                $"{what} so that a fault at the source end of {below}, on its far end's bus, trips {below}'s device without delay: it drew {minimumA:0} A against the {tripA:0} A trip; a device on {below} that trips without delay at or below {minimumA:0} A would clear it without the raise for the fault");
        }

        return FormattableString.Invariant(
            $"{what} so that a fault at its far end trips its device without delay: it drew {minimumA:0} A against the {tripA:0} A trip; a device that trips without delay at or below {minimumA:0} A{(run.Conductors.OcpdA is { } a ? $" ({minimumA / a:0.#} × {a:0.#} A)" : "")} would clear it without the raise for the fault");
    }

    // The runs the plan leaves alone whose stated grounding conductor is below its minimum: no line size fixes that.
    private static IEnumerable<UnresolvableLimit> GroundsLeft(Solution after, List<UpsizeChange> changes)
    {
        var changed = new HashSet<string>(changes.Select(c => c.RunId), StringComparer.Ordinal);
        return after.AllFindings
            .Where(f => f.Kind == FindingKind.GroundingConductor && !changed.Contains(f.Subject))
            .Select(f => new UnresolvableLimit(f.Subject, $"{f.Message}: a larger line size cannot fix this; increase the grounding conductor"));
    }

    // What the plan leaves of the short-circuit checks: equipment rated below its fault current (no conductor fixes that),
    // and far ends whose fault is too small to trip their device.
    private static IEnumerable<UnresolvableLimit> FaultsLeft(Solution after) => after.AllFindings
        .Where(f => f.Kind is FindingKind.InterruptingRating or FindingKind.FaultClearing)
        .Select(f => new UnresolvableLimit(f.Subject, f.Kind == FindingKind.InterruptingRating
            ? $"{f.Message}: conductor sizes cannot fix this; it needs equipment of a higher rating"
            : FormattableString.Invariant($"{f.Message}: no allowed size of its lines or grounding conductor clears it (pinned, no larger within the terminals at its ends or the catalogue, or the fault at its source end already too small); a shorter run, or a device that trips without delay at or below {f.Value:0} A, would")));

    // A plan, what it reports as unfixable, and its proof.
    private sealed record Attempted(PlanPicks Picks, List<UnresolvableLimit> Unresolvable, Solution After, SizingProblem Problem);
}
