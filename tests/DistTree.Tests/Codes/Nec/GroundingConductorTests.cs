using DistTree.Codes;
using DistTree.Codes.Nec;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Sizing;
using DistTree.Tests.Solving;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.Codes.Nec;

/// <summary>
/// The equipment grounding conductor's minimum (issue 18, item 5), worked by hand from NEC 250.122 (2020, memory: verify):
/// Table 250.122 by the device; 250.122(B), in proportion to the lines' circular-mil area over the smallest size that
/// has the ampacity; 250.122(A), never above the lines. Areas are ASTM B258's (the catalogue's own sizes): 8 AWG
/// 16,510 cmil, 6 AWG 26,240, 4 AWG 41,740, 3 AWG 52,620, 1/0 AWG 105,600 (to four figures). Ampacities are NEC Table
/// 310.16's 75 °C copper column (read): 4 AWG 85 A, 3 AWG 100 A.
/// </summary>
public sealed class GroundingConductorTests
{
    private static readonly NecRules Rules = new(ConductorCatalog.Standard);

    private static readonly Rules Defaults = new();

    // 80 A under a 100 A device: 4 AWG (85 A) carries it, but 100 A is above the next standard rating over 85 A
    // (90 A; NEC 240.4(B), 240.6(A)); 3 AWG (100 A) is the smallest that meets every rule.
    [Fact]
    public void SmallestSufficientSize_80AUnder100A_Is3Awg() =>
        Assert.Equal("3 AWG", Rules.SmallestSufficientSize(80, 100, Copper("3 AWG", 100), SizeSeries.NorthAmerican, 1, Defaults)!.Value.Text);

    // On the smallest size that will do, the table's size: 100 A, copper, 8 AWG.
    [Fact]
    public void MinimumGroundSize_LinesAtTheSizeTheLoadNeeds_IsTheTablesSize() =>
        Assert.Equal("8 AWG", Min("3 AWG", 1, 80, 100));

    // Upsized to 1/0 AWG for voltage drop: 16,510 × 105,600 / 52,620 = 33,130 cmil, above 6 AWG (26,240) and not above
    // 4 AWG (41,740): 4 AWG.
    [Fact]
    public void MinimumGroundSize_LinesUpsizedFor1_0Awg_GrowsInProportionTo4Awg()
    {
        var required = Size("8 AWG").AreaCmil * Size("1/0 AWG").AreaCmil / Size("3 AWG").AreaCmil;
        Assert.Equal(33_130, required, tolerance: 30);
        Assert.InRange(required, Size("6 AWG").AreaCmil, Size("4 AWG").AreaCmil);
        Assert.Equal("4 AWG", Min("1/0 AWG", 1, 80, 100));
    }

    // 250.122(A): 20 A device, 14 AWG is not allowed (240.4(D)), 12 AWG is the table's size; lines of 12 AWG need 12 AWG
    // and an upsize to 10 AWG gives 12 AWG × 10/12 area ratio = the lines' own size, never more.
    [Theory]
    [InlineData("12 AWG", "12 AWG")]
    [InlineData("10 AWG", "10 AWG")]
    [InlineData("6 AWG", "6 AWG")]
    public void MinimumGroundSize_SmallBranch_NeverAboveTheLines(string lines, string expected) =>
        Assert.Equal(expected, Min(lines, 1, 16, 20));

    // 250.122(F): two parallel sets under a 400 A device, 300 A: each set's grounding conductor is sized on the full
    // 400 A (3 AWG) and increased per set. The smallest size that will do at two sets is 3/0 AWG (2 × 200 A = 400 A; 2/0
    // gives 350 A, a standard rating, so 400 A may not protect it, 240.4(B)): on 3/0 AWG, 3 AWG. On 250 kcmil a set,
    // 52,620 × 250,000 / 167,800 = 78,400 cmil: above 2 AWG (66,360), not above 1 AWG (83,690): 1 AWG.
    [Theory]
    [InlineData("3/0 AWG", "3 AWG")]
    [InlineData("250 kcmil", "1 AWG")]
    public void MinimumGroundSize_ParallelSets_PerSetOnTheFullRating(string lines, string expected) =>
        Assert.Equal(expected, Min(lines, 2, 300, 400));

