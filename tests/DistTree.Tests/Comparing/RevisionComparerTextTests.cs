using DistTree.Comparing;
using DistTree.Reports;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Comparing;

/// <summary>What a comparison shows people: lengths in the newer revision's units, loads with their units, ids in natural order, the project's own fields.</summary>
public sealed class RevisionComparerTextTests
{
    private static Comparison Compare(string before, string after) =>
        RevisionComparer.Compare(SolverHarness.Solve(before, "old.yaml"), SolverHarness.Solve(after, "new.yaml"));

    // A panel with circuits 1, 2, 10 and 11, each load stated in another unit; the lengths are bare numbers in `units`.
    private static string Panels(string units, string description = "First issue", string name = "Text test", double scale = 1, string length = "80") => FormattableString.Invariant($$"""
        disttree: 1
        project:
          name: {{name}}
          units: {{units}}
          description: {{description}}
        service:
          id: SVC
          system: 208Y/120
        equipment:
          - id: LP10
            kind: panelboard
            from: SVC
            circuits:
              - { id: "1", poles: 1, ocpd: 20, load: { va: {{1000 * scale}}, pf: 0.9 }, run: { length: 30, size: 12 AWG } }
          - id: LP2
            kind: panelboard
            from: SVC
            feeder: { length: {{length}}, size: 1/0 AWG, ocpd: 150 }
            circuits:
              - { id: "10", poles: 3, ocpd: 30, load: { kva: {{5 * scale}}, pf: 0.9 }, run: { length: 30, size: 10 AWG } }
              - { id: "2", poles: 3, ocpd: 30, load: { kw: {{4 * scale}}, pf: 0.9 }, run: { length: 30, size: 10 AWG } }
              - { id: "11", poles: 1, ocpd: 20, load: { amps: {{8 * scale}}, pf: 0.9 }, run: { length: 30, size: 12 AWG } }
              - { id: "1", poles: 3, ocpd: 30, load: { hp: {{2 * scale}}, pf: 0.8 }, run: { length: 30, size: 10 AWG } }
        """);

    [Fact]
    public void Compare_CircuitsAndEquipment_InNaturalOrderByPanelThenCircuit()
    {
        var c = Compare(Panels("imperial"), Panels("imperial", scale: 1.5, length: "90"));

        Assert.Equal(["LP2/1", "LP2/2", "LP2/10", "LP2/11", "LP10/1"], c.Circuits.Select(e => e.Id));
        Assert.Equal(["LP2"], c.Equipment.Select(e => e.Id));
        // Both revisions reversed in the file give the same order (matched by id, sorted after).
        var again = Compare(Panels("imperial"), Panels("imperial", scale: 1.5, length: "90"));
        Assert.Equal(c.Circuits.Select(e => e.Id), again.Circuits.Select(e => e.Id));
    }

    [Fact]
    public void Compare_LoadValues_CarryTheUnitTheyAreStatedIn()
    {
        var c = Compare(Panels("imperial"), Panels("imperial", scale: 1.5));

        string Load(string id) => c.Circuits.Single(e => e.Id == id).Fields.Single(f => f.Field == "load.value") is var f ? $"{f.BeforeText} -> {f.AfterText}" : "";
        Assert.Equal("1000 VA -> 1500 VA", Load("LP10/1"));
        Assert.Equal("5 kVA -> 7.5 kVA", Load("LP2/10"));
        Assert.Equal("4 kW -> 6 kW", Load("LP2/2"));
        Assert.Equal("8 A -> 12 A", Load("LP2/11"));
        Assert.Equal("2 hp -> 3 hp", Load("LP2/1"));
        // The JSON's values stay bare numbers.
        Assert.Equal(("1000", "1500"), c.Circuits.Single(e => e.Id == "LP10/1").Fields.Single(f => f.Field == "load.value") is var j ? (j.Before, j.After) : default);
    }

    // 80 ft = 24.384 m and 90 ft = 27.432 m (1 ft = 0.3048 m exactly, NIST SP 811 Appendix B.8).
    [Fact]
    public void Compare_ImperialProject_ShowsLengthsInFeetAndKeepsMetresForTheJson()
    {
        var c = Compare(Panels("imperial"), Panels("imperial", length: "90"));

        var f = Assert.Single(Assert.Single(c.Equipment).Fields);
        Assert.Equal(("feeder.length", "80 ft", "90 ft"), (f.Label, f.BeforeText, f.AfterText));
        Assert.Equal(("feeder.length_m", "24.384 (80 ft)", "27.432 (90 ft)"), (f.Field, f.Before, f.After));
        var markdown = ComparisonMarkdown.Write(c, 20);
        Assert.Contains("feeder.length: 80 ft → 90 ft", markdown, StringComparison.Ordinal);
        Assert.DoesNotContain("length\\_m", markdown, StringComparison.Ordinal);
        using var console = new StringWriter();
        ComparisonConsole.Write(console, c, 20);
        Assert.Contains("feeder.length 80 ft -> 90 ft", console.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_MetricRevisionTurnedImperial_ShowsBothInTheNewerUnits()
    {
        // The old revision in metres (24.384 m), the new one in feet (90 ft): both shown in feet.
        var c = Compare(Panels("metric", length: "24.384"), Panels("imperial", length: "90"));

        var f = Assert.Single(c.Equipment.Single(e => e.Id == "LP2").Fields, f => f.Field == "feeder.length_m");
        Assert.Equal(("80 ft", "90 ft"), (f.BeforeText, f.AfterText));
        var back = Compare(Panels("imperial", length: "90"), Panels("metric", length: "24.384"));
        var g = Assert.Single(back.Equipment.Single(e => e.Id == "LP2").Fields, f => f.Field == "feeder.length_m");
        Assert.Equal(("27.432 m", "24.384 m"), (g.BeforeText, g.AfterText));
    }

    [Fact]
    public void Compare_DescriptionAndNameChanged_ListsBothAsProjectFields()
    {
        var c = Compare(Panels("imperial"), Panels("imperial", description: "Second issue", name: "Text test B"));

        Assert.Equal(
            [new FieldChange("project.name", "Text test", "Text test B"), new FieldChange("project.description", "First issue", "Second issue")],
            c.ProjectChanges);
        Assert.Equal(2, c.Summary.ProjectChanges);
        Assert.Contains("| `project` | changed | project.description: First issue → Second issue |", ComparisonMarkdown.Write(c, 20), StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_DescriptionAdded_ListsItFromNone()
    {
        var without = Panels("imperial").Replace("  description: First issue\n", "", StringComparison.Ordinal);
        Assert.NotEqual(Panels("imperial"), without);

        var c = Compare(without, Panels("imperial"));

        Assert.Equal([new FieldChange("project.description", "none", "First issue")], c.ProjectChanges);
    }
}
