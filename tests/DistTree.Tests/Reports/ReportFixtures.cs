using AngleSharp.Html.Dom;
using AngleSharp.Html.Parser;
using DistTree.Reports;
using DistTree.Solving;

namespace DistTree.Tests.Reports;

/// <summary>The demo project solved once, and helpers to render and parse reports.</summary>
internal static class ReportFixtures
{
    private static readonly Lazy<Solution> DemoSolution = new(() => SolveFile(DemoPath));

    /// <summary>The invented demo building (projects/quillfeather-medical.yaml).</summary>
    public static string DemoPath => Path.Combine(TestPaths.RepoRoot, "projects", "quillfeather-medical.yaml");

    public static Solution Demo => DemoSolution.Value;

    public static Solution SolveFile(string path) => Analysis.Run(path).Solution;

    public static Solution SolveText(string yaml, string file = "test.yaml") =>
        Analysis.Parse(yaml, file).Solution;

    public static IHtmlDocument Parse(string html) => new HtmlParser().ParseDocument(html);

    public static IHtmlDocument RenderDemo(HtmlReportOptions? options = null) =>
        Parse(HtmlReport.Render(Demo, options ?? HtmlReportOptions.Default));

    /// <summary>A project with one panel at the service and the given circuits (YAML flow mappings, one a line).</summary>
    public static string OnePanel(string projectName, IEnumerable<string> circuits, string panel = "P") => $"""
        disttree: 1
        project:
          name: {projectName}
          units: metric
        service:
          id: SVC
          system: 208Y/120
          frequency_hz: 60
        equipment:
          - id: {panel}
            kind: panelboard
            from: SVC
            circuits:
        {string.Join("\n", circuits.Select(c => "      - " + c))}
        """;
}
