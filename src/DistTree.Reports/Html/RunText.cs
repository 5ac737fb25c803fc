using DistTree.Solving;
using DistTree.Vocabulary;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>How the page names a run, its kind and conductors, and a list of finding codes: shared by the paths, the tree, the panels and the plan.</summary>
internal static class RunText
{
    /// <summary>The run's conductors (<c>2× 3/0 Cu</c>; with <c>, 6 current-carrying</c>, or under IEC <c>, 3 grouped circuits</c>, where a shared raceway derates it), or "regulation" for a transformer's row; escaped.</summary>
    public static string Conductor(RunResult r) => Escape(ConductorText(r));

    /// <summary>The text of <see cref="Conductor"/>, not escaped (for the schedules' CSV).</summary>
    public static string ConductorText(RunResult r)
    {
        if (r.Kind == RunResultKind.Transformer || r.Size is null)
        {
            return "regulation";
        }

        // A raceway shared by more than the code leaves unadjusted (three current-carrying conductors under the NEC, one
        // circuit under IEC 60364) derates the run's ampacity: the count shows, in the code's unit.
        var sets = r.Sets > 1 ? $"{r.Sets}× " : "";
        var shared = r.CurrentCarryingConductors is { } n && n > r.Code.UngroupedCount ? $", {n} {r.Code.GroupingUnit}" : "";
        return $"{sets}{r.Size} {r.Material}{shared}";
    }

    /// <summary>The kind in words.</summary>
    public static string KindText(RunResultKind kind) => Words.RunKind.Of(kind);

    /// <summary>The kind's CSS class suffix.</summary>
    public static string KindClass(RunResultKind kind) => kind switch
    {
        RunResultKind.Feeder => "feeder",
        RunResultKind.Branch => "branch",
        _ => "xfmr",
    };

    /// <summary>The distinct codes of <paramref name="findings"/> in order, comma-separated; escaped.</summary>
    public static string Codes(IEnumerable<Finding> findings) =>
        Escape(string.Join(", ", findings.Select(f => f.Code).Distinct(StringComparer.Ordinal)));
}
