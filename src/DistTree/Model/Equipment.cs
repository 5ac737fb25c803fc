using DistTree.Diagnostics;

namespace DistTree.Model;

/// <summary>What a piece of equipment is.</summary>
public enum EquipmentKind
{
    /// <summary>A switchboard or distribution board.</summary>
    Switchboard,

    /// <summary>A panelboard; it may have branch circuits.</summary>
    Panelboard,

    /// <summary>A step-down (or step-up) transformer.</summary>
    Transformer,

    /// <summary>A splitter or tap box.</summary>
    Splitter,
}

/// <summary>A transformer's nameplate data.</summary>
/// <param name="Kva">Rating in kVA.</param>
/// <param name="Secondary">The secondary system.</param>
/// <param name="ImpedancePercent">Percent impedance %Z.</param>
/// <param name="XOverR">Reactance-to-resistance ratio.</param>
/// <param name="TapPercent">
/// The primary tap as the nameplate gives it, percent of the primary's rated voltage: +2.5 adds 2.5 % to the
/// primary turns, so the secondary stands 1/1.025 of its rating at rated primary voltage (a tap for a high supply).
/// </param>
public sealed record TransformerData(double Kva, ElectricalSystem Secondary, double ImpedancePercent, double XOverR, double TapPercent)
{
    /// <summary>
    /// The primary lines a single-phase transformer on a three-phase primary is connected across: AB (the
    /// default), BC or CA. Not read for a three-phase transformer or a single-phase primary.
    /// </summary>
    public Phases PrimaryPhases { get; init; } = Phases.AB;

    /// <summary>
    /// How far from 0 the upsizer may set the tap (<c>tap_range_percent</c>), percent, in 2.5 % steps: 5 (the default, the
    /// common ±2 × 2.5 % taps), 2.5, or 0 (the tap stays as stated).
    /// </summary>
    public double TapRangePercent { get; init; } = 5;

    /// <summary>The nameplate's tap positions, percent: ±2 × 2.5 % (common practice).</summary>
    public static IReadOnlyList<double> TapSteps { get; } = [-5, -2.5, 0, 2.5, 5];
}

/// <summary>A switchboard, panelboard, transformer or splitter, fed from its source by an optional feeder.</summary>
public sealed record Equipment
{
    /// <summary>The equipment's id, unique in the project.</summary>
    public required string Id { get; init; }

    /// <summary>What it is.</summary>
    public required EquipmentKind Kind { get; init; }

    /// <summary>The id of the service or equipment that feeds it.</summary>
    public required string From { get; init; }

    /// <summary>The system its feeder carries (its source's system; a transformer's primary).</summary>
    public required ElectricalSystem System { get; init; }

    /// <summary>The feeder from its source, or null when it stands at its source (no run, no drop).</summary>
    public Run? Feeder { get; init; }

    /// <summary>Demand factor applied to everything it feeds (1.0 = none).</summary>
    public double DemandFactor { get; init; } = 1.0;

    /// <summary>Nameplate data when <see cref="Kind"/> is a transformer.</summary>
    public TransformerData? Transformer { get; init; }

    /// <summary>Branch circuits (panelboards and switchboards; never transformers or splitters).</summary>
    public IReadOnlyList<Circuit> Circuits { get; init; } = [];

    /// <summary>
    /// The short-circuit current its devices can interrupt, or the assembly's short-circuit current rating, kA
    /// (<c>interrupting_ka</c>), or null where the project states none.
    /// </summary>
    public double? InterruptingKa { get; init; }

    /// <summary>
    /// The rating of its main device, or of its main lugs (its bus) where it has none, A (<c>main_a</c>), or null where the
    /// project states none; never on a transformer. Its feeder lands on the terminals of that rating, so the upsizer proposes
    /// no feeder size they do not accept (see <see cref="Conductors.TerminalTable"/>).
    /// </summary>
    public double? MainA { get; init; }

    /// <summary>Where the equipment is in the project file.</summary>
    public SourceLocation Location { get; init; } = SourceLocation.None;

    /// <summary>The system of what it feeds: the secondary for a transformer, else its own system.</summary>
    public ElectricalSystem OutputSystem => Transformer?.Secondary ?? System;
}
