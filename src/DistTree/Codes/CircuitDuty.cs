using DistTree.Network;

namespace DistTree.Codes;

/// <summary>What a branch circuit serves, as the conductor and device rules tell circuits apart.</summary>
public enum DutyKind
{
    /// <summary>Any other load: the general rules (design current from the load, its continuous part at 125 %).</summary>
    General,

    /// <summary>One motor, given as <c>hp</c> or <c>fla</c>: the motor rules, from its full-load current.</summary>
    Motor,

    /// <summary>Air-conditioning equipment given by its nameplate's <c>mca</c> and <c>mocp</c>.</summary>
    AirConditioning,
}

/// <summary>
/// What a branch circuit serves and the figures its rules read: a motor's full-load current, or air-conditioning
/// equipment's nameplate minimum circuit ampacity and maximum overcurrent device (amperes). A feeder's duty is
/// <see cref="DutyKind.General"/>: the motors below it reach its design current through each line's largest motor.
/// </summary>
/// <param name="Kind">Which rules apply.</param>
/// <param name="FullLoadA">A motor's full-load current, amperes (0 for none).</param>
/// <param name="MinimumCircuitA">The nameplate minimum circuit ampacity, amperes (0 for none).</param>
/// <param name="MaximumDeviceA">The nameplate maximum overcurrent protective device, amperes (0 for none).</param>
public readonly record struct CircuitDuty(DutyKind Kind, double FullLoadA, double MinimumCircuitA, double MaximumDeviceA)
{
    /// <summary>
    /// The duty of <paramref name="run"/>: air conditioning where its circuit's load gives <c>mca</c> and
    /// <c>mocp</c>, a motor where its load is <c>hp</c> or <c>fla</c>, else general (every feeder).
    /// </summary>
    /// <exception cref="ArgumentException">A motor rating the tables do not list for the supply.</exception>
    public static CircuitDuty Of(NetworkRun run)
    {
        if (run.Kind != RunKind.Branch || run.Target.Circuit is not { Points.Count: 0 } circuit)
        {
            return default;
        }

        var load = circuit.Load;
        if (load is { MinimumCircuitA: { } mca, MaximumDeviceA: { } mocp })
        {
            return new CircuitDuty(DutyKind.AirConditioning, load.FullLoadCurrentA(circuit.Supply) ?? 0, mca, mocp);
        }

        return load.FullLoadCurrentA(circuit.Supply) is { } fla ? new CircuitDuty(DutyKind.Motor, fla, 0, 0) : default;
    }
}
