using System.Globalization;
using System.Text;
using DistTree.Diagnostics;
using DistTree.ProjectFiles;
using DistTree.Sizing;
using Xunit.Abstractions;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// The bounds on work that grows with a value of the file (docs/limits.md, Time and memory): the parallel sets, the
/// sizer's sets and grid, the length of ids and the "did you mean" hints among them. Each runs under
/// <see cref="Bounded"/> (1 MiB stack, 30 s guard) and states the memory it may allocate.
/// </summary>
public sealed class SizeBoundsTests(ITestOutputHelper output)
{
    // Values that cost without end before they were bounded: sets: 2147483647 looped in the sizer (its count of sets
    // overflowed), max_sets: 1000000 took 54 s and 7.7 GB, a grid of 1e-8 % ran out of memory and 1e-12 % crashed.
    [Theory]
    [InlineData("feeder: { length: 20, size: 2 AWG }", "feeder: { length: 20, size: 2 AWG, sets: 2147483647 }", "'sets' of the feeder of 'LP1' must be a whole number from 1 to 40; found 2147483647")]
    [InlineData("service:", "sizing: { max_sets: 1000000 }\nservice:", "'max_sets' must be a whole number from 1 to 40; found 1000000")]
    [InlineData("service:", "sizing: { resolution_percent: 1e-8 }\nservice:", "'resolution_percent' must be between 0.001 and 1 %; found 1e-8")]
    [InlineData("service:", "sizing: { resolution_percent: 1e-12 }\nservice:", "'resolution_percent' must be between 0.001 and 1 %; found 1e-12")]
    public void Parse_CostlyValue_RefusedWhereItIsRead(string original, string replacement, string message)
    {
        var text = ProjectText.Minimal().Replace(original, replacement, StringComparison.Ordinal);

        var result = Bounded.Run(() => ProjectLoader.Parse(text, "t.yaml"));

        var error = Assert.IsType<ProjectException>(result.Thrown);
        Assert.Equal(message, Assert.Single(error.Diagnostics).Message);
    }

    // The most the sizer is given: every feeder may take 40 sets of every size, on a grid of 0.001 % under a total
    // limit of almost 100 % (99,999 steps), over 30 panels of 3 circuits.
    [Fact]
    public void Plan_AtTheEndsOfSetsAndGrid_BoundedTimeAndMemory()
    {
        var text = new StringBuilder("""
            disttree: 1
            project: { name: Wide, units: metric }
            rules: { total_limit_percent: 99.999, feeder_limit_percent: 0.5, branch_limit_percent: 0.5 }
            sizing: { max_sets: 40, resolution_percent: 0.001 }
            service: { id: SVC, system: 480Y/277 }
            equipment:

            """);
        for (var p = 0; p < 30; p++)
        {
            text.Append(CultureInfo.InvariantCulture, $"  - {{ id: P{p}, kind: panelboard, from: {(p == 0 ? "SVC" : $"P{p - 1}")}, feeder: {{ length: 60, size: 1 AWG, sets: 40 }}, circuits: [");
            text.Append("{ id: \"1\", poles: 3, load: { kva: 30 }, run: { length: 80, size: 12 AWG } }, ");
            text.Append("{ id: \"2\", poles: 1, load: { va: 1800 }, run: { length: 50, size: 12 AWG } }, ");
            text.Append("{ id: \"3\", poles: 3, load: { hp: 20, pf: 0.85 }, run: { length: 70, size: 10 AWG } }] }\n");
        }

        var before = Analysis.Parse(text.ToString(), "wide.yaml").Solution;

        var result = Bounded.Run(() => Upsizer.Standard.Plan(before));

        output.WriteLine($"plan: {result.Elapsed.TotalSeconds:0.00} s, {result.AllocatedMiB} MiB allocated");
        Assert.Null(result.Thrown);
        Assert.True(result.AllocatedMiB <= 512, $"allocated {result.AllocatedMiB} MiB; the bound is 512 MiB");
    }

    // Two ids of 20,000 characters, one the other's source: comparing them for a hint took 8 s and 1.6 GB
    // (65,000 characters, 17 GB). Each is refused where it is read, and nothing compares them.
    [Fact]
    public void Parse_TwoIdsOf20000Characters_RefusedAtEachInBoundedMemory()
    {
        var a = new string('a', 20_000);
        var b = new string('a', 19_999) + "b";
        var text = ProjectText.Minimal()
            .Replace("- id: LP1", $"- id: {a}", StringComparison.Ordinal)
            .Replace("from: SVC", $"from: {b}", StringComparison.Ordinal);

        var result = Bounded.Run(() => ProjectLoader.Parse(text, "t.yaml"));

        output.WriteLine($"{result.Elapsed.TotalSeconds:0.00} s, {result.AllocatedMiB} MiB allocated");
        var error = Assert.IsType<ProjectException>(result.Thrown);
        Assert.Equal(
            [
                "t.yaml:9:9: error: 'id' of equipment has 20,000 characters; an id may have at most 200 (see docs/limits.md)",
                "t.yaml:11:11: error: 'from' of 'aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa...' has 20,000 characters; an id may have at most 200 (see docs/limits.md)",
            ],
            error.Diagnostics.Select(d => d.ToString()));
        Assert.True(result.AllocatedMiB <= 16, $"allocated {result.AllocatedMiB} MiB; the bound is 16 MiB");
    }

    [Fact]
    public void Parse_IdOfTheMostCharacters_Loads()
    {
        var id = new string('p', ProjectLimits.MaxIdLength);
        var text = ProjectText.Minimal().Replace("- id: LP1", $"- id: {id}", StringComparison.Ordinal);

        Assert.Equal(id, ProjectLoader.Parse(text, "t.yaml").Equipment[0].Id);
    }

    // 200 sources that are not defined, each one edit from one of 20,000 ids of 200 characters that all share their
    // first 194: every comparison runs to the end. Each hint looked at every id (a table of 200 × 200 cells per pair,
    // 200 × 20,000 pairs); now the hints share a budget of work, and the errors past it carry none.
    [Fact]
    public void Parse_UndefinedSourcesAmongManyNearIds_HintsStayBounded()
    {
        var stem = new string('x', ProjectLimits.MaxIdLength - 6);
        var text = new StringBuilder("disttree: 1\nproject: { name: Near }\nservice: { id: SVC, system: 208Y/120 }\nequipment:\n");
        for (var i = 0; i < 20_000; i++)
        {
            text.Append(CultureInfo.InvariantCulture, $"  - {{ id: {stem}a{i:D5}, kind: switchboard, from: SVC }}\n");
        }

        for (var i = 0; i < 200; i++)
        {
            text.Append(CultureInfo.InvariantCulture, $"  - {{ id: U{i}, kind: switchboard, from: {stem}b{i:D5} }}\n");
        }

        var result = Bounded.Run(() => ProjectLoader.Parse(text.ToString(), "t.yaml"));

        output.WriteLine($"{result.Elapsed.TotalSeconds:0.00} s, {result.AllocatedMiB} MiB allocated");
        var error = Assert.IsType<ProjectException>(result.Thrown);
        Assert.Equal(200, error.Diagnostics.Count);
        Assert.EndsWith($"did you mean '{stem}a00000'?", error.Diagnostics[0].Message, StringComparison.Ordinal);
        Assert.DoesNotContain("did you mean", error.Diagnostics[^1].Message, StringComparison.Ordinal);
        Assert.True(result.AllocatedMiB <= 256, $"allocated {result.AllocatedMiB} MiB; the bound is 256 MiB");
    }
}
