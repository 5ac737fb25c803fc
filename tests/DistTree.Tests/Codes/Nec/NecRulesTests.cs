using System.Numerics;
using DistTree.Codes;
using DistTree.Codes.Nec;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Solving;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Codes.Nec;

public sealed class NecRulesTests
{
    private static readonly NecRules Rules = new(ConductorCatalog.Standard);

    // NEC 240.6(A) (memory; verify against the edition in force): the standard ratings of fuses and inverse-time
    // circuit breakers start 15, 20, 25 … in steps of 5 to 50, then 10 to 110, and end at 6000 A. Checked by their
    // shape, not transcribed: ascending, and the ratings the next-size-up rows below rely on are there.
    [Fact]
    public void StandardRatingsA_AscendingFrom15To6000()
    {
        var ratings = Rules.StandardRatingsA;
        Assert.Equal(15, ratings[0]);
        Assert.Equal(6000, ratings[^1]);
        Assert.True(ratings.Zip(ratings.Skip(1)).All(p => p.First < p.Second));
        Assert.Equal([15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110], ratings.TakeWhile(r => r <= 110));
        Assert.Contains(800.0, ratings);
        Assert.DoesNotContain(900.0, ratings);
    }

    // NEC 240.4(B) (memory): a device of 800 A or less may take the next standard rating (240.6(A)) above the
    // conductors' ampacity when the ampacity is not itself a standard rating; above 800 A it may not exceed it
    // (240.4(C)). Rows are worked by hand from those two clauses.
    [Theory]
    [InlineData(20, 20, true)] // at the ampacity
    [InlineData(15, 20, true)] // below it
    [InlineData(25, 23, true)] // 25 A is the next standard rating above 23 A
    [InlineData(30, 23, false)] // the one after is not
    [InlineData(110, 100, false)] // 100 A is itself a standard rating: no step up
    [InlineData(125, 115, true)] // 110 is below 115, so the next is 125
    [InlineData(150, 115, false)]
    [InlineData(400, 380, true)]
    [InlineData(800, 760, true)] // 800 A is the largest device the rule covers
    [InlineData(1000, 820, false)] // above 800 A: not above the ampacity
    [InlineData(1000, 1000, true)]
    [InlineData(6000, 6500, true)]
    public void DevicePermits_NextSizeUpRule(double ocpdA, double ampacityA, bool expected) =>
        Assert.Equal(expected, Rules.DevicePermits(ocpdA, ampacityA, DeviceType.Breaker));

    [Fact]
    public void DevicePermits_WithinTolerance_IsAtTheAmpacity() => Assert.True(Rules.DevicePermits(30 + 1e-10, 30, DeviceType.Breaker));

    // NEC 240.4(D) (read; the catalogue's ocpd columns): 14 AWG copper 15 A, 12 AWG copper 20 A, 10 AWG copper 30 A,
    // 12 AWG aluminium 15 A, 10 AWG aluminium 25 A; parallel sets share the device, so the limit scales with them;
    // 8 AWG and larger have no such limit.
    [Theory]
    [InlineData("14 AWG", Material.Copper, 1, 15, true)]
    [InlineData("14 AWG", Material.Copper, 1, 20, false)]
    [InlineData("12 AWG", Material.Copper, 1, 20, true)]
    [InlineData("12 AWG", Material.Copper, 1, 25, false)]
    [InlineData("10 AWG", Material.Copper, 1, 30, true)]
    [InlineData("10 AWG", Material.Copper, 1, 35, false)]
    [InlineData("12 AWG", Material.Aluminum, 1, 15, true)]
    [InlineData("12 AWG", Material.Aluminum, 1, 20, false)]
    [InlineData("10 AWG", Material.Aluminum, 1, 25, true)]
    [InlineData("10 AWG", Material.Aluminum, 1, 30, false)]
    [InlineData("12 AWG", Material.Copper, 2, 40, true)]
    [InlineData("12 AWG", Material.Copper, 2, 45, false)]
    [InlineData("8 AWG", Material.Copper, 1, 100, true)]
    public void SmallConductorPermits_SmallConductorRule(string size, Material material, int sets, double ocpdA, bool expected) =>
        Assert.Equal(expected, Rules.SmallConductorPermits(ocpdA, ConductorSize.Parse(size), material, sets));

