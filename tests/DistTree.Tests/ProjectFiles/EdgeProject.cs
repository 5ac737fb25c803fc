using System.Collections;
using System.Globalization;
using System.Reflection;
using System.Text.RegularExpressions;
using DistTree.ProjectFiles;
using DistTree.Solving;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// A valid project (invented) that states every ranged key of <see cref="ValueRanges.All"/> once, each value marked
/// <c>{section.key}</c> so that a test can put any one, or all, at an edge of its range; and a check that a solution's
/// figures are all finite.
/// </summary>
internal static partial class EdgeProject
{
    // Every marker with its value in the plain project. Point 'at' lies on a run of the longest length allowed.
    private static readonly Dictionary<string, string> Plain = new(StringComparer.Ordinal)
    {
        ["rules.feeder_limit_percent"] = "3",
        ["rules.branch_limit_percent"] = "3",
        ["rules.total_limit_percent"] = "5",
        ["rules.lighting_limit_percent"] = "4",
        ["rules.motor_start_limit_percent"] = "15",
        ["rules.conductor_temperature"] = "75",
        ["rules.ambient_c"] = "30",
        ["rules.fault_voltage_factor_max"] = "1.05",
        ["rules.fault_voltage_factor_min"] = "0.95",
        ["sizing.max_sets"] = "4",
        ["sizing.resolution_percent"] = "0.01",
        ["sizing.prices"] = "3",
        ["sizing.tap_cost"] = "0",
        ["sizing.light_load_rise_percent"] = "5",
        ["service.frequency_hz"] = "60",
        ["service.available_fault_current_ka"] = "22",
        ["service.fault_x_r"] = "6",
        ["service.utility_transformer_kva"] = "1500",
        ["service.utility_transformer_impedance_percent"] = "5.75",
        ["equipment.interrupting_ka"] = "65",
        ["equipment.main_a"] = "400",
        ["equipment.demand_factor"] = "1",
        ["equipment.kva"] = "75",
        ["equipment.impedance_percent"] = "5",
        ["equipment.x_r"] = "4",
        ["equipment.tap_percent"] = "2.5",
        ["equipment.tap_range_percent"] = "5",
        ["run.length"] = "40",
        ["run.sets"] = "1",
        ["run.current_carrying"] = "4",
        ["run.ocpd"] = "125",
        ["run.limit_percent"] = "2",
        ["run.trip"] = "10",
        ["circuit.ocpd"] = "20",
        ["point.at"] = "10",
        ["load.va"] = "1000",
        ["load.kva"] = "1",
        ["load.kw"] = "1",
        ["load.amps"] = "5",
        ["load.hp"] = "5",
        ["load.fla"] = "10",
        ["load.pf"] = "0.9",
        ["load.starting_pf"] = "0.35",
        ["load.lrc_multiple"] = "6",
        ["load.mca"] = "28",
        ["load.mocp"] = "45",
    };

    private const string Template = """
        disttree: 1
        project: { name: Edges, units: metric }
        rules: { feeder_limit_percent: {rules.feeder_limit_percent}, branch_limit_percent: {rules.branch_limit_percent}, total_limit_percent: {rules.total_limit_percent}, lighting_limit_percent: {rules.lighting_limit_percent}, motor_start_limit_percent: {rules.motor_start_limit_percent}, conductor_temperature: {rules.conductor_temperature}, ambient_c: {rules.ambient_c}, fault_voltage_factor_max: {rules.fault_voltage_factor_max}, fault_voltage_factor_min: {rules.fault_voltage_factor_min} }
        sizing: { max_sets: {sizing.max_sets}, resolution_percent: {sizing.resolution_percent}, tap_cost: {sizing.tap_cost}, light_load_rise_percent: {sizing.light_load_rise_percent}, prices: { 12 AWG: 0.5, 1 AWG: {sizing.prices} } }
        service: { id: SVC, system: 480Y/277, frequency_hz: {service.frequency_hz}, available_fault_current_ka: {service.available_fault_current_ka}, fault_x_r: {service.fault_x_r} }
        equipment:
          - id: MSB
            kind: switchboard
            from: SVC
            interrupting_ka: {equipment.interrupting_ka}
          - id: MP
            kind: panelboard
            from: MSB
            main_a: {equipment.main_a}
            feeder: { length: 3, size: 250 kcmil }
            circuits:
              - { id: "5", poles: 3, load: { hp: {load.hp}, pf: 0.85, lrc_multiple: {load.lrc_multiple}, starting_pf: {load.starting_pf} }, run: { length: 20, size: 10 AWG } }
          - id: T1
            kind: transformer
            from: MSB
            kva: {equipment.kva}
            secondary: 208Y/120
            impedance_percent: {equipment.impedance_percent}
            x_r: {equipment.x_r}
            tap_percent: {equipment.tap_percent}
            tap_range_percent: {equipment.tap_range_percent}
            feeder: { length: {run.length}, size: 1 AWG, sets: {run.sets}, ocpd: {run.ocpd}, limit_percent: {run.limit_percent}, trip: {run.trip} }
          - id: LP1
            kind: panelboard
            from: T1
            demand_factor: {equipment.demand_factor}
            feeder: { length: 3, size: 250 kcmil, current_carrying: {run.current_carrying} }
            circuits:
              - { id: "1", poles: 1, ocpd: {circuit.ocpd}, load: { va: {load.va}, pf: {load.pf} }, run: { length: 20, size: 12 AWG } }
              - { id: "2", poles: 1, load: { kva: {load.kva} }, run: { length: 20, size: 12 AWG } }
              - { id: "3", poles: 1, load: { kw: {load.kw} }, run: { length: 20, size: 12 AWG } }
              - { id: "4", poles: 1, load: { amps: {load.amps} }, run: { length: 20, size: 12 AWG } }
              - { id: "5", poles: 2, ocpd: 45, load: { amps: 22, pf: 0.9, mca: {load.mca}, mocp: {load.mocp} }, run: { length: 20, size: 10 AWG } }
              - { id: "6", poles: 3, load: { fla: {load.fla}, pf: 0.85 }, run: { length: 20, size: 10 AWG } }
              - { id: "7", poles: 1, points: [{ at: {point.at}, load: { va: 500 } }], run: { length: 100000, size: 12 AWG } }

        """;

