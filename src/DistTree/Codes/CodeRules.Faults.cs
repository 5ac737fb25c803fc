using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Codes;

/// <summary>How a rule set judges the short-circuit study (see <c>FaultSolver</c>): equipment ratings and fault clearing.</summary>
public abstract partial class CodeRules
{
    /// <summary>
    /// The multiple of a breaker's rating at which it trips without delay where the project states no <c>trip</c>: 10, the
    /// top of IEC 60898-1's class C band and the usual instantaneous setting of a thermal-magnetic breaker (common
    /// practice; recalled).
    /// </summary>
    public const double DefaultTripMultiple = 10;

    /// <summary>
    /// The current that trips <paramref name="conductors"/>' device without delay, amperes; null where it is not known: no
    /// device stated, or a fuse without a stated multiple (a fuse's clearing current is read from its own time-current
    /// curve). <see cref="TripBasis"/> says how it was taken.
    /// </summary>
    public double? InstantaneousTripA(Run conductors)
    {
        ArgumentNullException.ThrowIfNull(conductors);
        return conductors switch
        {
            { OcpdA: null } => null,
            { Trip: { } trip, OcpdA: { } ocpd } => trip.Multiple * ocpd,
            { DeviceType: DeviceType.Fuse } => null,
            { OcpdA: { } ocpd } => DefaultTripMultiple * ocpd,
        };
    }

    /// <summary>How <see cref="InstantaneousTripA"/> was taken for <paramref name="conductors"/>' device, in words.</summary>
    public static string TripBasis(Run conductors)
    {
        ArgumentNullException.ThrowIfNull(conductors);
        if (conductors.OcpdA is not { } ocpd)
        {
            return "no device stated";
        }

        var device = Words.DeviceType.Of(conductors.DeviceType);
        return conductors.Trip switch
        {
            { } trip => FormattableString.Invariant($"{trip.Name}: {trip.Multiple:0.##} × the {ocpd:0.#} A {device}"),
            null when conductors.DeviceType == DeviceType.Fuse => FormattableString.Invariant($"a {ocpd:0.#} A fuse: state 'trip' as the multiple of its rating that clears it in time"),
            null => FormattableString.Invariant($"default {DefaultTripMultiple:0} × the {ocpd:0.#} A {device} (state 'trip')"),
        };
    }

    /// <summary>The finding of a far end <paramref name="farEnd"/> of <paramref name="run"/> whose minimum fault current does not trip its device without delay.</summary>
    internal Finding FaultClearingFinding(NetworkRun run, FarEndFault farEnd)
    {
        ArgumentNullException.ThrowIfNull(run);
        var trip = farEnd.TripCurrentA ?? 0;
        var fault = farEnd.Kind switch
        {
            FaultKind.LineToGround => $"line to ground through the {farEnd.GroundSize} {GroundingConductorTerm}",
            FaultKind.LineToNeutral => "line to neutral",
            FaultKind.LineToLine => "line to line",
            FaultKind.ThreePhase => "three-phase",
        };
        return Finding.Written(
            FindingKind.FaultClearing,
            Cite(CodeCheck.FaultClearing),
            run.Id,
            farEnd.MinimumCurrentA,
            trip,
            $"{Words.Noun(run.Kind)} {run.Id}: a fault at its far end ({fault}) draws at least {farEnd.MinimumCurrentA:0} A, below the {trip:0} A that trips its device without delay ({farEnd.TripBasis})",
            run.Conductors.Location);
    }

    /// <summary>The finding of <paramref name="equipment"/> rated below the <paramref name="largestKa"/> available at it.</summary>
    internal Finding InterruptingFinding(Equipment equipment, EquipmentFault fault, double largestKa)
    {
        ArgumentNullException.ThrowIfNull(equipment);
        ArgumentNullException.ThrowIfNull(fault);
        var rating = equipment.InterruptingKa ?? 0;
        var which = fault.AvailableFaultCurrentLgKa is { } lg && lg >= largestKa ? "line to ground" : (PhaseRules.Lines(equipment.OutputSystem) == 3 ? "three-phase" : "between conductors");
        var where = equipment.Kind == EquipmentKind.Transformer ? " at its secondary terminals" : "";
        return Finding.Written(
            FindingKind.InterruptingRating,
            Cite(CodeCheck.InterruptingRating),
            equipment.Id,
            largestKa,
            rating,
            $"{Words.EquipmentKind.Of(equipment.Kind)} {equipment.Id}: {largestKa:0.0} kA ({which}) is available{where}, above its {rating:0.#} kA rating",
            equipment.Location);
    }
}
