using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The lines pass: each circuit's set of lines. A circuit with stated or numbered phases keeps them; the others,
/// largest first, each go onto the least-loaded line (1 pole) or pair of lines (2 poles); 3 poles take all lines
/// (common practice). Ties go to the earlier line (A before B before C). Each panel sets the lines of its own
/// circuits only: the panels are shared out over the cores.
/// </summary>
internal static class PhaseAssignment
{
    // The sets of lines a balanced circuit may take, by poles and the panel's lines (see Candidates).
    private static readonly Phases[] OneOfThree = [Phases.A, Phases.B, Phases.C];
    private static readonly Phases[] OneOfTwo = [Phases.A, Phases.B];
    private static readonly Phases[] PairOfThree = [Phases.AB, Phases.BC, Phases.CA];
    private static readonly Phases[] AllThree = [Phases.ABC];
    private static readonly Phases[] BothOfTwo = [Phases.AB];
    private static readonly Phases[] TheOne = [Phases.A];

    /// <summary>Writes into <paramref name="assigned"/> (1 per node, zero) the lines of every circuit of <paramref name="network"/>, whose loads are <paramref name="power"/>.</summary>
    public static void Assign(DistributionNetwork network, ComplexPower[] power, Phases[] assigned) =>
        ParallelRanges.For(network.NodeArray.Length, (start, end) => Assign(network, power, assigned, start, end));

    // Assign for the panels start … end − 1.
    private static void Assign(DistributionNetwork network, ComplexPower[] power, Phases[] assigned, int start, int end)
    {
        var nodes = network.NodeArray;
        Span<double> load = stackalloc double[3];
        var automatic = new List<Automatic>();
        var largestFirst = Comparer<Automatic>.Create((a, b) =>
        {
            var order = b.VoltAmperes.CompareTo(a.VoltAmperes);
            return order != 0 ? order : string.CompareOrdinal(nodes[a.Child].Id, nodes[b.Child].Id);
        });
        var childStarts = network.Levels.ChildStarts;
        for (var p = start; p < end; p++)
        {
            // A node without children (most are end points) is passed over without reading its object.
            var (firstChild, endChild) = (childStarts[p], childStarts[p + 1]);
            if (firstChild == endChild)
            {
                continue;
            }

            var lines = PhaseRules.Lines(nodes[p].System);
            load.Clear();
            automatic.Clear();
            for (var child = firstChild; child < endChild; child++)
            {
                if (nodes[child].Circuit is not { } circuit)
                {
                    continue;
                }

                if (circuit.Phases is { } phases)
                {
                    assigned[child] = phases;
                    AddLoad(load, phases, lines, power[child].VoltAmperes);
                }
                else
                {
                    automatic.Add(new Automatic(child, power[child].VoltAmperes));
                }
            }

            // Largest first; ids are unique in a panel, so the order is total.
            automatic.Sort(largestFirst);
            foreach (var (child, voltAmperes) in automatic)
            {
                var best = LeastLoaded(Candidates(Math.Min(nodes[child].Circuit!.Poles, lines), lines), load, lines);
                assigned[child] = best;
                AddLoad(load, best, lines, voltAmperes);
            }
        }
    }

    // The candidate whose lines carry the least load so far; the first of equals.
    private static Phases LeastLoaded(Phases[] candidates, ReadOnlySpan<double> load, int lines)
    {
        var best = Phases.None;
        var bestLoad = double.PositiveInfinity;
        foreach (var candidate in candidates)
        {
            var sum = 0.0;
            for (var x = 0; x < lines; x++)
            {
                if (((int)candidate & (1 << x)) != 0)
                {
                    sum += load[x];
                }
            }

            if (sum < bestLoad - 1e-9)
            {
                best = candidate;
                bestLoad = sum;
            }
        }

        return best;
    }

    // Spreads apparent power evenly over the lines of a set (limited to the system's lines).
    private static void AddLoad(Span<double> load, Phases phases, int lines, double voltAmperes)
    {
        var on = (int)phases & ((1 << lines) - 1);
        var count = BitOperations.PopCount((uint)on);
        for (var x = 0; x < lines; x++)
        {
            if ((on & (1 << x)) != 0)
            {
                load[x] += voltAmperes / count;
            }
        }
    }

    private static Phases[] Candidates(int poles, int lines) => (poles, lines) switch
    {
        (1, 3) => OneOfThree,
        (1, 2) => OneOfTwo,
        (2, 3) => PairOfThree,
        (_, 3) => AllThree,
        (_, 2) => BothOfTwo,
        _ => TheOne,
    };

    // A circuit without stated phases, and its apparent power (VA), worked out once for the sort.
    private readonly record struct Automatic(int Child, double VoltAmperes);
}
