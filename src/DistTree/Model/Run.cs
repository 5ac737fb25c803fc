using DistTree.Conductors;
using DistTree.Diagnostics;

namespace DistTree.Model;

/// <summary>
/// The conductors of one feeder or branch circuit, as the project gives them (defaults applied).
/// </summary>
public sealed record Run
{
    /// <summary>One-way length in metres, service side to load side.</summary>
    public required double LengthM { get; init; }

    /// <summary>The conductor size of each phase conductor.</summary>
    public required ConductorSize Size { get; init; }

    /// <summary>
    /// The size of the neutral of each set, where the circuit has one and it differs from the lines; null for a
    /// neutral the size of the lines.
    /// </summary>
    public ConductorSize? NeutralSize { get; init; }

    /// <summary>
    /// The size of the equipment grounding conductor in each set, where the project states one (<c>ground_size</c>);
    /// null where it states none (then none is checked: the results still give the minimum).
    /// </summary>
    public ConductorSize? GroundSize { get; init; }

    /// <summary>Number of parallel sets (1 or more).</summary>
    public int Sets { get; init; } = 1;

    /// <summary>Conductor metal.</summary>
    public required Material Material { get; init; }

    /// <summary>Insulation rating in °C.</summary>
    public required int InsulationC { get; init; }

    /// <summary>Raceway kind.</summary>
    public required Raceway Raceway { get; init; }

    /// <summary>
    /// The raceway or cable the run shares with other runs, by a name the project gives (<c>raceway_id</c>), or null:
    /// the current-carrying conductors of every run that names it count together for the ampacity adjustment.
    /// </summary>
    public string? RacewayId { get; init; }

    /// <summary>
    /// The current-carrying conductors in the run's raceway or cable, all runs together, as the project states them
    /// (<c>current_carrying</c>), or null to count them (the run's own, or its shared raceway's).
    /// </summary>
    public int? CurrentCarrying { get; init; }

    /// <summary>Overcurrent device rating in amperes protecting the run, if stated.</summary>
    public double? OcpdA { get; init; }

    /// <summary>The kind of that device (<c>device_type</c>): a circuit-breaker unless stated.</summary>
    public DeviceType DeviceType { get; init; } = DeviceType.Breaker;

    /// <summary>
    /// How fast the device trips on a large fault (<c>trip</c>), or null for the rule set's default (see
    /// <c>CodeRules.InstantaneousTripA</c>).
    /// </summary>
    public TripSetting? Trip { get; init; }

    /// <summary>
    /// The reference method of installation (<c>installation_method</c>), which column of IEC 60364-5-52's tables gives
    /// the ampacity under <c>rules: code: iec</c>: B1 unless stated. The NEC's table has one column and ignores it.
    /// </summary>
    public InstallationMethod InstallationMethod { get; init; } = InstallationMethod.B1;

    /// <summary>
    /// The conductors of the run's circuit that carry the load current in normal service, as IEC 60364-5-52's tables
    /// count them: 2 for a single-phase or two-wire circuit, 3 for a three-phase one. Set by the loader from the circuit's
    /// poles or the feeder's system; 3 where not set.
    /// </summary>
    public int LoadedConductors { get; init; } = 3;

    /// <summary>How the run is installed, as the ampacity tables read it.</summary>
    public Installation Installation => new(InstallationMethod, LoadedConductors);

    /// <summary>A limit for this run alone in percent, overriding the rules' feeder or branch limit.</summary>
    public double? LimitPercent { get; init; }

    /// <summary>
    /// The overcurrent device and its assembly are marked for continuous operation at 100 % of their rating
    /// (<c>device_rated_continuous</c>): the continuous load then counts at 100 %, not 125 %, in the lines' design
    /// current (NEC 210.19(A)(1) and 215.2(A)(1) Exception No. 1; CEC Rule 8-104; recalled).
    /// </summary>
    public bool DeviceRatedContinuous { get; init; }

    /// <summary>Pinned by the user: upsizing must keep this size.</summary>
    public bool Fixed { get; init; }

    /// <summary>Where the run's mapping starts in the project file.</summary>
    public SourceLocation Location { get; init; } = SourceLocation.None;

    /// <summary>Where the run's <c>size</c> value is in the project file (for edits and findings).</summary>
    public SourceLocation SizeLocation { get; init; } = SourceLocation.None;
}
