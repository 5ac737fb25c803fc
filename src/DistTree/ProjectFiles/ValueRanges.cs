using DistTree.Model;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles;

/// <summary>
/// The range of every numeric key of a project file, in one place: the section readers check each value against
/// its range where they read it (a located error outside it), <c>schema/project.schema.json</c> gives the same
/// bounds (minimum, maximum, exclusiveMinimum, exclusiveMaximum) and <c>docs/project-file.md</c> the same words;
/// a test keeps the three in step (<see cref="All"/>). Each range keeps the figures a valid project gives finite,
/// and its ends are what buildings have, with room to spare; the reason is beside each.
/// </summary>
public static class ValueRanges
{
    /// <summary>The longest run, and the farthest point along one: 100 km, in metres (no building feeder comes near).</summary>
    public const double MaxLengthM = 100_000;

    /// <summary>
    /// The same bound for a length in feet: 328,084 ft (100 km is 328,083.99 ft). A bare number may be in either unit,
    /// so the schema states this, the larger.
    /// </summary>
    public const double MaxLengthFt = 328_084;

    /// <summary>The most parallel sets of a run, and the most the sizer may give (40: the generator's own bound).</summary>
    public const int MaxSets = 40;

    /// <summary>A drop limit, percent of the nominal voltage: more than nothing, less than all of it.</summary>
    public static readonly NumberRange LimitPercent = NumberRange.Open(0, 100, "%");

    /// <summary>
    /// A fixed conductor temperature, °C: above 0, at most 250 (the short-circuit limit of 90 °C insulation, the
    /// hottest any insulation lets a conductor be even for seconds: IEC 60364-4-43 Table 43A, XLPE and EPR; memory).
    /// </summary>
    public static readonly NumberRange ConductorTemperatureC = NumberRange.AboveUpTo(0, 250, "°C");

    /// <summary>
    /// Ambient temperature, °C: the coldest and hottest places cables are laid in (−60 outdoors in the far north; 90
    /// is past every correction table, whose ampacities reach zero at the insulation's rating). Below about −234 °C
    /// copper's resistance by its temperature coefficient would be negative.
    /// </summary>
    public static readonly NumberRange AmbientC = NumberRange.Closed(-60, 90, "°C");

    /// <summary>The sizer's parallel sets: 1 to <see cref="MaxSets"/> (each more set is tried for every size).</summary>
    public static readonly NumberRange MaxSetsRange = NumberRange.WholeNumbers(1, MaxSets);

    /// <summary>
    /// The sizer's grid, percent: at least 0.001 (the default; with a limit below 100 % the grid has at most 100,000
    /// steps, and the sizer keeps two bytes a step for every feeder), at most 1 (coarser wastes copper).
    /// </summary>
    public static readonly NumberRange ResolutionPercent = NumberRange.Closed(0.001, 1, "%");

    /// <summary>A price per metre of one conductor: above 0, at most a million (the sums stay finite).</summary>
    public static readonly NumberRange Price = NumberRange.AboveUpTo(0, 1_000_000, "");

    /// <summary><c>sizing: tap_cost</c>: what setting a transformer's tap costs, in the plan's cost unit (0: free).</summary>
    public static readonly NumberRange TapCost = NumberRange.Closed(0, 1_000_000_000, "");

    /// <summary>
    /// <c>sizing: light_load_rise_percent</c>: how far above nominal a bus may stand at no load for a raising tap to be
    /// taken, percent: 0 (no raise above nominal) to 10 (twice the +5 % of ANSI C84.1's Range A, recalled).
    /// </summary>
    public static readonly NumberRange LightLoadRisePercent = NumberRange.Closed(0, 10, "%");

    /// <summary>A transformer's <c>tap_range_percent</c>: how far from 0 the optimiser may set its tap, in 2.5 % steps.</summary>
    public static readonly NumberRange TapRangePercent = NumberRange.Closed(0, 5, "%");

    /// <summary>
    /// The supply frequency, Hz: mains frequencies, 50 and 60 with room (the catalogue's reactances are at 60 Hz and
    /// scale with it; the skin and proximity effect follow IEC 60287-1-1, which is for power frequencies).
    /// </summary>
    public static readonly NumberRange FrequencyHz = NumberRange.Closed(40, 70, "Hz");

    /// <summary>
    /// The utility's available three-phase fault current at the service, kA: 0.1 (a 100 A short-circuit current, less
    /// than any service gives) to 300 (beyond any building service); below it the source's impedance is not a number.
    /// </summary>
    public static readonly NumberRange AvailableFaultCurrentKa = NumberRange.Closed(0.1, 300, "kA");

