using System.Runtime.CompilerServices;
using DistTree.Model;
using DistTree.Network;

namespace DistTree.Solving;

/// <summary>Counts and the worst figure of a solution.</summary>
/// <param name="EndPoints">Number of end points.</param>
/// <param name="Runs">Number of result rows (feeders, branch circuits and transformers).</param>
/// <param name="Findings">Number of findings on runs and end points.</param>
/// <param name="WorstTotalDropPercent">The largest end-point total, percent (0 without end points).</param>
/// <param name="WorstEndPoint">Its id, or null without end points.</param>
public sealed record SolutionSummary(int EndPoints, int Runs, int Findings, double WorstTotalDropPercent, string? WorstEndPoint);

/// <summary>The solved tree: every run's and every end point's figures and findings.</summary>
public sealed record Solution
{
    /// <summary>The project solved.</summary>
    public required Project Project { get; init; }

    /// <summary>The tree solved.</summary>
    public required DistributionNetwork Network { get; init; }

    /// <summary>Results of runs in network order (a parent's run before its children's), transformers after their primary feeder.</summary>
    public required IReadOnlyList<RunResult> Runs { get; init; }

    /// <summary>End points in network order.</summary>
    public required IReadOnlyList<EndPointResult> EndPoints { get; init; }

    /// <summary>Phase loads and imbalance of every panel or switchboard with circuits, in network order.</summary>
    public IReadOnlyList<PanelResult> Panels { get; init; } = [];

    /// <summary>Counts and the worst figure.</summary>
    public required SolutionSummary Summary { get; init; }

    /// <summary>The load flow's outcome: converged, and in how many sweeps.</summary>
    public required LoadFlowResult LoadFlow { get; init; }

    /// <summary>The conductor catalogue's name.</summary>
    public required string CatalogName { get; init; }

    /// <summary>The rule set that judged the project (its code, edition and clauses).</summary>
    public required Codes.CodeRules Code { get; init; }

    /// <summary>The short-circuit study: the fault currents at every piece of equipment and at every run's far end.</summary>
    public required FaultStudy Faults { get; init; }

    /// <summary>Every finding, runs' first, then end points', then equipment's, each in network order.</summary>
    public IEnumerable<Finding> AllFindings
    {
        get
        {
            // Loops, not SelectMany over the result views (value types, compiled at start: DEVELOPERS.md, Start-up).
            for (var i = 0; i < Runs.Count; i++)
            {
                foreach (var finding in Runs[i].Findings)
                {
                    yield return finding;
                }
            }

            for (var i = 0; i < EndPoints.Count; i++)
            {
                foreach (var finding in EndPoints[i].Findings)
                {
                    yield return finding;
                }
            }

            foreach (var finding in Faults.Findings)
            {
                yield return finding;
            }
        }
    }

    /// <summary>True when any limit is exceeded.</summary>
    public bool HasFindings => Summary.Findings > 0;

    /// <summary>
    /// The feeder or branch circuit that comes into the node at <paramref name="nodeIndex"/> (its index in
    /// <see cref="DistributionNetwork.Nodes"/>), or null where none does (the service).
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="nodeIndex"/> is not the index of a node of the tree.</exception>
    public RunResult? IncomingRun(int nodeIndex) => Row(At(Lookups.IncomingRun, nodeIndex));

    /// <summary>The regulation row of the transformer at the node at <paramref name="nodeIndex"/>, or null where that node is no transformer.</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="nodeIndex"/> is not the index of a node of the tree.</exception>
    public RunResult? TransformerRun(int nodeIndex) => Row(At(Lookups.TransformerRun, nodeIndex));

    /// <summary>The end point at the node at <paramref name="nodeIndex"/>, or null where that node is no end point.</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="nodeIndex"/> is not the index of a node of the tree.</exception>
    public EndPointResult? EndPointAt(int nodeIndex) => At(Lookups.EndPoint, nodeIndex) is var k and >= 0 ? EndPoints[k] : null;

    /// <summary>The end point whose id (<c>PANEL/ID</c>, ordinal) is <paramref name="id"/>, or null where none is.</summary>
    public EndPointResult? EndPointById(string id) => Lookups.EndPointById.TryGetValue(id, out var k) ? EndPoints[k] : null;

    /// <summary>End points, worst total first (ties by id, ordinal), at most <paramref name="count"/>.</summary>
    public IReadOnlyList<EndPointResult> WorstEndPoints(int count) =>
        EndPoints.Order(Comparer<EndPointResult>.Create(WorstFirst)).Take(count).ToArray();

    /// <summary>The order of end points, worst first: the larger total first (a total that is not a number last), then by id, ordinal.</summary>
    internal static int WorstFirst(EndPointResult a, EndPointResult b) => WorstFirst(a.TotalDropPercent, a.Id, b.TotalDropPercent, b.Id);

    /// <summary>The same order on an end point's total and id.</summary>
    internal static int WorstFirst(double totalA, string idA, double totalB, string idB)
    {
        var order = totalB.CompareTo(totalA);
        return order != 0 ? order : string.CompareOrdinal(idA, idB);
    }

    // The lookups by node and by id, made on first use from the rows (one pass over the runs and the end points)
    // and kept beside the solution, not in it, so that they take no part in the record's equality or its copies.
    private static readonly ConditionalWeakTable<Solution, NodeLookups> LookupsOf = new();

    private NodeLookups Lookups => LookupsOf.GetValue(this, static s => new NodeLookups(s));

    private RunResult? Row(int index) => index >= 0 ? Runs[index] : null;

    private static int At(int[] byNode, int nodeIndex)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(nodeIndex);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(nodeIndex, byNode.Length);
        return byNode[nodeIndex];
    }

    // Per node, the index of its incoming run's row, of its transformer's row and of its end point (-1 for none);
    // and each end point's index by id.
    private sealed class NodeLookups
    {
        private readonly Solution _solution;
        private Dictionary<string, int>? _endPointById;

        public NodeLookups(Solution solution)
        {
            _solution = solution;
            var n = solution.Network.Nodes.Count;
            IncomingRun = Filled(n);
            TransformerRun = Filled(n);
            EndPoint = Filled(n);
            for (var r = 0; r < solution.Runs.Count; r++)
            {
                var run = solution.Runs[r];
                (run.Kind == RunResultKind.Transformer ? TransformerRun : IncomingRun)[run.NodeIndex] = r;
            }

            for (var k = 0; k < solution.EndPoints.Count; k++)
            {
                EndPoint[solution.EndPoints[k].NodeIndex] = k;
            }
        }

        public int[] IncomingRun { get; }

        public int[] TransformerRun { get; }

        public int[] EndPoint { get; }

        // Made only when first asked for: most callers look up by node.
        public Dictionary<string, int> EndPointById => LazyInitializer.EnsureInitialized(ref _endPointById, () =>
        {
            var endPoints = _solution.EndPoints;
            var byId = new Dictionary<string, int>(endPoints.Count, StringComparer.Ordinal);
            for (var k = 0; k < endPoints.Count; k++)
            {
                byId.TryAdd(endPoints[k].Id, k);
            }

            return byId;
        });

        private static int[] Filled(int n)
        {
            var a = new int[n];
            Array.Fill(a, -1);
            return a;
        }
    }
}
