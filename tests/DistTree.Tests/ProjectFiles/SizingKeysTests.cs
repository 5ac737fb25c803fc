using DistTree.Diagnostics;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>The sizing keys of issue 21: <c>sizing: terminal_table</c> (read as the rules' tables are), <c>sizing: tap_cost</c>, <c>sizing: light_load_rise_percent</c>, and a transformer's <c>tap_range_percent</c>.</summary>
public sealed class SizingKeysTests : IDisposable
{
    private const string Table = "# Invented test table, not a maker's.\ndevice_a\tsets\tawg\tmm2\n20\t1\t6 AWG\t16 mm2\n";

    private readonly OwnTablesFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static string WithSizing(string sizing) => OwnTablesFolder.Project().Replace("service:", $"sizing: {{ {sizing} }}\nservice:", StringComparison.Ordinal);

    [Fact]
    public void Load_TerminalTable_HeldOnTheSizingAndAmongTheFiles()
    {
        _folder.Write("tables/lugs.tsv", Table);
        var project = ProjectLoader.Load(_folder.Write("p.yaml", WithSizing("terminal_table: tables/lugs.tsv, tap_cost: 12.5, light_load_rise_percent: 3.5")));

        Assert.EndsWith("tables/lugs.tsv", project.Sizing.TerminalTable!.SourceName, StringComparison.Ordinal);
        Assert.Equal(12.5, project.Sizing.TapCost);
        Assert.Equal(3.5, project.Sizing.LightLoadRisePercent);
        Assert.Equal(["p.yaml", "tables/lugs.tsv"], project.Files.Select(f => f.PathInProject));
    }

    // ANSI C84.1's Range A upper limit, +5 % (recalled): the default.
    [Fact]
    public void Load_NoLightLoadRise_FivePercent() =>
        Assert.Equal(5.0, ProjectLoader.Load(_folder.Write("p.yaml", WithSizing("tap_cost: 1"))).Sizing.LightLoadRisePercent);

    [Fact]
    public void Load_LightLoadRiseOutOfRange_ErrorAtTheValue()
    {
        var main = _folder.Write("p.yaml", WithSizing("light_load_rise_percent: 12"));
        var error = Assert.Single(Assert.Throws<ProjectException>(() => ProjectLoader.Load(main)).Diagnostics, d => d.Severity == Severity.Error);
        Assert.StartsWith("'light_load_rise_percent' must be between 0 and 10 %", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Load_TerminalTableMissing_ErrorAtTheKey()
    {
        var text = WithSizing("terminal_table: tables/none.tsv");
        var main = _folder.Write("p.yaml", text);

        var error = Assert.Single(Assert.Throws<ProjectException>(() => ProjectLoader.Load(main)).Diagnostics, d => d.Severity == Severity.Error);

        Assert.StartsWith("cannot read the file 'terminal_table' names, '", error.Message, StringComparison.Ordinal);
        var lines = text.Split('\n');
        var line = Array.FindIndex(lines, l => l.StartsWith("sizing:", StringComparison.Ordinal));
        Assert.Equal((line + 1, lines[line].IndexOf("terminal_table", StringComparison.Ordinal) + 1), (error.Location.Line, error.Location.Column));
    }

    [Fact]
    public void Load_TerminalTableBadLine_ErrorInTheTable()
    {
        var table = _folder.Write("tables/lugs.tsv", Table.Replace("6 AWG", "6 AWGG", StringComparison.Ordinal));
        var main = _folder.Write("p.yaml", WithSizing("terminal_table: tables/lugs.tsv"));

        var error = Assert.Single(Assert.Throws<ProjectException>(() => ProjectLoader.Load(main)).Diagnostics, d => d.Severity == Severity.Error);

        Assert.Equal((table, 3, 6), (error.Location.File, error.Location.Line, error.Location.Column));
        Assert.StartsWith("column awg:", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("1", "'tap_range_percent' of 'T1' is 1; the upsizer sets taps in 2.5 % steps, so the range is 0, 2.5 or 5")]
    [InlineData("7.5", "'tap_range_percent' of 'T1' must be between 0 and 5 %")]
    public void Parse_TapRangeNotAStep_LocatedError(string range, string message)
    {
        var text = $$"""
            disttree: 1
            project: { name: T, units: metric }
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - { id: T1, kind: transformer, from: SVC, kva: 45, secondary: 208Y/120, impedance_percent: 5, x_r: 2, tap_range_percent: {{range}} }
            """;
        var error = Assert.Single(Assert.Throws<ProjectException>(() => ProjectLoader.Parse(text, "t.yaml")).Diagnostics, d => d.Severity == Severity.Error);
        Assert.StartsWith(message, error.Message, StringComparison.Ordinal);
        Assert.Equal(5, error.Location.Line);
    }
}
