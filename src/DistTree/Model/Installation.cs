namespace DistTree.Model;

/// <summary>
/// A reference method of installation of IEC 60364-5-52 (Table B.52.1, memory), choosing the column of its
/// current-carrying capacity tables (<c>installation_method</c>; read under <c>rules: code: iec</c> only).
/// </summary>
public enum InstallationMethod
{
    /// <summary>A1: insulated conductors in conduit in a thermally insulated wall.</summary>
    A1,

    /// <summary>B1: insulated conductors in conduit on a wooden or masonry wall (the catalogue's metric columns).</summary>
    B1,

    /// <summary>B2: a multi-core cable in conduit on a wooden or masonry wall.</summary>
    B2,

    /// <summary>C: a single- or multi-core cable on a wooden or masonry wall.</summary>
    C,

    /// <summary>E: a multi-core cable in free air (on a perforated tray or ladder).</summary>
    E,
}

/// <summary>The kind of overcurrent device ahead of a run (<c>device_type</c>), as the rules that depend on it tell them apart.</summary>
public enum DeviceType
{
    /// <summary>A circuit-breaker (under the NEC an inverse-time breaker; under IEC one to IEC 60898-1 or 60947-2).</summary>
    Breaker,

    /// <summary>A fuse (under IEC a gG fuse to IEC 60269-2).</summary>
    Fuse,
}

/// <summary>
/// How a run is installed, as a code's ampacity table reads it: the reference method and the loaded conductors of its
/// circuit (2 for a single-phase or two-wire circuit, 3 for a three-phase one).
/// </summary>
/// <param name="Method">The reference method of installation.</param>
/// <param name="LoadedConductors">The conductors that carry the load current in normal service, 2 or 3.</param>
public readonly record struct Installation(InstallationMethod Method, int LoadedConductors)
{
    /// <summary>What the conductor catalogue's metric columns hold: method B1, three loaded conductors.</summary>
    public static Installation Catalogue { get; } = new(InstallationMethod.B1, 3);
}

/// <summary>
/// The current at which a circuit-breaker trips without intended delay, as a multiple of its rating (<c>trip</c>): IEC
/// 60898-1's curve classes B, C and D take the top of their bands (5, 10 and 20 times the rating, the current that is sure
/// to trip them; recalled, not read), or the multiple stated for a breaker's instantaneous trip.
/// </summary>
/// <param name="Name">The class as written (<c>B</c>, <c>C</c>, <c>D</c>), or the stated multiple's text (<c>8x</c>).</param>
/// <param name="Multiple">The multiple of the device's rating.</param>
public readonly record struct TripSetting(string Name, double Multiple)
{
    /// <summary>IEC 60898-1's curve classes and the top of their instantaneous bands (recalled).</summary>
    public static IReadOnlyList<(string Word, TripSetting Value)> Classes { get; } =
    [
        ("B", new TripSetting("B", 5)),
        ("C", new TripSetting("C", 10)),
        ("D", new TripSetting("D", 20)),
    ];

    /// <summary>A stated multiple, named by its figure.</summary>
    public static TripSetting Stated(double multiple) => new(FormattableString.Invariant($"{multiple:0.##}x"), multiple);
}
