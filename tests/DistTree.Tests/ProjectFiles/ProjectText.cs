using DistTree.Diagnostics;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>Small project texts for tests, built from a valid minimal project (invented data).</summary>
internal static class ProjectText
{
    /// <summary>A valid project: one panel on the given system with one circuit.</summary>
    public static string Minimal(string units = "metric", string system = "208Y/120", string feeder = "{ length: 20, size: 2 AWG }",
        string circuit = "poles: 1\n        ocpd: 20\n        load: { va: 1000 }\n        run: { length: 20, size: 12 AWG }",
        string extraTop = "", string extraPanel = "") =>
        $"""
        disttree: 1
        project:
          name: Test
          units: {units}
        {extraTop}service:
          id: SVC
          system: {system}
        equipment:
          - id: LP1
            kind: panelboard
            from: SVC
            feeder: {feeder}
        {extraPanel}    circuits:
              - id: "1"
                {circuit}

        """;

    /// <summary>
    /// Loading <paramref name="text"/> gives exactly one diagnostic, an error with <paramref name="message"/>, located
    /// where <paramref name="token"/> is written (on <paramref name="line"/> where one is given).
    /// </summary>
    public static void AssertOneError(string text, string token, string message, int? line = null)
    {
        var error = Assert.Throws<ProjectException>(() => ProjectLoader.Parse(text, "t.yaml"));
        var diagnostic = Assert.Single(error.Diagnostics);
        Assert.Equal((Severity.Error, message), (diagnostic.Severity, diagnostic.Message));
        if (line is { } expected)
        {
            Assert.Equal(expected, diagnostic.Location.Line);
        }

        var written = text.Split('\n')[diagnostic.Location.Line - 1];
        Assert.StartsWith(token, written[(diagnostic.Location.Column - 1)..], StringComparison.Ordinal);
    }
}
