using System.Text.Json;
using DistTree.Tests.Sizing;

namespace DistTree.Tests.Cli.Commands;

public sealed class UpsizeCommandTests
{
    private static string Demo => Path.Combine(TestPaths.RepoRoot, "projects", "quillfeather-medical.yaml");

    // The --apply round trip: the applied copy checks with only the two findings no allowed size fixes (a feeder and a
    // branch circuit whose least fitting size is beyond their devices' terminals), and a line diff shows only size lines
    // changed and T4's tap line added below its last one-line value (x_r).
    [Fact]
    public void Upsize_Apply_ThenCheckHasOnlyWhatNoAllowedSizeFixes_AndOnlySizeLinesChange()
    {
        var output = Path.Combine(Path.GetTempPath(), $"disttree-{Guid.NewGuid():N}.yaml");
        try
        {
            var before = File.ReadAllBytes(Demo);
            var result = CliRunner.Run("upsize", Demo, "--apply", output);
            Assert.Equal(1, result.ExitCode);
            Assert.Equal(before, File.ReadAllBytes(Demo));
            var check = CliRunner.Run("check", output);
            Assert.Equal(1, check.ExitCode);
            // HG's drop and LP4/32's drop; T4's tap, written, clears LP4/32's total; HG's far end clears with its 4 AWG grounding conductor.
            Assert.Contains(", 2 findings,", check.Out, StringComparison.Ordinal);
            var old = File.ReadAllLines(Demo);
            var written = File.ReadAllLines(output).ToList();
            var added = written.IndexOf("    tap_percent: -2.5");
            Assert.Equal("    x_r: 2.2", written[added - 1]);
            Assert.Equal("  - id: T4", written[added - 7]);
            written.RemoveAt(added);
            var @new = written.ToArray();
            Assert.Equal(old.Length, @new.Length);
            var changed = old.Zip(@new).Where(p => p.First != p.Second).ToArray();
            Assert.NotEmpty(changed);
            Assert.All(changed, p => Assert.Contains("size:", p.Second, StringComparison.Ordinal));
            Assert.All(changed, p => Assert.Equal(WithoutSizes(p.First), WithoutSizes(p.Second)));
        }
        finally
        {
            File.Delete(output);
        }
    }

    // A plan that only sets a tap: the copy differs from the input by the one tap_percent line, and analyzes clean.
    [Fact]
    public void Upsize_ApplyAPlanWithATap_WritesTheTapLineOnly()
    {
        using var folder = new TempFolder();
        var project = folder.File("tap.yaml");
        var text = Sizing.UpsizerRemedyTests.Transformer();
        File.WriteAllText(project, text);
        var result = CliRunner.Run("upsize", project, "--apply", folder.File("fixed.yaml"));
        Assert.Equal(0, result.ExitCode);
        Assert.Equal($"wrote {folder.File("fixed.yaml")}: 0 runs changed, 1 transformer tap set\n", result.Error.ReplaceLineEndings("\n"));
        var x = text.IndexOf("x_r: 2\n", StringComparison.Ordinal) + "x_r: 2\n".Length;
        Assert.Equal(text.Insert(x, "    tap_percent: -2.5\n"), File.ReadAllText(folder.File("fixed.yaml")));
        Assert.Equal(0, CliRunner.Run("analyze", folder.File("fixed.yaml")).ExitCode);
    }

    // A grounding conductor raised alone for the far-end fault is written as the run's ground_size, on the size's line, and
    // the copy then checks clean; the JSON names it and why.
    [Fact]
    public void Upsize_ApplyAGroundRaise_WritesGroundSizeAndTheCopyPasses()
    {
        using var folder = new TempFolder();
        var project = folder.File("ground.yaml");
        File.WriteAllText(project, FarEndRepairTests.Feeder(220));
        var result = CliRunner.Run("upsize", project, "--apply", folder.File("fixed.yaml"), "--json", folder.File("plan.json"));
        Assert.Equal(0, result.ExitCode);
        using var doc = JsonDocument.Parse(File.ReadAllText(folder.File("plan.json")));
        var change = Assert.Single(doc.RootElement.GetProperty("upsize_plan").GetProperty("changes").EnumerateArray());
        var ground = change.GetProperty("ground_size_after").GetString()!;
        Assert.StartsWith("its grounding conductor alone raised to " + ground, change.GetProperty("fault_clearing_note").GetString(), StringComparison.Ordinal);

        var old = File.ReadAllLines(project);
        var @new = File.ReadAllLines(folder.File("fixed.yaml"));
        var changed = Assert.Single(old.Zip(@new), p => p.First != p.Second);
        Assert.Equal(changed.First.Replace("ocpd: 150", $"ground_size: {ground}, ocpd: 150", StringComparison.Ordinal), changed.Second);
        Assert.Equal(0, CliRunner.Run("check", folder.File("fixed.yaml")).ExitCode);
    }

