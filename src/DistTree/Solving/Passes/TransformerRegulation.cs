using DistTree.Codes;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// A transformer's row: its regulation as each voltage of its secondary sees it, the leakage drop of its windings
/// at the secondary's currents, Re f(E − V) (see <see cref="TransformerModel.WindingDrop"/>; balanced, the familiar
/// (%R·cos θ + %X·sin θ)·S/S_rated), plus what its tap takes off, tap/(1 + tap) (see
/// <see cref="TransformerModel.TapShare"/>); the row's figure is the worst of them. Worked out in the runs' pass
/// (see <see cref="RunDrops"/>).
/// </summary>
internal static class TransformerRegulation
{
    /// <summary>
    /// Fills the row of the transformer <paramref name="data"/> at <paramref name="node"/>, carrying
    /// <paramref name="carried"/>; gives its findings (judged by <paramref name="code"/>), or null for none.
    /// <paramref name="noLoad"/> is its secondary's no-load ratio to nominal at the stated taps (see <see cref="NoLoadRise"/>),
    /// judged where its own tap raises against <paramref name="riseLimitPercent"/>.
    /// </summary>
    public static List<Finding>? Solve(
        ref RunRow row, NetworkNode node, Model.TransformerData data, ComplexPower carried, PhaseFlow phases, CodeRules code, double noLoad, double riseLimitPercent)
    {
        var supply = data.Secondary.FeederSupply;
        var model = phases.Frame.Models[node.Index]!;
        var current = phases.SecondaryCurrents(node.Index);
        var slots = Slots.Of(Model.PhaseRules.Lines(data.Secondary), data.Secondary.HasNeutral);
        var dropPercent = double.NegativeInfinity;
        for (var slot = 0; slot < Slots.Count; slot++)
        {
            if ((slots & (1 << slot)) != 0)
            {
                var f = phases.SlotOn(node, slot);
                dropPercent = Math.Max(dropPercent, (model.WindingDrop(f, current).Real + model.TapShare) * 100.0);
            }
        }

        var loading = carried.VoltAmperes / (data.Kva * 1000.0);
        var currentA = LoadPower.CurrentA(carried.VoltAmperes, supply);
        List<Finding>? findings = null;
        if (loading > 1 + 1e-9)
        {
            findings = [Finding.Written(
                FindingKind.TransformerOverload,
                code.Cite(CodeCheck.TransformerLoading),
                node.Id,
                carried.VoltAmperes / 1000.0,
                data.Kva,
                $"transformer {node.Id}: load {carried.VoltAmperes / 1000.0:0.0} kVA exceeds its {data.Kva:0.#} kVA rating ({loading * 100:0} %)",
                node.Equipment!.Location)];
        }

        // A raising tap over the light-load limit (every bus over it has one such at or above it: the nearest raising
        // transformer above a bus stands at least as high, the taps between not raising).
        if (data.TapPercent < 0 && !NoLoadRise.Within(noLoad, riseLimitPercent))
        {
            var rise = NoLoadRise.RisePercent(noLoad);
            var above = Math.Abs((noLoad / NoLoadRise.Factor(data.TapPercent)) - 1.0) > 1e-12 ? " and the taps above it" : "";
            (findings ??= []).Add(Finding.Written(
                FindingKind.NoLoadRise,
                code.Cite(CodeCheck.NoLoadRise),
                node.Id,
                rise,
                riseLimitPercent,
                $"transformer {node.Id}: at its stated tap_percent {data.TapPercent:0.#}{above}, its secondary stands {rise:0.00} % above nominal at no load with the source at nominal, over the {riseLimitPercent:0.##} % light-load limit (sizing: light_load_rise_percent)",
                node.Equipment!.Location));
        }

        row = new RunRow
        {
            Node = node.Index,
            IsTransformer = true,
            CurrentA = currentA,
            DesignCurrentA = currentA,
            RatedA = LoadPower.CurrentA(data.Kva * 1000.0, supply),
            DropPercent = dropPercent,
            PercentSumDropPercent = dropPercent,
            VoltageV = supply.VoltageV,
        };
        return findings;
    }
}
