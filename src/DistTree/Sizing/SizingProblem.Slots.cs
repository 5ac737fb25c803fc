using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>The problem's drops per voltage: what a feeder's choice takes from the budget of the end points it feeds directly.</summary>
internal sealed partial class SizingProblem
{
    /// <summary>Per node index, an end point's own voltages (<see cref="Slots"/>, as bits) on its panel's bus; 0 elsewhere.</summary>
    public int[] OwnSlots { get; private init; } = [];

    /// <summary>
    /// The steps <paramref name="option"/>, a choice of node <paramref name="node"/>'s run, takes from the budget of
    /// <paramref name="child"/>, a node below it: an end point fed directly from the feeder's far bus sees the feeder's drop in
    /// its own voltages only (a single-pole circuit on line A, line A's with the neutral's), the worst of them; any other
    /// node the feeder's worst voltage. A load's current is its nominal one by the percent sum, so each voltage's drop is
    /// the run's own on the solver's figures (see <c>RunDrops.UnitDrops</c>).
    /// </summary>
    public int StepsBelow(int node, in RunOption option, int child)
    {
        return Network.Nodes[child].ParentIndex == node ? StepsIn(option, OwnSlots[child]) : option.Steps;
    }

    /// <summary>The steps of <paramref name="option"/>, a feeder's choice, in the worst of the voltages <paramref name="ownSlots"/> (its worst where none, or where it carries no drop per voltage).</summary>
    public int StepsIn(in RunOption option, int ownSlots) =>
        option.SlotDrops is null || ownSlots == 0 ? option.Steps : Steps(DropIn(option, ownSlots), ResolutionPercent);

    /// <summary>The drop of <paramref name="option"/>, percent, in the worst of the voltages <paramref name="ownSlots"/> (as <see cref="StepsIn"/>).</summary>
    public static double DropIn(in RunOption option, int ownSlots)
    {
        if (option.SlotDrops is not { } drops || ownSlots == 0)
        {
            return option.DropPercent;
        }

        var worst = double.NegativeInfinity;
        for (var slot = 0; slot < Slots.Count; slot++)
        {
            if ((ownSlots & (1 << slot)) != 0)
            {
                worst = Math.Max(worst, drops[slot]);
            }
        }

        return worst;
    }
}
