using System.Numerics;

namespace DistTree.Solving;

/// <summary>
/// The line a row of an end point's path is read on, and its current in amperes: of the lines of that run (of a
/// transformer, of its secondary) that the end point's voltage reads, the one whose own conductor makes the largest
/// part of the end point's share in the row; <see cref="Line"/> is <c>A</c>, <c>B</c> or <c>C</c>.
/// </summary>
/// <param name="Line">The line, <c>A</c>, <c>B</c> or <c>C</c>.</param>
/// <param name="CurrentA">The current on that line, amperes: the run's line current (as in its
/// <see cref="RunResult.LineCurrentsA"/>); a transformer's, its secondary line's.</param>
public sealed record PathLineCurrent(string Line, double CurrentA);

/// <summary>
/// Works out <see cref="EndPointResult.RunLineCurrents"/>: each row's line by the linearised share the solver counts
/// (see <see cref="Functional"/>), f = a·V_A + b·V_B + c·V_C + n·V_N read through every transformer below the row. A
/// run's line x drops (R + jX)·I_x·L/n on its own conductor, of which f takes Re(f_x·(R + jX)·I_x)·L/n (L/n the same
/// for every line, so the line with the largest Re(f_x·(R + jX)·I_x) is taken); a transformer's, the part of its
/// leakage drop that its secondary line x's current alone makes (see <see cref="TransformerModel.WindingDrop"/>).
/// Only lines f reads (f_x ≠ 0) are candidates: a 1-pole end point's own line, a 2-pole's pair, a 3-pole's worst
/// pair, and above a delta-wye transformer the two primary lines of its winding. Worked out when asked for, not in
/// the solve: only the reports' worst paths read it.
/// </summary>
internal static class PathLines
{
    public static PathLineCurrent[] Of(SolvedRows rows, int endPoint)
    {
        ref readonly var e = ref rows.EndPoints[endPoint];
        var (phases, nodes) = (rows.Phases, rows.Nodes);
        var f = phases.SlotOn(nodes[nodes[e.Node].ParentIndex], e.CountedSlot);
        var lines = new PathLineCurrent[e.PathCount];
        Span<double> drops = stackalloc double[3];
        Span<Complex> one = stackalloc Complex[3];

        // The rows are stored service side first; the walk goes up from the end point, as the solver's does.
        for (var k = e.PathCount - 1; k >= 0; k--)
        {
            ref readonly var row = ref rows.Runs[rows.PathRuns[e.PathStart + k]];
            if (row.IsTransformer)
            {
                var model = phases.Frame.Models[row.Node]!;
                var current = phases.SecondaryCurrents(row.Node);
                for (var x = 0; x < 3; x++)
                {
                    one.Clear();
                    one[x] = current[x];
                    drops[x] = model.WindingDrop(f, one).Real;
                }

                lines[k] = Largest(f, drops, current);
                f = model.MapUp(f);
            }
            else
            {
                var z = new Complex(row.ResistanceOhmPerKm, row.ReactanceOhmPerKm);
                var current = phases.Currents.AsSpan(row.Node * 3, 3);
                for (var x = 0; x < 3; x++)
                {
                    drops[x] = (f[x] * z * current[x]).Real;
                }

                lines[k] = Largest(f, drops, current);
            }
        }

        return lines;
    }

    // The line f reads whose drop is the largest (the first of equals), and its current.
    private static PathLineCurrent Largest(Functional f, ReadOnlySpan<double> drops, ReadOnlySpan<Complex> current)
    {
        var best = -1;
        for (var x = 0; x < 3; x++)
        {
            if (f[x] != Complex.Zero && (best < 0 || drops[x] > drops[best]))
            {
                best = x;
            }
        }

        // Every voltage an end point reads takes at least one line; the guard keeps a row if one ever did not.
        best = Math.Max(best, 0);
        return new PathLineCurrent(((char)('A' + best)).ToString(), current[best].Magnitude);
    }
}