    /// <summary>The X/R ratio of the utility's source impedance: above 0, at most 100.</summary>
    public static readonly NumberRange FaultXOverR = NumberRange.AboveUpTo(0, 100, "");

    /// <summary>A voltage factor c of a short-circuit calculation: 0.8 to 1.2 (IEC 60909-0 uses 0.95 to 1.10 at low voltage).</summary>
    public static readonly NumberRange VoltageFactor = NumberRange.Closed(0.8, 1.2, "");

    /// <summary>The rating of the utility's transformer at the service, kVA: 5 to 10,000.</summary>
    public static readonly NumberRange UtilityKva = NumberRange.Closed(5, 10_000, "kVA");

    /// <summary>An equipment's interrupting or short-circuit current rating, kA: 1 to 300.</summary>
    public static readonly NumberRange InterruptingKa = NumberRange.Closed(1, 300, "kA");

    /// <summary>A breaker's instantaneous trip as a multiple of its rating: above 1, at most 50.</summary>
    public static readonly NumberRange TripMultiple = NumberRange.AboveUpTo(1, 50, "");

    /// <summary>A demand factor: above 0, at most 2 (above 1 is a warning: it raises the load it applies to).</summary>
    public static readonly NumberRange DemandFactor = NumberRange.AboveUpTo(0, 2, "");

    /// <summary>A transformer's rating, kVA: at least 0.05 (a control transformer), at most 100,000 (a large substation).</summary>
    public static readonly NumberRange Kva = NumberRange.Closed(0.05, 100_000, "kVA");

    /// <summary>A transformer's %Z: above 0, below 50 (distribution transformers have 1 to 15 %).</summary>
    public static readonly NumberRange ImpedancePercent = NumberRange.Open(0, 50, "%");

    /// <summary>A transformer's X/R: above 0, below 100 (distribution transformers have 1 to 30 or so).</summary>
    public static readonly NumberRange XOverR = NumberRange.Open(0, 100, "");

    /// <summary>A transformer's tap, percent: −5 to 5 (then in 2.5 % steps, checked by the reader).</summary>
    public static readonly NumberRange TapPercent = NumberRange.Closed(-5, 5, "%");

    /// <summary>A length or a point's distance, metres: above 0, at most <see cref="MaxLengthM"/>.</summary>
    public static readonly NumberRange LengthM = NumberRange.AboveUpTo(0, MaxLengthM, "m");

    /// <summary>
    /// The current-carrying conductors in a run's raceway or cable, as stated: 1 to 200 (the adjustment's last band
    /// starts at 41; a count beyond 200 in one raceway is a typo).
    /// </summary>
    public static readonly NumberRange CurrentCarrying = NumberRange.WholeNumbers(1, 200);

    /// <summary>A run's parallel sets: 1 to <see cref="MaxSets"/>.</summary>
    public static readonly NumberRange Sets = NumberRange.WholeNumbers(1, MaxSets);

    /// <summary>An overcurrent device, A: above 0, at most 6000 (the largest standard rating, NEC 240.6(A)).</summary>
    public static readonly NumberRange OcpdA = NumberRange.AboveUpTo(0, 6000, "A");

    /// <summary>A load in VA: 0 (a spare) to 100 MVA.</summary>
    public static readonly NumberRange Va = NumberRange.Closed(0, 1e8, "VA");

    /// <summary>A load in kVA: 0 to 100 MVA.</summary>
    public static readonly NumberRange LoadKva = NumberRange.Closed(0, 1e5, "kVA");

    /// <summary>A load in kW: 0 to 100 MW.</summary>
    public static readonly NumberRange LoadKw = NumberRange.Closed(0, 1e5, "kW");

    /// <summary>A load in amperes: 0 to 100 kA.</summary>
    public static readonly NumberRange Amps = NumberRange.Closed(0, 1e5, "A");

    /// <summary>A motor's horsepower: above 0, at most 500 (the largest rating of the full-load current tables).</summary>
    public static readonly NumberRange Hp = NumberRange.AboveUpTo(0, 500, "hp");

    /// <summary>A motor's full-load amperes: 0 to 10 kA.</summary>
    public static readonly NumberRange Fla = NumberRange.Closed(0, 1e4, "A");

    /// <summary>Air-conditioning equipment's nameplate minimum circuit ampacity: above 0, at most 10 kA (as <c>fla</c>).</summary>
    public static readonly NumberRange MinimumCircuitAmpacity = NumberRange.AboveUpTo(0, 1e4, "A");

