namespace DistTree.Model;

/// <summary>Which current a branch circuit's drop is computed at.</summary>
public enum BranchCurrentBasis
{
    /// <summary>The connected load's current.</summary>
    Connected,

    /// <summary>80 % of the overcurrent device's rating.</summary>
    Ocpd80,

    /// <summary>The lesser of the connected load's current and 80 % of the device rating.</summary>
    Lesser,
}

/// <summary>How a transformer enters the total drop.</summary>
public enum TransformerDropMode
{
    /// <summary>Its regulation counts in the total along the path.</summary>
    Count,

    /// <summary>Its secondary starts a new budget: totals below it start from zero.</summary>
    NewOrigin,
}

/// <summary>How the conductor temperature used for resistance is chosen.</summary>
public enum TemperatureMode
{
    /// <summary>From loading: T = Ta + (Tr − Ta)·(I/Iz)², never below Ta, above Tr past the ampacity.</summary>
    Estimated,

    /// <summary>The insulation's rated temperature.</summary>
    Rated,

    /// <summary>A temperature the project states.</summary>
    Fixed,
}

/// <summary>The electrical code whose rule set judges a project (<c>rules: code:</c>; see <c>Codes/CodeRules</c>).</summary>
public enum ElectricalCode
{
    /// <summary>The National Electrical Code (NFPA 70).</summary>
    Nec,

    /// <summary>The Canadian Electrical Code, Part I (CSA C22.1).</summary>
    Cec,

    /// <summary>IEC 60364, low-voltage electrical installations (parts 4-43, 5-52 and 5-54).</summary>
    Iec,
}

/// <summary>Who supplies the installation, where a code's limits depend on it (IEC 60364-5-52 Annex G).</summary>
public enum SupplyKind
{
    /// <summary>Supplied directly from a public low-voltage distribution system.</summary>
    Public,

    /// <summary>Supplied from a private supply (the installation's own transformer or generator).</summary>
    Private,
}

/// <summary>
/// How a code lets the total limit grow on a long path: by <paramref name="PercentPerM"/> for every metre of the path's
/// wiring beyond <paramref name="FromM"/>, at most <paramref name="MaxPercent"/> in all.
/// </summary>
/// <param name="FromM">The path length, metres, from which the allowance starts.</param>
/// <param name="PercentPerM">The allowance per metre beyond it, percent.</param>
/// <param name="MaxPercent">The largest allowance, percent.</param>
public sealed record LengthAllowance(double FromM, double PercentPerM, double MaxPercent)
{
    /// <summary>The allowance for a path of <paramref name="pathLengthM"/> metres, percent.</summary>
    public double PercentAt(double pathLengthM) => Math.Min(MaxPercent, PercentPerM * Math.Max(0.0, pathLengthM - FromM));
}

/// <summary>Which method's figures the findings rest on.</summary>
public enum SolutionMethod
{
    /// <summary>The percent-sum of run drops by the effective-impedance formula (hand-calculation practice).</summary>
    PercentSum,

    /// <summary>The exact backward/forward sweep load flow.</summary>
    LoadFlow,
}

/// <summary>
/// The limits and choices of method in force for a project. The limits' defaults are the rule set's (see
/// <c>CodeRules.Defaults</c>); <see cref="Default"/> is the NEC's, the default code.
/// </summary>
public sealed record Rules
{
    /// <summary>The code whose rule set judges the project.</summary>
    public ElectricalCode Code { get; init; } = ElectricalCode.Nec;

    /// <summary>Limit for any one feeder, in percent of its nominal voltage.</summary>
    public double FeederLimitPercent { get; init; } = 3;

    /// <summary>Limit for any one branch circuit, in percent.</summary>
    public double BranchLimitPercent { get; init; } = 3;

    /// <summary>Limit from the service (or a new origin) to any end point, in percent.</summary>
    public double TotalLimitPercent { get; init; } = 5;

    /// <summary>
    /// Limit from the service (or a new origin) to an end point whose load is lighting, in percent; null where lighting
    /// takes <see cref="TotalLimitPercent"/> like any other load.
    /// </summary>
    public double? LightingLimitPercent { get; init; }

