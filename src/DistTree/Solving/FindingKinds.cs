namespace DistTree.Solving;

/// <summary>
/// What one kind of finding is, for every output: its code, its title, its SARIF rule, its description and the
/// figures it carries. Every renderer reads these, so a kind cannot reach one output and miss another.
/// </summary>
/// <param name="Kind">The kind described.</param>
/// <param name="Code">The code written in JSON, SARIF, the console and reports: <c>feeder_drop</c>, …</param>
/// <param name="Title">A heading for people: <c>Feeder drop over its limit</c>.</param>
/// <param name="Check">The check's name in a list of checks: <c>Feeder drop</c>.</param>
/// <param name="SarifName">The SARIF rule's name (a Pascal-case identifier).</param>
/// <param name="Description">One sentence saying what the finding means (the SARIF rule's short description).</param>
/// <param name="Unit">The unit of the finding's value and limit: <c>%</c>, <c>A</c>, <c>kVA</c> or <c>mm2</c>.</param>
/// <param name="Value">What the finding's value is.</param>
/// <param name="Limit">What the finding's limit is.</param>
public sealed record FindingKindInfo(
    FindingKind Kind, string Code, string Title, string Check, string SarifName, string Description, string Unit, string Value, string Limit);

/// <summary>The registry of finding kinds: one <see cref="FindingKindInfo"/> per <see cref="FindingKind"/>, in enum order.</summary>
public static class FindingKinds
{
    private static readonly FindingKindInfo[] Infos = Enum.GetValues<FindingKind>().Select(Describe).ToArray();

    /// <summary>Every kind, in the order of <see cref="FindingKind"/> (the SARIF rules' order).</summary>
    public static IReadOnlyList<FindingKindInfo> All => Infos;

    /// <summary>What <paramref name="kind"/> is.</summary>
    public static FindingKindInfo Of(FindingKind kind) => Infos[(int)kind];

    // No fallback arm: a new kind does not compile until it is described here.
    private static FindingKindInfo Describe(FindingKind kind) => kind switch
    {
        FindingKind.FeederDrop => new(
            kind, "feeder_drop", "Feeder drop over its limit", "Feeder drop", "FeederDrop",
            "A feeder's voltage drop is over the feeder limit.", "%", "the feeder's drop", "its drop limit"),
        FindingKind.BranchDrop => new(
            kind, "branch_drop", "Branch-circuit drop over its limit", "Branch-circuit drop", "BranchDrop",
            "A branch circuit's voltage drop is over the branch limit.", "%", "the branch circuit's drop", "its drop limit"),
        FindingKind.TotalDrop => new(
            kind, "total_drop", "Total drop over the total limit", "Total drop to each point of use", "TotalDrop",
            "The total voltage drop from the service to an end point is over the total limit.", "%", "the end point's total drop", "the total limit"),
        FindingKind.Ampacity => new(
            kind, "ampacity", "Design current above the allowable ampacity", "Ampacity (design current)", "Ampacity",
            "The design current of a run is above its conductors' corrected ampacity.", "A", "the design current", "the allowable ampacity"),
        FindingKind.OcpdAboveAmpacity => new(
            kind, "ocpd_above_ampacity", "Overcurrent device above what the conductors or the equipment permit", "Overcurrent device", "OcpdAboveAmpacity",
            "The overcurrent device is rated above what the conductors' ampacity permits, or, for a motor or air-conditioning equipment, above what its own rules allow.",
            "A", "the device rating", "the largest rating the conductors or the equipment permit"),
        FindingKind.TransformerOverload => new(
            kind, "transformer_overload", "Transformer loaded above its rating", "Transformer loading", "TransformerOverload",
            "A transformer is loaded above its rating.", "kVA", "the load carried", "the nameplate rating"),
        FindingKind.MotorStart => new(
            kind, "motor_start", "Motor terminals dip over the limit while starting", "Motor starting dip at the terminals", "MotorStart",
            "A motor's terminal voltage dips more than the motor-start limit while it starts.", "%", "the terminal dip", "the motor-start limit"),
        FindingKind.NeutralAmpacity => new(
            kind, "neutral_ampacity", "Neutral current above its ampacity", "Neutral ampacity", "NeutralAmpacity",
            "A run's neutral carries more current than its corrected ampacity.", "A", "the neutral's current", "the neutral's allowable ampacity"),
        FindingKind.DeviceBelowLoad => new(
            kind, "device_below_load", "Design current above the overcurrent device's rating", "Overcurrent device rating (load)", "DeviceBelowLoad",
            "The design current of a run is above the rating of its overcurrent device.", "A", "the design current", "the device rating"),
        FindingKind.GroundingConductor => new(
            kind, "grounding_conductor", "Equipment grounding conductor below its minimum", "Equipment grounding conductor", "GroundingConductor",
            "A run's stated equipment grounding conductor is smaller than the minimum for its device and lines.", "mm2",
            "the stated grounding conductor's area", "the minimum's area"),
        FindingKind.InterruptingRating => new(
            kind, "interrupting_rating", "Available fault current above the equipment's rating", "Interrupting rating", "InterruptingRating",
            "The short-circuit current available at a piece of equipment is above its stated interrupting or short-circuit current rating.", "kA",
            "the largest available fault current", "the stated rating"),
        FindingKind.FaultClearing => new(
            kind, "fault_clearing", "Far-end fault too small to trip the device without delay", "Fault clearing at the far end", "FaultClearing",
            "The minimum fault current at a run's far end is below the current that trips its overcurrent device without delay.", "A",
            "the minimum far-end fault current", "the device's instantaneous trip current"),
        FindingKind.NoLoadRise => new(
            kind, "no_load_rise", "Secondary over the light-load limit at no load", "No-load voltage under raising taps", "NoLoadRise",
            "A transformer's stated raising tap, with the taps above it, puts its secondary more than the light-load limit above nominal at no load.", "%",
            "the secondary's rise above nominal at no load", "the light-load limit"),
    };
}