    /// <summary>
    /// Air-conditioning equipment's nameplate maximum overcurrent device: above 0, at most 6 kA (the largest standard
    /// rating of fuses and breakers; NEC 240.6(A), memory).
    /// </summary>
    public static readonly NumberRange MaximumOvercurrentDevice = NumberRange.AboveUpTo(0, 6000, "A");

    /// <summary>
    /// A power factor, running or starting: 0.05 to 1 (a large motor starts at 0.15 or so; a lower bound keeps a load
    /// given in kW finite as power).
    /// </summary>
    public static readonly NumberRange PowerFactor = NumberRange.Closed(0.05, 1, "");

    /// <summary>Locked-rotor over full-load current: 1 to 20 (induction motors take 4 to 12 or so).</summary>
    public static readonly NumberRange LockedRotorMultiple = NumberRange.Closed(1, 20, "");

    /// <summary>
    /// Every ranged key: where the schema holds it (<c>rules</c>, <c>sizing</c>, <c>service</c> under the top-level
    /// properties; <c>equipment</c>, <c>circuit</c>, <c>run</c>, <c>load</c>, <c>point</c> under <c>$defs</c>;
    /// <c>prices</c> is the prices' values), its key and its range.
    /// </summary>
    public static IReadOnlyList<(string Section, string Key, NumberRange Range)> All => Every.Ranges;

    // The list is made when first asked for (the tests ask), not with the ranges a load reads:
    // a list of these tuples (value types) is compiled at start (DEVELOPERS.md, Start-up).
    private static class Every
    {
        internal static readonly IReadOnlyList<(string Section, string Key, NumberRange Range)> Ranges =
        [
            ("rules", "feeder_limit_percent", LimitPercent),
            ("rules", "branch_limit_percent", LimitPercent),
            ("rules", "total_limit_percent", LimitPercent),
            ("rules", "lighting_limit_percent", LimitPercent),
            ("rules", "motor_start_limit_percent", LimitPercent),
            ("rules", "conductor_temperature", ConductorTemperatureC),
            ("rules", "ambient_c", AmbientC),
            ("rules", "fault_voltage_factor_max", VoltageFactor),
            ("rules", "fault_voltage_factor_min", VoltageFactor),
            ("sizing", "max_sets", MaxSetsRange),
            ("sizing", "resolution_percent", ResolutionPercent),
            ("sizing", "prices", Price),
            ("sizing", "tap_cost", TapCost),
            ("sizing", "light_load_rise_percent", LightLoadRisePercent),
            ("service", "frequency_hz", FrequencyHz),
            ("service", "available_fault_current_ka", AvailableFaultCurrentKa),
            ("service", "fault_x_r", FaultXOverR),
            ("service", "utility_transformer_kva", UtilityKva),
            ("service", "utility_transformer_impedance_percent", ImpedancePercent),
            ("equipment", "interrupting_ka", InterruptingKa),
            ("equipment", "main_a", OcpdA),
            ("equipment", "demand_factor", DemandFactor),
            ("equipment", "kva", Kva),
            ("equipment", "impedance_percent", ImpedancePercent),
            ("equipment", "x_r", XOverR),
            ("equipment", "tap_percent", TapPercent),
            ("equipment", "tap_range_percent", TapRangePercent),
            ("circuit", "ocpd", OcpdA),
            ("run", "length", LengthM),
            ("run", "sets", Sets),
            ("run", "current_carrying", CurrentCarrying),
            ("run", "ocpd", OcpdA),
            ("run", "limit_percent", LimitPercent),
            ("run", "trip", TripMultiple),
            ("point", "at", LengthM),
            .. Words.LoadQuantity.Pairs.Select(p => ("load", p.Word, Of(p.Value))),
            ("load", "pf", PowerFactor),
            ("load", "starting_pf", PowerFactor),
            ("load", "lrc_multiple", LockedRotorMultiple),
            ("load", "mca", MinimumCircuitAmpacity),
            ("load", "mocp", MaximumOvercurrentDevice),
        ];
    }

    /// <summary>The range of a load quantity, by the quantity's kind.</summary>
    public static NumberRange Of(LoadKind kind) => kind switch
    {
        LoadKind.Va => Va,
        LoadKind.Kva => LoadKva,
        LoadKind.Kw => LoadKw,
        LoadKind.Amps => Amps,
        LoadKind.Hp => Hp,
        LoadKind.Fla => Fla,
    };
}
