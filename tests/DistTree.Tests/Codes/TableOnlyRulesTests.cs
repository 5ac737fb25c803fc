using System.Numerics;
using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Tests.Codes;

/// <summary>
/// A rule set that holds no grounding table of its own (as a code whose table is not held from a source read): without a
/// project's table it gives no minimum; with one, the project's table is the only source, read as it stands (the smallest
/// size of the lines' series at or above the table's area; no step of another code's is applied).
/// </summary>
public sealed class TableOnlyRulesTests
{
    private static readonly GroundingTable Table = GroundingTable.Load(
        new StringReader("# Invented test table, not a code's.\ndevice_a\tcu\tal\n60\t10 AWG\t8 AWG\n100\t6 AWG\t\n"), "own.tsv");

    private static readonly Run Run = new() { LengthM = 10, Size = ConductorSize.Parse("1/0 AWG"), Material = Material.Copper, InsulationC = 75, Raceway = Raceway.Pvc, OcpdA = 100 };

    [Fact]
    public void MinimumGroundSize_NoTableAnywhere_IsNone() =>
        Assert.Null(new NoTableRules().MinimumGroundSize(Run, Run.Size, 1, 80, new Rules()));

    // 1/0 AWG lines, larger than the load needs: the NEC would increase the table's size (250.122(B)); a rule set that says
    // nothing more reads the table as it stands, 6 AWG.
    [Fact]
    public void MinimumGroundSize_ProjectTable_TheOnlySourceReadAsItStands()
    {
        var rules = new NoTableRules { ProjectGroundingTable = Table };
        Assert.Same(Table, rules.GroundingTableInForce);
        Assert.Equal("6 AWG", rules.MinimumGroundSize(Run, Run.Size, 1, 80, new Rules())!.Value.Text);
        Assert.Null(rules.MinimumGroundSize(Run with { Material = Material.Aluminum }, Run.Size, 1, 80, new Rules())); // a blank cell
        Assert.Null(rules.MinimumGroundSize(Run with { OcpdA = 125 }, Run.Size, 1, 80, new Rules())); // above the last row
    }

    // The least a rule set must say to be asked for a grounding minimum; nothing else is called here.
    private sealed class NoTableRules() : CodeRules(ConductorCatalog.Standard)
    {
        public override ElectricalCode Code => ElectricalCode.Nec;

        public override string Name => "TEST";

        public override string Edition => "0";

        public override string Title => "a test rule set";

        public override string ClauseSource => "none";

        public override Rules Defaults => new();

        public override IReadOnlyList<double> StandardRatingsA => [15, 20, 100];

        public override string AmpacitySource => "the catalogue, uncorrected";

        public override double AmpacityFactor(double ratedC, double ambientC, int currentCarrying) => 1;

        public override string Cite(CodeCheck check) => "none";

        public override double DesignCurrentA(Complex carried, Complex continuous, double largestMotorA, bool protectedByDevice) => carried.Magnitude;

        public override double? EquipmentDesignCurrentA(in CircuitDuty duty) => null;

        public override double? EquipmentMaxDeviceA(in CircuitDuty duty) => null;

        public override bool DevicePermits(double ocpdA, double ampacityA, DeviceType device) => ocpdA <= ampacityA;

        public override int UngroupedCount => 3;

        public override string GroupingUnit => "current-carrying";

        public override string DesignCurrentFormula => "I_{design} = I";

        public override string DesignCurrentRule => "none";

        public override bool SmallConductorPermits(double ocpdA, ConductorSize size, Material material, int sets) => true;

        public override int CurrentCarryingConductors(NetworkRun run) => 3;

        internal override List<Finding>? AddFindings(List<Finding>? findings, NetworkRun run, in CurrentFigures figures) => findings;
    }
}
