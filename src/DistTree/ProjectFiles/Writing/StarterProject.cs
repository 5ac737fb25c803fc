using System.Globalization;
using System.Text;
using DistTree.Model;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Writing;

/// <summary>
/// The commented starter project that <c>disttree init</c> writes: a service, its service-entrance
/// switchboard, one panelboard on a feeder (through a delta-wye dry-type transformer where the code's usual
/// building takes one) and a few branch circuits that the system can give, every key explained. The rules are
/// the code's defaults (<see cref="Codes.CodeRules.DefaultsOf(ElectricalCode)"/>) and the conductor defaults the
/// standard ones (<see cref="ConductorDefaults.Standard"/>), written out; the sizes are in the code's usual series;
/// every word of the format comes from <see cref="Words"/>.
/// The other figures are invented placeholders, chosen to be within every limit so that the file validates and
/// analyzes cleanly before it is edited.
/// </summary>
public static class StarterProject
{
    // Notes start in this column (0-based) when the line is short enough, else two spaces after it.
    private const int NoteColumn = 34;

    /// <summary>The default units for a system: metric for the 230 V systems (IEC practice), else imperial.</summary>
    public static UnitSystem DefaultUnits(ElectricalSystem system) => IsIec(system) ? UnitSystem.Metric : UnitSystem.Imperial;

    /// <summary>The default units of a starter under <paramref name="code"/> on <paramref name="system"/>: metric wherever the code's country builds in metres.</summary>
    public static UnitSystem DefaultUnits(ElectricalCode code, ElectricalSystem system) => code switch
    {
        ElectricalCode.Nec => DefaultUnits(system),
        ElectricalCode.Cec => UnitSystem.Metric,
        ElectricalCode.Iec => UnitSystem.Metric,
    };

    /// <summary>The service system a starter under <paramref name="code"/> has unless told otherwise: the code's usual building's.</summary>
    public static ElectricalSystem DefaultSystem(ElectricalCode code) => ElectricalSystem.Find(code switch
    {
        ElectricalCode.Nec => "208Y/120",
        ElectricalCode.Cec => "600Y/347",
        ElectricalCode.Iec => "400Y/230",
    })!;

    /// <summary>The starter project's text (ending in a newline) for the given units and service system, under the NEC.</summary>
    public static string Write(UnitSystem units, ElectricalSystem system) => Write(units, system, ElectricalCode.Nec);

    /// <summary>The starter project's text (ending in a newline) for the given units and service system, under <paramref name="code"/>.</summary>
    public static string Write(UnitSystem units, ElectricalSystem system, ElectricalCode code)
    {
        ArgumentNullException.ThrowIfNull(system);
        var o = new StringBuilder();
        o.Append("""
            # A starter project written by 'disttree init'. Every name and figure below is an invented
            # placeholder to be replaced with the building's own; it describes no real building or design.
            # The format: docs/project-file.md. Check it: disttree validate FILE; solve it: disttree analyze FILE.
            # A design aid: the code in force and the authority having jurisdiction decide, and a qualified
            # person reviews the design.

            """);
        Line(o, "disttree: 1", "the format version");
        o.Append("project:\n  name: New building\n");
        Line(o, $"  units: {Words.Units.Of(units)}", $"unit of bare lengths: {Words.Units.Of(UnitSystem.Metric)} (m) or {Words.Units.Of(UnitSystem.Imperial)} (ft)");
        var profile = StarterProfile.Of(code, system);
        WriteRules(o, Codes.CodeRules.DefaultsOf(code));
        WriteDefaults(o, ConductorDefaults.Standard);
        o.Append(CultureInfo.InvariantCulture, $"service:\n  id: SVC\n  system: {system.Name}\n  frequency_hz: {profile.FrequencyHz}\n");
        WriteEquipment(o, units, system, profile);
        return o.ToString();
    }

