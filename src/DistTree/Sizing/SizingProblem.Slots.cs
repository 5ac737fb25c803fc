using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>The problem's drops per voltage: what a feeder's choice takes from the budget of the nodes it feeds.</summary>
internal sealed partial class SizingProblem
{
    /// <summary>
    /// Per node index, the voltages of its parent's bus (<see cref="Slots"/>, as bits) that the end points at or below it
    /// read: an end point's own; a panel's, splitter's or switchboard's of the same system as its parent's bus, those of
    /// every end point below it (no transformer between, so each voltage below is the same voltage above); every voltage
    /// for a transformer, or equipment of another system, with end points below; 0 with none.
    /// </summary>
    public int[] SlotsBelow { get; private init; } = [];


    // See SlotsBelow. Bottom-up over the parent-first array: each node's children are done before it.
    private static int[] SlotsBelowOf(IReadOnlyList<NetworkNode> nodes, int[] ownSlots)
    {
        const int every = (1 << Slots.Count) - 1;
        var under = new int[nodes.Count];
        var below = new int[nodes.Count];
        for (var i = nodes.Count - 1; i > 0; i--)
        {
            var node = nodes[i];
            var parent = node.ParentIndex;
            below[i] = node.Circuit is not null ? (ownSlots[i] != 0 ? ownSlots[i] : every)
                : under[i] == 0 ? 0
                : node.Kind == NodeKind.Transformer || node.System != nodes[parent].System ? every
                : under[i];
            under[parent] |= below[i];
        }

        return below;
    }

    /// <summary>
    /// The steps <paramref name="option"/>, a feeder's choice, takes from the budget of a node it feeds whose end points read
    /// the voltages <paramref name="ownSlots"/> (its <see cref="SlotsBelow"/>): the feeder's drop in the worst of them (a
    /// single-pole circuit on line A sees line A's drop with the neutral's); its worst voltage's where none is given or it
    /// carries no drop per voltage. A load's current is its nominal one by the percent sum, so each voltage's drop is the
    /// run's own on the solver's figures (see <c>RunDrops.UnitDrops</c>), and along a path without a transformer an end
    /// point's total is the sum of its own voltage's drops.
    /// </summary>
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
