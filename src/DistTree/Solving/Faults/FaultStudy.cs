using DistTree.Conductors;
using DistTree.Model;

namespace DistTree.Solving;

/// <summary>What the short-circuit currents start from: the service's source impedance.</summary>
public enum FaultSourceKind
{
    /// <summary>The utility's available three-phase fault current and X/R at the service.</summary>
    Utility,

    /// <summary>The utility's transformer (kVA, %Z, X/R) on an infinite primary bus.</summary>
    UtilityTransformer,

    /// <summary>No source impedance: an infinite bus at the service (the safe side for the maximum currents only).</summary>
    InfiniteBus,
}

/// <summary>Which fault a short-circuit current is of.</summary>
public enum FaultKind
{
    /// <summary>A bolted fault of all three lines.</summary>
    ThreePhase,

    /// <summary>A bolted fault between two lines.</summary>
    LineToLine,

    /// <summary>A bolted fault of one line to the neutral.</summary>
    LineToNeutral,

    /// <summary>A bolted fault of one line to the grounding (protective) conductor.</summary>
    LineToGround,
}

/// <summary>
/// The maximum short-circuit currents at one switchboard, panelboard, transformer (at its secondary terminals) or
/// splitter, and its rating against them.
/// </summary>
/// <param name="Id">The equipment's id.</param>
/// <param name="Kind">What it is.</param>
/// <param name="NodeIndex">Its node's index in the tree.</param>
/// <param name="System">The system of its bus (a transformer's secondary).</param>
/// <param name="AvailableFaultCurrentKa">
/// The largest bolted fault current between its conductors, kA, symmetrical rms: three-phase on three lines; on a
/// single-phase bus the larger of line to line and line to neutral. Null where no impedance bounds it (an infinite bus
/// at the service with no conductor between).
/// </param>
/// <param name="AvailableFaultCurrentLgKa">The line-to-ground fault current, kA; null where the bus has no grounded source or no impedance bounds it.</param>
/// <param name="XOverR">The X/R ratio of the impedance behind the largest fault; null with it.</param>
/// <param name="InterruptingKa">The equipment's stated interrupting or short-circuit current rating, kA, or null.</param>
/// <param name="Findings">The rating below the available current, if it is.</param>
public sealed record EquipmentFault(
    string Id,
    EquipmentKind Kind,
    int NodeIndex,
    string System,
    double? AvailableFaultCurrentKa,
    double? AvailableFaultCurrentLgKa,
    double? XOverR,
    double? InterruptingKa,
    IReadOnlyList<Finding> Findings)
{
    /// <summary>The largest of its fault currents, kA (the figure a rating is judged against); null where one is unbounded.</summary>
    public double? LargestKa => AvailableFaultCurrentKa is { } bolted ? Math.Max(bolted, AvailableFaultCurrentLgKa ?? 0) : null;
}

