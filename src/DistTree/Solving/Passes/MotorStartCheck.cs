using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// A motor's dip while it starts: the extra drop of ΔS = S_locked-rotor − S_running on each run,
/// 100·(ΔP·R_loop + ΔQ·X_loop)/V², R_loop and X_loop the run's impedance (both conductors for single-phase), and on
/// a transformer (%R·ΔP + %X·ΔQ)/S_rated, superposed on the steady drops of the whole path (a new origin does not
/// stop a physical dip). Asked by the end points' pass for each motor (see <see cref="EndPointTotals"/>).
/// </summary>
internal static class MotorStartCheck
{
    /// <summary>The check of the motor at node <paramref name="motor"/>, running at <paramref name="running"/> and starting at <paramref name="lockedRotor"/>.</summary>
    public static MotorStartResult Of(DistributionNetwork network, RunRows runs, int motor, ComplexPower running, ComplexPower lockedRotor)
    {
        var (nodes, parents) = (network.NodeArray, network.ParentIndices);
        var (rows, loopKm, incomingRow, transformerRow) = (runs.Rows, runs.LoopKm, runs.IncomingRow, runs.TransformerRow);
        var delta = lockedRotor + (running * -1.0);
        double terminal = 0, panel = 0;
        for (var i = motor; i > 0; i = parents[i])
        {
            var extraHere = 0.0;
            var steadyHere = 0.0;
            if (incomingRow[i] >= 0)
            {
                ref var r = ref rows[incomingRow[i]];
                var km = loopKm[incomingRow[i]];
                extraHere += 100.0 * ((delta.Watts * r.ResistanceOhmPerKm * km) + (delta.Vars * r.ReactanceOhmPerKm * km)) / (r.VoltageV * r.VoltageV);
                steadyHere += r.DropPercent;
            }

            if (transformerRow[i] >= 0 && i != motor)
            {
                var t = nodes[i].Equipment!.Transformer!;
                var (percentR, percentX) = TransformerRegulation.PercentRx(t);
                extraHere += ((percentR * delta.Watts) + (percentX * delta.Vars)) / (t.Kva * 1000.0);
                steadyHere += rows[transformerRow[i]].DropPercent;
            }

            terminal += extraHere + steadyHere;
            if (i != motor)
            {
                panel += extraHere + steadyHere;
            }
        }

        return new MotorStartResult(lockedRotor.VoltAmperes, terminal, panel, network.Project.Rules.MotorStartLimitPercent);
    }
}
