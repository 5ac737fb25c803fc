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

    /// <summary>IEC 60364, low-voltage electrical installations (parts 4-43, 5-52 and 5-54).</summary>
    Iec,
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

    /// <summary>The defaults, as a shared instance.</summary>
    public static Rules Default { get; } = new();
}
