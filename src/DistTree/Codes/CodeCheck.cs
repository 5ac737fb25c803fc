namespace DistTree.Codes;

/// <summary>
/// A rule a finding reports a breach of. Each rule set cites its own clause for each (see <see cref="CodeRules.Cite"/>);
/// nothing outside a rule set knows a clause number.
/// </summary>
public enum CodeCheck
{
    /// <summary>A feeder's voltage drop over the feeder limit.</summary>
    FeederDrop,

    /// <summary>A branch circuit's voltage drop over the branch limit.</summary>
    BranchDrop,

    /// <summary>An end point's total drop over the total limit.</summary>
    TotalDrop,

    /// <summary>A feeder's conductors below the current they must carry.</summary>
    FeederAmpacity,

    /// <summary>A branch circuit's conductors below the current they must carry.</summary>
    BranchAmpacity,

    /// <summary>A neutral below the current it carries.</summary>
    NeutralAmpacity,

    /// <summary>A feeder's overcurrent device rated below the load it serves.</summary>
    FeederDevice,

    /// <summary>A branch circuit's overcurrent device rated below the load it serves.</summary>
    BranchDevice,

    /// <summary>An overcurrent device above the conductors' ampacity, and not the next standard rating above it.</summary>
    DeviceAboveAmpacity,

    /// <summary>A small conductor protected above its own limit.</summary>
    SmallConductor,

    /// <summary>A motor branch circuit's conductors below the current the motor rules ask of them.</summary>
    MotorBranchAmpacity,

    /// <summary>A feeder's conductors below the current the motor rules ask of them, with motors on its most loaded line.</summary>
    MotorFeederAmpacity,

    /// <summary>A motor branch circuit's device above the largest the motor rules allow.</summary>
    MotorDevice,

    /// <summary>Air-conditioning equipment's conductors below its nameplate minimum circuit ampacity.</summary>
    AirConditioningAmpacity,

    /// <summary>Air-conditioning equipment's device above its nameplate maximum overcurrent device.</summary>
    AirConditioningDevice,

    /// <summary>A transformer loaded above its nameplate rating.</summary>
    TransformerLoading,

    /// <summary>A motor's terminals dipping more than the limit while it starts.</summary>
    MotorStart,

    /// <summary>A stated equipment grounding conductor smaller than the run needs.</summary>
    GroundingConductor,

    /// <summary>Equipment rated below the fault current available at it.</summary>
    InterruptingRating,

    /// <summary>A far-end fault too small to trip the run's device without delay (automatic disconnection).</summary>
    FaultClearing,

    /// <summary>A stated raising tap putting a transformer's secondary over the light-load limit at no load.</summary>
    NoLoadRise,
}
