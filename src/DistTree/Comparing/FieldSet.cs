using System.Globalization;
using DistTree.Model;
using DistTree.Vocabulary;

namespace DistTree.Comparing;

/// <summary>
/// The comparable fields of a model element, in a fixed order: a name, its text for people and, for numbers,
/// the value compared within <see cref="ComparisonTolerance.Relative"/>.
/// </summary>
internal sealed class FieldSet
{
    private readonly List<Field> _fields = [];

    public static FieldSet ForProject(Project p)
    {
        var r = p.Rules;
        var set = new FieldSet()
            .Text("project.name", p.Name)
            .Text("project.description", p.Description.Length == 0 ? "none" : p.Description)
            .Text("rules.code", Words.Code.Of(r.Code))
            .Number("rules.feeder_limit_percent", r.FeederLimitPercent)
            .Number("rules.branch_limit_percent", r.BranchLimitPercent)
            .Number("rules.total_limit_percent", r.TotalLimitPercent)
            .Text("rules.lighting_limit_percent", r.LightingLimitPercent is { } lighting ? Format(lighting) : "as total_limit_percent")
            .Text("rules.supply", r.Supply is { } supply ? Words.Supply.Of(supply) : "not read")
            .Text("rules.branch_current", Words.BranchCurrent.Of(r.BranchCurrent))
            .Text("rules.conductor_temperature", r.Temperature == TemperatureMode.Fixed ? Format(r.FixedTemperatureC ?? 0) : Words.Temperature.Of(r.Temperature))
            .Text("rules.transformer_drop", Words.TransformerDrop.Of(r.TransformerDrop))
            .Number("rules.ambient_c", r.AmbientC)
            .Number("rules.terminal_c", r.TerminalC)
            .Text("rules.conductor_catalog", r.ConductorCatalog?.SourceName ?? "none")
            .Text("rules.grounding_table", r.GroundingTable?.SourceName ?? "none")
            .Text("service.id", p.Service.Id)
            .Text("service.system", p.Service.System.Name)
            .Number("service.frequency_hz", p.Service.FrequencyHz)
            .Number("service.available_fault_current_ka", p.Service.AvailableFaultCurrentKa)
            .Number("service.fault_x_r", p.Service.FaultXOverR)
            .Number("service.utility_transformer_kva", p.Service.UtilityTransformerKva)
            .Number("service.utility_transformer_impedance_percent", p.Service.UtilityTransformerImpedancePercent)
            .Number("rules.fault_voltage_factor_max", r.FaultVoltageFactorMax)
            .Number("rules.fault_voltage_factor_min", r.FaultVoltageFactorMin)
            .Text("defaults.material", Words.Material.Of(p.Defaults.Material))
            .Number("defaults.insulation_c", p.Defaults.InsulationC)
            .Text("defaults.raceway", Words.Raceway.Of(p.Defaults.Raceway));
        return set;
    }

    public static FieldSet ForEquipment(Equipment e, UnitSystem units)
    {
        var set = new FieldSet()
            .Text("kind", Words.EquipmentKind.Of(e.Kind))
            .Text("from", e.From)
            .Text("system", e.System.Name)
            .Text("feeder", e.Feeder is null ? "none" : "yes");
        if (e.Feeder is { } feeder)
        {
            set.AddRun("feeder", feeder, units);
        }

        set.Number("demand_factor", e.DemandFactor);
        if (e.InterruptingKa is { } rating)
        {
            set.Number("interrupting_ka", rating);
        }

        if (e.MainA is { } main)
        {
            set.Number("main_a", main);
        }

        if (e.Transformer is { } t)
        {
            set.Number("transformer.kva", t.Kva)
                .Text("transformer.secondary", t.Secondary.Name)
                .Number("transformer.impedance_percent", t.ImpedancePercent)
                .Number("transformer.x_r", t.XOverR)
                .Number("transformer.tap_percent", t.TapPercent);
            if (t.Secondary.Phases == 1 && e.System.Phases == 3)
            {
                // Where 'phase' applies: a single-phase transformer on a three-phase primary.
                set.Text("transformer.phase", PhaseRules.Text(t.PrimaryPhases));
            }
        }

        return set.Number("circuits", e.Circuits.Count);
    }

