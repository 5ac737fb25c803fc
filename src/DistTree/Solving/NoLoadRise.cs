using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// The light-load limit on raising taps (<c>sizing: light_load_rise_percent</c>). A tap of t % divides a transformer's
/// turns ratio by 1 + t/100 (see <c>TransformerModel.Ratio</c>), so with the source at nominal and no load (no drop
/// anywhere) a bus stands at nominal × Π over the transformers above it of 100/(100 + t): a raising tap (t &lt; 0)
/// raises every bus below it at every load, the lightest included. A single −2.5 % tap gives 100/97.5 = +2.564 %, a
/// −5 % tap 100/95 = +5.263 %, two −2.5 % taps in series (100/97.5)² = +5.194 %.
/// </summary>
internal static class NoLoadRise
{
    /// <summary>The no-load ratio of a transformer's secondary to its rating at tap <paramref name="tapPercent"/>, with its primary at its rating: 100/(100 + tap).</summary>
    public static double Factor(double tapPercent) => 100.0 / (100.0 + tapPercent);

    /// <summary>How far above nominal, percent, a bus stands whose no-load ratio to nominal is <paramref name="factor"/>.</summary>
    public static double RisePercent(double factor) => (factor - 1.0) * 100.0;

    /// <summary>True when a bus at no-load ratio <paramref name="factor"/> stands no more than <paramref name="limitPercent"/> above nominal.</summary>
    public static bool Within(double factor, double limitPercent) => RisePercent(factor) <= limitPercent + 1e-9;

    /// <summary>Per node index, the no-load ratio of its bus to nominal at the stated taps (the transformers at and above it).</summary>
    public static double[] Stated(DistributionNetwork network)
    {
        var nodes = network.Nodes;
        var factors = new double[nodes.Count];
        for (var i = 0; i < nodes.Count; i++)
        {
            var above = nodes[i].ParentIndex < 0 ? 1.0 : factors[nodes[i].ParentIndex];
            factors[i] = nodes[i].Equipment?.Transformer is { } t ? above * Factor(t.TapPercent) : above;
        }

        return factors;
    }
}
