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
}

/// <summary>A load as the project states it; the solver turns it into complex power.</summary>
/// <param name="Kind">The quantity stated.</param>
/// <param name="Value">The number, in the unit <paramref name="Kind"/> names.</param>
/// <param name="PowerFactor">Displacement power factor in (0, 1], lagging.</param>
public sealed record Load(LoadKind Kind, double Value, double PowerFactor);
