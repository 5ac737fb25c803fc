namespace DistTree.Conductors;

/// <summary>How a conductor size is named.</summary>
public enum SizeKind
{
    /// <summary>American Wire Gauge, 14 AWG to 4/0 AWG.</summary>
    Awg,

    /// <summary>Thousands of circular mils, 250 to 2000 kcmil.</summary>
    Kcmil,

    /// <summary>Metric nominal cross-section, 1.5 to 630 mm².</summary>
    Metric,
}

/// <summary>
/// A ladder of sizes that a designer steps along when upsizing: AWG continues into kcmil
/// (4/0 AWG is followed by 250 kcmil), metric sizes form a ladder of their own.
/// </summary>
public enum SizeSeries
{
    /// <summary>AWG and kcmil sizes.</summary>
    NorthAmerican,

    /// <summary>IEC 60228 metric sizes.</summary>
    Metric,
}
