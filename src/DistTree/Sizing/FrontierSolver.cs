using System.Numerics.Tensors;

namespace DistTree.Sizing;

/// <summary>
/// The exact optimiser on the budget grid: a bottom-up dynamic programme over the tree. For every node,
/// H[b] is the least cost of its subtree (its incoming run included) when b grid steps of drop are left
/// at its input; a node's bus sums its children's H; a run takes the best choice
/// H[b] = min over choices (cost + bus[b − steps]). Leaves need only a sorted sweep. The choices are then
/// read back top-down from the service with the whole budget. Iterative over the parent-first node array.
/// A feeder is priced for each node it feeds in the voltages the end points at or below that node read: its bus is kept
/// as one sum per group of voltages, and H[b] = min over choices (cost + Σ groups bus_g[b − steps in g]) (see
/// <see cref="SizingProblem.StepsIn"/>, <see cref="SizingProblem.SlotsBelow"/>); a transformer's is priced at its worst.
/// </summary>
internal static class FrontierSolver
{
    /// <summary>The chosen option index per node (−1 without a run), and the total cost; cost is +∞ when infeasible.</summary>
    public static (int[] Choice, double Cost) Solve(SizingProblem problem) => Solve(problem, out _);

    /// <summary>As <see cref="Solve(SizingProblem)"/>, with the chosen tap index per node in <paramref name="tapChoice"/> (−1 where the tap is no choice).</summary>
    public static (int[] Choice, double Cost) Solve(SizingProblem problem, out int[] tapChoice)
    {
        var nodes = problem.Network.Nodes;
        var n = nodes.Count;

        // The service's budget is b steps; below a transformer whose tap raises its secondary by more than its windings
        // drop, the end points may take more than b steps of their own (the raise counts against them). The tables reach
        // as far as the most any path can be raised (the largest sum of raises along a path), so that no raise is cut off.
        var b = problem.BudgetSteps;
        var top = b + MostRaise(problem);
        var bus = new double[]?[n];
        var slotBus = new Dictionary<int, double[]>?[n];
        var binds = new bool[n]; // a node's bus holds a child that limits the budget (not only constants)
        var choices = new short[]?[n];
        var tapChoices = new short[]?[n];

        // A subtree with no end point left in the budget puts no limit on the drops above it.
        var constrained = new bool[n];
        for (var i = n - 1; i > 0; i--)
        {
            constrained[i] |= nodes[i].Circuit is not null && !problem.Excluded[i];
            constrained[nodes[i].ParentIndex] |= constrained[i];
        }

        for (var i = n - 1; i >= 0; i--)
        {
            var node = nodes[i];
            var parent = node.ParentIndex;
            if (node.Circuit is not null)
            {
                // Fed directly by a feeder whose drop is known per voltage: it joins the others on the same voltages.
                // One left out of the budget adds a constant, and limits nothing.
                var bySlot = !problem.Excluded[i] && BySlot(problem, i);
                var target = bySlot ? SlotBus(slotBus, parent, problem.SlotsBelow[i], top) : ParentBus(bus, parent, top);
                AddLeaf(target, problem.Options[i]!, problem.Excluded[i]);
                binds[parent] |= !bySlot && !problem.Excluded[i];
                continue;
            }

            var hasWorst = binds[i];
            var own = bus[i] ?? new double[top + 1];
            var slotted = slotBus[i];
            (bus[i], slotBus[i]) = (null, null);
            if (slotted is not null && !(constrained[i] && problem.Options[i] is not null))
            {
                Merge(own, slotted.Values);
                slotted = null;
            }

            if (parent < 0)
            {
                return (ReadBack(problem, choices, tapChoices, top, out tapChoice), own[b]);
            }

            var atInput = constrained[i] ? Transform(problem, i, own, out tapChoices[i]) : own;
            var h = problem.Options[i] is not { } options ? atInput
                : !constrained[i] ? Cheapest(atInput, options, out choices[i])
                : slotted is null ? BestChoice(atInput, options, out choices[i])
                : BestChoiceBySlot(problem, options, own, hasWorst, slotted, out choices[i]);
            // Equipment of the same system joins the others on the voltages its end points read; a subtree with no end point
            // in the budget adds a constant (limiting nothing).
            var slottedUp = constrained[i] && BySlot(problem, i);
            Merge(slottedUp ? SlotBus(slotBus, parent, problem.SlotsBelow[i], top) : ParentBus(bus, parent, top), [h]);
            binds[parent] |= constrained[i] && !slottedUp;
        }

        throw new InvalidOperationException("the network has no service node");
    }

