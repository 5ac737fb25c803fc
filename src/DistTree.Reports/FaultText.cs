using System.Globalization;
using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Reports;

/// <summary>The words every output says of the short-circuit study: its method in a sentence, its source, each fault's name.</summary>
public static class FaultText
{
    /// <summary>The method, in one sentence (with the figures it takes as the code holds them).</summary>
    public const string Method =
        "ohmic method of IEC 60909-0 (symmetrical components, negative sequence equal to positive): the maximum at each piece of equipment "
        + "with c_max, conductors at 20 °C, transformers corrected by K_T and three-phase motors feeding in; the minimum at each run's far end "
        + "with c_min, conductors at their insulation's rated temperature and no motors";

    /// <summary>The source's kind as written in JSON.</summary>
    public static string SourceWord(FaultSourceKind kind) => kind switch
    {
        FaultSourceKind.Utility => "utility",
        FaultSourceKind.UtilityTransformer => "utility_transformer",
        FaultSourceKind.InfiniteBus => "infinite_bus",
    };

    /// <summary>A fault's kind as written in JSON and tables.</summary>
    public static string KindWord(FaultKind kind) => kind switch
    {
        FaultKind.ThreePhase => "three_phase",
        FaultKind.LineToLine => "line_to_line",
        FaultKind.LineToNeutral => "line_to_neutral",
        FaultKind.LineToGround => "line_to_ground",
    };

    /// <summary>A fault's kind for people: <c>L-G</c>, <c>L-N</c>, <c>L-L</c>, <c>3-phase</c>.</summary>
    public static string KindShort(FaultKind kind) => kind switch
    {
        FaultKind.ThreePhase => "3-phase",
        FaultKind.LineToLine => "L-L",
        FaultKind.LineToNeutral => "L-N",
        FaultKind.LineToGround => "L-G",
    };

    /// <summary>What the currents start from, in a sentence for people (with a caution where the source is unknown).</summary>
    public static string Source(FaultStudy faults, Service service)
    {
        ArgumentNullException.ThrowIfNull(faults);
        ArgumentNullException.ThrowIfNull(service);
        return faults.Source switch
        {
            FaultSourceKind.Utility => string.Create(CultureInfo.InvariantCulture, $"the utility's available fault current of {service.AvailableFaultCurrentKa:0.###} kA at X/R {service.FaultXOverR:0.##} (its zero sequence taken equal to its positive)"),
            FaultSourceKind.UtilityTransformer => string.Create(CultureInfo.InvariantCulture, $"the utility's {service.UtilityTransformerKva:0.#} kVA transformer at {service.UtilityTransformerImpedancePercent:0.##} % and X/R {service.FaultXOverR:0.##}, on an infinite primary bus"),
            FaultSourceKind.InfiniteBus => "no source impedance is given, so the service is taken as an infinite bus: the equipment's currents are the largest the tree allows (the safe side for ratings), but the far ends' minimum currents are overstated; give the utility's available fault current or its transformer",
        };
    }

    /// <summary>The voltage factors and motors, in a few words: <c>c_max 1.05, c_min 0.95, motors at 4 × full-load current</c>.</summary>
    public static string Factors(FaultStudy faults)
    {
        ArgumentNullException.ThrowIfNull(faults);
        return string.Create(CultureInfo.InvariantCulture, $"c_max {faults.VoltageFactorMax:0.00}, c_min {faults.VoltageFactorMin:0.00}, three-phase motors at {faults.MotorMultiple:0.#} × full-load current (common practice)");
    }
}
