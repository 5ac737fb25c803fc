using DistTree.Network;

namespace DistTree.Solving.Passes;

/// <summary>
/// The shares of the rows on an end point's path in one voltage it reads (a <see cref="Functional"/> on its
/// panel's bus), walking up: a run's by the percent sum, Re f(ΔV) of the drops along it at the currents of nominal
/// voltage (see <see cref="Functional.OfRun"/>), and by the load flow, the fall of |f(V)| along it; a transformer's,
/// the leakage drop of its windings (see <see cref="TransformerModel.WindingDrop"/>) plus its tap's part of the
/// voltage arriving at it, (100 − the shares above)·tap/(1 + tap), and by the load flow the fall from its primary
/// terminals (read through its connection at the principal tap) to its secondary. Above a transformer the voltage is
/// read through its connection (see <see cref="TransformerModel.MapUp"/>). The percent sum is the linearisation of
/// the load flow: the two agree at light load.
/// </summary>
internal sealed class PathShares(DistributionNetwork network, PhaseFlow phases, RunRows runs, PhaseVoltages? voltages)
{
    private readonly int[] _parents = network.ParentIndices;

    /// <summary>How many rows lie between end point <paramref name="index"/> and the service.</summary>
    public int AllRows(int index)
    {
        var count = 0;
        for (var i = index; i > 0; i = _parents[i])
        {
            count += (runs.IncomingRow[i] >= 0 ? 1 : 0) + (runs.TransformerRow[i] >= 0 ? 1 : 0);
        }

        return count;
    }

    /// <summary>
    /// Walks <paramref name="count"/> rows up from end point <paramref name="index"/> reading <paramref name="f"/>:
    /// into <paramref name="ps"/>, <paramref name="lf"/> (without a converged load flow: zeros) and
    /// <paramref name="rows"/> each row's shares and row, the end point's own first; gives the totals.
    /// </summary>
    public (double PercentSum, double LoadFlow) Walk(int index, Functional f, int count, Span<double> ps, Span<double> lf, Span<int> rows)
    {
        var (parents, incomingRow, transformerRow, moments, runRows) = (_parents, runs.IncomingRow, runs.TransformerRow, runs.Moments, runs.Rows);
        var models = phases.Frame.Models;
        Span<double> tap = count <= 64 ? stackalloc double[count] : new double[count];
        var at = 0;
        for (var i = index; at < count; i = parents[i])
        {
            if (transformerRow[i] >= 0)
            {
                var model = models[i]!;
                var up = model.MapUp(f);
                (rows[at], tap[at]) = (transformerRow[i], model.TapShare);
                ps[at] = model.WindingDrop(f, phases.SecondaryCurrents(i)).Real * 100.0;
                lf[at] = voltages is null ? 0.0 : (up.Of(voltages.Input(i)).Magnitude - f.Of(voltages.Bus(i)).Magnitude) * 100.0;
                f = up;
                if (++at == count)
                {
                    break;
                }
            }

            if (incomingRow[i] >= 0)
            {
                var r = incomingRow[i];
                ref var row = ref runRows[r];
                (rows[at], tap[at]) = (r, 0.0);
                ps[at] = f.DropPercent(moments.AsSpan(r * 3, 3), row.ResistanceOhmPerKm, row.ReactanceOhmPerKm);
                lf[at] = voltages is null ? 0.0 : (f.Of(voltages.Bus(parents[i])).Magnitude - f.Of(voltages.Input(i)).Magnitude) * 100.0;
                at++;
            }
        }

        // The taps act on the voltage that reaches them: from the top down.
        double percentSum = 0, loadFlow = 0;
        for (var k = count - 1; k >= 0; k--)
        {
            ps[k] += (100.0 - percentSum) * tap[k];
            percentSum += ps[k];
            loadFlow += lf[k];
        }

        return (percentSum, loadFlow);
    }
}