    private static void WriteRules(StringBuilder o, Rules rules)
    {
        Line(o, "rules:", "the defaults, written out to be changed");
        Line(o, $"  code: {Words.Code.Of(rules.Code)}", $"the code whose rules judge the design ({Codes.CodeRules.Describe(rules.Code)}); " + Choices(Words.Code.Words));
        Line(o, $"  feeder_limit_percent: {N(rules.FeederLimitPercent)}", "the most drop allowed in one feeder");
        Line(o, $"  branch_limit_percent: {N(rules.BranchLimitPercent)}", "... in one branch circuit");
        if (rules.Supply is { } supply)
        {
            Line(o, $"  supply: {Words.Supply.Of(supply)}", $"who supplies the building; its limits follow: {Choices(Words.Supply.Words)}");
        }

        Line(o, $"  total_limit_percent: {N(rules.TotalLimitPercent)}", "... from the service to the farthest point of use");
        if (rules.LightingLimitPercent is { } lighting)
        {
            Line(o, $"  lighting_limit_percent: {N(lighting)}", "... to a point of use whose load is lighting");
        }

        Line(o, $"  branch_current: {Words.BranchCurrent.Of(rules.BranchCurrent)}", Choices(Words.BranchCurrent.Words));
        Line(o, $"  conductor_temperature: {Words.TemperatureOf(rules)}", Choices(Words.Temperature.Words) + " | a temperature in °C");
        Line(o, $"  transformer_drop: {Words.TransformerDrop.Of(rules.TransformerDrop)}", Choices(Words.TransformerDrop.Words));
        o.Append(CultureInfo.InvariantCulture, $"  ambient_c: {N(rules.AmbientC)}\n");
    }

    private static void WriteDefaults(StringBuilder o, ConductorDefaults defaults)
    {
        Line(o, "defaults:", "every run inherits these unless it says otherwise");
        Line(o, $"  material: {Words.Material.Of(defaults.Material)}", Choices(Words.Material.Words));
        Line(o, $"  insulation_c: {N(defaults.InsulationC)}", "60 | 75 | 90");
        Line(o, $"  raceway: {Words.Raceway.Of(defaults.Raceway)}", Choices(Words.Raceway.Words));
    }

    // The service-entrance switchboard, a dry-type transformer where the profile has one, the panelboard on its
    // feeder, and the circuits the panel's system can give.
    private static void WriteEquipment(StringBuilder o, UnitSystem units, ElectricalSystem system, StarterProfile profile)
    {
        var metric = units == UnitSystem.Metric;
        Line(o, "equipment:", "in any order; each names what feeds it ('from')");
        o.Append("  - id: MDP\n");
        Line(o, $"    kind: {Words.EquipmentKind.Of(EquipmentKind.Switchboard)}", Choices(Words.EquipmentKind.Words));
        Line(o, "    from: SVC", "service-entrance equipment: no feeder, so no drop");
        var panelFrom = "MDP";
        if (profile.Transformer is { } t)
        {
            o.Append(CultureInfo.InvariantCulture, $"  - id: T1\n    kind: {Words.EquipmentKind.Of(EquipmentKind.Transformer)}\n    from: MDP\n");
            Line(o, $"    primary: {t.Primary}", "a delta primary on the wye service: three lines, no neutral");
            o.Append(CultureInfo.InvariantCulture, $"    secondary: {t.Secondary.Name}\n    kva: {N(t.Kva)}\n    impedance_percent: {N(t.ImpedancePercent)}\n    x_r: {N(t.XOverR)}\n");
            o.Append(CultureInfo.InvariantCulture, $"    feeder: {{ length: {Length(metric, 60, 20)}, size: {t.PrimarySize}, ocpd: {N(t.PrimaryOcpdA)} }}\n");
            panelFrom = "T1";
        }

        var panelSystem = profile.Transformer?.Secondary ?? system;
        o.Append(CultureInfo.InvariantCulture, $"  - id: LP1\n    kind: {Words.EquipmentKind.Of(EquipmentKind.Panelboard)}\n    from: {panelFrom}\n");
        o.Append(CultureInfo.InvariantCulture, $"    # Lengths are one way, in {(metric ? "metres" : "feet")} (or write the unit: \"30 m\", \"100 ft\").\n");
        o.Append(CultureInfo.InvariantCulture, $"    feeder: {{ length: {Length(metric, profile.Transformer is null ? 100 : 15, profile.Transformer is null ? 30 : 5)}, size: {profile.FeederSize}, ocpd: {N(profile.FeederOcpdA)} }}\n");
        o.Append("    demand_factor: 1.0\n    circuits:\n");
        var circuits = new CircuitWriter(o, metric, profile.BranchSize, profile.BranchOcpdA);
        system = panelSystem;
        if (system.CircuitFor(1) is not null)
        {
            circuits.Write("Lighting", LoadCategory.Lighting, 1, Load(LoadKind.Va, "1200", "0.95"), continuous: true, 50, 15);
            circuits.Write("Receptacles", LoadCategory.Receptacle, 1, Load(LoadKind.Va, "1440", "0.95"), continuous: false, 40, 12);
        }

        if (system.CircuitFor(2) is not null)
        {
            circuits.Write("Water heater", LoadCategory.Other, 2, Load(LoadKind.Kw, "3", "1.0"), continuous: false, 30, 9);
        }

        if (system.CircuitFor(3) is not null)
        {
            circuits.Write("Exhaust fan", LoadCategory.Hvac, 3, Load(LoadKind.Kva, "5", "0.85"), continuous: true, 60, 18);
        }
    }

