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

    /// <summary>Every finding, runs' first then end points', in network order.</summary>
    public IEnumerable<Finding> AllFindings => Runs.SelectMany(r => r.Findings).Concat(EndPoints.SelectMany(e => e.Findings));

    /// <summary>True when any limit is exceeded.</summary>
    public bool HasFindings => Summary.Findings > 0;

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
}
