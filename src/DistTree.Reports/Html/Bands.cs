using DistTree.Solving;

namespace DistTree.Reports.Html;

/// <summary>How near an end point's total is to the total limit, or the worst of those below a node; worse bands compare greater.</summary>
internal enum Band
{
    /// <summary>No end point to judge.</summary>
    None = -1,

    /// <summary>Below <see cref="Bands.NearFraction"/> of the limit.</summary>
    Ok,

    /// <summary>From <see cref="Bands.NearFraction"/> of the limit up to it.</summary>
    Near,

    /// <summary>Over the total limit (the end point has a total-drop finding).</summary>
    Over,
}

/// <summary>The band of an end point, and each band's CSS class and words on the page.</summary>
internal static class Bands
{
    /// <summary>The share of the total limit from which an end point counts as near its limit.</summary>
    public const double NearFraction = 0.8;

    /// <summary>The band of <paramref name="e"/>: over where the solver found its total over the limit, else by its share of the limit.</summary>
    public static Band Of(EndPointResult e)
    {
        if (e.Findings.Any(f => f.Kind == FindingKind.TotalDrop))
        {
            return Band.Over;
        }

        return e.TotalDropPercent >= NearFraction * e.LimitPercent ? Band.Near : Band.Ok;
    }

    /// <summary>The worse of two bands.</summary>
    public static Band Worse(Band a, Band b) => a >= b ? a : b;

    /// <summary>The band's CSS class suffix.</summary>
    public static string Class(Band band) => band switch
    {
        Band.Over => "over",
        Band.Near => "near",
        Band.Ok => "ok",
        _ => "none",
    };

    /// <summary>The band in words, for a tooltip.</summary>
    public static string Text(Band band) => band switch
    {
        Band.Over => "over limit",
        Band.Near => "near limit",
        Band.Ok => "within limit",
        _ => "no circuits",
    };
}
