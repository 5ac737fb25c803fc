using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Solving.Passes;

namespace DistTree.Sizing;

/// <summary>One allowed choice for a run: a size and a number of sets, with its drop and cost.</summary>
/// <param name="Size">Conductor size.</param>
/// <param name="Sets">Parallel sets.</param>
/// <param name="DropPercent">The run's drop at this choice, percent (exact).</param>
/// <param name="Steps">The drop on the optimiser's grid, rounded up: ceil(drop / resolution).</param>
/// <param name="Cost">Cost added against the present choice (material in mm²·m, or priced).</param>
/// <param name="MeetsRunLimits">True when the choice meets the run's own drop limit, ampacity and device rules.</param>
/// <param name="WithinTerminals">True when the terminals at both its ends accept the choice (its device's, and a feeder's far-end main, see <see cref="TerminalTable"/>), or it is the present one.</param>
/// <param name="SlotDrops">
/// A feeder's drop in each voltage of its bus (<see cref="Slots"/>), percent, where the end points it feeds directly see
/// them (see <see cref="SizingProblem.StepsIn"/>); <see cref="DropPercent"/> in a voltage it does not have; null elsewhere.
/// </param>
internal readonly record struct RunOption(
    ConductorSize Size, int Sets, double DropPercent, int Steps, double Cost, bool MeetsRunLimits, bool WithinTerminals = true, double[]? SlotDrops = null);

/// <summary>One allowed tap of a transformer: its setting, the transformer's regulation there on the grid, and what setting it costs.</summary>
/// <param name="TapPercent">The tap, percent (negative raises the secondary).</param>
/// <param name="Steps">The transformer's regulation at this tap on the grid, rounded up (negative for a net raise).</param>
/// <param name="Cost">What setting it costs (0 for the present tap).</param>
internal readonly record struct TapOption(double TapPercent, int Steps, double Cost);

/// <summary>
/// The upsizing problem of a solved tree, on a budget grid: per node the choices of its incoming run (only
/// those that meet the run's own limits, unless none does), the transformers' regulation in grid steps,
/// and the end points whose total no choice can bring within the limit (left out of the budget and
/// reported). Loads are fixed, so a run's drop depends on its own choice alone.
/// </summary>
internal sealed partial class SizingProblem
{
    private SizingProblem(Solution solution, int budgetSteps, double resolution, RunOption[]?[] options, int[] transformerSteps,
        TapOption[]?[] taps, bool[] excluded, List<UnresolvableLimit> unresolvable)
    {
        Taps = taps;
        Solution = solution;
        BudgetSteps = budgetSteps;
        ResolutionPercent = resolution;
        Options = options;
        TransformerSteps = transformerSteps;
        Excluded = excluded;
        Unresolvable = unresolvable;
    }

    public Solution Solution { get; }

    public DistributionNetwork Network => Solution.Network;

    /// <summary>The total limit in grid steps.</summary>
    public int BudgetSteps { get; }

    public double ResolutionPercent { get; }

    /// <summary>Per node index, the choices of its incoming run (present choice first), or null without a run.</summary>
    public RunOption[]?[] Options { get; }

    /// <summary>Per node index, a transformer's regulation in grid steps (0 elsewhere).</summary>
    public int[] TransformerSteps { get; }

    /// <summary>
    /// Per node index, the most its bus can stand above nominal at no load, as a ratio to nominal, with every transformer
    /// at or above it at its most raising allowed tap (its stated one where its tap is no choice): see <see cref="LightLoadRise"/>.
    /// </summary>
    public double[] NoLoadMost { get; private init; } = [];

    /// <summary>The rule set the choices were judged by (its catalogue prices their figures).</summary>
    public CodeRules? Protection { get; private init; }