    // Aluminium takes the table's aluminium column: 100 A, 6 AWG. 80 A needs 1 AWG aluminium (100 A at 75 °C; 2 AWG's
    // 90 A is a standard rating, so 100 A may not protect it): on 1 AWG, 6 AWG; on 1/0 AWG, 26,240 × 105,600 / 83,690 =
    // 33,110 cmil → 4 AWG.
    [Theory]
    [InlineData("1 AWG", "6 AWG")]
    [InlineData("1/0 AWG", "4 AWG")]
    public void MinimumGroundSize_Aluminium_TakesItsColumn(string lines, string expected)
    {
        var run = Copper(lines, 100) with { Material = Material.Aluminum };
        Assert.Equal(expected, Rules.MinimumGroundSize(run, Size(lines), 1, 80, Defaults)!.Value.Text);
    }

    // A metric run: the table's 8 AWG (8.37 mm²) on lines at the size the load needs names the smallest metric size at or
    // above it, 10 mm².
    [Fact]
    public void MinimumGroundSize_Metric_SmallestMetricSizeAtOrAbove()
    {
        var least = Rules.SmallestSufficientSize(80, 100, Copper("25 mm2", 100), SizeSeries.Metric, 1, Defaults)!.Value;
        Assert.Equal("10 mm2", Rules.MinimumGroundSize(Copper(least.Text, 100), least, 1, 80, Defaults)!.Value.Text);
    }

    [Fact]
    public void MinimumGroundSize_NoDevice_IsNone() =>
        Assert.Null(Rules.MinimumGroundSize(Copper("3 AWG", null), Size("3 AWG"), 1, 80, Defaults));

    // The minimum never exceeds the lines (250.122(A)) and never falls below the table's row, except where the lines
    // themselves are smaller than the row.
    [Property(MaxTest = 2_000)]
    public Property MinimumGroundSize_BetweenTheTableAndTheLines(PositiveInt device, byte lineIndex, byte sufficientIndex, bool aluminum, bool metric)
    {
        var series = ConductorSize.InSeries(metric ? SizeSeries.Metric : SizeSeries.NorthAmerican);
        var line = series[lineIndex % series.Count];
        ConductorSize? sufficient = sufficientIndex % (series.Count + 1) is var i && i == series.Count ? null : series[i];
        var deviceA = 1 + (device.Get % 6000);
        var material = aluminum ? Material.Aluminum : Material.Copper;
        var row = NecGroundingTable.RowOf(deviceA);
        var table = NecGroundingTable.AreaCmil(row, material);
        var least = Rules.MinimumGroundSize(new GroundingCase(deviceA, material, line, sufficient, new GroundingTableSize(NecGroundingTable.SizeText(row, material), table)))!.Value;
        return (least <= line && least.Series == line.Series && least.AreaCmil >= Math.Min(table, line.AreaCmil) * (1 - 1e-9)).ToProperty();
    }

