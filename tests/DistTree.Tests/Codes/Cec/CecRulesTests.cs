using System.Numerics;
using DistTree.Codes;
using DistTree.Codes.Cec;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Solving;
using DistTree.Tests.Solving;
using DistTree.Vocabulary;

namespace DistTree.Tests.Codes.Cec;

// CSA C22.1, Canadian Electrical Code, Part I, 2021 (25th edition). Every rule number and figure below is recalled,
// not read from the text: each row says so.
public sealed class CecRulesTests
{
    private static readonly CecRules Rules = new(ConductorCatalog.Standard);

    // Rule 8-102(1) (recalled): 3 % in a feeder or a branch circuit, 5 % from the supply side of the consumer's service
    // to the point of utilization.
    [Fact]
    public void DefaultsOf_Cec_AreRule8102sLimits()
    {
        var defaults = CodeRules.DefaultsOf(ElectricalCode.Cec);
        Assert.Equal((ElectricalCode.Cec, 3.0, 3.0, 5.0), (defaults.Code, defaults.FeederLimitPercent, defaults.BranchLimitPercent, defaults.TotalLimitPercent));
        Assert.Same(defaults, CodeRules.For(ElectricalCode.Cec, ConductorCatalog.Standard).Defaults);
        Assert.Equal(BranchCurrentBasis.Connected, defaults.BranchCurrent);
    }

    [Fact]
    public void For_Cec_IsTheCecRuleSetNamedAsItsWordAndEdition()
    {
        Assert.IsType<CecRules>(CodeRules.For(ElectricalCode.Cec, ConductorCatalog.Standard));
        Assert.Equal("CEC 2021", CodeRules.Describe(ElectricalCode.Cec));
        Assert.Equal("cec", Words.Code.Of(ElectricalCode.Cec));
        Assert.Contains("recalled", Rules.ClauseSource, StringComparison.Ordinal);
        Assert.Contains("25th edition", Rules.Title, StringComparison.Ordinal);
    }

    // Table 5C (recalled): 1–3 conductors 100 %, 4–6 80 %, 7–24 70 %, 25–42 60 %, 43 and more 50 %. Where the NEC's
    // 310.15(C)(1) (read) differs: 10–20 at 50 % (CEC 70 %), 21–24 at 45 % (CEC 70 %), 31–40 at 40 % (CEC 60 %).
    [Theory]
    [InlineData(1, 1.00, 1.00)]
    [InlineData(3, 1.00, 1.00)]
    [InlineData(4, 0.80, 0.80)]
    [InlineData(6, 0.80, 0.80)]
    [InlineData(7, 0.70, 0.70)]
    [InlineData(9, 0.70, 0.70)]
    [InlineData(10, 0.70, 0.50)]
    [InlineData(24, 0.70, 0.45)]
    [InlineData(25, 0.60, 0.45)]
    [InlineData(42, 0.60, 0.35)]
    [InlineData(43, 0.50, 0.35)]
    [InlineData(200, 0.50, 0.35)]
    public void AdjustmentFactor_Table5C_AgainstTheNecs(int conductors, double cec, double nec)
    {
        Assert.Equal(cec, CecRules.AdjustmentFactor(conductors), 9);
        Assert.Equal(nec, Ampacity.AdjustmentFactor(conductors), 9);
    }

