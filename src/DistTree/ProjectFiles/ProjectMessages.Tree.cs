using System.Globalization;
using DistTree.Model;

namespace DistTree.ProjectFiles;

/// <summary>The tree checks' messages (<see cref="FeedChecker"/>): ids, sources, systems, poles and feed cycles.</summary>
internal static partial class ProjectMessages
{
    /// <summary>Equipment that takes the service's id; <paramref name="where"/> says where the service's is.</summary>
    public static string ServiceIdTaken(string id, string where) => $"duplicate id '{id}': it is the service's id ({where})";

    /// <summary>A second equipment with <paramref name="id"/>; <paramref name="where"/> says where the first is.</summary>
    public static string DuplicateEquipment(string id, string where) => $"duplicate equipment id '{id}' (first given at {where})";

    /// <summary>Equipment fed from a source no one defines; <paramref name="near"/> is the closest defined id, if any.</summary>
    public static string UndefinedSource(string id, string from, string? near) =>
        $"'{id}' is fed from '{from}', which is not defined{(near is null ? "" : $"; did you mean '{near}'?")}";

    /// <summary>
    /// A transformer whose stated primary is neither the system its source gives nor a delta primary on it;
    /// <paramref name="delta"/> is the delta primary the source would take, if any.
    /// </summary>
    public static string PrimaryMismatch(string? id, ElectricalSystem primary, string sourceId, ElectricalSystem given, ElectricalSystem? delta) =>
        $"the primary of '{id}' is {primary.Name}, but it is fed from '{sourceId}', which gives {given.Name}" +
        (delta is null || delta.Name == given.Name ? "" : $" (a delta primary on it is {delta.Name})");

    /// <summary>A feeder that states a neutral size on a system with no neutral.</summary>
    public static string NeutralWithoutNeutral(string? id, string sourceId, ElectricalSystem system) =>
        $"'neutral_size' of the feeder of '{id}': it is fed from '{sourceId}', which gives {system.Name}, a system with no neutral";

    /// <summary>A transformer's feeder that states a neutral size where its primary is delta.</summary>
    public static string NeutralOnDeltaPrimary(string? id, ElectricalSystem primary) =>
        $"'neutral_size' of the feeder of '{id}': its primary is {primary.Name}, delta, so the feeder carries three lines and no neutral";

    /// <summary>A transformer's <c>phase</c> on a primary that is not three-phase.</summary>
    public static string TransformerPhaseOnSinglePhase(string? id, string sourceId, ElectricalSystem system) =>
        $"'phase' of '{id}' chooses two lines of a three-phase primary, but it is fed from '{sourceId}', which gives {system.Name}, single-phase";

    /// <summary>A transformer with a three-phase secondary on a primary of fewer than three lines.</summary>
    public static string ThreePhaseSecondaryOnSinglePhase(string? id, ElectricalSystem secondary, string sourceId, ElectricalSystem system) =>
        $"the secondary of '{id}' is {secondary.Name}, three-phase, but it is fed from '{sourceId}', which gives {system.Name}, single-phase: a three-phase secondary needs a three-phase primary";

    /// <summary>A circuit whose stated phases do not fit its poles on its panel's system.</summary>
    public static string PhasesDoNotFit(string? panel, string? circuit, int poles, Phases phases, ElectricalSystem system)
    {
        var lines = PhaseRules.Lines(system) switch { 3 => "A, B and C", 2 => "A and B", _ => "one line, A" };
        return $"circuit '{panel}/{circuit}' has {poles} pole{(poles == 1 ? "" : "s")} and cannot be on {PhaseRules.Text(phases)}; '{panel}' is on {system.Name}, with {lines}";
    }

    /// <summary>A circuit of <paramref name="poles"/> poles that its panel's system cannot give; <paramref name="name"/> names the circuit.</summary>
    public static string PolesNotGiven(string name, int poles, string? panel, ElectricalSystem system) => poles switch
    {
        1 => $"{name} has 1 pole, which needs a neutral; '{panel}' is on {system.Name}, which has none",
        2 => $"{name} has 2 poles, which need two lines; '{panel}' is on {system.Name}, which has one line and a neutral",
        _ => $"{name} has 3 poles, which need a three-phase system; '{panel}' is on {system.Name}, which is single-phase",
    };

    /// <summary>Equipment whose chain of sources leads into a feed cycle at <paramref name="entry"/>.</summary>
    public static string LeadsIntoCycle(string? id, string serviceId, string? entry) =>
        $"'{id}' is not reached from the service '{serviceId}': following 'from' leads into the feed cycle at '{entry}'";

    /// <summary>Equipment fed from itself.</summary>
    public static string FedFromItself(string? id) => $"'{id}' is fed from itself: a feed cycle that the service does not reach";

    /// <summary>
    /// A feed cycle of two or more: <paramref name="first"/> is fed from the rest in order, the last from <paramref name="first"/>
    /// (the last of <paramref name="rest"/>). Past <see cref="ProjectLimits.MaxCycleNames"/> members, the rest are counted.
    /// </summary>
    public static string FeedCycle(string? first, IEnumerable<string?> rest)
    {
        var all = rest.ToList();
        if (all.Count <= ProjectLimits.MaxCycleNames + 1)
        {
            return $"feed cycle: '{first}' is fed from {string.Join(", which is fed from ", all.Select(id => $"'{id}'"))}; the service reaches none of them";
        }

        var named = string.Join(", which is fed from ", all.Take(ProjectLimits.MaxCycleNames).Select(id => $"'{id}'"));
        return string.Create(
            CultureInfo.InvariantCulture,
            $"feed cycle: '{first}' is fed from {named}, and so on through {all.Count - 1 - ProjectLimits.MaxCycleNames:N0} more back to '{all[^1]}' ({all.Count:N0} in all); the service reaches none of them");
    }
}
