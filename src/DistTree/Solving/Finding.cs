using DistTree.Diagnostics;

namespace DistTree.Solving;

/// <summary>What limit a finding reports.</summary>
public enum FindingKind
{
    /// <summary>A feeder's drop is over its limit.</summary>
    FeederDrop,

    /// <summary>A branch circuit's drop is over its limit.</summary>
    BranchDrop,

    /// <summary>An end point's total drop from the service (or a new origin) is over the total limit.</summary>
    TotalDrop,

    /// <summary>The design current (125 % of continuous load plus the rest) exceeds the allowable ampacity.</summary>
    Ampacity,

    /// <summary>The overcurrent device is rated above what the conductors' ampacity permits.</summary>
    OcpdAboveAmpacity,

    /// <summary>A transformer is loaded above its rating.</summary>
    TransformerOverload,

    /// <summary>A motor's terminals dip more than the limit while it starts.</summary>
    MotorStart,
}

/// <summary>A limit exceeded, with the figures that prove it.</summary>
/// <param name="Kind">Which limit.</param>
/// <param name="Subject">The id of the run or end point.</param>
/// <param name="Value">The figure found (percent, amperes or kVA as the kind says).</param>
/// <param name="Limit">The limit it exceeds, in the same unit.</param>
/// <param name="Message">One sentence with the figures, for people.</param>
/// <param name="Location">Where the run or circuit is in the project file.</param>
public sealed record Finding(FindingKind Kind, string Subject, double Value, double Limit, string Message, SourceLocation Location)
{
    /// <summary>The kind as written in JSON and reports: <c>feeder_drop</c>, <c>branch_drop</c>, …</summary>
    public string Code => Kind switch
    {
        FindingKind.FeederDrop => "feeder_drop",
        FindingKind.BranchDrop => "branch_drop",
        FindingKind.TotalDrop => "total_drop",
        FindingKind.Ampacity => "ampacity",
        FindingKind.OcpdAboveAmpacity => "ocpd_above_ampacity",
        FindingKind.TransformerOverload => "transformer_overload",
        FindingKind.MotorStart => "motor_start",
        _ => "unknown",
    };
}