    /// <summary>A line with a note after it: at <see cref="NoteColumn"/> when the text is short enough, else two spaces after it.</summary>
    private static void Line(StringBuilder o, string text, string note) =>
        o.Append(text.Length < NoteColumn - 1 ? text.PadRight(NoteColumn) : text + "  ").Append("# ").Append(note).Append('\n');

    private static string Choices(IEnumerable<string> words) => string.Join(" | ", words);

    private static string Load(LoadKind kind, string value, string pf) => $"{{ {Words.LoadQuantity.Of(kind)}: {value}, pf: {pf} }}";

    private static string Length(bool metric, double feet, double metres) => (metric ? metres : feet).ToString("0.#", CultureInfo.InvariantCulture);

    private static string N(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);

    private static bool IsIec(ElectricalSystem system) => system.Name is "400Y/230" or "230";

    /// <summary>A delta-wye dry-type transformer of a starter: its primary, secondary, rating and the feeder to it.</summary>
    private sealed record StarterTransformer(string Primary, ElectricalSystem Secondary, double Kva, double ImpedancePercent, double XOverR, string PrimarySize, double PrimaryOcpdA);

    /// <summary>What a starter under one code on one system is made of: its frequency, sizes, devices and transformer.</summary>
    private sealed record StarterProfile(int FrequencyHz, string FeederSize, double FeederOcpdA, string BranchSize, int BranchOcpdA, StarterTransformer? Transformer)
    {
        public static StarterProfile Of(ElectricalCode code, ElectricalSystem system) => code switch
        {
            ElectricalCode.Nec => IsIec(system) ? Metric : Imperial,
            ElectricalCode.Cec => system.Name == "600Y/347" ? Canadian : IsIec(system) ? Metric : Imperial,
            ElectricalCode.Iec => Metric,
        };

        // The NEC's usual building; invented placeholder figures, sized within every limit.
        private static StarterProfile Imperial { get; } = new(60, "4 AWG", 60, "12 AWG", 20, null);

        // The CEC's usual building: a 600Y/347 V service, the 120 V circuits through a 45 kVA 600 V delta to
        // 208Y/120 V dry-type transformer (its primary feeder 6 AWG on 60 A: 43 A rated; its secondary 3/0 AWG on 150 A:
        // 125 A rated); invented placeholder figures.
        private static StarterProfile Canadian { get; } = new(60, "3/0 AWG", 150, "12 AWG", 20, new StarterTransformer("600D", ElectricalSystem.Find("208Y/120")!, 45, 3.8, 1.6, "6 AWG", 60));

        // A building of 230/400 V practice: mm² sizes and IEC device ratings.
        private static StarterProfile Metric { get; } = new(50, "16 mm2", 63, "2.5 mm2", 16, null);
    }

    /// <summary>Writes the branch circuits, numbered from 1; the first explains its keys.</summary>
    private sealed class CircuitWriter(StringBuilder o, bool metric, string size, int ocpdA)
    {
        private int _id = 1;

        public void Write(string name, LoadCategory category, int poles, string load, bool continuous, double feet, double metres)
        {
            var first = _id == 1;
            var quantities = Words.LoadQuantity;
            Note($"      - id: \"{_id++}\"", "unique in its panel; the full id is LP1/1");
            Note($"        name: {name}", "free text");
            Note($"        category: {Words.LoadCategory.Of(category)}", $"{Choices(Words.LoadCategory.Words)}; unstated: motor for {quantities.Of(LoadKind.Hp)}/{quantities.Of(LoadKind.Fla)}, else other");
            Note(string.Create(CultureInfo.InvariantCulture, $"        poles: {poles}"), "1: line-neutral; 2: line-line; 3: three-phase");
            Note(string.Create(CultureInfo.InvariantCulture, $"        ocpd: {ocpdA}"), "the overcurrent device's rating, A");
            Note($"        continuous: {(continuous ? "true" : "false")}", "3 hours or more: counted at 125 % for ampacity");
            Note(
                $"        load: {load}",
                $"or {quantities.Of(LoadKind.Kva)}, {quantities.Of(LoadKind.Kw)} (+pf), {quantities.Of(LoadKind.Amps)} (+pf), {quantities.Of(LoadKind.Hp)} (+pf)");
            Note($"        run: {{ length: {Length(metric, feet, metres)}, size: {size} }}", "the branch circuit's conductors");

            void Note(string text, string note)
            {
                if (first)
                {
                    Line(o, text, note);
                }
                else
                {
                    o.Append(text).Append('\n');
                }
            }
        }
    }
}