    public static FieldSet ForCircuit(Circuit c, UnitSystem units)
    {
        var set = new FieldSet()
            .Text("name", c.Name)
            .Number("poles", c.Poles)
            .Number("voltage_v", c.Supply.VoltageV)
            .Text("load.kind", c.Load.Kind.ToString().ToLowerInvariant())
            .Number("load.value", c.Load.Value, Load.UnitOf(c.Load.Kind))
            .Number("load.pf", c.Load.PowerFactor)
            .Text("category", Words.LoadCategory.Of(c.Category))
            .Number("load.mca_a", c.Load.MinimumCircuitA)
            .Number("load.mocp_a", c.Load.MaximumDeviceA)
            .Text("continuous", c.Continuous ? "true" : "false");
        set.AddRun("run", c.Run, units);
        return set;
    }

    /// <summary>
    /// True when two pieces of equipment hold exactly the same design (locations aside): the fast path that spares
    /// building field sets for the many elements a change does not touch.
    /// </summary>
    public static bool SameDesign(Equipment a, Equipment b) =>
        a.Kind == b.Kind && string.Equals(a.From, b.From, StringComparison.Ordinal) && a.System == b.System &&
        SameRun(a.Feeder, b.Feeder) && a.DemandFactor.Equals(b.DemandFactor) && a.Transformer == b.Transformer &&
        Nullable.Equals(a.InterruptingKa, b.InterruptingKa) && Nullable.Equals(a.MainA, b.MainA) &&
        a.Circuits.Count == b.Circuits.Count;

    /// <summary>True when two circuits hold exactly the same design (locations aside).</summary>
    public static bool SameDesign(Circuit a, Circuit b) =>
        string.Equals(a.Name, b.Name, StringComparison.Ordinal) && a.Poles == b.Poles && a.Supply == b.Supply &&
        a.Load == b.Load && a.Category == b.Category && a.Continuous == b.Continuous && SameRun(a.Run, b.Run);

    private static bool SameRun(Run? a, Run? b) =>
        a is null || b is null
            ? a is null && b is null
            : a.LengthM.Equals(b.LengthM) && a.Size == b.Size && a.Sets == b.Sets && a.Material == b.Material &&
              Nullable.Equals(a.NeutralSize, b.NeutralSize) && Nullable.Equals(a.GroundSize, b.GroundSize) && a.InsulationC == b.InsulationC && a.Raceway == b.Raceway && Nullable.Equals(a.OcpdA, b.OcpdA) &&
              a.DeviceType == b.DeviceType && a.InstallationMethod == b.InstallationMethod && Nullable.Equals(a.LimitPercent, b.LimitPercent) && a.Fixed == b.Fixed && a.DeviceRatedContinuous == b.DeviceRatedContinuous &&
              Nullable.Equals(a.Trip, b.Trip);

    /// <summary>
    /// The fields that differ between two sets built by the same factory (missing fields count as null), lengths shown
    /// to people in <paramref name="shown"/> (the newer revision's units).
    /// </summary>
    public static List<FieldChange> Differences(FieldSet before, FieldSet after, UnitSystem shown)
    {
        var changes = new List<FieldChange>();
        var b = before._fields;
        var a = after._fields;
        var aligned = a.Count == b.Count;
        for (var i = 0; aligned && i < a.Count; i++)
        {
            aligned = ReferenceEquals(a[i].Name, b[i].Name) || string.Equals(a[i].Name, b[i].Name, StringComparison.Ordinal);
        }

        if (aligned)
        {
            // The usual case: the same fields in the same order; compare pairwise without allocating.
            for (var i = 0; i < a.Count; i++)
            {
                if (Differs(b[i], a[i]))
                {
                    changes.Add(Change(b[i], a[i], shown));
                }
            }

            return changes;
        }

        var old = new Dictionary<string, Field>(StringComparer.Ordinal);
        foreach (var f in b)
        {
            old[f.Name] = f;
        }

        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var f in a)
        {
            seen.Add(f.Name);
            if (!old.TryGetValue(f.Name, out var was))
            {
                changes.Add(Change(null, f, shown));
            }
            else if (Differs(was, f))
            {
                changes.Add(Change(was, f, shown));
            }
        }

        foreach (var f in b)
        {
            if (!seen.Contains(f.Name))
            {
                changes.Add(Change(f, null, shown));
            }
        }

