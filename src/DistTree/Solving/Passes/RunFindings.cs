using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Vocabulary;

namespace DistTree.Solving.Passes;

/// <summary>
/// A run's findings: its drop over its own limit, and the conductor and device rules of the code in force (see <see cref="CodeRules"/>).
/// On the percent sum they are found in the runs' pass (see <see cref="RunDrops"/>); on the load flow, whose drops
/// count then, in a pass of their own once it is solved (see <see cref="OnLoadFlow"/>).
/// </summary>
internal static class RunFindings
{
    /// <summary>
    /// The findings of <paramref name="run"/>, whose figures are <paramref name="r"/>, or null for none; a length in
    /// their sentences is in the project's <paramref name="units"/>.
    /// </summary>
    public static List<Finding>? Of(ref RunRow r, NetworkRun run, CodeRules code, UnitSystem units)
    {
        List<Finding>? findings = null;
        var conductors = run.Conductors;
        var branch = run.Kind == RunKind.Branch;
        var what = Words.Noun(run.Kind);
        var size = conductors.Size.Text;
        var limit = run.LimitPercent;
        if (r.DropPercent > limit + 1e-9)
        {
            (findings ??= []).Add(Finding.Written(
                branch ? FindingKind.BranchDrop : FindingKind.FeederDrop,
                code.Cite(branch ? CodeCheck.BranchDrop : CodeCheck.FeederDrop),
                run.Id,
                r.DropPercent,
                limit,
                $"{what} {run.Id}: drop {r.DropPercent:0.00} % ({r.DropV:0.0} V of {r.VoltageV:0} V at {r.CurrentA:0.0} A over {new LengthText(conductors.LengthM, units)} of {size}) exceeds its {limit:0.##} % limit",
                conductors.Location));
        }

        return code.AddFindings(findings, run, new CurrentFigures(
            r.DesignCurrentA, (char)('A' + r.DesignLine), r.AmpacityA, r.NeutralDesignCurrentA, r.NeutralAmpacityA, r.LargestMotorA, r.FromEquipment ? CircuitDuty.Of(run) : default,
            r.GroundMinIndex == 0 ? null : ConductorSize.All[r.GroundMinIndex - 1]));
    }

    /// <summary>Finds every run's findings into <paramref name="runs"/>, on every core, lengths in <paramref name="units"/>; gives their number.</summary>
    public static int OnLoadFlow(NetworkNode[] nodes, RunRows runs, CodeRules code, UnitSystem units)
    {
        var (rows, findings) = (runs.Rows, runs.Findings);
        var count = 0;
        ParallelRanges.For(runs.Count, (start, end) =>
        {
            var found = 0;
            for (var r = start; r < end; r++)
            {
                ref var row = ref rows[r];
                if (!row.IsTransformer)
                {
                    found += (findings[r] = Of(ref row, nodes[row.Node].Incoming!, code, units))?.Count ?? 0;
                }
            }

            Interlocked.Add(ref count, found);
        });
        return count;
    }
}
