using System.Text.Json;
using DistTree.Diagnostics;
using DistTree.Tests.Reports;

namespace DistTree.Tests.Cli;

/// <summary>
/// Control characters, separators and direction marks in a project's names and in its path reach every output shown
/// to a person escaped as <c>\uXXXX</c> (console, messages, Markdown, HTML), and JSON and SARIF carry the exact text
/// with JSON's own escapes (RFC 8259, section 7: control characters must be escaped in a string).
/// </summary>
public sealed class DisplayEscapingTests : IDisposable
{
    // ESC [ 31 m (ECMA-48: colour red), RIGHT-TO-LEFT OVERRIDE, NEL (C1), DEL.
    private const string ProjectName = "Red \u001B[31mname\u202E x\u0085\u007F";
    private const string ShownProjectName = "Red \\u001B[31mname\\u202E x\\u0085\\u007F";

    // OSC 0 (set the window title) ended by BEL, a tab and a line break: the line would forge a line of output.
    private const string CircuitName = "Cop\tier\u001B]0;title\u0007\nforged line";
    private const string ShownCircuitName = "Cop\\u0009ier\\u001B]0;title\\u0007\\u000Aforged line";

    private readonly TempFolder _folder = new();

    public DisplayEscapingTests()
    {
        // A path with an escape sequence of its own where the file system allows one.
        var name = OperatingSystem.IsWindows() ? "named.yaml" : "nam\u001B[2Jed.yaml";
        Path = _folder.File(name);
        ShownPath = DisplayText.Escape(Path);
        File.WriteAllText(Path, Project(ProjectName, CircuitName, length: 60));
    }

    private string Path { get; }

    private string ShownPath { get; }

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Analyze_Console_ShowsNamesAndPathEscaped()
    {
        var r = CliRunner.Run("analyze", Path);

        Assert.Equal(1, r.ExitCode); // the long branch is over its limit
        AssertNothingActs(r.Out);
        Assert.Contains($"DistTree analysis: {ShownProjectName}\n", Lf(r.Out), StringComparison.Ordinal);
        Assert.Contains(ShownCircuitName, r.Out, StringComparison.Ordinal);
        Assert.Contains($"  file   {ShownPath} ", r.Out, StringComparison.Ordinal);
        Assert.Contains($"  {ShownPath}:", r.Out, StringComparison.Ordinal); // a finding's location
    }

    [Fact]
    public void Check_Console_ShowsThePathEscapedInTheVerdictAndEachFinding()
    {
        var r = CliRunner.Run("check", Path);

        Assert.Equal(1, r.ExitCode);
        AssertNothingActs(r.Out);
        Assert.StartsWith($"FAIL: {ShownPath}: ", r.Out, StringComparison.Ordinal);
        Assert.Contains($"\n{ShownPath}:", Lf(r.Out), StringComparison.Ordinal);
    }