        return changes;
    }

    /// <summary>Every field as added (before null) or as removed (after null), lengths shown to people in <paramref name="shown"/>.</summary>
    public List<FieldChange> All(bool added, UnitSystem shown) =>
        _fields.Select(f => added ? Change(null, f, shown) : Change(f, null, shown)).ToList();

    // A change of one field: its JSON text (lengths in metres, as before) and its text for people.
    private static FieldChange Change(Field? before, Field? after, UnitSystem shown)
    {
        var field = (after ?? before)!.Value;
        return new FieldChange(field.Name, before?.Display, after?.Display)
        {
            Label = field.Length ? field.Name[..^LengthSuffix.Length] : field.Name,
            BeforeText = before?.Shown(shown),
            AfterText = after?.Shown(shown),
        };
    }

    private static bool Differs(Field before, Field after) =>
        before.Number is { } b && after.Number is { } a
            ? ComparisonTolerance.Moved(b, a)
            : before.Number.HasValue != after.Number.HasValue || !string.Equals(before.Text, after.Text, StringComparison.Ordinal);

    // Lengths are compared in metres; for a project in feet the text adds the length in feet.
    private void AddRun(string prefix, Run run, UnitSystem units)
    {
        _fields.Add(new Field(prefix + ".length" + LengthSuffix, null, run.LengthM, units == UnitSystem.Imperial) { Length = true });
        this
            .Text($"{prefix}.size", run.Size.Text);
        if (run.NeutralSize is { } neutral)
        {
            // Only when stated, so that an element added or removed lists the fields it always did.
            Text($"{prefix}.neutral_size", neutral.Text);
        }

        if (run.GroundSize is { } ground)
        {
            Text($"{prefix}.ground_size", ground.Text);
        }

        this
            .Number($"{prefix}.sets", run.Sets)
            .Text($"{prefix}.material", Words.Material.Of(run.Material))
            .Number($"{prefix}.insulation_c", run.InsulationC)
            .Text($"{prefix}.raceway", Words.Raceway.Of(run.Raceway));
        if (run.RacewayId is { } racewayId)
        {
            Text($"{prefix}.raceway_id", racewayId);
        }

        if (run.CurrentCarrying is { } carrying)
        {
            Number($"{prefix}.current_carrying", carrying);
        }

        // The device's kind and the installation method where not their defaults (a breaker, method B1).
        if (run.DeviceType != DeviceType.Breaker)
        {
            Text($"{prefix}.device_type", Words.DeviceType.Of(run.DeviceType));
        }

        if (run.InstallationMethod != InstallationMethod.B1)
        {
            Text($"{prefix}.installation_method", Words.InstallationMethod.Of(run.InstallationMethod));
        }

        if (run.Trip is { } trip)
        {
            Text($"{prefix}.trip", trip.Name);
        }

        this
            .Number($"{prefix}.ocpd_a", run.OcpdA)
            .Number($"{prefix}.limit_percent", run.LimitPercent)
            .Text($"{prefix}.fixed", run.Fixed ? "true" : "false");
        if (run.DeviceRatedContinuous)
        {
            Text($"{prefix}.device_rated_continuous", "true");
        }
    }

    private FieldSet Text(string name, string text)
    {
        _fields.Add(new Field(name, text, null, false));
        return this;
    }

    private FieldSet Number(string name, double? value, string? unit = null)
    {
        _fields.Add(new Field(name, value is null ? "none" : null, value, false) { Unit = unit });
        return this;
    }

    // The suffix of a length's name in JSON; for people the values carry their unit and the name drops it.
    private const string LengthSuffix = "_m";

    private static string Format(double value) => value.ToString("G10", CultureInfo.InvariantCulture);

    /// <summary>
    /// A field: text, or a number formatted only when shown. <see cref="Display"/> is the JSON's text (a length in
    /// metres, with feet beside for a project in feet); <see cref="Shown"/> the text for people (a length in the
    /// units given, a number with its <see cref="Unit"/>).
    /// </summary>
    private readonly record struct Field(string Name, string? Text, double? Number, bool Feet)
    {
        /// <summary>True for a length, m: shown in the units of the newer revision.</summary>
        public bool Length { get; init; }

        /// <summary>The unit written after the number for people (a load's VA, kVA, kW, A or hp), or null.</summary>
        public string? Unit { get; init; }

        public string Display => Number is { } v
            ? Format(v) + (Feet ? $" ({(v / UnitFactors.MetresPerFoot).ToString("0.##", CultureInfo.InvariantCulture)} ft)" : "")
            : Text ?? "none";

        public string Shown(UnitSystem units) => Number is { } v
            ? Length ? LengthText.Precise(v, units) : Unit is null ? Format(v) : Format(v) + " " + Unit
            : Text ?? "none";
    }
}