    /// <summary>
    /// The least rise, over the voltages its own drop is the worst of, of node <paramref name="node"/>'s run's drop from
    /// <paramref name="toSets"/> × <paramref name="toSize"/> back to <paramref name="fromSets"/> × <paramref name="fromSize"/>,
    /// percent, by the percent sum: what undoing the change raises every end point below it by at least (where no
    /// transformer lies between).
    /// </summary>
    public double LeastRise(int node, ConductorSize fromSize, int fromSets, ConductorSize toSize, int toSets)
    {
        var row = Solution.IncomingRun(node)!.Value;
        var conductors = Network.Nodes[node].Incoming!.Conductors;
        var rules = Solution.Project.Rules;
        Span<double> unitR = stackalloc double[Slots.Count];
        Span<double> unitX = stackalloc double[Slots.Count];
        var own = row.UnitDrops(unitR, unitX);
        (double R, double X) At(ConductorSize size, int sets)
        {
            var f = RunElectrics.Compute(Protection!, rules, conductors, size, sets, Solution.Project.Service.FrequencyHz, row.CurrentA, row.CurrentCarryingConductors ?? 3);
            var ratio = (double)conductors.Sets / sets;
            return (f.ResistanceOhmPerKm * ratio, f.ReactanceOhmPerKm * ratio);
        }

        var (rFrom, xFrom) = At(fromSize, fromSets);
        var (rTo, xTo) = At(toSize, toSets);
        var least = double.PositiveInfinity;
        for (var slot = 0; slot < Slots.Count; slot++)
        {
            if ((own & (1 << slot)) != 0)
            {
                least = Math.Min(least, ((rFrom - rTo) * unitR[slot]) + ((xFrom - xTo) * unitX[slot]));
            }
        }

        return double.IsFinite(least) ? least : 0.0;
    }

    /// <summary>Per node index, a transformer's allowed taps (present tap first), or null where its tap is not a choice.</summary>
    public TapOption[]?[] Taps { get; }

    /// <summary>Per node index, true for an end point left out of the budget (no choice fixes it).</summary>
    public bool[] Excluded { get; }

    public List<UnresolvableLimit> Unresolvable { get; }

    public bool NewOrigin => Solution.Project.Rules.TransformerDrop == TransformerDropMode.NewOrigin;