    [Fact]
    public void Upsize_Console_ShowsNamesAndPathEscaped()
    {
        var r = CliRunner.Run("upsize", Path);

        Assert.Equal(0, r.ExitCode);
        AssertNothingActs(r.Out);
        Assert.Contains($"DistTree upsize plan: {ShownProjectName}\n", Lf(r.Out), StringComparison.Ordinal);
        Assert.Contains($"  file   {ShownPath} ", r.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_ConsoleAndMarkdown_ShowNamesEscaped()
    {
        var old = _folder.File("old.yaml");
        File.WriteAllText(old, Project("Plain", "Plain circuit", length: 20));
        var markdown = _folder.File("c.md");

        var r = CliRunner.Run("compare", old, Path, "--markdown", markdown);

        Assert.Equal(1, r.ExitCode); // a new finding
        AssertNothingActs(r.Out);
        Assert.Contains($"DistTree comparison: {ShownProjectName}\n", Lf(r.Out), StringComparison.Ordinal);
        Assert.Contains($"name Plain circuit -> {ShownCircuitName}", r.Out, StringComparison.Ordinal);
        var md = File.ReadAllText(markdown);
        AssertNothingActs(md);

        // In Markdown a backslash before 'u' is no escape (CommonMark 0.31, 2.4: only ASCII punctuation is escaped), so
        // the escapes read as written; the pipe table's markup characters are escaped as before.
        Assert.Contains("### DistTree comparison: Red \\u001B\\[31mname\\u202E x\\u0085\\u007F\n", md, StringComparison.Ordinal);
        Assert.Contains("name: Plain circuit → Cop\\u0009ier\\u001B\\]0;title\\u0007\\u000Aforged line; ", md, StringComparison.Ordinal);
    }

    [Fact]
    public void Analyze_Html_ShowsNamesAndPathEscaped()
    {
        var html = _folder.File("r.html");

        var r = CliRunner.Run("analyze", Path, "--html", html, "--date", "day\u001B[5m\u2067");

        Assert.Equal(1, r.ExitCode);
        var page = File.ReadAllText(html);
        AssertNothingActs(page);
        var doc = ReportFixtures.Parse(page);
        Assert.Equal(ShownProjectName, doc.QuerySelector("h1")!.TextContent);
        Assert.Contains(doc.QuerySelectorAll(".meta dd"), dd => dd.TextContent == "day\\u001B[5m\\u2067");
        Assert.Contains(doc.QuerySelectorAll(".meta dd code"), c => c.TextContent == ShownPath);
        Assert.Contains(doc.QuerySelectorAll(".cname"), c => c.TextContent == ShownCircuitName);
    }

    [Fact]
    public void Analyze_JsonAndSarif_CarryTheExactTextWithControlCharactersAsJsonEscapes()
    {
        var json = _folder.File("r.json");
        var sarif = _folder.File("r.sarif");

        var r = CliRunner.Run("analyze", Path, "--json", json, "--sarif", sarif);

        Assert.Equal(1, r.ExitCode);
        foreach (var file in new[] { json, sarif })
        {
            var text = File.ReadAllText(file);
            Assert.DoesNotContain(text, c => c < ' ' && c != '\n'); // RFC 8259: no control character unescaped
            Assert.Contains("\\u001B[31m", text, StringComparison.Ordinal);
        }

        using var results = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Equal(ProjectName, results.RootElement.GetProperty("project").GetProperty("name").GetString());
        Assert.Equal(Path, results.RootElement.GetProperty("project").GetProperty("file").GetString());
        Assert.Contains(CircuitName, JsonNames(results), StringComparer.Ordinal);
        using var log = JsonDocument.Parse(File.ReadAllText(sarif));
        var run = log.RootElement.GetProperty("runs")[0];
        Assert.Equal(ProjectName, run.GetProperty("properties").GetProperty("project").GetString());
    }

    [Fact]
    public void Validate_MissingFileWithEscapeSequenceInItsName_MessageShowsItEscaped()
    {
        var r = CliRunner.Run("validate", _folder.File("no\u001B[31mne.yaml"));

        Assert.Equal(2, r.ExitCode);
        AssertNothingActs(r.Error);
        Assert.Contains("no\\u001B[31mne.yaml': no such file", r.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_UnknownOptionWithEscapeSequence_MessageShowsItEscaped()
    {
        var r = CliRunner.Run("validate", Path, "--x\u001B[8m");

        Assert.Equal(2, r.ExitCode);
        AssertNothingActs(r.Error);
        Assert.Contains("--x\\u001B[8m", r.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_WarningOnAFileWithEscapeSequenceInItsPath_LocationShowsItEscaped()
    {
        File.WriteAllText(Path, Project(ProjectName, CircuitName, length: 700)); // a branch over 609.6 m: a warning

        var r = CliRunner.Run("validate", Path);

        Assert.Equal(0, r.ExitCode);
        AssertNothingActs(r.Error);
        Assert.StartsWith($"{ShownPath}:", r.Error, StringComparison.Ordinal);
    }

    // Everything but the line breaks an output is made of.
    private static void AssertNothingActs(string output)
    {
        var lines = Lf(output).Replace("\n", "", StringComparison.Ordinal);
        Assert.False(DisplayText.NeedsEscape(lines), $"a character that acts reached the output: {DisplayText.Escape(lines)}");
    }

    private static string Lf(string text) => text.ReplaceLineEndings("\n");

    private static string[] JsonNames(JsonDocument results) =>
        results.RootElement.GetProperty("end_points").EnumerateArray().Select(e => e.GetProperty("name").GetString()!).ToArray();

    // One panel on the service with one circuit; length in metres (a long run fails the branch limit).
    private static string Project(string name, string circuitName, int length) => $$"""
        disttree: 1
        project:
          name: {{JsonSerializer.Serialize(name)}}
          units: metric
        service:
          id: SVC
          system: 208Y/120
        equipment:
          - id: LP1
            kind: panelboard
            from: SVC
            feeder: { length: 20, size: 2 AWG }
            circuits:
              - id: "1"
                name: {{JsonSerializer.Serialize(circuitName)}}
                poles: 1
                ocpd: 20
                load: { va: 1500 }
                run: { length: {{length}}, size: 12 AWG }

        """;
}