    [Fact]
    public void AdjustmentFactor_NoConductor_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => CecRules.AdjustmentFactor(0));

    // Table 5A (recalled): the factors are √((Tc − Ta)/(Tc − 30)) with Ta at the top of its 5 °C band, printed to two
    // decimals: 75 °C at 36–40 °C: √(35/45) = 0.88; 90 °C at 36–40 °C: √(50/60) = 0.91. Times Table 5C's 70 % for 10
    // conductors: 0.616 and 0.637.
    [Fact]
    public void AmpacityFactor_Table5ATimesTable5C()
    {
        Assert.Equal(0.88 * 0.70, Rules.AmpacityFactor(75, 40, 10), 9);
        Assert.Equal(0.91 * 0.70, Rules.AmpacityFactor(90, 40, 10), 9);
        Assert.Equal(1.0, Rules.AmpacityFactor(75, 30, 3), 9);
        Assert.Equal(0.0, Rules.AmpacityFactor(60, 60, 3), 9);
    }

    // Rule 14-104(1) (recalled), read strictly here: the device at most the conductors' ampacity. The NEC's 240.4(B)
    // would let 25 A protect 23 A and 70 A protect 65 A (the next standard rating above); the CEC rule set does not.
    [Theory]
    [InlineData(20, 20, true)]
    [InlineData(15, 20, true)]
    [InlineData(25, 23, false)]
    [InlineData(70, 65, false)]
    [InlineData(800, 760, false)]
    [InlineData(1000, 1000, true)]
    public void DevicePermits_Rule14104_NoNextSizeUp(double ocpdA, double ampacityA, bool expected)
    {
        Assert.Equal(expected, Rules.DevicePermits(ocpdA, ampacityA, DeviceType.Breaker));
        Assert.True(CodeRules.For(ElectricalCode.Nec, ConductorCatalog.Standard).DevicePermits(ocpdA, ampacityA, DeviceType.Breaker));
    }

    // Rule 14-104(2) (recalled; the catalogue's ocpd columns): 14 AWG copper 15 A, 12 AWG 20 A, 10 AWG 30 A; 12 AWG
    // aluminium 15 A, 10 AWG 25 A; parallel sets share the device.
    [Theory]
    [InlineData("14 AWG", Material.Copper, 1, 15, true)]
    [InlineData("14 AWG", Material.Copper, 1, 20, false)]
    [InlineData("12 AWG", Material.Copper, 1, 20, true)]
    [InlineData("12 AWG", Material.Copper, 1, 25, false)]
    [InlineData("10 AWG", Material.Copper, 1, 30, true)]
    [InlineData("10 AWG", Material.Copper, 1, 35, false)]
    [InlineData("12 AWG", Material.Aluminum, 1, 20, false)]
    [InlineData("10 AWG", Material.Aluminum, 1, 25, true)]
    [InlineData("12 AWG", Material.Copper, 2, 40, true)]
    [InlineData("8 AWG", Material.Copper, 1, 100, true)]
    public void SmallConductorPermits_Rule14104Part2(string size, Material material, int sets, double ocpdA, bool expected) =>
        Assert.Equal(expected, Rules.SmallConductorPermits(ocpdA, ConductorSize.Parse(size), material, sets));

    // Rule 8-104 (recalled): a continuous load at most 80 % of the device and of the ampacity, so 125 % of it plus the
    // rest: 10 A continuous and 10 A not is 22.5 A; a neutral (Rule 4-022, recalled) at 100 %: 20 A. Rules 28-106(1)
    // and 28-108(1) (recalled): 25 % more of the largest motor, 34 A: 55.6 + 8.5 = 64.1 A.
    [Fact]
    public void DesignCurrentA_Rule8104AndRule28108()
    {
        Assert.Equal(22.5, Rules.DesignCurrentA(new Complex(20, 0), new Complex(10, 0), 0, protectedByDevice: true), 9);
        Assert.Equal(20, Rules.DesignCurrentA(new Complex(20, 0), new Complex(10, 0), 0, protectedByDevice: false), 9);
        Assert.Equal(64.1, Rules.DesignCurrentA(new Complex(55.6, 0), Complex.Zero, 34, protectedByDevice: true), 9);
    }

    // Rule 28-106(1) (recalled): a motor's branch conductors at 125 % of its full-load current, 34 A: 42.5 A. Rule
    // 28-200 and Table 29 (recalled): an inverse-time breaker at most 250 %, 85 A, or the next standard rating above,
    // 90 A. Air conditioning: the nameplate's minimum circuit ampacity and maximum device.
    [Fact]
    public void EquipmentRules_MotorAndAirConditioning()
    {
        Assert.Equal(42.5, Rules.EquipmentDesignCurrentA(new CircuitDuty(DutyKind.Motor, 34, 0, 0))!.Value, 9);
        Assert.Equal(90, Rules.EquipmentMaxDeviceA(new CircuitDuty(DutyKind.Motor, 34, 0, 0))!.Value, 9);
        Assert.Equal(28, Rules.EquipmentDesignCurrentA(new CircuitDuty(DutyKind.AirConditioning, 22, 28, 45))!.Value, 9);
        Assert.Equal(45, Rules.EquipmentMaxDeviceA(new CircuitDuty(DutyKind.AirConditioning, 22, 28, 45))!.Value, 9);
        Assert.Null(Rules.EquipmentMaxDeviceA(default));
    }

    // Table 16 (recalled as the bonding conductor's table) is not held: without a table the project brings there is no
    // minimum, so nothing is checked; the code calls the conductor a bonding conductor.
    [Fact]
    public void MinimumGroundSize_Table16NotHeld_IsNoneWithoutTheProjectsTable()
    {
        var run = new Run { LengthM = 10, Size = ConductorSize.Parse("3 AWG"), Material = Material.Copper, InsulationC = 75, Raceway = Raceway.Pvc, OcpdA = 100 };
        Assert.Null(Rules.OwnGroundingTable);
        Assert.Null(Rules.MinimumGroundSize(run, run.Size, 1, 80, new DistTree.Model.Rules { Code = ElectricalCode.Cec }));
        Assert.Equal("bonding conductor", Rules.GroundingConductorTerm);
        Assert.Equal("equipment grounding conductor", CodeRules.For(ElectricalCode.Nec, ConductorCatalog.Standard).GroundingConductorTerm);
    }

    // Every check cites a CEC rule (recalled), or says what stands in where the code has none.
    [Fact]
    public void Cite_EveryCheck_NamesACecRule()
    {
        foreach (var check in Enum.GetValues<CodeCheck>())
        {
            var clause = Rules.Cite(check);
            Assert.True(clause.StartsWith("CEC ", StringComparison.Ordinal) || clause.Contains("(CEC Section 28", StringComparison.Ordinal)
                || clause.Contains("no CEC rule", StringComparison.Ordinal), clause);
        }

        Assert.Equal("CEC Rule 8-102(1)(c)", Rules.Cite(CodeCheck.BranchDrop));
        Assert.Equal("CEC Rule 8-102(1)(b)", Rules.Cite(CodeCheck.TotalDrop));
        Assert.Equal("CEC Rule 14-104(1)", Rules.Cite(CodeCheck.DeviceAboveAmpacity));
    }

    // The ampacity source says plainly that the CEC's tables are not held and what stands in.
    [Fact]
    public void AmpacitySource_SaysTheCsaTablesAreNotHeld()
    {
        Assert.Contains("Tables 2 and 4 are not held", Rules.AmpacitySource, StringComparison.Ordinal);
        Assert.Contains("NEC Table 310.16", Rules.AmpacitySource, StringComparison.Ordinal);
        Assert.Contains("NEC Tables 430.248 and 430.250", Rules.AmpacitySource, StringComparison.Ordinal);
    }

    // The sizer's Meets and the solver's AddFindings agree under the strict Rule 14-104(1): 6 AWG copper at 75 °C is
    // 65 A (NEC Table 310.16, read, standing in); a 70 A device is a finding citing the CEC rule, with no "next
    // standard rating" in its sentence.
    [Fact]
    public void AddFindings_DeviceAboveAmpacity_CitesRule14104()
    {
        Assert.False(Rules.Meets(60, 70, ConductorSize.Parse("6 AWG"), Material.Copper, 1, 65, DeviceType.Breaker, default));
        var found = Assert.Single(Rules.AddFindings(null, RunOf("6 AWG", 70), new CurrentFigures(60, 'A', 65, null, null))!);
        Assert.Equal((FindingKind.OcpdAboveAmpacity, "CEC Rule 14-104(1)"), (found.Kind, found.Reference));
        Assert.Equal("branch circuit P/1: the 70 A overcurrent device is above the 1×6 AWG ampacity of 65 A", found.Message);
        Assert.True(Rules.Meets(60, 60, ConductorSize.Parse("6 AWG"), Material.Copper, 1, 65, DeviceType.Breaker, default));
        Assert.Null(Rules.AddFindings(null, RunOf("6 AWG", 60), new CurrentFigures(60, 'A', 65, null, null)));
    }

    // The run of a one-circuit project, copper, of the given size and device.
    private static NetworkRun RunOf(string size, double ocpdA)
    {
        var yaml = SolverHarness.OneCircuit("120/240", "imperial",
            FormattableString.Invariant($"{{ id: \"1\", poles: 1, load: {{ amps: 10 }}, run: {{ length: 10, size: {size}, ocpd: {ocpdA} }} }}"), "code: cec");
        return NetworkBuilder.Build(ProjectLoader.Parse(yaml, "test.yaml")).NodeArray[^1].Incoming!;
    }
}
