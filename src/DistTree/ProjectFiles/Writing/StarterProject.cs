using System.Globalization;
using System.Text;
using DistTree.Model;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Writing;

/// <summary>
/// The commented starter project that <c>disttree init</c> writes: a service, its service-entrance
/// switchboard, one panelboard on a feeder and a few branch circuits that the system can give, every key
/// explained. The rules and conductor defaults are the defaults (<see cref="Rules.Default"/>,
/// <see cref="ConductorDefaults.Standard"/>) written out; every word of the format comes from <see cref="Words"/>.
/// The other figures are invented placeholders, chosen to be within every limit so that the file validates and
/// analyzes cleanly before it is edited.
/// </summary>
public static class StarterProject
{
    // Notes start in this column (0-based) when the line is short enough, else two spaces after it.
    private const int NoteColumn = 34;

    /// <summary>The default units for a system: metric for the 230 V systems (IEC practice), else imperial.</summary>
    public static UnitSystem DefaultUnits(ElectricalSystem system) => IsIec(system) ? UnitSystem.Metric : UnitSystem.Imperial;

    /// <summary>The starter project's text (ending in a newline) for the given units and service system.</summary>
    public static string Write(UnitSystem units, ElectricalSystem system)
    {
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
        WriteRules(o, Rules.Default);
        WriteDefaults(o, ConductorDefaults.Standard);
        o.Append(CultureInfo.InvariantCulture, $"service:\n  id: SVC\n  system: {system.Name}\n  frequency_hz: {(IsIec(system) ? 50 : 60)}\n");
        WriteEquipment(o, units, system);
        return o.ToString();
    }

    private static void WriteRules(StringBuilder o, Rules rules)
    {
        Line(o, "rules:", "the defaults, written out to be changed");
        Line(o, $"  code: {Words.Code.Of(rules.Code)}", $"the code whose rules judge the design ({Codes.CodeRules.Describe(rules.Code)}); " + Choices(Words.Code.Words));
        Line(o, $"  feeder_limit_percent: {N(rules.FeederLimitPercent)}", "the most drop allowed in one feeder");
        Line(o, $"  branch_limit_percent: {N(rules.BranchLimitPercent)}", "... in one branch circuit");
        Line(o, $"  total_limit_percent: {N(rules.TotalLimitPercent)}", "... from the service to the farthest point of use");
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

    // The service-entrance switchboard, the panelboard on its feeder, and the circuits the system can give.
    private static void WriteEquipment(StringBuilder o, UnitSystem units, ElectricalSystem system)
    {
        var iec = IsIec(system);
        var metric = units == UnitSystem.Metric;
        Line(o, "equipment:", "in any order; each names what feeds it ('from')");
        o.Append("  - id: MDP\n");
        Line(o, $"    kind: {Words.EquipmentKind.Of(EquipmentKind.Switchboard)}", Choices(Words.EquipmentKind.Words));
        Line(o, "    from: SVC", "service-entrance equipment: no feeder, so no drop");
        o.Append(CultureInfo.InvariantCulture, $"  - id: LP1\n    kind: {Words.EquipmentKind.Of(EquipmentKind.Panelboard)}\n    from: MDP\n");
        o.Append(CultureInfo.InvariantCulture, $"    # Lengths are one way, in {(metric ? "metres" : "feet")} (or write the unit: \"30 m\", \"100 ft\").\n");
        o.Append(CultureInfo.InvariantCulture, $"    feeder: {{ length: {Length(metric, 100, 30)}, size: {(iec ? "16 mm2" : "4 AWG")}, ocpd: {(iec ? 63 : 60)} }}\n");
        o.Append("    demand_factor: 1.0\n    circuits:\n");
        var circuits = new CircuitWriter(o, metric, iec ? "2.5 mm2" : "12 AWG", iec ? 16 : 20);
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
