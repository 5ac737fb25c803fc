namespace DistTree.Model;

/// <summary>How a circuit's load is stated.</summary>
public enum LoadKind
{
    /// <summary>Apparent power in volt-amperes.</summary>
    Va,

    /// <summary>Apparent power in kilovolt-amperes.</summary>
    Kva,

    /// <summary>Real power in kilowatts.</summary>
    Kw,

    /// <summary>Current in amperes at the circuit's nominal voltage.</summary>
    Amps,

    /// <summary>Motor horsepower: the current comes from the motor full-load current tables.</summary>
    Hp,

    /// <summary>Motor full-load amperes, as the nameplate or the designer gives them.</summary>
    Fla,
}

/// <summary>How a load's power follows its voltage in the load flow.</summary>
public enum LoadModel
{
    /// <summary>Constant power: S = S₀ whatever the voltage (motors, drives, most electronic loads).</summary>
    ConstantPower,

    /// <summary>Constant current: S = S₀·|V|.</summary>
    ConstantCurrent,

    /// <summary>Constant impedance: S = S₀·|V|² (resistance heating, incandescent lighting).</summary>
    ConstantImpedance,
}

/// <summary>A load as the project states it; the solver turns it into complex power.</summary>
/// <param name="Kind">The quantity stated.</param>
/// <param name="Value">The number, in the unit <paramref name="Kind"/> names.</param>
/// <param name="PowerFactor">Displacement power factor in (0, 1], lagging.</param>
public sealed record Load(LoadKind Kind, double Value, double PowerFactor)
{
    /// <summary>How the load's power follows its voltage in the load flow (constant power unless stated).</summary>
    public LoadModel Model { get; init; } = LoadModel.ConstantPower;

    /// <summary>Starting data for a motor (<c>hp</c> or <c>fla</c>); null for other loads.</summary>
    public MotorStart? Start { get; init; }

    /// <summary>True for a motor load (<c>hp</c> or <c>fla</c>).</summary>
    public bool IsMotor => IsMotorKind(Kind);

    /// <summary>True for the quantities a motor is given in (<c>hp</c> or <c>fla</c>): such a load needs its power factor and may state how it starts.</summary>
    public static bool IsMotorKind(LoadKind kind) => kind is LoadKind.Hp or LoadKind.Fla;
}

/// <summary>How a motor starts: its locked-rotor current from a code letter or a multiple of full-load current.</summary>
/// <param name="CodeLetter">The NEMA locked-rotor code letter (A to V), or null.</param>
/// <param name="LockedRotorMultiple">Locked-rotor current as a multiple of full-load current, or null.</param>
/// <param name="PowerFactor">Power factor while starting.</param>
public sealed record MotorStart(string? CodeLetter, double? LockedRotorMultiple, double PowerFactor)
{
    /// <summary>Starting power factor when none is given: 0.35 (common practice for small and medium induction motors; memory).</summary>
    public const double DefaultPowerFactor = 0.35;

    /// <summary>Locked-rotor multiple when neither a code letter nor a multiple is given: 6 × full-load current (common practice for NEMA design B motors; memory).</summary>
    public const double DefaultMultiple = 6.0;

    /// <summary>The defaults: 6 × full-load current at 0.35 power factor.</summary>
    public static MotorStart Default { get; } = new(null, null, DefaultPowerFactor);
}

/// <summary>A load at a distance along a branch circuit's run (a row of luminaires, a chain of receptacles).</summary>
/// <param name="AtM">Distance from the panel in metres.</param>
/// <param name="Load">The load there.</param>
public sealed record LoadPoint(double AtM, Load Load);