    // The largest sum, along any path from the service, of the steps by which a transformer's most raising allowed tap
    // (or its stated one, where its tap is no choice) raises its secondary beyond its windings' drop; zero at a new origin.
    private static int MostRaise(SizingProblem problem)
    {
        if (problem.NewOrigin)
        {
            return 0;
        }

        var nodes = problem.Network.Nodes;
        var raise = new int[nodes.Count];
        var most = 0;
        for (var i = 1; i < nodes.Count; i++)
        {
            var steps = problem.Taps[i] is { } taps ? taps.Min(t => t.Steps) : problem.TransformerSteps[i];
            raise[i] = raise[nodes[i].ParentIndex] + (nodes[i].Kind == Network.NodeKind.Transformer ? Math.Max(0, -steps) : 0);
            most = Math.Max(most, raise[i]);
        }

        return most;
    }

    private static double[] ParentBus(double[]?[] bus, int parent, int budget) => bus[parent] ??= new double[budget + 1];

    // True where node i's parent's run carries its drop per voltage and i's end points read some of them (see SizingProblem.SlotsBelow).
    private static bool BySlot(SizingProblem problem, int i) =>
        problem.SlotsBelow[i] != 0 && problem.Options[problem.Network.Nodes[i].ParentIndex] is [{ SlotDrops: not null }, ..];

    // The bus of a feeder's end points on the voltages ownSlots.
    private static double[] SlotBus(Dictionary<int, double[]>?[] slotBus, int parent, int ownSlots, int budget)
    {
        var buses = slotBus[parent] ??= [];
        if (!buses.TryGetValue(ownSlots, out var b))
        {
            buses[ownSlots] = b = new double[budget + 1];
        }

        return b;
    }

    // Adds every one of the functions into target.
    private static void Merge(double[] target, IEnumerable<double[]> functions)
    {
        foreach (var f in functions)
        {
            TensorPrimitives.Add(target, f, target);
        }
    }

    // A leaf adds the step function min{cost : steps ≤ k}; left out of the budget, its cheapest choice.
    private static void AddLeaf(double[] target, RunOption[] options, bool excluded)
    {
        if (excluded)
        {
            TensorPrimitives.Add(target, options.Min(o => o.Cost), target);
            return;
        }

        // One constant a stretch between the choices' steps, added a stretch at a time.
        var bySteps = options.OrderBy(o => o.Steps).ToArray();
        var best = double.PositiveInfinity;
        var j = 0;
        for (var k = 0; k < target.Length;)
        {
            while (j < bySteps.Length && bySteps[j].Steps <= k)
            {
                best = Math.Min(best, bySteps[j].Cost);
                j++;
            }

            var end = j < bySteps.Length ? Math.Clamp(bySteps[j].Steps, k + 1, target.Length) : target.Length;
            var stretch = target.AsSpan(k, end - k);
            TensorPrimitives.Add(stretch, best, stretch);
            k = end;
        }
    }

