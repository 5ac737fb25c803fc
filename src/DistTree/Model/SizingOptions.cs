using DistTree.Conductors;

namespace DistTree.Model;

/// <summary>Choices for the upsizer, from the project's <c>sizing</c> section.</summary>
public sealed record SizingOptions
{
    /// <summary>The most parallel sets a feeder may be given, or null to keep each feeder's own sets.</summary>
    public int? MaxSets { get; init; }

    /// <summary>Price per metre of one conductor by size; empty to minimise material (mm²·m) instead.</summary>
    public IReadOnlyDictionary<ConductorSize, double> Prices { get; init; } = new Dictionary<ConductorSize, double>();

    /// <summary>The prices' unit (e.g. <c>USD</c>), or empty.</summary>
    public string Currency { get; init; } = "";

    /// <summary>The grid in percentage points on which the optimiser rounds drop budgets up (the safe side).</summary>
    public double ResolutionPercent { get; init; } = 0.001;

    /// <summary>
    /// The table of the largest conductor a device's terminals accept that the project brings (<c>sizing: terminal_table</c>),
    /// read by the loader; null for the embedded one (<see cref="Conductors.TerminalTable.Standard"/>).
    /// </summary>
    public Conductors.TerminalTable? TerminalTable { get; init; }

    /// <summary>What setting a transformer's tap to another position costs, in the plan's cost unit (<c>sizing: tap_cost</c>); 0: free.</summary>
    public double TapCost { get; init; }

    /// <summary>
    /// How far above nominal a bus may stand at no load with the source at nominal, percent (<c>sizing:
    /// light_load_rise_percent</c>): the upsizer takes no raising tap that would put any bus below it higher. 5 by default
    /// (ANSI C84.1's Range A upper limit at the service and utilization points, +5 %: recalled, not read).
    /// </summary>
    public double LightLoadRisePercent { get; init; } = 5;

    /// <summary>The defaults: keep sets, minimise material, 0.001 percentage points.</summary>
    public static SizingOptions Default { get; } = new();
}
