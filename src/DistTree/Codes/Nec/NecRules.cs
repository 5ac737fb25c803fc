using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Codes.Nec;

/// <summary>
/// The National Electrical Code's rule set (NFPA 70, 2020 edition; the clause numbers are recalled, not read: verify
/// them against the edition in force):
/// <list type="bullet">
/// <item>Voltage drop: 3 % in a feeder or a branch circuit, 5 % in all to the farthest outlet (NEC 215.2(A)(1)
/// Informational Note No. 2 and 210.19(A)(1) Informational Note No. 4: advice, not requirements).</item>
/// <item>The design current of a line is 125 % of the continuous load plus the rest (NEC 210.19(A)(1)(a) for branch
/// circuits, 215.2(A)(1)(a) for feeders); a neutral, which no device opens, carries 100 % of its load
/// (210.19(A)(1) Exception No. 2, 215.2(A)(1) Exception No. 3). The conductors' allowable ampacity must carry it.</item>
/// <item>The device must be rated for the same current (NEC 210.20(A), 215.3).</item>
/// <item>The device may be rated at the ampacity or below, or, at 800 A or less, at the next standard rating above
/// it (NEC 240.4(B)). The standard ratings of fuses and inverse-time circuit breakers are NEC 240.6(A)'s.</item>
/// <item>Small conductors (14 to 10 AWG copper, 12 and 10 AWG aluminium) may be protected at the catalogue's
/// <c>ocpd_cu</c> and <c>ocpd_al</c> columns at most (NEC 240.4(D), read; see conductors.tsv), times the parallel
/// sets.</item>
/// <item>An equipment grounding conductor is at least the size of Table 250.122 for the device ahead of it (see
/// <see cref="NecGroundingTable"/>); where the lines are larger than the smallest size that would meet the rules above
/// for the run's load, it grows in proportion to their circular-mil area, to the next size at or above (250.122(B));
/// it need not be larger than the lines (250.122(A)); in parallel sets each set's is sized on the device's full rating,
/// so the proportion is per set (250.122(F)). A metric run takes the smallest metric size at or above the area so found.
/// No device, no minimum.</item>
/// <item>Motors (Article 430): a motor's full-load current is the table's for <c>hp</c> (NEC 430.6(A)(1); Tables
/// 430.248 and 430.250, see <see cref="MotorTables"/>), the stated amperes for <c>fla</c>. A motor branch circuit's
/// conductors carry 125 % of it (NEC 430.22), whatever its <c>continuous</c> flag says; a feeder's line carries 125 %
/// of the largest motor's full-load current on that line plus the rest (NEC 430.24). A motor branch circuit's device
/// (an inverse-time breaker assumed, whatever <c>device_type</c> says: Table 430.52's fuse columns are not modelled)
/// may be at most 250 % of the full-load current, or the next standard rating above
/// that (NEC 430.52(C)(1) and Table 430.52, Exception No. 1); 240.4(B) and (D) do not apply (NEC 240.4(G)), nor does
/// 210.20(A).</item>
/// <item>Conductors counted for the adjustment (NEC 310.15(E)): a neutral that carries only the unbalanced current
/// of the other conductors of its circuit is not counted (a three-phase four-wire feeder, a three-wire single-phase
/// one); it is counted on a two-wire circuit and on two lines and the neutral of a three-phase wye (310.15(E)(2)).
/// One counted because most of the load is nonlinear (310.15(E)(3)) is not modelled.</item>
/// <item>Air-conditioning equipment given by its nameplate (Article 440): the conductors' ampacity at least the
/// minimum circuit ampacity (NEC 440.35, marked per 440.4(B)); the device at most the maximum overcurrent device
/// (NEC 440.22(C)); 240.4(B) and (D) and 210.20(A) do not apply.</item>
/// </list>
/// </summary>
public sealed class NecRules : NorthAmericanRules
{
    /// <summary>The short name and edition, as the outputs name the code assumed.</summary>
    internal const string Described = "NEC 2020";

    // NEC 240.6(A) (memory; verify against the edition in force), amperes, ascending.
    private static readonly double[] Standard =
    [
        15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450, 500,
        600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
    ];

    /// <summary>The rules with the ampacities and small-conductor limits of <paramref name="catalog"/>.</summary>
    public NecRules(ConductorCatalog catalog)
        : base(catalog)
    {
    }

    /// <summary>The limits a project under the NEC starts from: 3 % per feeder and per branch circuit, 5 % in all.</summary>
    internal static Rules RuleDefaults { get; } = new() { Code = ElectricalCode.Nec, FeederLimitPercent = 3, BranchLimitPercent = 3, TotalLimitPercent = 5 };

    /// <inheritdoc/>
    public override ElectricalCode Code => ElectricalCode.Nec;

    /// <inheritdoc/>
    public override string Name => "NEC";

    /// <inheritdoc/>
    public override string Edition => "2020";

    /// <inheritdoc/>
    public override string Title => "NFPA 70, National Electrical Code, 2020 edition";

    /// <inheritdoc/>
    public override string ClauseSource => "clause numbers recalled from the 2020 edition, not read from it: verify them against the edition in force";

