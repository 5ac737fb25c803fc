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

    public static RunResult Branch(this Solution s) => s.Runs.Single(r => r.Kind == RunResultKind.Branch);
}