    // From a node's bus to its input side (after its run): a transformer shifts the budget by its regulation,
    // or, at a new origin, gives its secondary the whole budget whatever is left above.
    // Where its tap is a choice, the best tap at every budget: the least of its cost plus the bus's at what is left.
    private static double[] Transform(SizingProblem problem, int node, double[] own, out short[]? tapChoice)
    {
        tapChoice = null;
        if (problem.Network.Nodes[node].Kind != Network.NodeKind.Transformer)
        {
            return own;
        }

        var top = own.Length - 1;
        var shifted = new double[top + 1];
        var taps = problem.Taps[node];
        tapChoice = taps is null ? null : new short[top + 1];
        for (var k = 0; k <= top; k++)
        {
            if (taps is null)
            {
                var at = problem.NewOrigin ? problem.BudgetSteps : k - problem.TransformerSteps[node];
                shifted[k] = at < 0 ? double.PositiveInfinity : own[Math.Min(at, top)];
                continue;
            }

            var best = double.PositiveInfinity;
            for (short j = 0; j < taps.Length; j++)
            {
                var at = k - taps[j].Steps;
                var cost = at < 0 ? double.PositiveInfinity : taps[j].Cost + own[Math.Min(at, top)];
                if (cost < best)
                {
                    (best, tapChoice![k]) = (cost, j);
                }
            }

            shifted[k] = best;
        }

        return shifted;
    }

    // No budget below: the cheapest choice, whatever its drop, at every budget.
    private static double[] Cheapest(double[] below, RunOption[] options, out short[] choice)
    {
        short pick = 0;
        for (short j = 1; j < options.Length; j++)
        {
            if (options[j].Cost < options[pick].Cost)
            {
                pick = j;
            }
        }

        var h = new double[below.Length];
        var rest = below[^1];
        Array.Fill(h, options[pick].Cost + rest);
        choice = new short[below.Length];
        Array.Fill(choice, pick);
        return h;
    }

    private static double[] BestChoice(double[] below, RunOption[] options, out short[] choice)
    {
        var h = NewTable(below.Length, out choice, out var sum);
        for (short j = 0; j < options.Length; j++)
        {
            var from = Math.Max(options[j].Steps, 0);
            if (from < below.Length)
            {
                var at = sum.AsSpan(from);
                at.Fill(options[j].Cost);
                AddShifted(at, below, from, options[j].Steps);
                KeepLeast(h, choice, sum, from, j);
            }
        }

        return h;
    }

    // A table of least costs, every one +∞ to begin with, its choices, and a scratch row of one choice's costs.
    private static double[] NewTable(int length, out short[] choice, out double[] sum)
    {
        var h = new double[length];
        Array.Fill(h, double.PositiveInfinity);
        (choice, sum) = (new short[length], new double[length]);
        return h;
    }

    // target[i] += bus[from + i − shift], at most at the top of the bus (a bus costs no more with more steps left). The
    // choices are taken one at a time over the whole table, so each sum is two runs of contiguous memory.
    private static void AddShifted(Span<double> target, double[] bus, int from, int shift)
    {
        var start = from - shift;
        var inRange = Math.Clamp(bus.Length - start, 0, target.Length);
        if (inRange > 0)
        {
            TensorPrimitives.Add(target[..inRange], bus.AsSpan(start, inRange), target[..inRange]);
        }

        TensorPrimitives.Add(target[inRange..], bus[^1], target[inRange..]);
    }

    // Where choice j's cost is less than the least so far, from step from up: j (ties keep the earlier choice).
    private static void KeepLeast(double[] h, short[] choice, double[] sum, int from, short j)
    {
        for (var k = from; k < h.Length; k++)
        {
            if (sum[k] < h[k])
            {
                (h[k], choice[k]) = (sum[k], j);
            }
        }
    }

