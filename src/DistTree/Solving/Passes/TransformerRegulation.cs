using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// A transformer's regulation ≈ (%R·cos θ + %X·sin θ)·(S/S_rated) − tap, %R = %Z/√(1 + (X/R)²), %X = %R·X/R
/// (common practice). Per secondary line: (%R·P_x + %X·Q_x)/(S_rated/lines) − tap (see
/// <see cref="PhaseFlow.TransformerRegulation"/>); balanced, the same as the three-phase formula. Worked out in the
/// runs' pass (see <see cref="RunDrops"/>).
/// </summary>
internal static class TransformerRegulation
{
    /// <summary>
    /// Fills the row of the transformer <paramref name="data"/> at <paramref name="node"/>, carrying
    /// <paramref name="carried"/>, and into <paramref name="drops"/> its regulation as each set of lines below sees it;
    /// gives its findings, or null for none.
    /// </summary>
    public static List<Finding>? Solve(ref RunRow row, NetworkNode node, TransformerData data, ComplexPower carried, PhaseFlow phases, Span<double> drops)
    {
        var supply = data.Secondary.FeederSupply;
        var (percentR, percentX) = PercentRx(data);
        var loading = carried.VoltAmperes / (data.Kva * 1000.0);
        Span<double> perLine = stackalloc double[3];
        phases.TransformerRegulation(node.Index, data, percentR, percentX, perLine);
        var lines = PhaseRules.Lines(data.Secondary);
        for (var set = 1; set < 8; set++)
        {
            var mask = set & ((1 << lines) - 1);
            drops[set] = BitOperations.PopCount((uint)mask) switch
            {
                0 => perLine[0],
                2 => (perLine[BitOperations.TrailingZeroCount(mask)] + perLine[31 - BitOperations.LeadingZeroCount((uint)mask)]) / 2,
                _ => WorstOf(perLine, mask),
            };
        }

        var dropPercent = drops[(int)Phases.ABC];
        var currentA = LoadPower.CurrentA(carried.VoltAmperes, supply);
        List<Finding>? findings = null;
        if (loading > 1 + 1e-9)
        {
            findings = [Finding.Written(
                FindingKind.TransformerOverload,
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
            WidensToAllLines = PhaseRules.Lines(data.Secondary) != PhaseRules.Lines(node.Equipment!.System),
        };
        return findings;
    }

    /// <summary>The transformer's %R and %X: %R = %Z/√(1 + (X/R)²), %X = %R·X/R.</summary>
    public static (double PercentR, double PercentX) PercentRx(TransformerData data)
    {
        var percentR = data.ImpedancePercent / Math.Sqrt(1 + (data.XOverR * data.XOverR));
        return (percentR, percentR * data.XOverR);
    }

    // The largest of the per-line figures on the lines of a set (bits 0..2 = A..C). A line whose figure is not a
    // number (an overflowing load) is passed over unless every line's is, as the maximum always has been taken.
    private static double WorstOf(ReadOnlySpan<double> perLine, int mask)
    {
        var worst = double.NaN;
        for (var x = 0; x < 3; x++)
        {
            if ((mask & (1 << x)) != 0 && (double.IsNaN(worst) || perLine[x] > worst))
            {
                worst = perLine[x];
            }
        }

        return worst;
    }
}
