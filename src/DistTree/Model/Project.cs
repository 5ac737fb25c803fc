using DistTree.Diagnostics;

namespace DistTree.Model;

/// <summary>The unit of bare lengths in a project file.</summary>
public enum UnitSystem
{
    /// <summary>Metres.</summary>
    Metric,

    /// <summary>Feet.</summary>
    Imperial,
}

/// <summary>The service: the root of the distribution tree.</summary>
/// <param name="Id">Its id.</param>
/// <param name="System">The utility supply system.</param>
/// <param name="FrequencyHz">Supply frequency in hertz.</param>
/// <param name="Location">Where it is in the project file.</param>
public sealed record Service(string Id, ElectricalSystem System, double FrequencyHz, SourceLocation Location)
{
    /// <summary>
    /// The utility's available three-phase fault current at the service, kA, or null for a stiff source (no
    /// impedance ahead of the service).
    /// </summary>
    public double? AvailableFaultCurrentKa { get; init; }

    /// <summary>
    /// The X/R ratio of the utility's source impedance; read with <see cref="AvailableFaultCurrentKa"/> or with
    /// <see cref="UtilityTransformerKva"/>.
    /// </summary>
    public double? FaultXOverR { get; init; }

    /// <summary>
    /// The rating of the utility's transformer that feeds the service, kVA, where the project gives it in place of an
    /// available fault current (with <see cref="UtilityTransformerImpedancePercent"/> and <see cref="FaultXOverR"/>): the
    /// transformer is then taken on an infinite primary bus.
    /// </summary>
    public double? UtilityTransformerKva { get; init; }

    /// <summary>The percent impedance of the utility's transformer; read with <see cref="UtilityTransformerKva"/>.</summary>
    public double? UtilityTransformerImpedancePercent { get; init; }

    /// <summary>True when the project gives the utility's source impedance, by its fault current or its transformer.</summary>
    public bool HasSourceImpedance => AvailableFaultCurrentKa is not null || UtilityTransformerKva is not null;
}

/// <summary>A loaded, validated project: the model every later stage reads.</summary>
public sealed record Project
{
    /// <summary>The project's name.</summary>
    public required string Name { get; init; }

    /// <summary>The project's description as written (<c>project: description</c>), or empty when it has none.</summary>
    public string Description { get; init; } = "";

    /// <summary>The project file's path as given.</summary>
    public required string File { get; init; }

    /// <summary>
    /// Lower-case hex SHA-256 of the project file's bytes; with included files, the SHA-256 of every file's
    /// 32-byte digest concatenated in the order read (main file first, then depth first in list order).
    /// </summary>
    public required string Sha256 { get; init; }

    /// <summary>
    /// Every file read for the project, in the order read: the main file first, then the included files depth
    /// first in list order. Empty for a project made in code.
    /// </summary>
    public IReadOnlyList<SourceFile> Files { get; init; } = [];

    /// <summary>The unit of bare lengths in the file (figures are always in metres in the model).</summary>
    public UnitSystem Units { get; init; } = UnitSystem.Metric;

    /// <summary>Limits and method choices.</summary>
    public Rules Rules { get; init; } = Rules.Default;

    /// <summary>Conductor defaults.</summary>
    public ConductorDefaults Defaults { get; init; } = ConductorDefaults.Standard;

    /// <summary>Choices for the upsizer.</summary>
    public SizingOptions Sizing { get; init; } = SizingOptions.Default;

    /// <summary>The service.</summary>
    public required Service Service { get; init; }

    /// <summary>Every piece of equipment, in file order.</summary>
    public required IReadOnlyList<Equipment> Equipment { get; init; }

    /// <summary>Warnings found while loading (suspicious but legal input).</summary>
    public IReadOnlyList<Diagnostic> Warnings { get; init; } = [];
}
