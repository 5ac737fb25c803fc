using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// ProjectLoader on how a size is written (docs/project-file.md, YAML rules): a bare number is an error naming the
/// standard sizes it could be (the AWG ladder, kcmil and IEC 60228's mm2 cross-sections), located at the value, in
/// an imperial and in a metric project alike; a size with its unit, <c>#12</c> and <c>1/0</c> read as before.
/// </summary>
public sealed class ProjectLoaderSizeTextTests
{
    // 4 is on both ladders (4 AWG; IEC 60228 4 mm2); 12 only on the AWG ladder; 2.5 only in mm2; 400 both in kcmil
    // and mm2; 7 on none.
    [Theory]
    [InlineData("imperial", "208Y/120", "4", "'4 AWG' or '4 mm2'")]
    [InlineData("metric", "400Y/230", "4", "'4 AWG' or '4 mm2'")]
    [InlineData("imperial", "208Y/120", "12", "'12 AWG'")]
    [InlineData("metric", "400Y/230", "2.5", "'2.5 mm2'")]
    [InlineData("metric", "400Y/230", "400", "'400 kcmil' or '400 mm2'")]
    [InlineData("imperial", "208Y/120", "\"4\"", "'4 AWG' or '4 mm2'")]
    public void Parse_BareSize_IsAnErrorNamingItsReadings(string units, string system, string size, string readings)
    {
        var text = Project(units, system, "", $"{{ length: 20, size: {size} }}");
        var bare = size.Trim('"');

        ProjectText.AssertOneError(text, size, $"'size' of the run of circuit 'P/1' is '{bare}', which has no unit: write {readings}", line: 5);
    }

    [Fact]
    public void Parse_BareNumberOnNoLadder_IsAnErrorAskingForTheUnit()
    {
        var text = Project("imperial", "208Y/120", "", "{ length: 20, size: 7 }");

        ProjectText.AssertOneError(text, "7", "'size' of the run of circuit 'P/1' is '7', which has no unit and is no standard size in AWG, kcmil or mm2: write a size with its unit, e.g. '12 AWG', '250 kcmil' or '95 mm2'", line: 5);
    }

    [Fact]
    public void Parse_BareNeutralSize_IsAnErrorAtItsValue()
    {
        var text = Project("metric", "400Y/230", "", "{ length: 20, size: 4 mm2, neutral_size: 6 }");

        ProjectText.AssertOneError(text, "6", "'neutral_size' of the run of circuit 'P/1' is '6', which has no unit: write '6 AWG' or '6 mm2'", line: 5);
    }

    [Fact]
    public void Parse_BarePriceSize_IsAnErrorAtTheKey()
    {
        var text = Project("imperial", "208Y/120", "sizing: { prices: { 10 AWG: 0.9, 12: 0.6 } }\n", "{ length: 20, size: 12 AWG }");

        ProjectText.AssertOneError(text, "12:", "a size in 'prices' is '12', which has no unit: write '12 AWG'", line: 3);
    }

    [Theory]
    [InlineData("\"#12\"", "12 AWG")]
    [InlineData("12 AWG", "12 AWG")]
    [InlineData("12awg", "12 AWG")]
    [InlineData("4 mm2", "4 mm2")]
    [InlineData("1/0", "1/0 AWG")]
    [InlineData("250 MCM", "250 kcmil")]
    public void Parse_SizeWithItsUnit_Reads(string size, string expected)
    {
        var text = Project("imperial", "208Y/120", "sizing: { prices: { \"#10\": 0.9, 4 mm2: 0.5 } }\n", $"{{ length: 20, size: {size} }}");

        var project = ProjectLoader.Parse(text, "t.yaml");

        Assert.Equal(expected, project.Equipment[0].Circuits[0].Run.Size.Text);
        Assert.Equal(["10 AWG", "4 mm2"], project.Sizing.Prices.Keys.Select(k => k.Text).Order(StringComparer.Ordinal));
    }

    private static string Project(string units, string system, string sizing, string run) =>
        $"disttree: 1\nproject: {{ name: Sizes, units: {units} }}\n{sizing}service: {{ id: SVC, system: {system} }}\n"
        + "equipment:\n"
        + $"  - {{ id: P, kind: panelboard, from: SVC, feeder: {{ length: 20, size: 2/0 AWG }}, circuits: [ {{ id: 1, poles: 1, load: {{ va: 1000 }}, run: {run} }} ] }}\n";
}