    /// <summary>
    /// Builds the problem. <paramref name="maxSteps"/> limits each run to that many sizes above its own (tests).
    /// <paramref name="dropFactors"/>, per node index, scales the drops priced for its incoming run (1 where absent):
    /// the upsizer's allowance for a load flow whose drops come out larger than the percent sums it prices.
    /// </summary>
    public static SizingProblem Build(Solution solution, ConductorCatalog catalog, int? maxSteps = null, IReadOnlyDictionary<int, double>? dropFactors = null)
    {
        var project = solution.Project;
        var sizing = project.Sizing;
        var resolution = sizing.ResolutionPercent;
        var nodes = solution.Network.Nodes;
        var options = new RunOption[]?[nodes.Count];
        var transformerSteps = new int[nodes.Count];
        var unresolvable = new List<UnresolvableLimit>();
        var protection = CodeRules.For(project.Rules, catalog);
        var terminals = sizing.TerminalTable ?? TerminalTable.Standard;
        var ownSlots = new int[nodes.Count];
        var unitR = new double[Slots.Count];
        var unitX = new double[Slots.Count];
        foreach (var row in solution.Runs)
        {
            if (row.Kind == RunResultKind.Transformer)
            {
                transformerSteps[row.NodeIndex] = Steps(row.DropPercent, resolution);
                continue;
            }

            var run = nodes[row.NodeIndex].Incoming!;
            var factor = dropFactors?.GetValueOrDefault(row.NodeIndex, 1.0) ?? 1.0;
            var own = row.UnitDrops(unitR, unitX);
            var bySlot = run.Kind == RunKind.Feeder && nodes[row.NodeIndex].Kind != NodeKind.Transformer && run.System == nodes[row.NodeIndex].System;
            ownSlots[row.NodeIndex] = run.Kind == RunKind.Branch ? own : 0;
            var all = Candidates(run, row, (unitR, unitX, own, bySlot), project, catalog, protection, terminals, maxSteps, factor).ToArray();
            var buildable = all.Where(o => o.WithinTerminals).ToArray();
            var fitting = buildable.Where(o => o.MeetsRunLimits).ToArray();
            if (fitting.Length == 0)
            {
                unresolvable.Add(new UnresolvableLimit(row.Id, UnfixableRun(row, run, buildable, all, terminals)));
            }

            options[row.NodeIndex] = Pareto(fitting.Length > 0 ? fitting : buildable);
        }

        // The budget is the largest end point's limit on the grid; an end point with a smaller limit (lighting, a
        // shorter path under a long-path allowance) has the difference added to its own run's steps, so that it fits
        // exactly where its own limit allows.
        var budget = solution.EndPoints.Count == 0 ? BudgetOf(project.Rules.TotalLimitPercent, resolution) : solution.EndPoints.Max(e => BudgetOf(e.LimitPercent, resolution));
        foreach (var e in solution.EndPoints)
        {
            var shortBy = budget - BudgetOf(e.LimitPercent, resolution);
            if (shortBy > 0 && options[e.NodeIndex] is { } leaf)
            {
                options[e.NodeIndex] = Array.ConvertAll(leaf, o => o with { Steps = o.Steps + shortBy });
            }
        }

        // The light-load limit (see LightLoadRise), judged from the service down: a transformer's raises are judged with every
        // transformer above it at its most raising allowed tap, so no combination of allowed taps puts a bus over the limit.
        // The taps above have the first claim on the rise: a raise below that would fit only while those above stay put is
        // refused (the safe side; PathRemedies says so where it was the only remedy).
        var taps = new TapOption[]?[nodes.Count];
        var noLoadMost = new double[nodes.Count];
        for (var i = 0; i < nodes.Count; i++)
        {
            var above = i == 0 ? 1.0 : noLoadMost[nodes[i].ParentIndex];
            noLoadMost[i] = above;
            if (solution.TransformerRun(i) is { } row)
            {
                var data = nodes[i].Equipment!.Transformer!;
                (taps[i], transformerSteps[i]) = TapChoices(row, data, budget * resolution, resolution, sizing, project.Rules, above);
                noLoadMost[i] = above * NoLoadRise.Factor(taps[i]?.Min(t => t.TapPercent) ?? data.TapPercent);
            }
        }

        var problem = new SizingProblem(solution, budget, resolution, options, transformerSteps, taps, new bool[nodes.Count], unresolvable)
        {
            Protection = protection,
            NoLoadMost = noLoadMost,
            SlotsBelow = SlotsBelowOf(nodes, ownSlots),
        };
        problem.ExcludeUnfixableEndPoints();
        return problem;
    }

    // A transformer's taps at or raising the secondary from its present one, within its range and within the light-load
    // limit with its primary's bus at no-load ratio aboveFactor (none to choose at a new origin, where its regulation counts
    // in no total), and its present regulation on the grid. A tap takes (100 − the shares above it)·tap/(1 + tap) off the
    // voltage (see PathShares); the shares above are not known here, so a raise is priced as if they were the whole budget
    // and a lowering as if they were none (the safe side either way).
    private static (TapOption[]? Taps, int PresentSteps) TapChoices(RunResult row, TransformerData data, double budgetPercent, double resolution, SizingOptions sizing, Rules rules, double aboveFactor)
    {
        static double Share(double tapPercent) => tapPercent / (100.0 + tapPercent);
        var winding = row.DropPercent - (100.0 * Share(data.TapPercent));
        int StepsAt(double tap) => Steps(winding + ((Share(tap) < 0 ? 100.0 - budgetPercent : 100.0) * Share(tap)), resolution);
        var present = new TapOption(data.TapPercent, StepsAt(data.TapPercent), 0.0);
        if (rules.TransformerDrop == TransformerDropMode.NewOrigin)
        {
            return (null, Steps(row.DropPercent, resolution));
        }

        var raises = TransformerData.TapSteps.Where(t => t < data.TapPercent && Math.Abs(t) <= data.TapRangePercent + 1e-9
            && NoLoadRise.Within(aboveFactor * NoLoadRise.Factor(t), sizing.LightLoadRisePercent)).OrderByDescending(t => t);
        TapOption[] all = [present, .. raises.Select(t => new TapOption(t, StepsAt(t), sizing.TapCost))];
        return (all.Length > 1 ? all : null, present.Steps);
    }

