using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>Runs the pipeline on project text (<see cref="Analysis.Parse"/>: parse, build, solve).</summary>
internal static class SolverHarness
{
    public static Solution Solve(string yaml, string file = "test.yaml") =>
        Analysis.Parse(yaml, file).Solution;

    /// <summary>A project with one panel at the service and one circuit; the circuit's YAML is given.</summary>
    public static string OneCircuit(string system, string units, string circuit, string rules = "conductor_temperature: rated", double frequencyHz = 60) => $"""
        disttree: 1
        project:
          name: Test
          units: {units}
        rules:
          {rules}
        service:
          id: SVC
          system: {system}
          frequency_hz: {frequencyHz}
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            circuits:
              - {circuit}
        """;

    /// <summary>
    /// A metric project with a 208Y/120 panel P on a feeder from the service, whose run is the flow mapping's keys
    /// <paramref name="feeder"/> (<c>length: 10, size: 4 AWG</c>), with <paramref name="circuits"/> (each a flow
    /// mapping); conductor temperatures at their rating.
    /// </summary>
    public static string PanelOnFeeder(string feeder, params string[] circuits) =>
        "disttree: 1\nproject: { name: Panel on a feeder, units: metric }\nrules: { conductor_temperature: rated }\n"
        + "service: { id: SVC, system: 208Y/120 }\nequipment:\n  - id: P\n    kind: panelboard\n    from: SVC\n"
        + $"    feeder: {{ {feeder} }}\n    circuits:\n" + string.Concat(circuits.Select(c => $"      - {c}\n"));

    public static RunResult Branch(this Solution s) => s.Runs.Single(r => r.Kind == RunResultKind.Branch);
}
