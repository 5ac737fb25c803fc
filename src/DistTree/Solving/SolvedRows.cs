using System.Collections;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>
/// Every figure a solve worked out, held as a few arrays: one element a run or end point, and the per-node
/// arrays the solve filled. <see cref="RunResult"/> and <see cref="EndPointResult"/> are views into it, so a
/// solve of 100,000 runs makes a handful of arrays rather than 100,000 result objects for the collector to copy
/// (DEVELOPERS.md, Performance). Nothing here is written after the solve.
/// </summary>
internal sealed class SolvedRows
{
    // The text of each set of lines, by (int)Phases.
    private static readonly string[] LinesText = Enumerable.Range(0, 8).Select(set => PhaseRules.Text((Phases)set)).ToArray();

    public SolvedRows(DistributionNetwork network, PhaseFlow phases, ComplexPower[] power, SolvedRuns runs, SolvedEndPoints endPoints, Codes.CodeRules code)
    {
        Code = code;
        Rules = network.Project.Rules;
        Nodes = network.NodeArray;
        Phases = phases;
        Power = power;
        Runs = runs.Rows;
        RunFindings = runs.Findings;
        EndPoints = endPoints.Rows;
        EndPointFindings = endPoints.Findings;
        MotorStarts = endPoints.MotorStarts;
        PathRuns = endPoints.PathRuns;
        PathShares = endPoints.PathShares;
    }

    public Rules Rules { get; }

    /// <summary>The rule set that judged the solve.</summary>
    public Codes.CodeRules Code { get; }

    public NetworkNode[] Nodes { get; }

    /// <summary>The phase currents and line assignments per node.</summary>
    public PhaseFlow Phases { get; }

    /// <summary>Per node, the complex power it carries after demand factors.</summary>
    public ComplexPower[] Power { get; }

    /// <summary>Per row, its figures (see <see cref="RunResult"/>).</summary>
    public RunRow[] Runs { get; }

    /// <summary>Per row, the limits it exceeds, or null for none.</summary>
    public IReadOnlyList<Finding>?[] RunFindings { get; }

    /// <summary>Per end point, its figures (see <see cref="EndPointResult"/>).</summary>
    public EndPointRow[] EndPoints { get; }

    /// <summary>Per end point, the limits it exceeds, or null for none.</summary>
    public IReadOnlyList<Finding>?[] EndPointFindings { get; }

    /// <summary>Per end point, a motor's starting check, or null for any other load.</summary>
    public MotorStartResult?[] MotorStarts { get; }

    /// <summary>The counted runs of every end point's path, end point after end point (see <see cref="EndPointRow.PathStart"/>).</summary>
    public int[] PathRuns { get; }

    /// <summary>Each counted run's share, aligned with <see cref="PathRuns"/>.</summary>
    public double[] PathShares { get; }

    public static string LinesOf(Phases set) => LinesText[(int)set];
}

/// <summary>What the runs' pass of a solve gives: a row per run or transformer, and each row's findings (null for none).</summary>
internal readonly record struct SolvedRuns(RunRow[] Rows, IReadOnlyList<Finding>?[] Findings);

/// <summary>What the end points' pass of a solve gives (see <see cref="SolvedRows"/>).</summary>
internal readonly record struct SolvedEndPoints(
    EndPointRow[] Rows, IReadOnlyList<Finding>?[] Findings, MotorStartResult?[] MotorStarts, int[] PathRuns, double[] PathShares);

/// <summary>
/// A run's or transformer's figures, filled in stage by stage during the solve (the run, the load flow, the reach).
/// Plain numbers only, no references: an array of them is made without clearing and is never scanned by the
/// collector; the run and the transformer are found from the node, the findings kept beside the rows.
/// </summary>
internal struct RunRow
{
    public int Node;
    public bool IsTransformer;
    public double CurrentA;
    public double DesignCurrentA;
    public byte DesignLine;
    public double LargestMotorA;
    public bool FromEquipment; // a motor's or air-conditioning equipment's branch circuit (see CircuitDuty)
    public double? NeutralDesignCurrentA;
    public double? NeutralAmpacityA;
    public int CurrentCarrying;
    public double TemperatureC;
    public double ResistanceOhmPerKm;
    public double ReactanceOhmPerKm;
    public double NeutralResistanceOhmPerKm;
    public double NeutralReactanceOhmPerKm;
    public double? AmpacityA;
    public double RatedA;
    public double VoltageV;
    public double DropPercent;
    public double PercentSumDropPercent;
    public double? LoadFlowDropPercent;
    public double? MaxLengthM;
    public double? MaxLengthTotalM;

    /// <summary>The smallest equipment grounding conductor the run needs, as its size's index + 1 (0 for none).</summary>
    public short GroundMinIndex;

    /// <summary>The drop in volts: always the drop in percent of the nominal voltage.</summary>
    public readonly double DropV => DropPercent / 100.0 * VoltageV;
}

/// <summary>
/// An end point's figures; its counted runs are <c>PathRuns[PathStart .. PathStart + PathCount]</c>. Plain numbers
/// only, as <see cref="RunRow"/>; the findings and motor-start checks are kept beside the rows.
/// </summary>
internal struct EndPointRow
{
    public int Node;
    public int PathStart;
    public int PathCount;
    public double TotalDropPercent;
    public double LimitPercent;
    public double PercentSumTotalDropPercent;
    public double? LoadFlowTotalDropPercent;
    public double? LoadFlowEndVoltageV;
    public double SourceSharePercent;

    /// <summary>The slot (see <see cref="Slots"/>) whose voltage <see cref="TotalDropPercent"/> is read in, for <see cref="PathLines"/>.</summary>
    public byte CountedSlot;
}

/// <summary>A solution's runs or end points as a list of views: the view of an index is made when it is read.</summary>
internal sealed class ViewList<T>(int count, Func<int, T> view) : IReadOnlyList<T>
{
    public int Count => count;

    public T this[int index] => (uint)index < (uint)count ? view(index) : throw new ArgumentOutOfRangeException(nameof(index));

    public IEnumerator<T> GetEnumerator()
    {
        for (var i = 0; i < count; i++)
        {
            yield return view(i);
        }
    }

    IEnumerator IEnumerable.GetEnumerator() => GetEnumerator();
}