    // A limit on the grid, rounded down (the safe side).
    private static int BudgetOf(double limitPercent, double resolution) => (int)Math.Floor((limitPercent / resolution) + 1e-9);

    /// <summary>A drop on the grid, rounded up (the safe side); exact multiples are not pushed up by rounding noise.</summary>
    public static int Steps(double dropPercent, double resolution) => (int)Math.Ceiling((dropPercent / resolution) - 1e-9);

    // An end point is fixable when its path at every run's least-drop choice fits the budget. All end points
    // can reach their least drops at once, so the others need no more than that.
    private void ExcludeUnfixableEndPoints()
    {
        var nodes = Network.Nodes;
        var least = new int[nodes.Count];
        for (var i = 0; i < nodes.Count; i++)
        {
            var parent = nodes[i].ParentIndex;
            var above = parent < 0 ? 0 : BusSteps(parent, least[parent]);
            if (parent >= 0 && SlotsBelow[i] != 0 && Options[parent] is { } feeder && feeder[0].SlotDrops is not null)
            {
                above += feeder.Min(x => StepsIn(x, SlotsBelow[i])) - feeder.Min(x => x.Steps); // the drop in the voltages read below, not the worst
            }

            least[i] = above + (Options[i] is { } o ? o.Min(x => x.Steps) : 0);
        }

        foreach (var e in Solution.EndPoints)
        {
            if (least[e.NodeIndex] > BudgetSteps)
            {
                Excluded[e.NodeIndex] = true;
                var over = (least[e.NodeIndex] - BudgetSteps) * ResolutionPercent;
                Unresolvable.Add(new UnresolvableLimit(e.Id, FormattableString.Invariant(
                    $"end point {e.Id}: even with every run on its path at its largest allowed size and sets (within the terminals at its ends) and every transformer above it at its most raising allowed tap, the total is about {e.LimitPercent + over:0.00} % against the {e.LimitPercent:0.##} % limit; {PathRemedies.Smallest(this, e.NodeIndex, over)}")));
            }
        }
    }

    /// <summary>Steps used at a node's bus, given the steps used at its input plus its run: adds a transformer's least regulation (at its most raising allowed tap), or restarts at a new origin.</summary>
    public int BusSteps(int node, int stepsAtInputAfterRun)
    {
        if (Network.Nodes[node].Kind != NodeKind.Transformer)
        {
            return stepsAtInputAfterRun;
        }

        return NewOrigin ? 0 : stepsAtInputAfterRun + (Taps[node] is { } taps ? taps.Min(t => t.Steps) : TransformerSteps[node]);
    }