    /// <inheritdoc/>
    public override Rules Defaults => RuleDefaults;

    /// <inheritdoc/>
    public override IReadOnlyList<double> StandardRatingsA => Standard;

    /// <summary>NEC 240.4(B): the next standard rating above the ampacity, for a device of 800 A or less.</summary>
    protected override double? NextSizeUpMaxA => 800;

    /// <inheritdoc/>
    public override string AmpacitySource =>
        "NEC Table 310.16 (the conductor catalogue's 60, 75 and 90 °C columns; IEC 60364-5-52 method B1 for mm² sizes), corrected for ambient by 310.15(B)(1) and for more than three current-carrying conductors by 310.15(C)(1), limited by the terminal rating (110.14(C))";

    /// <summary>NEC 310.15(B)(1)'s ambient factor times 310.15(C)(1)'s adjustment (see <see cref="Ampacity"/>).</summary>
    public override double AmpacityFactor(double ratedC, double ambientC, int currentCarrying) =>
        Ampacity.AmbientFactor(ratedC, ambientC) * Ampacity.AdjustmentFactor(currentCarrying);

    /// <inheritdoc/>
    public override string Cite(CodeCheck check) => check switch
    {
        CodeCheck.FeederDrop => "NEC 215.2(A)(1) Informational Note No. 2",
        CodeCheck.BranchDrop => "NEC 210.19(A)(1) Informational Note No. 4",
        CodeCheck.TotalDrop => "NEC 210.19(A)(1) Informational Note No. 4",
        CodeCheck.FeederAmpacity => "NEC 215.2(A)(1)(a)",
        CodeCheck.BranchAmpacity => "NEC 210.19(A)(1)(a)",
        CodeCheck.NeutralAmpacity => "NEC 310.14(A)",
        CodeCheck.FeederDevice => "NEC 215.3",
        CodeCheck.BranchDevice => "NEC 210.20(A)",
        CodeCheck.DeviceAboveAmpacity => "NEC 240.4(B)",
        CodeCheck.SmallConductor => "NEC 240.4(D)",
        CodeCheck.MotorBranchAmpacity => "NEC 430.22",
        CodeCheck.MotorFeederAmpacity => "NEC 430.24",
        CodeCheck.MotorDevice => "NEC 430.52(C)(1)",
        CodeCheck.AirConditioningAmpacity => "NEC 440.35",
        CodeCheck.AirConditioningDevice => "NEC 440.22(C)",
        CodeCheck.TransformerLoading => "nameplate rating (common practice; no NEC clause)",
        CodeCheck.MotorStart => "starting voltage (common practice; no NEC clause)",
        CodeCheck.GroundingConductor => "NEC 250.122",
        CodeCheck.InterruptingRating => "NEC 110.9 and 110.10",
        CodeCheck.FaultClearing => "NEC 250.4(A)(5)",
        CodeCheck.NoLoadRise => "ANSI C84.1 Range A (recalled; no NEC clause)",
    };

    /// <inheritdoc/>
    public override GroundingTable OwnGroundingTable => NecGroundingTable.Table;

    /// <summary>
    /// The table's size (NEC Table 250.122, or the project's own table in its place), increased by 250.122(B) and limited
    /// by 250.122(A) as the class describes.
    /// </summary>
    public override ConductorSize? MinimumGroundSize(in GroundingCase ground)
    {
        // 250.122(B): in proportion to the lines' area over the smallest that would do, where they are larger.
        var line = ground.LineSize;
        var requiredCmil = ground.TableSize.AreaCmil;
        if (ground.SufficientSize is { } least && line.AreaCmil > least.AreaCmil * (1 + Tolerance))
        {
            requiredCmil *= line.AreaCmil / least.AreaCmil;
        }

        // 250.122(A): never larger than the lines. The lines' own size is in their series, so a size is always found.
        requiredCmil = Math.Min(requiredCmil, line.AreaCmil);
        foreach (var size in ConductorSize.All)
        {
            if (size.Series == line.Series && size.AreaCmil >= requiredCmil * (1 - Tolerance))
            {
                return size;
            }
        }

        return line;
    }

    /// <inheritdoc/>
    protected override Finding GroundingFinding(NetworkRun run, ConductorSize ground, ConductorSize least)
    {
        var conductors = run.Conductors;
        var device = conductors.OcpdA ?? 0;
        var table = GroundingTableInForce?.SizeFor(device, conductors.Material)?.Text ?? least.Text;
        var whose = ProjectGroundingTable is null ? "the table's" : "the project's table's";
        var why = table == least.Text
            ? FormattableString.Invariant($"{whose} size for a {device:0} A device")
            : FormattableString.Invariant($"{whose} {table} for a {device:0} A device, increased in proportion to lines of {conductors.Size.Text}, larger than the load needs");
        return Finding.Written(
            FindingKind.GroundingConductor,
            Cite(CodeCheck.GroundingConductor),
            run.Id,
            ground.AreaMm2,
            least.AreaMm2,
            $"{Words.Noun(run.Kind)} {run.Id}: the stated {ground.Text} {GroundingConductorTerm} is smaller than the {least.Text} it needs ({why})",
            conductors.Location);
    }
}