    // The service's source by the utility's transformer in place of its fault current (the two are exclusive): the
    // template a test of those keys fills.
    private static readonly string UtilityTemplate = Template.Replace(
        "available_fault_current_ka: {service.available_fault_current_ka}",
        "utility_transformer_kva: {service.utility_transformer_kva}, utility_transformer_impedance_percent: {service.utility_transformer_impedance_percent}",
        StringComparison.Ordinal);

    private static string TemplateFor(IReadOnlyDictionary<string, double> values) =>
        values.Keys.Any(k => k.StartsWith("service.utility_transformer_", StringComparison.Ordinal)) ? UtilityTemplate : Template;

    /// <summary>The marker of a key of <see cref="ValueRanges.All"/>.</summary>
    public static string Marker(string section, string key) => $"{section}.{key}";

    /// <summary>The project with the given markers' values in place of the plain ones.</summary>
    public static string Text(IReadOnlyDictionary<string, double> values) =>
        MarkerPattern().Replace(TemplateFor(values), m =>
        {
            var marker = m.Groups["marker"].Value;
            return values.TryGetValue(marker, out var v) ? Number(v) : Plain[marker];
        });

    /// <summary>The 1-based line and column at which the value of <paramref name="marker"/> stands in <see cref="Text"/> of <paramref name="values"/>.</summary>
    public static (int Line, int Column) Where(IReadOnlyDictionary<string, double> values, string marker)
    {
        var text = MarkerPattern().Replace(TemplateFor(values), m =>
            m.Groups["marker"].Value == marker ? "\u0001" : values.TryGetValue(m.Groups["marker"].Value, out var v) ? Number(v) : Plain[m.Groups["marker"].Value]);
        var at = text.IndexOf('\u0001', StringComparison.Ordinal);
        var lineStart = text.LastIndexOf('\n', at) + 1;
        return (text[..at].Count(c => c == '\n') + 1, at - lineStart + 1);
    }

    /// <summary>A number as a test writes it into the file: shortest round-trip text.</summary>
    public static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>The markers the template has (a test checks that every ranged key has one).</summary>
    public static IReadOnlyCollection<string> Markers => Plain.Keys;

    /// <summary>
    /// The figures of <paramref name="solution"/> that are not finite, by where they are: every number (and list of
    /// numbers) a run, an end point, a panel, a finding and a motor start gives, and the load flow's voltages.
    /// </summary>
    public static List<string> NotFinite(Solution solution)
    {
        var bad = new List<string>();
        foreach (var run in solution.Runs)
        {
            Check(run, $"run {run.Id}", bad, 0);
        }

        foreach (var end in solution.EndPoints)
        {
            Check(end, $"end point {end.Id}", bad, 0);
        }

        foreach (var panel in solution.Panels)
        {
            Check(panel, $"panel {panel}", bad, 0);
        }

        if (solution.LoadFlow.Converged)
        {
            Check(solution.LoadFlow, "load flow", bad, 0);
        }

        if (!double.IsFinite(solution.Summary.WorstTotalDropPercent))
        {
            bad.Add("summary: worst total");
        }

        return bad;
    }

    // Walks the public properties of the solving's result types (numbers, lists of numbers, findings, motor starts).
    private static void Check(object value, string where, List<string> bad, int depth)
    {
        foreach (var property in value.GetType().GetProperties(BindingFlags.Public | BindingFlags.Instance))
        {
            if (property.GetIndexParameters().Length > 0)
            {
                continue;
            }

            var got = property.GetValue(value);
            var at = $"{where}.{property.Name}";
            switch (got)
            {
                case double d when !double.IsFinite(d):
                    bad.Add($"{at} = {d}");
                    break;
                case IEnumerable<double> list when list.Any(d => !double.IsFinite(d)):
                    bad.Add($"{at} holds {string.Join(", ", list.Where(d => !double.IsFinite(d)))}");
                    break;
                case IEnumerable items and not string when depth < 2:
                    foreach (var item in items.OfType<object>().Where(IsResult))
                    {
                        Check(item, at, bad, depth + 1);
                    }

                    break;
                case { } nested when depth < 2 && IsResult(nested):
                    Check(nested, at, bad, depth + 1);
                    break;
            }
        }
    }

    private static bool IsResult(object o) => o is Finding or MotorStartResult or PanelResult;

    [GeneratedRegex(@"\{(?<marker>[a-z_]+\.[a-z_]+)\}")]
    private static partial Regex MarkerPattern();
}