/// <summary>
/// The minimum short-circuit current at the load end of one feeder or branch circuit, and the current that trips its
/// device without delay. The words of its basis are written when read (a solve of 100,000 runs writes none).
/// </summary>
public readonly record struct FarEndFault
{
    private static readonly string[] GroundBases = ["stated", "the code's minimum", "the lines' size: state ground_size"];

    private readonly Run _conductors;
    private readonly ConductorSize _ground;
    private readonly byte _groundBasis;

    internal FarEndFault(double minimumCurrentA, FaultKind kind, double? tripCurrentA, Run conductors, ConductorSize ground, byte groundBasis)
    {
        MinimumCurrentA = minimumCurrentA;
        Kind = kind;
        TripCurrentA = tripCurrentA;
        _conductors = conductors;
        _ground = ground;
        _groundBasis = groundBasis;
    }

    /// <summary>The smallest bolted fault current at the far end, amperes (conductors hot, the minimum voltage factor, no motors).</summary>
    public double MinimumCurrentA { get; }

    /// <summary>Which fault gives it.</summary>
    public FaultKind Kind { get; }

    /// <summary>The current that trips the device without delay, amperes; null where it is not known (no device, or a fuse without a stated multiple).</summary>
    public double? TripCurrentA { get; }

    /// <summary>How the trip current was taken: <c>C: 10 × the 20 A breaker</c>, <c>default 10 × …</c>, or why there is none.</summary>
    public string TripBasis => Codes.CodeRules.TripBasis(_conductors);

    /// <summary>The grounding conductor the line-to-ground loop returns through, each set.</summary>
    public string GroundSize => _ground.Text;

    /// <summary>That conductor's size.</summary>
    internal ConductorSize Ground => _ground;

    /// <summary>True where that conductor is the lines' size for want of a stated one or a table (raising it alone means nothing).</summary>
    internal bool GroundIsLinesSize => _groundBasis == 2;

    /// <summary>Whether that conductor is <c>stated</c>, the code's minimum, or the lines' size where neither is known.</summary>
    public string GroundBasis => GroundBases[_groundBasis];

    /// <summary>
    /// The same fault's minimum current at the run's source end, amperes (infinite on an infinite bus): the most any size
    /// of this run could give its far end, so where it is below the trip current only a change above the run, a shorter
    /// run's source or a lower trip clears it.
    /// </summary>
    public double SourceEndA { get; init; }

    /// <summary>True when the device is known and the minimum current trips it without delay, or the device is not known.</summary>
    public bool Clears => TripCurrentA is not { } trip || !(MinimumCurrentA < trip);
}

/// <summary>
/// The short-circuit study of a tree: the maximum currents at every piece of equipment and the minimum at every run's far
/// end, by the ohmic method of IEC 60909-0 on the same impedances as the voltage drop (see <c>FaultSolver</c>).
/// </summary>
public sealed class FaultStudy
{
    private readonly FarEndRow[] _farEnds;
    private readonly Network.NetworkNode[] _nodes;

    internal FaultStudy(FaultSourceKind source, double factorMax, double factorMin, IReadOnlyList<EquipmentFault> equipment, FarEndRow[] farEnds, double motorMultiple, Network.NetworkNode[] nodes)
    {
        _nodes = nodes;
        Source = source;
        VoltageFactorMax = factorMax;
        VoltageFactorMin = factorMin;
        Equipment = equipment;
        _farEnds = farEnds;
        MotorMultiple = motorMultiple;
    }

    /// <summary>What the currents start from.</summary>
    public FaultSourceKind Source { get; }

    /// <summary>The voltage factor c of the maximum currents.</summary>
    public double VoltageFactorMax { get; }

    /// <summary>The voltage factor c of the minimum currents.</summary>
    public double VoltageFactorMin { get; }

    /// <summary>The multiple of its full-load current a three-phase induction motor feeds into a fault (common practice).</summary>
    public double MotorMultiple { get; }

    /// <summary>Every switchboard, panelboard, transformer and splitter, in node order.</summary>
    public IReadOnlyList<EquipmentFault> Equipment { get; }

    /// <summary>The findings on equipment ratings, in node order.</summary>
    public IEnumerable<Finding> Findings => Equipment.SelectMany(e => e.Findings);

    /// <summary>The far end of the run into the node at <paramref name="nodeIndex"/>, or null where no run comes into it.</summary>
    public FarEndFault? FarEndAt(int nodeIndex) =>
        _farEnds[nodeIndex] is { Present: true } row && _nodes[nodeIndex].Incoming is { } run
            ? new FarEndFault(row.MinimumA, row.Kind, double.IsNaN(row.TripA) ? null : row.TripA, run.Conductors, ConductorSize.All[row.GroundIndex], row.GroundBasis) { SourceEndA = row.SourceEndA }
            : null;
}

/// <summary>
/// A far end as the study keeps it: plain numbers only, so that an array of 100,000 is one block the collector never
/// scans (see <see cref="FaultStudy.FarEndAt"/>, which makes the <see cref="FarEndFault"/> when asked).
/// </summary>
internal struct FarEndRow
{
    public double MinimumA;
    public double SourceEndA;
    public double TripA; // NaN where the trip current is not known
    public short GroundIndex;
    public FaultKind Kind;
    public byte GroundBasis;
    public bool Present;
}
