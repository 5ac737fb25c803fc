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
    /// </summary>
    public static List<Finding>? Solve(ref RunRow row, NetworkNode node, Model.TransformerData data, ComplexPower carried, PhaseFlow phases, CodeRules code)
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
