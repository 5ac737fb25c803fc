namespace DistTree.Codes.Nec;

/// <summary>The NEC rule set's texts for the report's method (see <see cref="NecRules"/>).</summary>
public sealed partial class NecRules
{
    /// <inheritdoc/>
    public override string GroupingUnit => "current-carrying";

    /// <inheritdoc/>
    public override string DesignCurrentFormula => "I_{design} = 1.25 · I_{continuous} + I_{other} + 0.25 · I_{largest motor} ≤ I_{z}";

    /// <inheritdoc/>
    public override string DesignCurrentRule =>
        "The allowable ampacity of all sets, corrected for ambient and limited by the terminal rating; the overcurrent device may not exceed what the conductors permit. A motor's branch circuit takes 1.25 times its full-load current and its device by the motor rules; air-conditioning equipment given by its nameplate takes its minimum circuit ampacity and maximum overcurrent device.";
}