    // 125 % of the continuous part plus the rest for a line (NEC 210.19(A)(1)(a), 215.2(A)(1)(a); memory): 10 A
    // continuous and 10 A not is 1.25 × 10 + 10 = 22.5 A. A neutral, which no device opens, at 100 %
    // (210.19(A)(1) Exception No. 2, 215.2(A)(1) Exception No. 3; memory): 20 A.
    [Fact]
    public void DesignCurrentA_ContinuousPart_IsTakenAt125PercentOnALineOnly()
    {
        var carried = new Complex(20, 0);
        var continuous = new Complex(10, 0);
        Assert.Equal(22.5, Rules.DesignCurrentA(carried, continuous, 0, protectedByDevice: true), 9);
        Assert.Equal(20, Rules.DesignCurrentA(carried, Complex.Zero, 0, protectedByDevice: true), 9);
        Assert.Equal(20, Rules.DesignCurrentA(carried, continuous, 0, protectedByDevice: false), 9);
    }

    // 125 % of the largest motor's full-load current plus the rest (NEC 430.24; memory): a line carrying 55.6 A, of
    // which the largest motor is 34 A, is 55.6 + 0.25 × 34 = 64.1 A; with 10 A of it continuous besides, 66.6 A. A
    // neutral takes no motor share: 55.6 A.
    [Fact]
    public void DesignCurrentA_LargestMotor_AddsItsQuarterOnALineOnly()
    {
        var carried = new Complex(55.6, 0);
        Assert.Equal(64.1, Rules.DesignCurrentA(carried, Complex.Zero, 34, protectedByDevice: true), 9);
        Assert.Equal(66.6, Rules.DesignCurrentA(carried, new Complex(10, 0), 34, protectedByDevice: true), 9);
        Assert.Equal(55.6, Rules.DesignCurrentA(carried, Complex.Zero, 34, protectedByDevice: false), 9);
    }

    // A motor branch circuit's conductors: 125 % of the full-load current (NEC 430.22; memory): 34 A gives 42.5 A. Air
    // conditioning: the nameplate minimum circuit ampacity (NEC 440.35; memory). A general circuit: none.
    [Fact]
    public void EquipmentDesignCurrentA_ByDuty()
    {
        Assert.Equal(42.5, Rules.EquipmentDesignCurrentA(new CircuitDuty(DutyKind.Motor, 34, 0, 0))!.Value, 9);
        Assert.Equal(28, Rules.EquipmentDesignCurrentA(new CircuitDuty(DutyKind.AirConditioning, 22, 28, 45))!.Value, 9);
        Assert.Null(Rules.EquipmentDesignCurrentA(default));
    }

    // A motor branch circuit's inverse-time breaker: at most 250 % of the full-load current (NEC 430.52(C)(1), Table
    // 430.52; memory), or the next standard rating above that (Exception No. 1): 34 A gives 85 A, so 90 A; 14 A gives
    // 35 A, itself a standard rating; 7.6 A gives 19 A, so 20 A. Air conditioning: the nameplate's maximum (NEC
    // 440.22(C); memory).
    [Theory]
    [InlineData(34, 90)]
    [InlineData(14, 35)]
    [InlineData(7.6, 20)]
    [InlineData(361, 1000)] // 902.5 A: the next standard rating is 1000 A
    public void EquipmentMaxDeviceA_Motor_250PercentOrTheNextStandardRating(double fullLoadA, double expectedA)
    {
        Assert.Equal(expectedA, Rules.EquipmentMaxDeviceA(new CircuitDuty(DutyKind.Motor, fullLoadA, 0, 0))!.Value, 9);
        Assert.Equal(45, Rules.EquipmentMaxDeviceA(new CircuitDuty(DutyKind.AirConditioning, 0, 28, 45))!.Value, 9);
        Assert.Null(Rules.EquipmentMaxDeviceA(default));
    }

    // The device is rated for the design current (NEC 210.20(A), 215.3; memory): 110 A on a 100 A breaker is a
    // finding citing the branch-circuit clause; 100 A on it is not.
    [Fact]
    public void AddFindings_LoadAboveDevice_CitesTheDeviceRule()
    {
        var found = Rules.AddFindings(null, RunOf("2/0 AWG", 1, 100), Figures(110, 175))!;
        var device = Assert.Single(found, f => f.Kind == FindingKind.DeviceBelowLoad);
        Assert.Equal("NEC 210.20(A)", device.Reference);
        Assert.Equal(100, device.Limit);
        Assert.Null(Rules.AddFindings(null, RunOf("2/0 AWG", 1, 100), Figures(100, 175)));
    }

    // A neutral whose current is above its ampacity is a finding (NEC 310.14(A); memory); within it, none.
    [Fact]
    public void AddFindings_NeutralAboveItsAmpacity_IsAFinding()
    {
        var found = Assert.Single(Rules.AddFindings(null, RunOf("8 AWG", 1, null), new CurrentFigures(40, 'A', 50, 64, 50))!);
        Assert.Equal(FindingKind.NeutralAmpacity, found.Kind);
        Assert.Equal((64.0, 50.0), (found.Value, found.Limit));
        Assert.Null(Rules.AddFindings(null, RunOf("8 AWG", 1, null), new CurrentFigures(40, 'A', 50, 50, 50)));
    }

