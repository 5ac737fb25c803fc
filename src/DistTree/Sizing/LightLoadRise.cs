using System.Globalization;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>The light-load limit in the upsize plan: the cautions for stated taps already over it (see <see cref="NoLoadRise"/>).</summary>
internal static class LightLoadRise
{
    /// <summary>
    /// Each transformer whose stated tap raises its secondary and whose secondary, at the stated taps, stands more than
    /// <paramref name="limitPercent"/> above nominal at no load. Every bus over the limit has one such at or above it:
    /// the nearest raising transformer above a bus stands at least as high as the bus, as the taps between are not raising.
    /// </summary>
    public static List<PlanCaution> Cautions(DistributionNetwork network, double limitPercent)
    {
        var stated = NoLoadRise.Stated(network);
        var cautions = new List<PlanCaution>();
        foreach (var node in network.Nodes)
        {
            if (node.Equipment?.Transformer is { TapPercent: < 0 } t && !NoLoadRise.Within(stated[node.Index], limitPercent))
            {
                var above = Math.Abs(stated[node.ParentIndex] - 1.0) > 1e-12 ? " and the taps above it" : "";
                cautions.Add(new PlanCaution(node.Id, string.Create(CultureInfo.InvariantCulture,
                    $"transformer {node.Id}: at its stated tap_percent {t.TapPercent:0.#}{above}, its secondary stands {NoLoadRise.RisePercent(stated[node.Index]):0.00} % above nominal at no load with the source at nominal, over the {limitPercent:0.##} % light-load limit (sizing: light_load_rise_percent); the plan keeps the stated tap and raises no tap below it")));
            }
        }

        return cautions;
    }
}
