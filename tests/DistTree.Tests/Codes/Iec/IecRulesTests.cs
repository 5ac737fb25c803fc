using System.Numerics;
using DistTree.Codes;
using DistTree.Codes.Iec;
using DistTree.Codes.Nec;
using DistTree.Conductors;
using DistTree.Model;

namespace DistTree.Tests.Codes.Iec;

/// <summary>
/// IEC 60364's rules, each beside its clause and figures. Every clause and figure here is recalled from memory (IEC
/// 60364-4-43:2008, 60364-5-52:2009, 60364-5-54:2011, IEC 60898-1, IEC 60269-2), not read: verify against the editions in force.
/// </summary>
public sealed class IecRulesTests
{
    private static readonly IecRules Rules = new(ConductorCatalog.Standard);

    // IEC 60898-1 preferred rated currents, then the R10 series (memory).
    [Fact]
    public void StandardRatingsA_PreferredValues()
    {
        Assert.Equal(
            [6, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250, 1600, 2000, 2500, 3200, 4000, 5000, 6300],
            Rules.StandardRatingsA);
    }

    // IEC 60364-5-52 Table B.52.14 (memory), air, 30 °C reference: PVC (70 °C) 35 °C 0.94, 40 °C 0.87, 45 °C 0.79,
    // 50 °C 0.71, 25 °C 1.06; XLPE (90 °C) 35 °C 0.96, 40 °C 0.91, 50 °C 0.82, 25 °C 1.04. 37 °C lies between rows:
    // the next row up (40 °C). One circuit: no grouping factor.
    [Theory]
    [InlineData(70, 35, 0.94)]
    [InlineData(70, 40, 0.87)]
    [InlineData(70, 45, 0.79)]
    [InlineData(70, 50, 0.71)]
    [InlineData(70, 25, 1.06)]
    [InlineData(70, 37, 0.87)]
    [InlineData(90, 35, 0.96)]
    [InlineData(90, 40, 0.91)]
    [InlineData(90, 50, 0.82)]
    [InlineData(90, 25, 1.04)]
    public void AmpacityFactor_OneCircuit_IsTableB5214(double ratedC, double ambientC, double expected) =>
        Assert.Equal(expected, Rules.AmpacityFactor(ratedC, ambientC, 1), 9);

    // IEC 60364-5-52 Table B.52.17 row 1 (memory), by number of circuits; between columns the next one up.
    [Theory]
    [InlineData(1, 1.00)]
    [InlineData(2, 0.80)]
    [InlineData(3, 0.70)]
    [InlineData(4, 0.65)]
    [InlineData(6, 0.57)]
    [InlineData(9, 0.50)]
    [InlineData(10, 0.45)] // between 9 and 12: 12's
    [InlineData(12, 0.45)]
    [InlineData(13, 0.41)] // between 12 and 16: 16's
    [InlineData(20, 0.38)]
    [InlineData(25, 0.38)] // beyond the table: its last
    public void AmpacityFactor_Grouped_IsTableB5217Row1(int circuits, double expected) =>
        Assert.Equal(expected, Rules.AmpacityFactor(70, 30, circuits), 9);

    // Both at once: PVC at 40 °C (0.87) with 3 circuits (0.70): 0.609.
    [Fact]
    public void AmpacityFactor_AmbientAndGrouping_Multiply() => Assert.Equal(0.87 * 0.70, Rules.AmpacityFactor(70, 40, 3), 9);

    // IEC 60364-4-43 433.1 (memory): IB ≤ In ≤ Iz and I2 ≤ 1.45·Iz. Worked by hand:
    // a breaker (I2 = 1.45·In, IEC 60898-1): In 32 A, Iz 34 A passes; Iz 31 A fails In ≤ Iz.
    // a gG fuse (I2 = 1.6·In for In ≥ 16 A, IEC 60269-2): In 32 A needs Iz ≥ 1.6 × 32 / 1.45 = 35.31 A.
    [Theory]
    [InlineData(32, 34, DeviceType.Breaker, true)]
    [InlineData(32, 31, DeviceType.Breaker, false)]
    [InlineData(32, 32, DeviceType.Breaker, true)]
    [InlineData(32, 34, DeviceType.Fuse, false)]
    [InlineData(32, 35.2, DeviceType.Fuse, false)]
    [InlineData(32, 35.4, DeviceType.Fuse, true)]
    [InlineData(10, 13.2, DeviceType.Fuse, true)] // 4 < In < 16: I2 = 1.9·In = 19 A ≤ 1.45 × 13.2 = 19.14
    [InlineData(10, 13.0, DeviceType.Fuse, false)] // 19 > 18.85
    public void DevicePermits_Clause4331(double ratedA, double izA, DeviceType device, bool expected) =>
        Assert.Equal(expected, Rules.DevicePermits(ratedA, izA, device));

    // The hand-worked case of 433.1 whole: IB 30 A, In 32 A, Iz 34 A passes; Iz 31 A fails; IB 35 A fails IB ≤ Iz.
    [Theory]
    [InlineData(30, 32, 34, true)]
    [InlineData(30, 32, 31, false)]
    [InlineData(35, 32, 34, false)]
    public void Meets_Clause4331_HandWorked(double ibA, double inA, double izA, bool expected) =>
        Assert.Equal(expected, Rules.Meets(ibA, inA, ConductorSize.Parse("6 mm2"), Material.Copper, 1, izA, DeviceType.Breaker, default));

