using DistTree.Codes;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The current-carrying conductors of shared raceways: a run that states <c>current_carrying</c> takes that count;
/// the runs that name one <c>raceway_id</c> take the sum of their conductors, every set of each (a run in parallel
/// sets that names a raceway puts all its sets in it), as the code counts a set's (see
/// <see cref="CodeRules.CurrentCarryingConductors"/>). Any other run's sets lie in raceways of their own (common
/// practice for parallel sets), and it counts its own set's.
/// </summary>
internal static class RacewayCounts
{
    /// <summary>Per node, the count of its incoming run's raceway where the project says it (0 elsewhere), or null where it says none.</summary>
    public static int[]? Of(DistributionNetwork network, CodeRules code)
    {
        var nodes = network.NodeArray;
        int[]? counts = null;
        Dictionary<string, int>? named = null;
        for (var i = 0; i < nodes.Length; i++)
        {
            if (nodes[i].Incoming is not { } run)
            {
                continue;
            }

            if (run.Conductors.CurrentCarrying is { } stated)
            {
                (counts ??= new int[nodes.Length])[i] = stated;
            }
            else if (run.Conductors.RacewayId is { } id)
            {
                named ??= new Dictionary<string, int>(StringComparer.Ordinal);
                named[id] = named.GetValueOrDefault(id) + (code.CurrentCarryingConductors(run) * run.Conductors.Sets);
            }
        }

        if (named is null)
        {
            return counts;
        }

        counts ??= new int[nodes.Length];
        for (var i = 0; i < nodes.Length; i++)
        {
            if (nodes[i].Incoming is { Conductors.RacewayId: { } id })
            {
                counts[i] = named[id];
            }
        }

        return counts;
    }
}