    // The rule set owns the ampacity's corrections: NEC Table 310.15(B)(1) (read) gives 0.88 for a 75 °C conductor at
    // 36–40 °C, Table 310.15(C)(1) (read) 80 % for 4–6 conductors: 0.704 together; at 30 °C and 3 conductors, 1.
    [Fact]
    public void AmpacityFactor_AmbientAndGrouping_AreTheNecTables()
    {
        Assert.Equal(0.704, Rules.AmpacityFactor(75, 40, 6), 9);
        Assert.Equal(1.0, Rules.AmpacityFactor(75, 30, 3), 9);
        Assert.Equal(25 * 0.704, Rules.ThermalAmpacityA(ConductorSize.Parse("12 AWG"), Material.Copper, 75, 40, 6)!.Value, 9);
    }

    // 90 °C conductor on 75 °C terminals at 40 °C ambient: 1/0 copper 170 A × 0.91 = 154.7 A, limited to the 75 °C
    // column's 150 A; with 6 conductors, 154.7 × 0.8 = 123.8 A (NEC 110.14(C), 310.15(B)(1) and (C)(1), read; the
    // arithmetic is common practice).
    [Fact]
    public void AllowableAmpacityA_TerminalLimitsTheColumn()
    {
        var s = ConductorSize.Parse("1/0 AWG");
        Assert.Equal(170 * 0.91, Rules.ThermalAmpacityA(s, Material.Copper, 90, 40)!.Value, 1);
        Assert.Equal(150, Rules.AllowableAmpacityA(s, Material.Copper, 90, 75, 40));
        Assert.Equal(170 * 0.91 * 0.8, Rules.AllowableAmpacityA(s, Material.Copper, 90, 75, 40, 6)!.Value, 1);
    }

    // Every check cites a clause of its own code, and the code's name leads each clause that is one.
    [Fact]
    public void Cite_EveryCheck_NamesAClause()
    {
        foreach (var check in Enum.GetValues<CodeCheck>())
        {
            var clause = Rules.Cite(check);
            Assert.False(string.IsNullOrWhiteSpace(clause));
            Assert.True(clause.StartsWith("NEC ", StringComparison.Ordinal) || clause.Contains("common practice", StringComparison.Ordinal)
                || clause.Contains("no NEC clause", StringComparison.Ordinal), clause);
        }
    }

    [Theory]
    [InlineData(25, 25, true)]
    [InlineData(25.01, 25, false)]
    [InlineData(double.NaN, 25, true)] // an overflowing load is not held against the conductors (as the solver always did)
    public void Carries_DesignCurrentAgainstAmpacity(double designA, double ampacityA, bool expected) =>
        Assert.Equal(expected, Rules.Carries(designA, ampacityA));

    // Meets is what the sizer asks and AddFindings what the solver reports: they agree on every row. 12 AWG copper at
    // 75 °C terminals: 25 A (NEC Table 310.16, read).
    [Theory]
    [InlineData("12 AWG", 1, 20.0, 18, 25, true, new string[0])]
    [InlineData("12 AWG", 1, null, 24, 25, true, new string[0])]
    [InlineData("12 AWG", 1, 20.0, 26, 25, false, new[] { "ampacity", "device_below_load" })]
    [InlineData("12 AWG", 1, 25.0, 18, 25, false, new[] { "ocpd_above_ampacity" })]
    [InlineData("12 AWG", 1, 35.0, 30, 25, false, new[] { "ampacity", "ocpd_above_ampacity", "ocpd_above_ampacity" })]
    [InlineData("12 AWG", 2, 40.0, 30, 50, true, new string[0])]
    [InlineData("6 AWG", 1, 70.0, 60, 65, true, new string[0])]
    [InlineData("6 AWG", 1, 80.0, 60, 65, false, new[] { "ocpd_above_ampacity" })]
    public void Meets_AgreesWithAddFindings(string size, int sets, double? ocpdA, double designA, double ampacityA, bool meets, string[] codes)
    {
        var run = RunOf(size, sets, ocpdA);
        Assert.Equal(meets, Rules.Meets(designA, ocpdA, ConductorSize.Parse(size), Material.Copper, sets, ampacityA, DeviceType.Breaker, default));
        var findings = Rules.AddFindings(null, run, Figures(designA, ampacityA));
        Assert.Equal(codes, findings?.Select(f => f.Code) ?? []);
        Assert.Equal(meets, findings is null);
    }

