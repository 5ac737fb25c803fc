using System.Globalization;
using DistTree.Network;

namespace DistTree.Sizing;

/// <summary>
/// The light-load limit on raising taps (<c>sizing: light_load_rise_percent</c>). A tap of t % divides a transformer's
/// turns ratio by 1 + t/100 (see <c>TransformerModel.Ratio</c>), so with the source at nominal and no load (no drop
/// anywhere) a bus stands at nominal × Π over the transformers above it of 100/(100 + t): a raising tap (t &lt; 0)
/// raises every bus below it at every load, the lightest included. A single −2.5 % tap gives 100/97.5 = +2.564 %, a
/// −5 % tap 100/95 = +5.263 %, two −2.5 % taps in series (100/97.5)² = +5.194 %.
/// </summary>
internal static class LightLoadRise
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

    /// <summary>
    /// Each transformer whose stated tap raises its secondary and whose secondary, at the stated taps, stands more than
    /// <paramref name="limitPercent"/> above nominal at no load. Every bus over the limit has one such at or above it:
    /// the nearest raising transformer above a bus stands at least as high as the bus, as the taps between are not raising.
    /// </summary>
    public static List<PlanCaution> Cautions(DistributionNetwork network, double limitPercent)
    {
        var stated = Stated(network);
        var cautions = new List<PlanCaution>();
        foreach (var node in network.Nodes)
        {
            if (node.Equipment?.Transformer is { TapPercent: < 0 } t && !Within(stated[node.Index], limitPercent))
            {
                var above = Math.Abs(stated[node.ParentIndex] - 1.0) > 1e-12 ? " and the taps above it" : "";
                cautions.Add(new PlanCaution(node.Id, string.Create(CultureInfo.InvariantCulture,
                    $"transformer {node.Id}: at its stated tap_percent {t.TapPercent:0.#}{above}, its secondary stands {RisePercent(stated[node.Index]):0.00} % above nominal at no load with the source at nominal, over the {limitPercent:0.##} % light-load limit (sizing: light_load_rise_percent); the plan keeps the stated tap and raises no tap below it")));
            }
        }

        return cautions;
    }
}
