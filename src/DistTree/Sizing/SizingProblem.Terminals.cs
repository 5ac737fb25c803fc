using DistTree.Conductors;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Sizing;

/// <summary>The terminals a run lands on, at both its ends, and what a run no buildable choice fixes would take.</summary>
internal sealed partial class SizingProblem
{
    /// <summary>
    /// The ratings of the terminals <paramref name="run"/> lands on, amperes, null where none is stated: its own device
    /// (<c>ocpd</c>) at its source end, and at its far end a feeder's equipment's main device or main lugs (<c>main_a</c>).
    /// A transformer states none: its primary terminals are the maker's, sized for the conductors its primary device calls
    /// for, and that device is the feeder's own, checked at the source end. A branch circuit's far end is its load.
    /// </summary>
    public static (double? SourceEndA, double? FarEndA) TerminalRatings(NetworkRun run)
    {
        ArgumentNullException.ThrowIfNull(run);
        return (run.Conductors.OcpdA, run.Kind == RunKind.Feeder ? run.Target.Equipment?.MainA : null);
    }

    /// <summary>True when the terminals at both ends of <paramref name="run"/> (see <see cref="TerminalRatings"/>) accept <paramref name="sets"/> × <paramref name="size"/>.</summary>
    public static bool AcceptsBothEnds(TerminalTable terminals, NetworkRun run, ConductorSize size, int sets)
    {
        ArgumentNullException.ThrowIfNull(terminals);
        var (sourceEndA, farEndA) = TerminalRatings(run);
        return (sourceEndA is not { } source || terminals.Accepts(source, size, sets))
            && (farEndA is not { } far || terminals.Accepts(far, size, sets));
    }

    private static string UnfixableRun(RunResult row, NetworkRun run, RunOption[] buildable, RunOption[] all, TerminalTable terminals)
    {
        var what = Words.Noun(run.Kind);
        if (run.Conductors.Fixed)
        {
            return $"{what} {row.Id}: pinned (fixed: true) and over its limits at {row.Size}; unpin it, shorten it, or move the load";
        }

        // A size beyond the terminals at one of its ends would do: the plan proposes none, but says which end and what would take it.
        if (all.Where(o => o.MeetsRunLimits && !o.WithinTerminals).OrderBy(o => o.Cost).FirstOrDefault() is { Sets: > 0 } beyond)
        {
            return BeyondTerminals(what, row.Id, run, beyond, terminals);
        }

        var best = (buildable.Length > 0 ? buildable : all).MinBy(o => o.DropPercent);
        return FormattableString.Invariant(
            $"{what} {row.Id}: no allowed size meets its own limits; the best, {best.Sets}×{best.Size}, drops {best.DropPercent:0.00} % against {row.LimitPercent:0.##} %; it would take more parallel sets (sizing: max_sets), a shorter run, or a panel nearer the load");
    }

    // Names each end whose terminals refuse the choice (its device at the source end, the equipment's main at the far end),
    // with the largest they take, and the table's band that would take it. At least one end refuses (the choice is not within them).
    private static string BeyondTerminals(string what, string id, NetworkRun run, RunOption beyond, TerminalTable terminals)
    {
        var (sourceEndA, farEndA) = TerminalRatings(run);
        var ends = new List<(string Subject, double RatingA, string Needs)>();
        if (sourceEndA is { } source && !terminals.Accepts(source, beyond.Size, beyond.Sets))
        {
            ends.Add((FormattableString.Invariant($"its {source:0.#} A device"), source, "a device"));
        }

        if (farEndA is { } far && !terminals.Accepts(far, beyond.Size, beyond.Sets))
        {
            var equipment = run.Target.Equipment!;
            ends.Add((FormattableString.Invariant($"the {far:0.#} A main (main_a) of {Words.EquipmentKind.Of(equipment.Kind)} {equipment.Id} at its far end"), far, "a main"));
        }

        string Takes(double ratingA) => terminals.LargestFor(ratingA, beyond.Sets, beyond.Size.Series) is (_, { } most) ? $"{beyond.Sets}×{most}" : $"no {beyond.Sets} conductors per terminal";
        var limits = string.Join(" and of ", ends.Select((e, i) => $"{e.Subject} ({Takes(e.RatingA)}{(i == ends.Count - 1 ? $"; {terminals.SourceName}" : "")})"));
        var who = string.Join(" and ", ends.Select(e => e.Needs));
        var band = terminals.SmallestBandAccepting(beyond.Size, beyond.Sets) is { } bandA ? FormattableString.Invariant($" (in the table, {(ends.Count == 1 ? who : "one")} of {bandA:0.#} A takes it)") : "";
        return FormattableString.Invariant(
            $"{what} {id}: the least choice that meets its own limits, {beyond.Sets}×{beyond.Size}, is beyond the terminal limit{(ends.Count > 1 ? "s" : "")} of {limits}; it needs {who} whose terminals take it{band}, a splice to a size the terminals take, a shorter run, or the load nearer its panel");
    }
}