    // I2 / In (memory): breaker 1.45 (IEC 60898-1); gG fuse 1.6 from 16 A, 1.9 above 4 A, 2.1 at 4 A and below (IEC 60269-2).
    [Theory]
    [InlineData(DeviceType.Breaker, 32, 1.45)]
    [InlineData(DeviceType.Fuse, 16, 1.6)]
    [InlineData(DeviceType.Fuse, 10, 1.9)]
    [InlineData(DeviceType.Fuse, 4, 2.1)]
    public void ConventionalOperatingFactor_ByDevice(DeviceType device, double ratedA, double expected) =>
        Assert.Equal(expected, IecRules.ConventionalOperatingFactor(device, ratedA), 9);

    // IB is the load's current (IEC 60364-4-43 433.1; no 125 % continuous factor, no motor's extra): 20 A with 10 A
    // of it continuous and a 34 A motor on the line is 20 A. A motor's IB is its full-load current; no motor multiple.
    [Fact]
    public void DesignCurrentA_IsTheLoadCurrent()
    {
        var carried = new Complex(20, 0);
        Assert.Equal(20, Rules.DesignCurrentA(carried, new Complex(10, 0), 34, protectedByDevice: true), 9);
        Assert.Equal(20, Rules.DesignCurrentA(carried, Complex.Zero, 0, protectedByDevice: false), 9);
        Assert.Equal(34, Rules.EquipmentDesignCurrentA(new CircuitDuty(DutyKind.Motor, 34, 0, 0))!.Value, 9);
        Assert.Null(Rules.EquipmentDesignCurrentA(new CircuitDuty(DutyKind.AirConditioning, 22, 28, 45)));
        Assert.Null(Rules.EquipmentMaxDeviceA(new CircuitDuty(DutyKind.Motor, 34, 0, 0)));
        Assert.True(Rules.SmallConductorPermits(63, ConductorSize.Parse("1.5 mm2"), Material.Copper, 1));
    }

    // IEC 60364-5-54 Table 54.2 (memory): S ≤ 16 → S; 16 < S ≤ 35 → 16; S > 35 → S/2, up to the next metric size.
    [Theory]
    [InlineData("10 mm2", "10 mm2")]
    [InlineData("16 mm2", "16 mm2")]
    [InlineData("25 mm2", "16 mm2")]
    [InlineData("35 mm2", "16 mm2")]
    [InlineData("50 mm2", "25 mm2")]
    [InlineData("70 mm2", "35 mm2")]
    [InlineData("95 mm2", "50 mm2")] // 47.5 → 50
    [InlineData("120 mm2", "70 mm2")] // 60 → 70
    [InlineData("185 mm2", "95 mm2")] // 92.5 → 95
    [InlineData("240 mm2", "120 mm2")]
    public void MinimumGroundSize_Table542(string line, string expected)
    {
        var size = ConductorSize.Parse(line);
        Assert.Equal(expected, Rules.MinimumGroundSize(new GroundingCase(100, Material.Copper, size, size, default))!.Value.Text);
    }

    // Each conductor and device rule cites its IEC clause (memory); every check has a citation.
    [Fact]
    public void Cite_EveryCheck_NamesIec60364()
    {
        Assert.All(Enum.GetValues<CodeCheck>(), c => Assert.Contains("IEC 60364", Rules.Cite(c), StringComparison.Ordinal));
        Assert.Equal("IEC 60364-4-43 433.1 a)", Rules.Cite(CodeCheck.BranchAmpacity));
        Assert.Equal("IEC 60364-4-43 433.1", Rules.Cite(CodeCheck.DeviceAboveAmpacity));
        Assert.Equal("IEC 60364-5-54 543.1.2, Table 54.2", Rules.Cite(CodeCheck.GroundingConductor));
        Assert.Equal("IEC 60364-5-52 525, Annex G", Rules.Cite(CodeCheck.TotalDrop));
    }

    // IEC 60364-5-52 Annex G, Table G.52.1 (memory): from the origin to the point of use, lighting 3 % and other uses
    // 5 % on a public low-voltage supply, 6 % and 8 % on a private one; + 0.005 % per metre beyond 100 m, at most
    // + 0.5 %. Annex G sets no per-run limit: those default to the largest total an end point can have.
    [Theory]
    [InlineData(SupplyKind.Public, 3, 5)]
    [InlineData(SupplyKind.Private, 6, 8)]
    public void DefaultsOf_AnnexG_LimitsByCategoryAndSupply(SupplyKind supply, double lighting, double other)
    {
        var rules = CodeRules.DefaultsOf(ElectricalCode.Iec, supply);
        Assert.Equal(supply, rules.Supply);
        Assert.Equal(lighting, rules.TotalLimitFor(LoadCategory.Lighting, 80));
        Assert.Equal(other, rules.TotalLimitFor(LoadCategory.Receptacle, 80));
        Assert.Equal(other + 0.25, rules.TotalLimitFor(LoadCategory.Motor, 150), 12);
        Assert.Equal(lighting + 0.5, rules.TotalLimitFor(LoadCategory.Lighting, 400), 12);
        Assert.Equal((other + 0.5, other + 0.5), (rules.FeederLimitPercent, rules.BranchLimitPercent));
    }

    // The seam: the code's word chooses this rule set, its limits (a public supply's unless told) and its name.
    [Fact]
    public void For_Iec_IsTheIecRuleSet()
    {
        Assert.IsType<IecRules>(CodeRules.For(ElectricalCode.Iec, ConductorCatalog.Standard));
        Assert.Equal(CodeRules.DefaultsOf(ElectricalCode.Iec, SupplyKind.Public), CodeRules.DefaultsOf(ElectricalCode.Iec));
        Assert.Equal("IEC 60364", CodeRules.Describe(ElectricalCode.Iec));
        Assert.Equal("protective conductor", Rules.GroundingConductorTerm);
        Assert.Equal("equipment grounding conductor", new NecRules(ConductorCatalog.Standard).GroundingConductorTerm);
        Assert.Equal(1, Rules.UngroupedCount);
    }
}