    /// <summary>Who supplies the installation, where the code's limits depend on it (null where they do not).</summary>
    public SupplyKind? Supply { get; init; }

    /// <summary>How the total limit grows on a long path, where the code allows it (null where it does not).</summary>
    public LengthAllowance? LongPathAllowance { get; init; }

    /// <summary>True when end points may have different total limits (a lighting limit or a long-path allowance).</summary>
    public bool TotalLimitVaries => LightingLimitPercent is { } l && l != TotalLimitPercent || LongPathAllowance is not null;

    /// <summary>
    /// The total limit of an end point whose load is of <paramref name="category"/>, on a path of
    /// <paramref name="pathLengthM"/> metres of wiring from its origin, percent: the lighting limit for lighting, the
    /// total limit for any other load, plus the long-path allowance.
    /// </summary>
    public double TotalLimitFor(LoadCategory category, double pathLengthM) =>
        (category == LoadCategory.Lighting && LightingLimitPercent is { } lighting ? lighting : TotalLimitPercent)
        + (LongPathAllowance?.PercentAt(pathLengthM) ?? 0.0);

    /// <summary>The largest total limit any end point can have, percent (the long-path allowance at its most).</summary>
    public double LargestTotalLimitPercent =>
        Math.Max(TotalLimitPercent, LightingLimitPercent ?? TotalLimitPercent) + (LongPathAllowance?.MaxPercent ?? 0.0);

    /// <summary>Which current a branch circuit's drop is computed at.</summary>
    public BranchCurrentBasis BranchCurrent { get; init; } = BranchCurrentBasis.Connected;

    /// <summary>How conductor temperature is chosen.</summary>
    public TemperatureMode Temperature { get; init; } = TemperatureMode.Estimated;

    /// <summary>The stated conductor temperature in °C when <see cref="Temperature"/> is <see cref="TemperatureMode.Fixed"/>.</summary>
    public double? FixedTemperatureC { get; init; }

    /// <summary>How transformers enter the total.</summary>
    public TransformerDropMode TransformerDrop { get; init; } = TransformerDropMode.Count;

    /// <summary>Ambient temperature in °C for ampacity correction and temperature estimates.</summary>
    public double AmbientC { get; init; } = 30;

    /// <summary>Terminal temperature rating in °C that limits the ampacity column used (60, 75 or 90).</summary>
    public int TerminalC { get; init; } = 75;

    /// <summary>The largest voltage dip at a motor's terminals while it starts, in percent (default 15: NEMA MG 1 motors start at 85 % of rated voltage; memory).</summary>
    public double MotorStartLimitPercent { get; init; } = 15;

    /// <summary>Which method the findings rest on; both are always reported.</summary>
    public SolutionMethod Method { get; init; } = SolutionMethod.PercentSum;

    /// <summary>
    /// The voltage factor c of the maximum short-circuit currents (<c>fault_voltage_factor_max</c>): 1.05 for low-voltage
    /// systems of +6 % tolerance, 1.10 for +10 % (IEC 60909-0 Table 1; recalled, not read).
    /// </summary>
    public double FaultVoltageFactorMax { get; init; } = 1.05;

    /// <summary>The voltage factor c of the minimum short-circuit currents (<c>fault_voltage_factor_min</c>): 0.95 (IEC 60909-0 Table 1; recalled).</summary>
    public double FaultVoltageFactorMin { get; init; } = 0.95;

    /// <summary>
    /// The conductor catalogue the project brings (<c>rules: conductor_catalog:</c>), read by the loader; it takes the
    /// place of the analysis's own for the whole analysis. Null: none brought.
    /// </summary>
    public Conductors.ConductorCatalog? ConductorCatalog { get; init; }

    /// <summary>
    /// The grounding-conductor table the project brings (<c>rules: grounding_table:</c>), read by the loader; it replaces
    /// the rule set's own table under every code (see <c>CodeRules.GroundingTableInForce</c>). Null: none brought.
    /// </summary>
    public Codes.GroundingTable? GroundingTable { get; init; }

    /// <summary>The defaults, as a shared instance.</summary>
    public static Rules Default { get; } = new();
}
