using System.Globalization;
using DistTree.Conductors;
using DistTree.Model;

namespace DistTree.Comparing;

/// <summary>
/// The comparable fields of a model element, in a fixed order: a name, its text for people and, for numbers,
/// the value compared within <see cref="ComparisonTolerance.Relative"/>.
/// </summary>
internal sealed class FieldSet
{
    private readonly List<(string Name, string? Text, double? Number)> _fields = [];

    public static FieldSet ForProject(Project p)
    {
        var r = p.Rules;
        var set = new FieldSet()
            .Text("name", p.Name)
            .Number("rules.feeder_limit_percent", r.FeederLimitPercent)
            .Number("rules.branch_limit_percent", r.BranchLimitPercent)
            .Number("rules.total_limit_percent", r.TotalLimitPercent)
            .Text("rules.branch_current", r.BranchCurrent switch
            {
                BranchCurrentBasis.Ocpd80 => "ocpd_80",
                BranchCurrentBasis.Lesser => "lesser",
                _ => "connected",
            })
            .Text("rules.conductor_temperature", r.Temperature switch
            {
                TemperatureMode.Rated => "rated",
                TemperatureMode.Fixed => Format(r.FixedTemperatureC ?? 0),
                _ => "estimated",
            })
            .Text("rules.transformer_drop", r.TransformerDrop == TransformerDropMode.NewOrigin ? "new_origin" : "count")
            .Number("rules.ambient_c", r.AmbientC)
            .Number("rules.terminal_c", r.TerminalC)
            .Text("service.id", p.Service.Id)
            .Text("service.system", p.Service.System.Name)
            .Number("service.frequency_hz", p.Service.FrequencyHz)
            .Text("defaults.material", MaterialText(p.Defaults.Material))
            .Number("defaults.insulation_c", p.Defaults.InsulationC)
            .Text("defaults.raceway", RacewayText(p.Defaults.Raceway));
        return set;
    }

    public static FieldSet ForEquipment(Equipment e)
    {
        var set = new FieldSet()
            .Text("kind", e.Kind.ToString().ToLowerInvariant())
            .Text("from", e.From)
            .Text("system", e.System.Name)
            .Text("feeder", e.Feeder is null ? "none" : "yes");
        if (e.Feeder is { } feeder)
        {
            set.AddRun("feeder", feeder);
        }

        set.Number("demand_factor", e.DemandFactor);
        if (e.Transformer is { } t)
        {
            set.Number("transformer.kva", t.Kva)
                .Text("transformer.secondary", t.Secondary.Name)
                .Number("transformer.impedance_percent", t.ImpedancePercent)
                .Number("transformer.x_r", t.XOverR)
                .Number("transformer.tap_percent", t.TapPercent);
        }

        return set.Number("circuits", e.Circuits.Count);
    }

    public static FieldSet ForCircuit(Circuit c)
    {
        var set = new FieldSet()
            .Text("name", c.Name)
            .Number("poles", c.Poles)
            .Number("voltage_v", c.Supply.VoltageV)
            .Text("load.kind", c.Load.Kind.ToString().ToLowerInvariant())
            .Number("load.value", c.Load.Value)
            .Number("load.pf", c.Load.PowerFactor)
            .Text("continuous", c.Continuous ? "true" : "false");
        set.AddRun("run", c.Run);
        return set;
    }

    /// <summary>The fields that differ between two sets built by the same factory (missing fields count as null).</summary>
    public static List<FieldChange> Differences(FieldSet before, FieldSet after)
    {
        var changes = new List<FieldChange>();
        var old = new Dictionary<string, (string? Text, double? Number)>(StringComparer.Ordinal);
        foreach (var (name, text, number) in before._fields)
        {
            old[name] = (text, number);
        }

        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var (name, text, number) in after._fields)
        {
            seen.Add(name);
            if (!old.TryGetValue(name, out var was))
            {
                changes.Add(new FieldChange(name, null, text));
            }
            else if (Differs(was.Text, was.Number, text, number))
            {
                changes.Add(new FieldChange(name, was.Text, text));
            }
        }

        foreach (var (name, text, _) in before._fields)
        {
            if (!seen.Contains(name))
            {
                changes.Add(new FieldChange(name, text, null));
            }
        }

        return changes;
    }

    /// <summary>Every field as added (before null) or as removed (after null).</summary>
    public List<FieldChange> All(bool added) =>
        _fields.Select(f => added ? new FieldChange(f.Name, null, f.Text) : new FieldChange(f.Name, f.Text, null)).ToList();

    private static bool Differs(string? textBefore, double? numberBefore, string? textAfter, double? numberAfter) =>
        numberBefore is { } b && numberAfter is { } a
            ? ComparisonTolerance.Moved(b, a)
            : !string.Equals(textBefore, textAfter, StringComparison.Ordinal);

    private void AddRun(string prefix, Run run)
    {
        Number($"{prefix}.length_m", run.LengthM)
            .Text($"{prefix}.size", run.Size.Text)
            .Number($"{prefix}.sets", run.Sets)
            .Text($"{prefix}.material", MaterialText(run.Material))
            .Number($"{prefix}.insulation_c", run.InsulationC)
            .Text($"{prefix}.raceway", RacewayText(run.Raceway))
            .Number($"{prefix}.ocpd_a", run.OcpdA)
            .Number($"{prefix}.limit_percent", run.LimitPercent)
            .Text($"{prefix}.fixed", run.Fixed ? "true" : "false");
    }

    private FieldSet Text(string name, string text)
    {
        _fields.Add((name, text, null));
        return this;
    }

    private FieldSet Number(string name, double? value)
    {
        _fields.Add((name, value is { } v ? Format(v) : "none", value));
        return this;
    }

    private static string Format(double value) => value.ToString("G10", CultureInfo.InvariantCulture);

    private static string MaterialText(Material m) => m == Material.Copper ? "cu" : "al";

    private static string RacewayText(Raceway r) => r.ToString().ToLowerInvariant();
}