    // As BestChoice, for a feeder whose nodes below read its drop in some voltages only (see SizingProblem.StepsIn):
    // each group of voltages takes its own steps per choice from the budget. Groups whose steps are the same for every choice
    // share one sum (the worst's bus, where they are its), so that a balanced feeder costs what BestChoice does.
    private static double[] BestChoiceBySlot(SizingProblem problem, RunOption[] options, double[] worstBus, bool hasWorst, Dictionary<int, double[]> slotted, out short[] choice)
    {
        var worstSteps = Array.ConvertAll(options, o => o.Steps);
        // A worst bus of constants only (children left out of the budget) adds its constant and limits nothing.
        var worst = hasWorst ? worstBus : null;
        var constant = hasWorst ? 0.0 : worstBus[0];
        var groups = new List<(int[] Steps, double[] Bus)>();
        foreach (var (slots, b) in slotted.OrderBy(p => p.Key))
        {
            var steps = Array.ConvertAll(options, o => problem.StepsIn(o, slots));
            if (steps.AsSpan().SequenceEqual(worstSteps))
            {
                worst ??= worstBus;
                Merge(worst, [b]);
                constant = 0.0;
            }
            else if (groups.FindIndex(g => g.Steps.AsSpan().SequenceEqual(steps)) is var same and >= 0)
            {
                Merge(groups[same].Bus, [b]);
            }
            else
            {
                groups.Add((steps, b));
            }
        }

        var h = NewTable(worstBus.Length, out choice, out var sum);
        for (short j = 0; j < options.Length; j++)
        {
            var from = Math.Max(worst is null ? 0 : worstSteps[j], 0);
            foreach (var (steps, _) in groups)
            {
                from = Math.Max(from, steps[j]);
            }

            if (from >= h.Length)
            {
                continue;
            }

            // A voltage the feeder's unbalance raises (a negative drop) leaves its end points more than the table holds;
            // the bus at its top is then the safe side.
            var at = sum.AsSpan(from);
            at.Fill(options[j].Cost + constant);
            if (worst is not null)
            {
                AddShifted(at, worst, from, worstSteps[j]);
            }

            foreach (var (steps, b) in groups)
            {
                AddShifted(at, b, from, steps[j]);
            }

            KeepLeast(h, choice, sum, from, j);
        }

        return h;
    }

    // Top-down: each node gets the steps left at its input; its run's choice uses some, a transformer more.
    private static int[] ReadBack(SizingProblem problem, short[]?[] choices, short[]?[] tapChoices, int top, out int[] tapChoice)
    {
        var nodes = problem.Network.Nodes;
        var left = new int[nodes.Count];
        var choice = new int[nodes.Count];
        Array.Fill(choice, -1);
        tapChoice = new int[nodes.Count];
        Array.Fill(tapChoice, -1);
        for (var i = 0; i < nodes.Count; i++)
        {
            var node = nodes[i];
            var atInput = node.ParentIndex < 0 ? problem.BudgetSteps : left[node.ParentIndex];
            if (node.ParentIndex >= 0 && problem.SlotsBelow[i] != 0 && choice[node.ParentIndex] >= 0
                && problem.Options[node.ParentIndex]![choice[node.ParentIndex]] is { SlotDrops: not null } feeder)
            {
                atInput += feeder.Steps - problem.StepsIn(feeder, problem.SlotsBelow[i]); // the drop in the voltages read below, not the worst
            }

            var afterRun = atInput;
            if (problem.Options[i] is { } options)
            {
                var pick = node.Circuit is not null ? LeafChoice(options, atInput, problem.Excluded[i]) : choices[i]![Math.Clamp(atInput, 0, top)];
                choice[i] = pick;
                afterRun = atInput - options[pick].Steps;
            }

            // Bus steps left = budget − steps used; a transformer uses its regulation at its tap, a new origin restores the whole budget.
            var regulation = problem.TransformerSteps[i];
            if (problem.Taps[i] is { } taps)
            {
                tapChoice[i] = tapChoices[i] is { } picked ? picked[Math.Clamp(afterRun, 0, top)] : 0;
                regulation = taps[tapChoice[i]].Steps;
            }

            left[i] = node.Kind == Network.NodeKind.Transformer
                ? (problem.NewOrigin ? problem.BudgetSteps : Math.Min(top, afterRun - regulation))
                : afterRun;
        }

        return choice;
    }

    private static int LeafChoice(RunOption[] options, int stepsLeft, bool excluded)
    {
        var pick = -1;
        for (var j = 0; j < options.Length; j++)
        {
            if ((excluded || options[j].Steps <= stepsLeft) && (pick < 0 || options[j].Cost < options[pick].Cost))
            {
                pick = j;
            }
        }

        return pick < 0 ? 0 : pick;
    }
}
