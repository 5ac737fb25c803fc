using System.Globalization;
using System.Text;
using DistTree.Model;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Writing;

/// <summary>
/// Writes the text of a generated project (format 1, LF line ends) in the order it is told: comments, the top
/// sections, then each equipment entry with its transformer data, feeder and circuits, a line per key and each
/// run and load as a flow mapping. Every word of the format comes from <see cref="Words"/>; numbers are written
/// with at most three decimals, invariant culture.
/// </summary>
internal sealed class GeneratedProjectWriter(int capacity)
{
    private readonly StringBuilder _text = new(capacity);

    /// <summary>A comment line, <c># text</c>.</summary>
    public void Comment(string text) => _text.Append("# ").Append(text).Append('\n');

    /// <summary>The format version, the <c>project</c> section, the <c>defaults</c> and the <c>service</c> (on the service's 60 Hz default), then the <c>equipment:</c> key.</summary>
    public void Top(string name, UnitSystem units, string description, ConductorDefaults defaults, string serviceId, ElectricalSystem system)
    {
        _text.Append(CultureInfo.InvariantCulture, $"disttree: 1\nproject:\n  name: {name}\n  units: {Words.Units.Of(units)}\n  description: {description}\n");
        _text.Append(CultureInfo.InvariantCulture, $"defaults: {{ material: {Words.Material.Of(defaults.Material)}, insulation_c: {defaults.InsulationC}, raceway: {Words.Raceway.Of(defaults.Raceway)} }}\n");
        _text.Append(CultureInfo.InvariantCulture, $"service: {{ id: {serviceId}, system: {system.Name} }}\nequipment:\n");
    }

    /// <summary>The first keys of an equipment entry.</summary>
    public void Equipment(string id, EquipmentKind kind, string from) =>
        _text.Append(CultureInfo.InvariantCulture, $"  - id: {id}\n    kind: {Words.EquipmentKind.Of(kind)}\n    from: {from}\n");

    /// <summary>A transformer's data; the tap only when not 0.</summary>
    public void Transformer(double kva, ElectricalSystem secondary, double impedancePercent, double xOverR, double tapPercent)
    {
        _text.Append(CultureInfo.InvariantCulture, $"    kva: {N(kva)}\n    secondary: {secondary.Name}\n    impedance_percent: {N(impedancePercent)}\n    x_r: {N(xOverR)}\n");
        if (tapPercent != 0)
        {
            _text.Append(CultureInfo.InvariantCulture, $"    tap_percent: {N(tapPercent)}\n");
        }
    }

    /// <summary>An equipment entry's feeder.</summary>
    public void Feeder(WrittenRun run) => _text.Append("    feeder: ").Append(Run(run)).Append('\n');

    /// <summary>The <c>circuits:</c> key, before an entry's circuits.</summary>
    public void Circuits() => _text.Append("    circuits:\n");

    /// <summary>One branch circuit: its id (quoted), name, poles, device, load, whether continuous, and run.</summary>
    public void Circuit(int id, string name, int poles, double ocpdA, Load load, bool continuous, WrittenRun run)
    {
        _text.Append(CultureInfo.InvariantCulture, $"""
                  - id: "{id}"
                    name: {name}
                    poles: {poles}
                    ocpd: {N(ocpdA)}
                    load: {"{"} {Words.LoadQuantity.Of(load.Kind)}: {N(load.Value)}, pf: {N(load.PowerFactor)} {"}"}
                    continuous: {(continuous ? "true" : "false")}
                    run: {Run(run)}

            """);
    }

    /// <summary>The text written.</summary>
    public override string ToString() => _text.ToString();

    private static string Run(WrittenRun run)
    {
        var text = new StringBuilder(64);
        text.Append(CultureInfo.InvariantCulture, $"{{ length: {N(run.Length)}, size: {run.Size.Text}");
        if (run.Sets > 1)
        {
            text.Append(CultureInfo.InvariantCulture, $", sets: {run.Sets}");
        }

        if (run.OcpdA is { } ocpd)
        {
            text.Append(CultureInfo.InvariantCulture, $", ocpd: {N(ocpd)}");

            // A feeder breaker of 200 A and up, as a designer sets one: its adjustable instantaneous trip at 5 times its
            // rating (common practice), so that a fault at the far end of a feeder on a transformer's secondary clears.
            if (ocpd >= LowInstantaneousFromA)
            {
                text.Append(", trip: 5");
            }
        }

        return text.Append(" }").ToString();
    }

    // The smallest feeder device given a low instantaneous setting.
    private const double LowInstantaneousFromA = 200;

    private static string N(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
}
