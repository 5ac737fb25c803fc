using DistTree.Solving;

namespace DistTree.Reports.Html;

/// <summary>The heading of each kind of finding on the page: the report's one table of finding-kind titles.</summary>
internal static class FindingKindTitles
{
    /// <summary>The heading of <paramref name="kind"/>, as the summary and the findings section print it.</summary>
    public static string Of(FindingKind kind) => kind switch
    {
        FindingKind.FeederDrop => "Feeder drop over its limit",
        FindingKind.BranchDrop => "Branch-circuit drop over its limit",
        FindingKind.TotalDrop => "Total drop over the total limit",
        FindingKind.Ampacity => "Design current above the allowable ampacity",
        FindingKind.OcpdAboveAmpacity => "Overcurrent device above what the conductors permit",
        FindingKind.TransformerOverload => "Transformer loaded above its rating",
        FindingKind.MotorStart => "Motor terminals dip over the limit while starting",
        _ => "Other",
    };
}
