namespace DistTree.Model;

/// <summary>
/// A supply system by its nameplate designation: <c>208Y/120</c>, <c>120/240</c>, <c>480D</c> and so on.
/// It knows which circuits it can give: a 1-pole circuit needs a neutral, a 2-pole circuit two lines.
/// </summary>
public sealed record ElectricalSystem
{
    private static readonly ElectricalSystem[] Known =
    [
        new("120/240", 1, 240, 120, 3),
        new("120", 1, null, 120, 2),
        new("240", 1, 240, null, 2),
        new("230", 1, null, 230, 2),
        new("208Y/120", 3, 208, 120, 4),
        new("480Y/277", 3, 480, 277, 4),
        new("600Y/347", 3, 600, 347, 4),
        new("400Y/230", 3, 400, 230, 4),
        new("240D", 3, 240, null, 3),
        new("480D", 3, 480, null, 3),
        new("600D", 3, 600, null, 3),
    ];

    private ElectricalSystem(string name, int phases, double? lineToLineV, double? lineToNeutralV, int wires)
    {
        Name = name;
        Phases = phases;
        LineToLineV = lineToLineV;
        LineToNeutralV = lineToNeutralV;
        Wires = wires;
    }

    /// <summary>The designation as written in project files.</summary>
    public string Name { get; }

    /// <summary>1 for single-phase systems, 3 for three-phase.</summary>
    public int Phases { get; }

    /// <summary>Line-to-line voltage in volts, or null for a two-wire line-to-neutral system.</summary>
    public double? LineToLineV { get; }

    /// <summary>Line-to-neutral voltage in volts, or null where there is no neutral.</summary>
    public double? LineToNeutralV { get; }

    /// <summary>Number of circuit conductors including the neutral (grounding conductor not counted).</summary>
    public int Wires { get; }

    /// <summary>True when the system has a neutral, so 1-pole circuits are possible.</summary>
    public bool HasNeutral => LineToNeutralV is not null;

    /// <summary>Every system designation DistTree knows, in a stable order.</summary>
    public static IReadOnlyList<string> Names { get; } = Known.Select(s => s.Name).ToArray();

    /// <summary>The voltage that a feeder of this system is rated at (line-to-line where there is one).</summary>
    public double NominalV => LineToLineV ?? LineToNeutralV!.Value;

    /// <summary>The supply of a feeder of this system: the whole system, balanced.</summary>
    public CircuitSupply FeederSupply =>
        Phases == 3 ? new CircuitSupply(NominalV, 3) : new CircuitSupply(NominalV, 1);

    /// <summary>Finds a system by its designation (case-insensitive); null when unknown.</summary>
    public static ElectricalSystem? Find(string name) =>
        Known.FirstOrDefault(s => string.Equals(s.Name, name.Trim(), StringComparison.OrdinalIgnoreCase));

    /// <summary>
    /// The supply a circuit of <paramref name="poles"/> poles gets from this system, or null when the
    /// system cannot give it (a 1-pole circuit without a neutral, a 2-pole circuit on a two-wire system,
    /// a 3-pole circuit on a single-phase system).
    /// </summary>
    public CircuitSupply? CircuitFor(int poles) => poles switch
    {
        1 when LineToNeutralV is { } vn => new CircuitSupply(vn, 1),
        2 when LineToLineV is { } vll => new CircuitSupply(vll, 1),
        3 when Phases == 3 => new CircuitSupply(LineToLineV!.Value, 3),
        _ => null,
    };

    /// <inheritdoc />
    public override string ToString() => Name;
}

/// <summary>The nominal voltage and phase count that a run is supplied at.</summary>
/// <param name="VoltageV">Nominal voltage in volts: line-to-line for three-phase, the circuit's voltage for single-phase.</param>
/// <param name="Phases">1 (drop factor 2) or 3 (drop factor √3).</param>
public readonly record struct CircuitSupply(double VoltageV, int Phases);
