using DistTree.Diagnostics;
using DistTree.Model;
using QuikGraph;
using QuikGraph.Algorithms.Search;

namespace DistTree.ProjectFiles;

/// <summary>
/// The checks that need the whole tree: duplicate ids, sources that do not exist; then, walking down
/// the feeds from the service (a breadth-first search), each equipment's system and the checks
/// that depend on it (a transformer's primary, the circuits a panel's system can give); then feed cycles
/// and the equipment the service does not reach (QuikGraph's depth-first search along 'from').
/// </summary>
internal sealed class FeedChecker(DiagnosticBag bag)
{
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
        CheckUnreached(byId, reached, service.Id);
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
                bag.Error(draft.IdLocation, ProjectMessages.ServiceIdTaken(id, Where(service.Location, draft.IdLocation)));
            }
            else if (byId.TryGetValue(id, out var first))
            {
                bag.Error(draft.IdLocation, ProjectMessages.DuplicateEquipment(id, Where(first.IdLocation, draft.IdLocation)));
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
        var hintWork = ProjectLimits.MaxHintWork;
        foreach (var draft in project.Equipment)
        {
            if (bag.IsFull)
            {
                // No more errors are reported: spare the hints, each of which looks at every id.
                break;
            }

            if (draft.From is { } from && draft.Id is { } id && from != serviceId && !byId.ContainsKey(from))
            {
                bag.Error(draft.FromLocation, ProjectMessages.UndefinedSource(id, from, Suggestions.Closest(from, known, ref hintWork)));
            }
        }
    }

    // A breadth-first search (a queue, no recursion) down the feeds from the service: each piece of equipment takes its
    // source's output system when first reached, in the order the loader has always checked them, each source's
    // equipment in file order. Returns the equipment reached. A search of its own rather than QuikGraph's, which keeps
    // a colour per id in a dictionary of a value type, compiled on every run (DEVELOPERS.md, Start-up).
    private HashSet<EquipmentDraft> AssignSystems(Dictionary<string, EquipmentDraft> byId, Service service)
    {
        // Per defined source, the equipment it feeds in file order (a dictionary enumerates in insertion order while
        // nothing is removed).
        var fed = new Dictionary<string, List<EquipmentDraft>>(byId.Count + 1, StringComparer.Ordinal);
        foreach (var draft in byId.Values)
        {
            if (draft.From is { } from && (from == service.Id || byId.ContainsKey(from)))
            {
                if (!fed.TryGetValue(from, out var list))
                {
                    fed[from] = list = [];
                }

                list.Add(draft);
            }
        }

        var reached = new HashSet<EquipmentDraft>();
        var queue = new Queue<string>();
        queue.Enqueue(service.Id);
        while (queue.TryDequeue(out var source))
        {
            if (!fed.TryGetValue(source, out var children))
            {
                continue;
            }

            var output = source == service.Id ? service.System : byId[source].OutputSystem;
            foreach (var child in children)
            {
                // The service's own id and equipment reached before are not entered again.
                if (child.Id == service.Id || !reached.Add(child))
                {
                    continue;
                }

                child.System = output;
                if (output is not null)
                {
                    child.System = CheckAgainstSystem(child, source, output);
                }

                queue.Enqueue(child.Id!);
            }
        }

        return reached;
    }

    // A delta primary (three lines, no neutral; the primary winding of a Dyn1 or a single-phase transformer across two
    // lines) takes any three-phase system of its line-to-line voltage: 600D on 600Y/347, 480D on 480Y/277 or 480D.
    private static bool IsDeltaOn(ElectricalSystem primary, ElectricalSystem given) =>
        primary is { Phases: 3, HasNeutral: false } && given.Phases == 3 && primary.LineToLineV == given.LineToLineV;

    // The delta system of the given system's line-to-line voltage, if the project knows one.
    private static ElectricalSystem? DeltaOf(ElectricalSystem given) =>
        given.Phases == 3 ? ElectricalSystem.Find(FormattableString.Invariant($"{given.LineToLineV:0}D")) : null;

    // Checks a piece of equipment against the system its source gives; returns the system its feeder carries: the
    // source's, or a transformer's delta primary on it.
    private ElectricalSystem CheckAgainstSystem(EquipmentDraft draft, string sourceId, ElectricalSystem system)
    {
        var carried = system;
        if (draft.Kind == EquipmentKind.Transformer && draft.Primary is { } primary && primary.Name != system.Name)
        {
            if (IsDeltaOn(primary, system))
            {
                carried = primary;
            }
            else
            {
                bag.Error(draft.PrimaryLocation, ProjectMessages.PrimaryMismatch(draft.Id, primary, sourceId, system, DeltaOf(system)));
            }
        }

        // A feeder carries its source's system (a transformer's feeder, its primary): a neutral needs one there.
        if (draft.FeederNeutralLocation is { } neutralAt && !carried.HasNeutral)
        {
            bag.Error(neutralAt, ReferenceEquals(carried, system)
                ? ProjectMessages.NeutralWithoutNeutral(draft.Id, sourceId, system)
                : ProjectMessages.NeutralOnDeltaPrimary(draft.Id, carried));
        }

        if (draft.Kind == EquipmentKind.Transformer)
        {
            CheckPrimary(draft, sourceId, system);
        }

        if (draft.OutputSystem is not { } panelSystem)
        {
            return carried;
        }

        foreach (var circuit in draft.Circuits)
        {
            if (circuit.Poles is { } p && panelSystem.CircuitFor(p) is not null && circuit.StatedPhases is { } phases && !PhaseRules.Fits(phases, p, PhaseRules.Lines(panelSystem)))
            {
                bag.Error(circuit.PhaseLocation, ProjectMessages.PhasesDoNotFit(draft.Id, circuit.Id, p, phases, panelSystem));
            }

            if (circuit.Poles is not { } poles || panelSystem.CircuitFor(poles) is not null)
            {
                continue;
            }

            var name = circuit.Id is null ? $"the circuit at line {circuit.Location.Line}" : $"circuit '{draft.Id}/{circuit.Id}'";
            bag.Error(circuit.PolesLocation, ProjectMessages.PolesNotGiven(name, poles, draft.Id, panelSystem));
        }

        return carried;
    }

    // A transformer's lines against its primary: the two lines a single-phase one is across are lines of a
    // three-phase primary, and a three-phase secondary needs a three-phase primary.
    private void CheckPrimary(EquipmentDraft transformer, string sourceId, ElectricalSystem primary)
    {
        if (transformer.PrimaryPhasesLocation is { } phaseAt && primary.Phases != 3)
        {
            bag.Error(phaseAt, ProjectMessages.TransformerPhaseOnSinglePhase(transformer.Id, sourceId, primary));
        }

        if (transformer.Transformer?.Secondary is { Phases: 3 } secondary && PhaseRules.Lines(primary) < 3)
        {
            bag.Error(transformer.SecondaryLocation, ProjectMessages.ThreePhaseSecondaryOnSinglePhase(transformer.Id, secondary, sourceId, primary));
        }
    }

    // Each piece of equipment has one source, so following 'from' from any unreached entry either ends at an
    // undefined source (already reported) or enters a cycle. QuikGraph's depth-first search (its own stack, no
    // recursion) follows 'from' over the unreached equipment, starting from each not yet visited in file order:
    // an edge back into the walk closes a cycle, an edge to an earlier walk leads where that walk led, and each
    // piece of equipment is finished in the reverse of the walk, which is the order its error is reported in.
    private void CheckUnreached(Dictionary<string, EquipmentDraft> byId, HashSet<EquipmentDraft> reached, string serviceId)
    {
        var unreached = new AdjacencyGraph<EquipmentDraft, Edge<EquipmentDraft>>(allowParallelEdges: true);
        unreached.AddVertexRange(byId.Values.Where(draft => !reached.Contains(draft)));
        if (unreached.IsVerticesEmpty)
        {
            return;
        }

        foreach (var draft in unreached.Vertices.ToList())
        {
            if (draft.From is { } from && byId.TryGetValue(from, out var source) && unreached.ContainsVertex(source))
            {
                unreached.AddEdge(new Edge<EquipmentDraft>(draft, source));
            }
        }

        var walk = new List<EquipmentDraft>();
        // The cycle each piece of equipment leads into, named by the member a walk entered it at; a member: itself.
        var cycleOf = new Dictionary<EquipmentDraft, EquipmentDraft>();
        EquipmentDraft? entry = null;
        var search = new DepthFirstSearchAlgorithm<EquipmentDraft, Edge<EquipmentDraft>>(unreached);
        search.StartVertex += _ => entry = null;
        search.DiscoverVertex += walk.Add;
        search.BackEdge += feed =>
        {
            var cycle = walk[walk.IndexOf(feed.Target)..];
            ReportCycle(cycle);
            foreach (var member in cycle)
            {
                cycleOf[member] = member;
            }

            entry = feed.Target;
        };
        search.ForwardOrCrossEdge += feed => entry = cycleOf.GetValueOrDefault(feed.Target);
        search.FinishVertex += member =>
        {
            walk.RemoveAt(walk.Count - 1);
            if (entry is null || cycleOf.ContainsKey(member))
            {
                return;
            }

            // Everything on the walk before the cycle leads into it: not reached from the service.
            cycleOf[member] = entry;
            bag.Error(member.FromLocation, ProjectMessages.LeadsIntoCycle(member.Id, serviceId, entry.Id));
        };
        search.Compute();
    }

    private void ReportCycle(List<EquipmentDraft> cycle)
    {
        // Start the message at the member that comes first in the file, then follow 'from'.
        var first = cycle.MinBy(d => (d.Location.Line, d.Location.Column))!;
        var start = cycle.IndexOf(first);
        var ordered = cycle.Skip(start).Concat(cycle.Take(start)).ToList();
        if (ordered.Count == 1)
        {
            bag.Error(first.FromLocation, ProjectMessages.FedFromItself(first.Id));
            return;
        }

        bag.Error(first.FromLocation, ProjectMessages.FeedCycle(first.Id, ordered.Skip(1).Append(first).Select(d => d.Id)));
    }
}
