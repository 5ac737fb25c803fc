using DistTree.Model;
using DistTree.Network;
using Flag = DistTree.Solving.Passes.Has;

namespace DistTree.Solving.Passes;

/// <summary>
/// The largest motors' pass, bottom-up: per node × 3, the full-load current of the largest motor on each line among
/// the motors at or below the node on the same system (a motor's own lines carry its full-load current; a node's is the
/// largest of its children's). A transformer's primary starts again at none: the motors below it are on another
/// system, and their currents reach its primary only through the transformer's own load. Demand factors do not reduce
/// it: the largest motor may run at full load whatever the others do. One plain loop in reverse node order, as the
/// power sums; a maximum is the same in any order, so the result does not depend on it.
/// </summary>
internal static class LargestMotors
{
    /// <summary>
    /// Per node × 3, each line's largest motor's full-load current, amperes, rented from the pool (give it back with
    /// <see cref="Scratch.Return{T}(T[], int)"/> at three times the node count), or null where the tree has no motor.
    /// </summary>
    public static double[]? Of(DistributionNetwork network, PowerSums sums, Phases[] assigned)
    {
        var (parents, has, fullLoad) = (network.ParentIndices, sums.Has, sums.FullLoadA);
        var n = network.NodeArray.Length;
        if (!AnyMotor(has, n))
        {
            return null;
        }

        var largest = Scratch.Rent<double>(n * 3);
        for (var i = n - 1; i >= 0; i--)
        {
            var mine = largest.AsSpan(i * 3, 3);
            if ((has[i] & Flag.Motor) != 0)
            {
                for (var x = 0; x < 3; x++)
                {
                    mine[x] = ((int)assigned[i] & (1 << x)) != 0 ? fullLoad[i] : 0.0;
                }
            }
            else if ((has[i] & Flag.Transformer) != 0)
            {
                mine.Clear();
            }

            if (parents[i] is var parent and >= 0)
            {
                var theirs = largest.AsSpan(parent * 3, 3);
                for (var x = 0; x < 3; x++)
                {
                    theirs[x] = Math.Max(theirs[x], mine[x]);
                }
            }
        }

        return largest;
    }

    private static bool AnyMotor(Has[] has, int n)
    {
        for (var i = 0; i < n; i++)
        {
            if ((has[i] & Flag.Motor) != 0)
            {
                return true;
            }
        }

        return false;
    }
}
