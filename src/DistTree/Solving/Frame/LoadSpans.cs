using System.Numerics;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// Loads along a run in the load flow, span by span (common practice): each point's load draws at its own voltage;
/// each span carries the phasor sum of the loads beyond it. The end point's bus is its last point.
/// </summary>
internal sealed class LoadSpans
{
    private readonly Complex[] _s0;
    private readonly LoadModel[] _model;
    private readonly double[] _spanKm;
    private readonly Complex[] _voltage;
    private readonly Complex[] _current;
    private readonly Complex _zLine;
    private readonly Complex _zNeutral;

    private LoadSpans(Complex[] s0, LoadModel[] model, double[] spanKm, Complex[] voltage, Complex zLine, Complex zNeutral)
    {
        _s0 = s0;
        _model = model;
        _spanKm = spanKm;
        _voltage = voltage;
        _current = new Complex[s0.Length * 3];
        _zLine = zLine;
        _zNeutral = zNeutral;
    }

    /// <summary>The spans of <paramref name="circuit"/>'s run, conductors of <paramref name="zLinePerKm"/> and <paramref name="zNeutralPerKm"/> (Ω/km, sets in parallel), starting at the voltages <paramref name="nominal"/>.</summary>
    public static LoadSpans Of(NetworkRun run, Circuit circuit, Complex zLinePerKm, Complex zNeutralPerKm, ReadOnlySpan<Complex> nominal)
    {
        var points = circuit.Points;
        var (s0, model, spanKm, voltage) = (new Complex[points.Count], new LoadModel[points.Count], new double[points.Count], new Complex[points.Count * 4]);
        var from = 0.0;
        for (var k = 0; k < points.Count; k++)
        {
            var s = LoadPower.Of(points[k].Load, run.Supply);
            s0[k] = new Complex(s.Watts, s.Vars);
            model[k] = points[k].Load.Model;
            spanKm[k] = (points[k].AtM - from) / 1000.0;
            from = points[k].AtM;
            nominal.CopyTo(voltage.AsSpan(k * 4, 4));
        }

        return new LoadSpans(s0, model, spanKm, voltage, zLinePerKm, zNeutralPerKm);
    }

    /// <summary>Into <paramref name="total"/> (three lines, cleared), the currents of every point's load at its present voltages, as <paramref name="load"/> connects them.</summary>
    public void Currents(in EndLoad load, Span<Complex> total)
    {
        for (var k = 0; k < _s0.Length; k++)
        {
            var mine = _current.AsSpan(k * 3, 3);
            mine.Clear();
            PhaseLoads.Add(_s0[k], _model[k], load.On, _voltage.AsSpan(k * 4, 4), load.SingleV, load.PairV, mine);
            total[0] += mine[0];
            total[1] += mine[1];
            total[2] += mine[2];
        }
    }

    /// <summary>Each point's voltages from the head's <paramref name="head"/> and the run's current <paramref name="current"/>; the last point's into <paramref name="end"/>.</summary>
    public void Voltages(ReadOnlySpan<Complex> head, ReadOnlySpan<Complex> current, Span<Complex> end)
    {
        head[..4].CopyTo(end);
        Span<Complex> carried = stackalloc Complex[3];
        current[..3].CopyTo(carried);
        for (var k = 0; k < _s0.Length; k++)
        {
            var (zl, zn) = (_zLine * _spanKm[k], _zNeutral * _spanKm[k]);
            end[0] -= carried[0] * zl;
            end[1] -= carried[1] * zl;
            end[2] -= carried[2] * zl;
            end[3] += (carried[0] + carried[1] + carried[2]) * zn;
            end[..4].CopyTo(_voltage.AsSpan(k * 4, 4));
            for (var x = 0; x < 3; x++)
            {
                carried[x] -= _current[(k * 3) + x];
            }
        }
    }
}
