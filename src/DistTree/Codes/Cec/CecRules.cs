using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Codes.Cec;

/// <summary>
/// The Canadian Electrical Code's rule set (CSA C22.1, Canadian Electrical Code, Part I, 2021, 25th edition assumed;
/// every rule number and figure below is recalled, not read from the text: verify them against the edition in force):
/// <list type="bullet">
/// <item>Voltage drop (Rule 8-102(1)): 3 % in a feeder or a branch circuit, 5 % from the supply side of the consumer's
/// service to the point of utilization. The rule bases the drop on the calculated demand load, or, where that is not
/// known, on 80 % of the rating of the overcurrent device protecting the branch circuit: a designer who does not know
/// the demand load states <c>branch_current: ocpd_80</c> (or <c>lesser</c>); the default, <c>connected</c>, takes the
/// load the project gives as the demand load.</item>
/// <item>Continuous loads (Rule 8-104): at most 80 % of the device's rating and of the conductors' ampacity, so the
/// design current is 125 % of the continuous load plus the rest, as the NEC counts it; 100 % where the device and its
/// assembly are marked for continuous operation at 100 % (<c>device_rated_continuous: true</c>). A neutral carries
/// its load at 100 % (Rule 4-022).</item>
/// <item>Ampacity: CSA Tables 2 (copper) and 4 (aluminium) are not held; the catalogue's columns (NEC Table 310.16's
/// figures) stand in (bring the CEC's table as the project's conductor catalogue). Corrected for ambient by Table 5A
/// (the factors √((Tc − Ta)/(Tc − 30)) with Ta at the top of its 5 °C band, the same as <see cref="Ampacity.AmbientFactor"/>)
/// and for more than three current-carrying conductors by Table 5C (<see cref="AdjustmentFactor"/>). The conductors are
/// counted as under the NEC: a neutral carrying only the unbalanced current is not counted.</item>
/// <item>Conductor protection (Rule 14-104(1)): the device's rating at most the conductors' ampacity. The rule is
/// recalled to let Table 13 take the next standard rating above an ampacity that matches none; that reading is not
/// held with certainty, so the stricter one applies here: no next size up (docs/limits.md).</item>
/// <item>Small conductors (Rule 14-104(2)): 14 AWG copper at 15 A, 12 AWG at 20 A, 10 AWG at 30 A, 12 AWG aluminium at
/// 15 A, 10 AWG at 25 A: the catalogue's <c>ocpd_cu</c>/<c>ocpd_al</c> columns, the same figures as the NEC's.</item>
/// <item>Motors (Section 28): full-load currents from the NEC's Tables 430.248 and 430.250 (<see cref="MotorTables"/>;
/// CSA Tables 44 and 45 are not held) or the stated <c>fla</c>; a motor branch circuit's conductors at 125 % of the
/// full-load current (Rule 28-106(1)); a feeder's at 125 % of the largest motor's plus the rest (Rule 28-108(1)); an
/// inverse-time breaker at most 250 % of the full-load current, or the next standard rating above that (Rule 28-200
/// and Table 29).</item>
/// <item>Air-conditioning equipment given by its nameplate: the conductors at least the marked minimum circuit
/// ampacity, the device at most the marked maximum (Section 28, Part VI, hermetic refrigerant motor-compressors; the
/// nameplate marking decides).</item>
/// <item>Bonding conductors (Rule 10-616 and Table 16): Table 16 is not held (<see cref="CodeRules.OwnGroundingTable"/>
/// is null), so a bonding conductor is checked only against a table the project brings (<c>rules: grounding_table:</c>),
/// read as it stands: the smallest size of the lines' series at or above the table's.</item>
/// </list>
/// </summary>
public sealed class CecRules : NorthAmericanRules
{
    /// <summary>The short name and edition, as the outputs name the code assumed.</summary>
    internal const string Described = "CEC 2021";

    // The standard ratings of fuses and inverse-time circuit breakers (recalled, not read: the ratings in common
    // manufacture, the same series as the NEC's 240.6(A)), amperes, ascending.
    private static readonly double[] Standard =
    [
        15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450, 500,
        600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
    ];

    /// <summary>The rules with the ampacities and small-conductor limits of <paramref name="catalog"/>.</summary>
    public CecRules(ConductorCatalog catalog)
        : base(catalog)
    {
    }

    /// <summary>
    /// The limits a project under the CEC starts from: 3 % per feeder and per branch circuit, 5 % from the service to the
    /// point of utilization (Rule 8-102(1), recalled).
    /// </summary>
    internal static Rules RuleDefaults { get; } = new() { Code = ElectricalCode.Cec, FeederLimitPercent = 3, BranchLimitPercent = 3, TotalLimitPercent = 5 };

    /// <inheritdoc/>
    public override ElectricalCode Code => ElectricalCode.Cec;

    /// <inheritdoc/>
    public override string Name => "CEC";

    /// <inheritdoc/>
    public override string Edition => "2021";

    /// <inheritdoc/>
    public override string Title => "CSA C22.1, Canadian Electrical Code, Part I, 2021 (25th edition)";

