using DistTree.Diagnostics;
using DistTree.Model;

namespace DistTree.ProjectFiles;

/// <summary>
/// The checks that need the whole tree: duplicate ids, sources that do not exist, feed cycles,
/// equipment the service does not reach; then, walking down from the service (breadth first,
/// iteratively), each equipment's system and the checks that depend on it (a transformer's primary,
/// the circuits a panel's system can give).
/// </summary>
internal sealed class FeedChecker(DiagnosticBag bag)
{
    private const int Unvisited = 0;
    private const int OnPath = 1;
    private const int Done = 2;

    /// <summary>Checks the drafts and sets each reachable draft's <see cref="EquipmentDraft.System"/>.</summary>
    public void Check(ProjectDraft project)
    {
        var byId = UniqueIds(project);
        var service = project.Service;
        CheckSources(project, byId, service?.Id);
        if (service is null)
        {
            return;
        }

        var reached = AssignSystems(byId, service);
        CheckUnreached(project, byId, reached, service.Id);
    }

    private Dictionary<string, EquipmentDraft> UniqueIds(ProjectDraft project)
    {
        var byId = new Dictionary<string, EquipmentDraft>(StringComparer.Ordinal);
        foreach (var draft in project.Equipment)
        {
            if (draft.Id is not { } id)
            {
                continue;
            }

            if (project.Service is { } service && service.Id == id)
            {
                bag.Error(draft.IdLocation, $"duplicate id '{id}': it is the service's id ({Where(service.Location, draft.IdLocation)})");
            }
            else if (byId.TryGetValue(id, out var first))
            {
                bag.Error(draft.IdLocation, $"duplicate equipment id '{id}' (first given at {Where(first.IdLocation, draft.IdLocation)})");
            }
            else
            {
                byId.Add(id, draft);
            }
        }

        return byId;
    }

    // "line 12" in the same file; "projects/campus/north.yaml:12" in another.
    private static string Where(SourceLocation first, SourceLocation here) =>
        first.File == here.File ? $"line {first.Line}" : $"{first.File}:{first.Line}";

    private void CheckSources(ProjectDraft project, Dictionary<string, EquipmentDraft> byId, string? serviceId)
    {
        if (serviceId is null)
        {
            return;
        }

        var known = byId.Keys.Append(serviceId).ToArray();
        foreach (var draft in project.Equipment)
        {
            if (bag.IsFull)
            {
                // No more errors are reported: spare the hints, each of which looks at every id.
                break;
            }

            if (draft.From is { } from && draft.Id is { } id && from != serviceId && !byId.ContainsKey(from))
            {
                var near = Suggestions.Closest(from, known);
                var hint = near is null ? "" : $"; did you mean '{near}'?";
                bag.Error(draft.FromLocation, $"'{id}' is fed from '{from}', which is not defined{hint}");
            }
        }
    }

    private HashSet<EquipmentDraft> AssignSystems(Dictionary<string, EquipmentDraft> byId, Service service)
    {
        var children = new Dictionary<string, List<EquipmentDraft>>(StringComparer.Ordinal);
        // In the order read (a dictionary enumerates in insertion order while nothing is removed): file order.
        foreach (var draft in byId.Values)
        {
            if (draft.From is { } from)
            {
                if (!children.TryGetValue(from, out var list))
                {
                    children[from] = list = [];
                }

                list.Add(draft);
            }
        }

        var reached = new HashSet<EquipmentDraft>();
        var queue = new Queue<(string Id, ElectricalSystem? Output)>();
        queue.Enqueue((service.Id, service.System));
        while (queue.Count > 0)
        {
            var (id, output) = queue.Dequeue();
            if (!children.TryGetValue(id, out var fed))
            {
                continue;
            }

            foreach (var child in fed)
            {
                if (!reached.Add(child))
                {
                    continue;
                }

                child.System = output;
                if (output is not null)
                {
                    CheckAgainstSystem(child, id, output);
                }

                queue.Enqueue((child.Id!, child.OutputSystem));
            }
        }

        return reached;
    }