    [Fact]
    public void Upsize_Json_HasThePlan()
    {
        var result = CliRunner.Run("upsize", Demo, "--json", "-");
        using var doc = JsonDocument.Parse(result.Out);
        var plan = doc.RootElement.GetProperty("upsize_plan");
        Assert.True(plan.GetProperty("changes").GetArrayLength() > 0);
        Assert.Equal(2, plan.GetProperty("findings_after").GetInt32());

        // The demo's feeder HG states a 10 AWG grounding conductor on 8 AWG lines under 50 A; its own limit would take 2 AWG,
        // beyond the 4 AWG a 50 A device's terminals take (terminal-limits.tsv, recalled), so the plan takes it to 4 AWG and
        // names it as unresolvable. 4 AWG needs 10 AWG × 41,740 / 16,510 cmil = 26,243 cmil, 6 AWG (26,240 cmil, within the
        // tables' rounding; NEC 250.122(B), memory; ASTM B258 areas).
        var hg = plan.GetProperty("changes").EnumerateArray().Single(c => c.GetProperty("run").GetString() == "HG");
        Assert.Equal("4 AWG", hg.GetProperty("size_after").GetString());
        Assert.Equal(("6 AWG", "10 AWG", true), (hg.GetProperty("ground_min_size").GetString(), hg.GetProperty("ground_size").GetString(), hg.GetProperty("ground_must_increase").GetBoolean()));
        // At 4 AWG its far end's line-to-ground fault through 6 AWG would not trip the 50 A breaker at 10 × (common practice):
        // the plan names a 4 AWG grounding conductor in place of the stated 10 AWG.
        Assert.Equal("4 AWG", hg.GetProperty("ground_size_after").GetString());
        Assert.Equal("4 AWG, larger than it need be for the code alone, so that a fault at the far end trips the device (NEC 250.4(A)(5)); the code's minimum is 6 AWG (NEC 250.122); it replaces the stated 10 AWG", hg.GetProperty("grounding_note").GetString());
        var left = plan.GetProperty("unresolvable").EnumerateArray().First(u => u.GetProperty("subject").GetString() == "HG");
        Assert.Contains("beyond the terminal limit of its 50 A device (1×4 AWG", left.GetProperty("message").GetString(), StringComparison.Ordinal);
        // T4's −2.5 % tap (free) lets LP4/32 take 10 AWG for its total in place of more copper; −5 % would put T4's
        // secondary 100/95 − 1 = 5.26 % above nominal at no load, over the default light-load limit of 5 % (ANSI C84.1, recalled).
        var tap = Assert.Single(plan.GetProperty("tap_changes").EnumerateArray());
        Assert.Equal(("T4", -2.5), (tap.GetProperty("transformer").GetString(), tap.GetProperty("tap_percent_after").GetDouble()));
    }

    // Each more set is tried for every size of every feeder: a million took 54 s and 7.7 GB (docs/limits.md).
    [Theory]
    [InlineData("0")]
    [InlineData("41")]
    [InlineData("1000000")]
    public void Upsize_MaxSetsOutOfRange_ExitsTwoNamingTheRange(string sets)
    {
        var result = CliRunner.Run("upsize", Demo, "--max-sets", sets);
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--max-sets must be a whole number from 1 to 40; found ", result.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Upsize_ApplyOntoTheInput_IsRefused() => Assert.Equal(2, CliRunner.Run("upsize", Demo, "--apply", Demo).ExitCode);

    // The line without the values of its 'size', and without its 'ground_size' entry (a stated grounding conductor the new size
    // makes too small is raised with it; one the far-end fault needs is written where none was).
    private static string WithoutSizes(string line)
    {
        line = System.Text.RegularExpressions.Regex.Replace(line, ", ground_size: [^,}]*", "");
        for (var at = line.IndexOf("size: ", StringComparison.Ordinal); at >= 0; at = line.IndexOf("size: ", at + 6, StringComparison.Ordinal))
        {
            var end = line.IndexOfAny([',', '}'], at + 6);
            line = line[..(at + 6)] + (end < 0 ? "" : line[end..]);
        }

        return line;
    }
}