    /// <inheritdoc/>
    public override string ClauseSource =>
        "rule numbers recalled from the 2021 edition, not read from it: verify them against the edition in force; not held: Tables 2 and 4 (ampacities), 16 (bonding conductors: checked only against a table the project brings) and 44 and 45 (motor full-load currents)";

    /// <inheritdoc/>
    public override string GroundingConductorTerm => "bonding conductor";

    /// <inheritdoc/>
    public override Rules Defaults => RuleDefaults;

    /// <inheritdoc/>
    public override IReadOnlyList<double> StandardRatingsA => Standard;

    /// <summary>Rule 14-104(1), read strictly: the device at most the ampacity, never the next standard rating above it.</summary>
    protected override double? NextSizeUpMaxA => null;

    /// <inheritdoc/>
    public override string AmpacitySource =>
        "CSA C22.1 Tables 2 and 4 are not held: the conductor catalogue's NEC Table 310.16 figures stand in (bring the CEC table as the project's conductor catalogue); corrected for ambient by Table 5A and for more than three current-carrying conductors by Table 5C; motor full-load currents from NEC Tables 430.248 and 430.250 (CSA Tables 44 and 45 not held) or the stated fla";

    /// <summary>Table 5A's ambient factor (the same relation as the NEC's, <see cref="Ampacity.AmbientFactor"/>) times <see cref="AdjustmentFactor"/>.</summary>
    public override double AmpacityFactor(double ratedC, double ambientC, int currentCarrying) =>
        Ampacity.AmbientFactor(ratedC, ambientC) * AdjustmentFactor(currentCarrying);

    /// <summary>
    /// CSA C22.1 Table 5C (recalled, not read): the ampacity of more than three current-carrying conductors in a raceway
    /// or cable: 1–3: 100 %, 4–6: 80 %, 7–24: 70 %, 25–42: 60 %, 43 and more: 50 %.
    /// </summary>
    /// <param name="currentCarryingConductors">How many current-carrying conductors share the raceway.</param>
    public static double AdjustmentFactor(int currentCarryingConductors) => currentCarryingConductors switch
    {
        < 1 => throw new ArgumentOutOfRangeException(nameof(currentCarryingConductors), "at least one conductor"),
        <= 3 => 1.0,
        <= 6 => 0.80,
        <= 24 => 0.70,
        <= 42 => 0.60,
        _ => 0.50,
    };

    /// <summary>Every rule number recalled from the 2021 edition, not read.</summary>
    public override string Cite(CodeCheck check) => check switch
    {
        CodeCheck.FeederDrop => "CEC Rule 8-102(1)(c)",
        CodeCheck.BranchDrop => "CEC Rule 8-102(1)(c)",
        CodeCheck.TotalDrop => "CEC Rule 8-102(1)(b)",
        CodeCheck.FeederAmpacity => "CEC Rule 8-104",
        CodeCheck.BranchAmpacity => "CEC Rule 8-104",
        CodeCheck.NeutralAmpacity => "CEC Rule 4-022",
        CodeCheck.FeederDevice => "CEC Rule 8-104",
        CodeCheck.BranchDevice => "CEC Rule 8-104",
        CodeCheck.DeviceAboveAmpacity => "CEC Rule 14-104(1)",
        CodeCheck.SmallConductor => "CEC Rule 14-104(2)",
        CodeCheck.MotorBranchAmpacity => "CEC Rule 28-106(1)",
        CodeCheck.MotorFeederAmpacity => "CEC Rule 28-108(1)",
        CodeCheck.MotorDevice => "CEC Rule 28-200 and Table 29",
        CodeCheck.AirConditioningAmpacity => "nameplate minimum circuit ampacity (CEC Section 28, hermetic refrigerant motor-compressors)",
        CodeCheck.AirConditioningDevice => "nameplate maximum overcurrent device (CEC Section 28, hermetic refrigerant motor-compressors)",
        CodeCheck.TransformerLoading => "nameplate rating (common practice; no CEC rule)",
        CodeCheck.MotorStart => "starting voltage (common practice; no CEC rule)",
        CodeCheck.GroundingConductor => "CEC Rule 10-616 and Table 16",
        CodeCheck.InterruptingRating => "CEC Rule 14-012(a)",
        CodeCheck.FaultClearing => "CEC Rule 14-010(a)",
        CodeCheck.NoLoadRise => "CSA CAN3-C235 voltage ranges (recalled; no CEC rule)",
    };

    /// <inheritdoc/>
    protected override Finding GroundingFinding(NetworkRun run, ConductorSize ground, ConductorSize least) => Finding.Written(
        FindingKind.GroundingConductor,
        Cite(CodeCheck.GroundingConductor),
        run.Id,
        ground.AreaMm2,
        least.AreaMm2,
        $"{Words.Noun(run.Kind)} {run.Id}: the stated {ground.Text} {GroundingConductorTerm} is smaller than the {least.Text} it needs",
        run.Conductors.Location);
}
