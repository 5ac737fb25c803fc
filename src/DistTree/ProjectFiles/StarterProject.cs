using System.Globalization;
using System.Text;
using DistTree.Model;

namespace DistTree.ProjectFiles;

/// <summary>
/// The commented starter project that <c>disttree init</c> writes: a service, its service-entrance
/// switchboard, one panelboard on a feeder and a few branch circuits that the system can give, every key
/// explained. The figures are invented placeholders, chosen to be within every limit so that the file
/// validates and analyzes cleanly before it is edited.
/// </summary>
public static class StarterProject
{
    /// <summary>The default units for a system: metric for the 230 V systems (IEC practice), else imperial.</summary>
    public static UnitSystem DefaultUnits(ElectricalSystem system) => IsIec(system) ? UnitSystem.Metric : UnitSystem.Imperial;

    /// <summary>The starter project's text (ending in a newline) for the given units and service system.</summary>
    public static string Write(UnitSystem units, ElectricalSystem system)
    {
        var iec = IsIec(system);
        var metric = units == UnitSystem.Metric;
        string Length(double feet, double metres) => (metric ? metres : feet).ToString("0.#", CultureInfo.InvariantCulture);
        var unitWord = metric ? "metres" : "feet";
        var branchSize = iec ? "2.5 mm2" : "12 AWG";
        var branchOcpd = iec ? 16 : 20;
        var o = new StringBuilder();
        o.Append(CultureInfo.InvariantCulture, $$"""
            # A starter project written by 'disttree init'. Every name and figure below is an invented
            # placeholder to be replaced with the building's own; it describes no real building or design.
            # The format: docs/project-file.md. Check it: disttree validate FILE; solve it: disttree analyze FILE.
            # A design aid: the code in force and the authority having jurisdiction decide, and a qualified
            # person reviews the design.
            disttree: 1                       # the format version
            project:
              name: New building
              units: {{(metric ? "metric  " : "imperial")}}                 # unit of bare lengths: metric (m) or imperial (ft)
            rules:                            # the defaults, written out to be changed
              feeder_limit_percent: 3         # the most drop allowed in one feeder
              branch_limit_percent: 3         # ... in one branch circuit
              total_limit_percent: 5          # ... from the service to the farthest point of use
              branch_current: connected       # connected | ocpd_80 | lesser
              conductor_temperature: estimated  # estimated | rated | a temperature in °C
              transformer_drop: count         # count | new_origin
              ambient_c: 30
            defaults:                         # every run inherits these unless it says otherwise
              material: cu                    # cu | al
              insulation_c: 75                # 60 | 75 | 90
              raceway: pvc                    # pvc | aluminum | steel
            service:
              id: SVC
              system: {{system.Name}}
              frequency_hz: {{(iec ? 50 : 60)}}
            equipment:                        # in any order; each names what feeds it ('from')
              - id: MDP
                kind: switchboard             # switchboard | panelboard | transformer | splitter
                from: SVC                     # service-entrance equipment: no feeder, so no drop
              - id: LP1
                kind: panelboard
                from: MDP
                # Lengths are one way, in {{unitWord}} (or write the unit: "30 m", "100 ft").
                feeder: { length: {{Length(100, 30)}}, size: {{(iec ? "16 mm2" : "4 AWG")}}, ocpd: {{(iec ? 63 : 60)}} }
                demand_factor: 1.0
                circuits:

            """);
        var id = 1;
        void Circuit(string name, int poles, string load, bool continuous, double feet, double metres)
        {
            // The first circuit explains its keys; the others follow it.
            var first = id == 1;
            void Line(string text, string note) =>
                o.Append(first ? (text.Length < 33 ? text.PadRight(34) : text + "  ") + "# " + note : text).Append('\n');
            Line($"      - id: \"{id++}\"", "unique in its panel; the full id is LP1/1");
            Line($"        name: {name}", "free text");
            Line(string.Create(CultureInfo.InvariantCulture, $"        poles: {poles}"), "1: line-neutral; 2: line-line; 3: three-phase");
            Line(string.Create(CultureInfo.InvariantCulture, $"        ocpd: {branchOcpd}"), "the overcurrent device's rating, A");
            Line($"        continuous: {(continuous ? "true" : "false")}", "3 hours or more: counted at 125 % for ampacity");
            Line($"        load: {load}", "or kva, kw (+pf), amps (+pf), hp (+pf)");
            Line($"        run: {{ length: {Length(feet, metres)}, size: {branchSize} }}", "the branch circuit's conductors");
        }

        if (system.CircuitFor(1) is not null)
        {
            Circuit("Lighting", 1, "{ va: 1200, pf: 0.95 }", continuous: true, 50, 15);
            Circuit("Receptacles", 1, "{ va: 1440, pf: 0.95 }", continuous: false, 40, 12);
        }

        if (system.CircuitFor(2) is not null)
        {
            Circuit("Water heater", 2, "{ kw: 3, pf: 1.0 }", continuous: false, 30, 9);
        }

        if (system.CircuitFor(3) is not null)
        {
            Circuit("Exhaust fan", 3, "{ kva: 5, pf: 0.85 }", continuous: true, 60, 18);
        }

        return o.ToString();
    }

    private static bool IsIec(ElectricalSystem system) => system.Name is "400Y/230" or "230";
}