    private void CheckAgainstSystem(EquipmentDraft draft, string sourceId, ElectricalSystem system)
    {
        if (draft.Kind == EquipmentKind.Transformer && draft.Primary is { } primary && !ReferenceEquals(primary, system) && primary.Name != system.Name)
        {
            bag.Error(draft.PrimaryLocation, $"the primary of '{draft.Id}' is {primary.Name}, but it is fed from '{sourceId}', which gives {system.Name}");
        }

        if (draft.OutputSystem is not { } panelSystem)
        {
            return;
        }

        foreach (var circuit in draft.Circuits)
        {
            if (circuit.Poles is { } p && panelSystem.CircuitFor(p) is not null && circuit.StatedPhases is { } phases && !PhaseRules.Fits(phases, p, PhaseRules.Lines(panelSystem)))
            {
                var lines = PhaseRules.Lines(panelSystem) switch { 3 => "A, B and C", 2 => "A and B", _ => "one line, A" };
                bag.Error(circuit.PhaseLocation, $"circuit '{draft.Id}/{circuit.Id}' has {p} pole{(p == 1 ? "" : "s")} and cannot be on {PhaseRules.Text(phases)}; '{draft.Id}' is on {panelSystem.Name}, with {lines}");
            }

            if (circuit.Poles is not { } poles || panelSystem.CircuitFor(poles) is not null)
            {
                continue;
            }

            var name = circuit.Id is null ? $"the circuit at line {circuit.Location.Line}" : $"circuit '{draft.Id}/{circuit.Id}'";
            var why = poles switch
            {
                1 => $"has 1 pole, which needs a neutral; '{draft.Id}' is on {panelSystem.Name}, which has none",
                2 => $"has 2 poles, which need two lines; '{draft.Id}' is on {panelSystem.Name}, which has one line and a neutral",
                _ => $"has 3 poles, which need a three-phase system; '{draft.Id}' is on {panelSystem.Name}, which is single-phase",
            };
            bag.Error(circuit.PolesLocation, $"{name} {why}");
        }
    }

    private void CheckUnreached(ProjectDraft project, Dictionary<string, EquipmentDraft> byId, HashSet<EquipmentDraft> reached, string serviceId)
    {
        // Each piece of equipment has one source, so following 'from' from any unreached entry either
        // ends at an undefined source (already reported) or enters a cycle. Walk iteratively.
        var state = new Dictionary<EquipmentDraft, int>();
        var cycleOf = new Dictionary<EquipmentDraft, EquipmentDraft>();
        foreach (var start in project.Equipment)
        {
            if (start.Id is null || !byId.TryGetValue(start.Id, out var owner) || owner != start || reached.Contains(start) || state.GetValueOrDefault(start) != Unvisited)
            {
                continue;
            }

            var path = new List<EquipmentDraft>();
            var current = start;
            EquipmentDraft? entry = null;
            while (true)
            {
                var s = state.GetValueOrDefault(current);
                if (s == OnPath)
                {
                    var cycle = path.Skip(path.IndexOf(current)).ToList();
                    ReportCycle(cycle);
                    foreach (var member in cycle)
                    {
                        cycleOf[member] = member;
                    }

                    entry = current;
                    break;
                }

                if (s == Done)
                {
                    entry = cycleOf.GetValueOrDefault(current);
                    break;
                }

                state[current] = OnPath;
                path.Add(current);
                if (current.From is not { } from || from == serviceId || !byId.TryGetValue(from, out var next) || reached.Contains(next))
                {
                    break;
                }

                current = next;
            }

            // Everything on the path before the cycle leads into it: not reached from the service.
            for (var i = path.Count - 1; i >= 0; i--)
            {
                var member = path[i];
                state[member] = Done;
                if (entry is null || cycleOf.ContainsKey(member))
                {
                    continue;
                }

                cycleOf[member] = entry;
                bag.Error(member.FromLocation, $"'{member.Id}' is not reached from the service '{serviceId}': following 'from' leads into the feed cycle at '{entry.Id}'");
            }
        }
    }

    private void ReportCycle(List<EquipmentDraft> cycle)
    {
        // Start the message at the member that comes first in the file, then follow 'from'.
        var first = cycle.MinBy(d => (d.Location.Line, d.Location.Column))!;
        var start = cycle.IndexOf(first);
        var ordered = cycle.Skip(start).Concat(cycle.Take(start)).ToList();
        if (ordered.Count == 1)
        {
            bag.Error(first.FromLocation, $"'{first.Id}' is fed from itself: a feed cycle that the service does not reach");
            return;
        }

        var chain = string.Join(", which is fed from ", ordered.Skip(1).Append(first).Select(d => $"'{d.Id}'"));
        bag.Error(first.FromLocation, $"feed cycle: '{first.Id}' is fed from {chain}; the service reaches none of them");
    }
}
