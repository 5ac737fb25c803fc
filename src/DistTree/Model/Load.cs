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

    /// <summary>
    /// Air-conditioning equipment's nameplate minimum circuit ampacity, amperes (<c>mca</c>), or null; given with
    /// <see cref="MaximumDeviceA"/>.
    /// </summary>
    public double? MinimumCircuitA { get; init; }

    /// <summary>
    /// Air-conditioning equipment's nameplate maximum overcurrent protective device, amperes (<c>mocp</c>), or null;
    /// given with <see cref="MinimumCircuitA"/>.
    /// </summary>
    public double? MaximumDeviceA { get; init; }

    /// <summary>True for a motor load (<c>hp</c> or <c>fla</c>).</summary>
    public bool IsMotor => IsMotorKind(Kind);

    /// <summary>The unit symbol of a stated <paramref name="kind"/>, as people read it after the number: VA, kVA, kW, A, hp (full-load amperes: A).</summary>
    public static string UnitOf(LoadKind kind) => kind switch
    {
        LoadKind.Va => "VA",
        LoadKind.Kva => "kVA",
        LoadKind.Kw => "kW",
        LoadKind.Amps => "A",
        LoadKind.Hp => "hp",
        LoadKind.Fla => "A",
    };

    /// <summary>True for the quantities a motor is given in (<c>hp</c> or <c>fla</c>): such a load needs its power factor and may state how it starts.</summary>
    public static bool IsMotorKind(LoadKind kind) => kind is LoadKind.Hp or LoadKind.Fla;

    /// <summary>
    /// The load's apparent power in volt-amperes at the nominal voltage of <paramref name="supply"/>: <c>va</c> and
    /// <c>kva</c> as stated, <c>kw</c> over the power factor, <c>amps</c> and <c>fla</c> at nominal voltage
    /// (|S| = V·I single-phase, √3·V·I three-phase), <c>hp</c> through the motor full-load current tables
    /// (<see cref="MotorTables"/>). The one place a stated quantity becomes power: the loader (a circuit's loads at
    /// points) and the solver both use it, so a new kind of load is worked out here and nowhere else.
    /// </summary>
    /// <exception cref="ArgumentException">A motor rating the tables do not list.</exception>
    public double VoltAmperes(CircuitSupply supply) => Kind switch
    {
        LoadKind.Va => Value,
        LoadKind.Kva => Value * 1000,
        LoadKind.Kw => Value * 1000 / PowerFactor,
        LoadKind.Amps or LoadKind.Fla => FromCurrent(Value, supply),
        LoadKind.Hp => FromCurrent(TableCurrentA(supply), supply),
    };

    // The full-load current the tables list for this many horsepower on the supply.
    private double TableCurrentA(CircuitSupply supply) =>
        MotorTables.FullLoadCurrentA(Value, supply)
            ?? throw new ArgumentException(FormattableString.Invariant(
                $"no full-load current is listed for a {Value} hp motor on {supply.Phases}-phase {supply.VoltageV} V; give the motor's nameplate current as 'fla' instead"));

    /// <summary>
    /// A motor's full-load current in amperes on <paramref name="supply"/>: <c>fla</c> as stated, <c>hp</c> from the
    /// motor full-load current tables (<see cref="MotorTables"/>); null for a load that is not a motor.
    /// </summary>
    /// <exception cref="ArgumentException">A motor rating the tables do not list for the supply.</exception>
    public double? FullLoadCurrentA(CircuitSupply supply) => Kind switch
    {
        LoadKind.Fla => Value,
        LoadKind.Hp => TableCurrentA(supply),
        LoadKind.Va or LoadKind.Kva or LoadKind.Kw or LoadKind.Amps => null,
    };

    /// <summary>
    /// Loads along a run as one load: the phasor sum of their powers (<see cref="VoltAmperes"/> at their power
    /// factors, lagging) as volt-amperes at the sum's power factor (1 for no load).
    /// </summary>
    public static Load Combined(IReadOnlyList<LoadPoint> points, CircuitSupply supply)
    {
        double p = 0, q = 0;
        foreach (var point in points)
        {
            var load = point.Load;
            var va = load.VoltAmperes(supply);
            p += va * load.PowerFactor;
            q += va * Math.Sqrt(1 - (load.PowerFactor * load.PowerFactor));
        }

        var s = Math.Sqrt((p * p) + (q * q));
        return new Load(LoadKind.Va, s, s > 0 ? p / s : 1.0);
    }

    // The apparent power in VA that a line current draws at the supply's nominal voltage.
    private static double FromCurrent(double currentA, CircuitSupply supply) =>
        supply.Phases == 3 ? Math.Sqrt(3) * supply.VoltageV * currentA : supply.VoltageV * currentA;
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
public sealed record LoadPoint(double AtM, Load Load)
{
    /// <summary>What the point's load is: the point's own <c>category</c>, else its circuit's.</summary>
    public LoadCategory Category { get; init; } = LoadCategory.Other;
}
