using System.Globalization;
using System.Text;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Solving;

namespace DistTree.Benchmarks;

/// <summary>
/// The same 100,000 branch circuits in one panelboard and spread over 1,000 panelboards: loading, building and
/// solving take time linear in the circuits of one panel, so the two cost about the same. Timed in turn, in this
/// process, from the text (the loader reads it like a file).
/// </summary>
internal static class PanelWidth
{
    /// <summary>The branch circuits of both projects.</summary>
    public const int Circuits = 100_000;

    /// <summary>The panelboards the second project spreads them over.</summary>
    public const int ManyPanels = 1_000;

    /// <summary>The most the one wide panel may take, as a multiple of the same circuits over many panels.</summary>
    public const double TargetRatio = 1.5;

    /// <summary>Times load, build and solve of both projects in turn, and returns the lines to print.</summary>
    public static List<string> Run(string folder)
    {
        var onePanel = Text(Circuits, 1);
        var manyPanels = Text(Circuits, ManyPanels);
        var (onePath, manyPath) = (Path.Combine(folder, "one-panel.yaml"), Path.Combine(folder, "many-panels.yaml"));
        var (one, many) = Measurement.Alternately(
            "1-panel", $"{ManyPanels}-panels", Circuits, repeats: 5, warmUps: 2,
            () => DropSolver.Standard.Solve(NetworkBuilder.Build(ProjectLoader.Parse(onePanel, onePath))),
            () => DropSolver.Standard.Solve(NetworkBuilder.Build(ProjectLoader.Parse(manyPanels, manyPath))));
        var ratio = one.Median / many.Median;
        return
        [
            $"Load, build and solve of {Circuits:N0} branch circuits (issue 16):",
            $"  {one}",
            $"  {many}",
            $"  one panel / {ManyPanels:N0} panels time ratio {ratio,6:0.00}   target <= {TargetRatio:0.0}   {(ratio <= TargetRatio ? "met" : "MISSED")}",
        ];
    }

    /// <summary>
    /// An invented project: <paramref name="circuits"/> branch circuits (lighting, receptacles, two- and three-pole
    /// loads, lengths 20 to 99 ft) over <paramref name="panels"/> 480Y/277 panelboards under one switchboard.
    /// Circuit k is the same in both projects wherever it stands.
    /// </summary>
    public static string Text(int circuits, int panels)
    {
        var text = new StringBuilder(circuits * 130);
        text.Append(CultureInfo.InvariantCulture, $$"""
            disttree: 1
            project:
              name: Panel width trial ({{circuits}} circuits over {{panels}} panelboards)
              units: imperial
              description: Invented for the benchmarks; describes no real site.
            defaults: { material: cu, insulation_c: 75, raceway: steel }
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - { id: MSB, kind: switchboard, from: SVC }

            """);
        var perPanel = circuits / panels;
        for (var k = 0; k < circuits; k++)
        {
            var number = k % perPanel;
            if (number == 0)
            {
                text.Append(CultureInfo.InvariantCulture, $"  - id: P{k / perPanel + 1:0000}\n    kind: panelboard\n    from: MSB\n");
                text.Append("    feeder: { length: 60, size: 500 kcmil, sets: 8, ocpd: 2500 }\n    circuits:\n");
            }

            var (poles, load) = (k % 10) switch
            {
                9 => (3, $"kva: {3 + k % 7}"),
                8 => (2, $"va: {1200 + 40 * (k % 11)}"),
                _ => (1, $"va: {180 + 37 * (k % 23)}"),
            };
            text.Append(CultureInfo.InvariantCulture, $"      - {{ id: \"{number + 1}\", poles: {poles}, ocpd: 20, load: {{ {load}, pf: 0.95 }}, run: {{ length: {20 + k * 7 % 80}, size: 12 AWG }} }}\n");
        }

        return text.ToString();
    }
}