    // The same agreement on a motor's and an air-conditioning unit's circuit, whose device is judged by its own rules
    // (NEC 430.52(C)(1), 440.22(C); memory) and not by 240.4(B), 240.4(D) or 210.20(A): a 25 hp motor (34 A, design
    // 42.5 A, breaker at most 90 A); a unit of mca 28 A, mocp 45 A.
    [Theory]
    [InlineData("10 AWG", 60.0, 35, 34, 0, 0, false, new[] { "NEC 430.22" })] // the review's case: too small, breaker allowed
    [InlineData("8 AWG", 60.0, 50, 34, 0, 0, true, new string[0])]
    [InlineData("8 AWG", 90.0, 50, 34, 0, 0, true, new string[0])]
    [InlineData("8 AWG", 100.0, 50, 34, 0, 0, false, new[] { "NEC 430.52(C)(1)" })]
    [InlineData("14 AWG", 15.0, 20, 7.6, 0, 0, true, new string[0])]
    [InlineData("10 AWG", 45.0, 35, 0, 28, 45, true, new string[0])]
    [InlineData("12 AWG", 45.0, 25, 0, 28, 45, false, new[] { "NEC 440.35" })]
    [InlineData("10 AWG", 50.0, 35, 0, 28, 45, false, new[] { "NEC 440.22(C)" })]
    public void Meets_MotorAndAirConditioning_AgreesWithAddFindings(
        string size, double ocpdA, double ampacityA, double fullLoadA, double mcaA, double mocpA, bool meets, string[] references)
    {
        var duty = mcaA > 0 ? new CircuitDuty(DutyKind.AirConditioning, fullLoadA, mcaA, mocpA) : new CircuitDuty(DutyKind.Motor, fullLoadA, 0, 0);
        var designA = Rules.EquipmentDesignCurrentA(duty)!.Value;
        Assert.Equal(meets, Rules.Meets(designA, ocpdA, ConductorSize.Parse(size), Material.Copper, 1, ampacityA, DeviceType.Breaker, duty));
        var findings = Rules.AddFindings(null, RunOf(size, 1, ocpdA), new CurrentFigures(designA, 'A', ampacityA, null, null, fullLoadA, duty));
        Assert.Equal(references, findings?.Select(f => f.Reference) ?? []);
        Assert.Equal(meets, findings is null);
    }

    // Without a tabulated ampacity (large metric sizes) only the small-conductor rule can be checked.
    [Fact]
    public void AddFindings_NoAmpacity_ChecksTheSmallConductorRuleOnly()
    {
        var found = Assert.Single(Rules.AddFindings(null, RunOf("12 AWG", 1, 30), Figures(30, null))!);
        Assert.Equal(FindingKind.OcpdAboveAmpacity, found.Kind);
        Assert.Equal(20, found.Limit);
        Assert.Equal("branch circuit P/1: a 12 AWG cu conductor may be protected at 20 A at most (small-conductor rule), not 30 A", found.Message);
        Assert.Null(Rules.AddFindings(null, RunOf("12 AWG", 1, 20), Figures(20, null)));
    }

    [Fact]
    public void AddFindings_GivenAList_AddsToIt()
    {
        var earlier = new Finding(FindingKind.BranchDrop, "NEC 210.19(A)(1) Informational Note No. 4", "P/1", 4, 3, "earlier", DistTree.Diagnostics.SourceLocation.None);
        var findings = Rules.AddFindings([earlier], RunOf("12 AWG", 1, 20), Figures(26, 25))!;
        Assert.Equal([FindingKind.BranchDrop, FindingKind.Ampacity, FindingKind.DeviceBelowLoad], findings.Select(f => f.Kind));
    }

    // A run's figures on line A without a neutral.
    private static CurrentFigures Figures(double designA, double? ampacityA) => new(designA, 'A', ampacityA, null, null);

    // The run of a one-circuit project, copper, of the given size, sets and device.
    private static NetworkRun RunOf(string size, int sets, double? ocpdA)
    {
        var ocpd = ocpdA is { } a ? FormattableString.Invariant($", ocpd: {a}") : "";
        var yaml = SolverHarness.OneCircuit("120/240", "imperial",
            $"{{ id: \"1\", poles: 1, load: {{ amps: 10 }}, run: {{ length: 10, size: {size}, sets: {sets}{ocpd} }} }}");
        return NetworkBuilder.Build(ProjectLoader.Parse(yaml, "test.yaml")).NodeArray[^1].Incoming!;
    }
}