    // Each choice of a run (its unit drops per voltage, the voltages its own drop is the worst of, and whether its choices
    // carry their drop per voltage: a feeder to equipment of its own system, not a transformer).
    private static IEnumerable<RunOption> Candidates(
        NetworkRun run, RunResult row, (double[] R, double[] X, int Own, bool BySlot) unit, Project project, ConductorCatalog catalog, CodeRules protection,
        TerminalTable terminals, int? maxSteps, double dropFactor)
    {
        var conductors = run.Conductors;
        var maxSets = conductors.Fixed || run.Kind == RunKind.Branch ? conductors.Sets : Math.Max(conductors.Sets, project.Sizing.MaxSets ?? conductors.Sets);
        var present = Cost(conductors, conductors.Size, conductors.Sets, run.Supply, project.Sizing) ?? 0.0;
        var (unitR, unitX, own) = (unit.R, unit.X, unit.Own);
        var steps = 0;
        // A terminal takes sizes up to its largest, so past the first size beyond the terminals that meets the run's limits (the
        // least such one, which names what would do where no buildable one does) no larger size of the same sets is wanted.
        var done = new bool[maxSets + 1];
        var open = maxSets - conductors.Sets + 1;
        for (ConductorSize? size = conductors.Size; size is { } s && open > 0; size = conductors.Fixed ? null : s.NextLarger, steps++)
        {
            if (maxSteps is { } limit && steps > limit)
            {
                yield break;
            }

            if (!catalog.Contains(s))
            {
                continue;
            }

            for (var sets = conductors.Sets; sets <= maxSets; sets++)
            {
                var isPresent = s == conductors.Size && sets == conductors.Sets;
                if (done[sets] || (sets > 1 && !isPresent && !protection.ParallelSetsAllowed(s)))
                {
                    continue; // the code allows no parallel sets of a conductor this small: not a buildable choice
                }

                var cost = Cost(conductors, s, sets, run.Supply, project.Sizing);
                if (cost is null && !isPresent)
                {
                    continue;
                }

                // The drop is linear in R and X (per phase too): the run's unit responses price any size. A branch
                // circuit's own lines are what its end point sees; a feeder's worst line bounds every end point below, and
                // its drop in each voltage is what the end points on its far bus see (SlotDrops).
                var figures = RunElectrics.Compute(protection, project.Rules, conductors, s, sets, project.Service.FrequencyHz, row.CurrentA, row.CurrentCarryingConductors ?? 3);
                var ratio = (double)conductors.Sets / sets;
                var (r, x) = (figures.ResistanceOhmPerKm * ratio, figures.ReactanceOhmPerKm * ratio);
                var drop = RunDrops.OwnDrop(unitR, unitX, r, x, own) * dropFactor;
                var meets = drop <= row.LimitPercent!.Value + 1e-9 && MeetsCurrentRules(protection, run, s, sets, row, figures.AmpacityA);
                var accepted = isPresent || AcceptsBothEnds(terminals, run, s, sets);
                if (!accepted && meets)
                {
                    (done[sets], open) = (true, open - 1);
                }

                var bySlot = unit.BySlot ? new double[Slots.Count] : null;
                for (var slot = 0; bySlot is not null && slot < Slots.Count; slot++)
                {
                    bySlot[slot] = (own & (1 << slot)) != 0 ? ((r * unitR[slot]) + (x * unitX[slot])) * dropFactor : drop;
                }

                yield return new RunOption(s, sets, drop, Steps(drop, project.Sizing.ResolutionPercent), isPresent ? 0.0 : (cost ?? 0.0) - present, meets, accepted, bySlot);
            }
        }
    }

    // The run's current and device rules at a choice (see CodeRules.Meets).
    private static bool MeetsCurrentRules(CodeRules protection, NetworkRun run, ConductorSize size, int sets, RunResult row, double? ampacityA)
    {
        var conductors = run.Conductors;
        if (ampacityA is not { } ampacity)
        {
            // No tabulated ampacity (e.g. metric 400 mm² and up): only the present choice, which the solver already reported on.
            return size == conductors.Size && sets == conductors.Sets;
        }

        return protection.Meets(row.DesignCurrentA, row.OcpdA, size, conductors.Material, sets, ampacity, conductors.DeviceType, CircuitDuty.Of(run));
    }

    // Material: area × length × current-carrying conductors × sets (mm²·m); with a price table, price × length × conductors × sets.
    internal static double? Cost(Run conductors, ConductorSize size, int sets, CircuitSupply supply, SizingOptions sizing)
    {
        var conductorsPerSet = supply.Phases == 3 ? 3 : 2;
        if (sizing.Prices.Count == 0)
        {
            return size.AreaMm2 * conductors.LengthM * conductorsPerSet * sets;
        }

        return sizing.Prices.TryGetValue(size, out var price) ? price * conductors.LengthM * conductorsPerSet * sets : null;
    }

    // Keeps the choices no other choice beats on both drop and cost; present choice first, then by cost.
    private static RunOption[] Pareto(RunOption[] options)
    {
        var ordered = options.Select((o, i) => (o, i)).OrderBy(p => p.o.Cost).ThenBy(p => p.o.Steps).ThenBy(p => p.i).Select(p => p.o);
        var kept = new List<RunOption>();
        var bestSteps = int.MaxValue;
        foreach (var o in ordered)
        {
            if (o.Steps < bestSteps)
            {
                kept.Add(o);
                bestSteps = o.Steps;
            }
        }

        return [.. kept];
    }
}
