using System.Numerics;
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
    /// <paramref name="rows"/> each row's shares and row, the end point's own first; with
    /// <paramref name="withSource"/> (the rows reach the service) the utility's share too, Re f(Z_s·I) and the fall
    /// from its no-load voltage. Gives the totals, the utility's share in them.
    /// </summary>
    public PathTotals Walk(int index, Functional f, int count, Span<double> ps, Span<double> lf, Span<int> rows, bool withSource)
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
                ps[at] = f.DropPercent(moments.AsSpan(r * 3, 3), row.ResistanceOhmPerKm, row.ReactanceOhmPerKm, row.NeutralResistanceOhmPerKm, row.NeutralReactanceOhmPerKm);
                lf[at] = voltages is null ? 0.0 : (f.Of(voltages.Bus(parents[i])).Magnitude - f.Of(voltages.Input(i)).Magnitude) * 100.0;
                at++;
            }
        }

        // The utility's share at the top; the taps act on the voltage that reaches them: from the top down.
        var (sourcePs, sourceLf) = withSource ? Source(f) : (0.0, 0.0);
        double percentSum = sourcePs, loadFlow = sourceLf;
        for (var k = count - 1; k >= 0; k--)
        {
            ps[k] += (100.0 - percentSum) * tap[k];
            percentSum += ps[k];
            loadFlow += lf[k];
        }

        return new PathTotals(percentSum, loadFlow, sourcePs, sourceLf);
    }

    // The utility's share in f, read on the service's bus: by the percent sum and by the load flow.
    private (double PercentSum, double LoadFlow) Source(Functional f)
    {
        var z = phases.Frame.SourceImpedance;
        if (z == Complex.Zero)
        {
            return (0.0, 0.0);
        }

        var i = phases.Currents.AsSpan(0, 3);
        var percentSum = ((f.A * i[0]) + (f.B * i[1]) + (f.C * i[2])) * z * 100.0;
        if (voltages is null)
        {
            return (percentSum.Real, 0.0);
        }

        Span<Complex> emf = stackalloc Complex[4];
        phases.Frame.Nominal(network.NodeArray[0], emf);
        return (percentSum.Real, (f.Of(emf).Magnitude - f.Of(voltages.Bus(0)).Magnitude) * 100.0);
    }
}

/// <summary>An end point's totals in one voltage, by each method, and the utility's share in each.</summary>
internal readonly record struct PathTotals(double PercentSum, double LoadFlow, double SourcePercentSum, double SourceLoadFlow);
