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
/// device without delay.
/// </summary>
/// <param name="MinimumCurrentA">The smallest bolted fault current at the far end, amperes (conductors hot, the minimum voltage factor, no motors).</param>
/// <param name="Kind">Which fault gives it.</param>
/// <param name="TripCurrentA">The current that trips the device without delay, amperes; null where it is not known (no device, or a fuse without a stated multiple).</param>
/// <param name="TripBasis">How the trip current was taken: <c>C (10 × 20 A)</c>, <c>default 10 × 20 A</c>, or why there is none.</param>
/// <param name="GroundSize">The grounding conductor the line-to-ground loop returns through, each set.</param>
/// <param name="GroundBasis">Whether that conductor is <c>stated</c>, the code's <c>minimum</c>, or <c>the lines' size</c> where neither is known.</param>
public readonly record struct FarEndFault(
    double MinimumCurrentA, FaultKind Kind, double? TripCurrentA, string TripBasis, string GroundSize, string GroundBasis)
{
    /// <summary>True when the device is known and the minimum current trips it without delay.</summary>
    public bool Clears => TripCurrentA is not { } trip || !(MinimumCurrentA < trip);
}

/// <summary>
/// The short-circuit study of a tree: the maximum currents at every piece of equipment and the minimum at every run's far
/// end, by the ohmic method of IEC 60909-0 on the same impedances as the voltage drop (see <c>FaultSolver</c>).
/// </summary>
public sealed class FaultStudy
{
    private readonly FarEndFault?[] _farEnds;

    internal FaultStudy(FaultSourceKind source, double factorMax, double factorMin, IReadOnlyList<EquipmentFault> equipment, FarEndFault?[] farEnds, double motorMultiple)
    {
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
    public FarEndFault? FarEndAt(int nodeIndex) => _farEnds[nodeIndex];

    /// <summary>The equipment at <paramref name="nodeIndex"/>, or null where that node is no equipment.</summary>
    public EquipmentFault? EquipmentAt(int nodeIndex)
    {
        foreach (var e in Equipment)
        {
            if (e.NodeIndex == nodeIndex)
            {
                return e;
            }
        }

        return null;
    }
}