    // A stated 10 AWG on the 1/0 AWG feeder (minimum 4 AWG) and on the 3 AWG one (minimum 8 AWG) is a finding citing
    // NEC 250.122; 8 AWG passes on 3 AWG; 4 AWG passes on 1/0 AWG.
    [Theory]
    [InlineData("3 AWG", "10 AWG", true)]
    [InlineData("3 AWG", "8 AWG", false)]
    [InlineData("1/0 AWG", "10 AWG", true)]
    [InlineData("1/0 AWG", "6 AWG", true)]
    [InlineData("1/0 AWG", "4 AWG", false)]
    public void Solve_StatedGround_FindingWhenBelowTheMinimum(string lines, string ground, bool found)
    {
        var feeder = SolverHarness.Solve(Feeder(lines, 10, $", ocpd: 100, ground_size: {ground}")).Runs.Single(r => r.Id == "P");
        Assert.Equal(ground, feeder.GroundSize);
        var finding = feeder.Findings.SingleOrDefault(f => f.Code == "grounding_conductor");
        Assert.Equal(found, finding is not null);
        if (finding is not null)
        {
            Assert.Equal("NEC 250.122", finding.Reference);
            Assert.Equal(Size(ground).AreaMm2, finding.Value, 9);
            Assert.Equal(Size(feeder.GroundMinSize!).AreaMm2, finding.Limit, 9);
            Assert.Contains($"the stated {ground} equipment grounding conductor is smaller than the {feeder.GroundMinSize}", finding.Message, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Solve_NoDevice_NoMinimumAndNoFinding()
    {
        var feeder = SolverHarness.Solve(Feeder("3 AWG", 10, ", ground_size: 14 AWG")).Runs.Single(r => r.Id == "P");
        Assert.Null(feeder.GroundMinSize);
        Assert.DoesNotContain(feeder.Findings, f => f.Code == "grounding_conductor");
    }

    // The voltage-drop upsize is what makes 250.122(B) bite: 80 A over 120 m of 3 AWG drops more than 3 %; the plan takes
    // a larger size, and the grounding conductor it names is 8 AWG × (new area / 52,620 cmil), to the next size up, not
    // the table's 8 AWG. A stated 8 AWG, enough before, must be increased, and the proof carries the increase. (The
    // far-end fault, a check of its own, may ask for more than the minimum: then the plan writes the larger one.)
    [Fact]
    public void Plan_VoltageDropUpsize_NamesTheProportionalGroundAndRaisesTheStatedOne()
    {
        var before = SolverHarness.Solve(Feeder("3 AWG", 70, ", ocpd: 100, ground_size: 8 AWG"));
        Assert.DoesNotContain(before.Runs.Single(r => r.Id == "P").Findings, f => f.Code == "grounding_conductor");
        var plan = Upsizer.Standard.Plan(before);
        var change = Assert.Single(plan.Changes, c => c.RunId == "P");
        var after = Size(change.SizeAfter);
        var required = Size("8 AWG").AreaCmil * after.AreaCmil / Size("3 AWG").AreaCmil;
        var expected = ConductorSize.InSeries(SizeSeries.NorthAmerican).First(s => s.AreaCmil >= required * (1 - 1e-9));
        Assert.True(expected > Size("8 AWG"));
        Assert.Equal(expected.Text, change.GroundMinSize);
        Assert.Equal("8 AWG", change.GroundSize);
        Assert.True(change.GroundMustIncrease);
        var written = Size(Assert.IsType<string>(change.GroundSizeAfter));
        Assert.True(written >= expected, change.GroundSizeAfter);
        Assert.Contains(written == expected ? $"at least {expected.Text} (NEC 250.122); the stated 8 AWG is too small and must be increased too" : "the stated 8 AWG", change.GroundingNote, StringComparison.Ordinal);
        Assert.False(plan.After.HasFindings);
        Assert.Equal(written.Text, plan.After.Runs.Single(r => r.Id == "P").GroundSize);
    }

    // A run the plan leaves alone whose stated grounding conductor is already too small is named as what no line size fixes.
    [Fact]
    public void Plan_RunLeftAloneWithTooSmallGround_IsUnresolvable()
    {
        var before = SolverHarness.Solve(Feeder("3 AWG", 10, ", ocpd: 100, ground_size: 10 AWG"));
        var plan = Upsizer.Standard.Plan(before);
        Assert.Empty(plan.Changes);
        var left = Assert.Single(plan.Unresolvable);
        Assert.Equal("P", left.Subject);
        Assert.EndsWith("a larger line size cannot fix this; increase the grounding conductor", left.Message, StringComparison.Ordinal);
    }

    private static ConductorSize Size(string text) => ConductorSize.Parse(text);

    private static string Min(string lines, int sets, double designA, double deviceA) =>
        Rules.MinimumGroundSize(Copper(lines, deviceA), Size(lines), sets, designA, Defaults)!.Value.Text;

    private static Run Copper(string size, double? deviceA) => new()
    {
        LengthM = 10,
        Size = Size(size),
        Material = Material.Copper,
        InsulationC = 75,
        Raceway = Raceway.Pvc,
        OcpdA = deviceA,
    };

    // A 208Y/120 panel P on a copper feeder of the given size and length with its extra keys, feeding one 3-pole 80 A load
    // (not continuous, so its design current is 80 A).
    private static string Feeder(string size, double lengthM, string keys) => SolverHarness.PanelOnFeeder(
        FormattableString.Invariant($"length: {lengthM}, size: {size}{keys}"),
        "{ id: \"1\", poles: 3, ocpd: 100, load: { amps: 80 }, run: { length: 3, size: 1/0 AWG } }");
}
