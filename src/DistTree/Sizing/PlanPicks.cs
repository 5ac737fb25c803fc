using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Sizing;

/// <summary>What a plan chooses where it differs from the project: per node index, a run's size and sets, and a transformer's tap.</summary>
/// <param name="Runs">Per node index, its incoming run's new choice.</param>
/// <param name="Taps">Per node index, its transformer's new tap.</param>
internal sealed record PlanPicks(Dictionary<int, RunOption> Runs, Dictionary<int, TapOption> Taps)
{
    /// <summary>
    /// Per node index, the grounding conductor its run's far-end repair installs (each set), where it names one: the run
    /// is in <see cref="Runs"/> too (at its present size where only the grounding conductor changes). Never undone alone.
    /// </summary>
    public Dictionary<int, ConductorSize> Grounds { get; init; } = [];

    /// <summary>The picks without the changes <paramref name="undone"/> names (see <see cref="KeyOfRun"/>, <see cref="KeyOfTap"/>).</summary>
    public PlanPicks Without(HashSet<int> undone) => new(
        Runs.Where(p => !undone.Contains(KeyOfRun(p.Key))).ToDictionary(p => p.Key, p => p.Value),
        Taps.Where(p => !undone.Contains(KeyOfTap(p.Key))).ToDictionary(p => p.Key, p => p.Value))
    {
        Grounds = Grounds.Where(p => !undone.Contains(KeyOfRun(p.Key))).ToDictionary(p => p.Key, p => p.Value),
    };

    /// <summary>Every change's key, with its cost.</summary>
    public IEnumerable<(int Key, double Cost)> Keys =>
        Runs.Select(p => (KeyOfRun(p.Key), p.Value.Cost)).Concat(Taps.Select(p => (KeyOfTap(p.Key), p.Value.Cost)));

    /// <summary>The key of the change of node <paramref name="node"/>'s run: the node index.</summary>
    public static int KeyOfRun(int node) => node;

    /// <summary>The key of the change of node <paramref name="node"/>'s tap: its complement (negative).</summary>
    public static int KeyOfTap(int node) => ~node;

    /// <summary>The node a change's key names.</summary>
    public static int NodeOf(int key) => key < 0 ? ~key : key;

    /// <summary>
    /// The project with the picked sizes and sets on their runs, a stated grounding conductor the new size makes too
    /// small raised to its minimum (the change says so), a grounding conductor the plan names written on its run (at
    /// least the new size's minimum), and the picked taps on their transformers; everything else as it was.
    /// </summary>
    public static Project Apply(Solution before, PlanPicks picks)
    {
        var (project, network) = (before.Project, before.Network);
        var rows = before.Runs.Where(r => r.Kind != RunResultKind.Transformer).ToDictionary(r => r.NodeIndex, r => (r.DesignCurrentA, r.CurrentCarryingConductors ?? 3));
        var feeders = new Dictionary<string, Picked>(StringComparer.Ordinal);
        var branches = new Dictionary<string, Picked>(StringComparer.Ordinal);
        foreach (var (index, option) in picks.Runs)
        {
            var node = network.Nodes[index];
            var (design, carrying) = rows[index];
            (node.Circuit is not null ? branches : feeders)[node.Id] = new Picked(option, design, carrying, CircuitDuty.Of(node.Incoming!), picks.Grounds.TryGetValue(index, out var g) ? g : null);
        }

        var taps = picks.Taps.ToDictionary(p => network.Nodes[p.Key].Id, p => p.Value.TapPercent, StringComparer.Ordinal);

        Run With(Run run, Picked pick) => run with { Size = pick.Option.Size, Sets = pick.Option.Sets, GroundSize = GroundAfter(before.Code, project.Rules, run, pick) };

        var equipment = project.Equipment.Select(e => e with
        {
            Feeder = e.Feeder is { } f && feeders.TryGetValue(e.Id, out var fo) ? With(f, fo) : e.Feeder,
            Circuits = e.Circuits.Select(c => branches.TryGetValue(c.FullId, out var co) ? c with { Run = With(c.Run, co) } : c).ToArray(),
            Transformer = e.Transformer is { } t && taps.TryGetValue(e.Id, out var tap) ? t with { TapPercent = tap } : e.Transformer,
        }).ToArray();
        return project with { Equipment = equipment };
    }

    // The grounding conductor a picked run is written with: the named one, or the stated one, either raised to the new size's
    // minimum where it is below it; none where none is stated or named.
    private static ConductorSize? GroundAfter(CodeRules code, Rules rules, Run run, Picked pick)
    {
        var least = code.MinimumGroundSize(run, pick.Option.Size, pick.Option.Sets, pick.DesignA, rules, pick.Carrying, pick.Duty);
        return RaisedToMinimum(pick.Ground ?? run.GroundSize, least);
    }

    /// <summary><paramref name="ground"/> raised to <paramref name="least"/> where it is below it; as it is where either is null.</summary>
    public static ConductorSize? RaisedToMinimum(ConductorSize? ground, ConductorSize? least) =>
        ground is { } g && least is { } l && g < l ? l : ground;

    // One run's pick with what its grounding conductor's minimum depends on.
    private sealed record Picked(RunOption Option, double DesignA, int Carrying, CircuitDuty Duty, ConductorSize? Ground);
}
