using System.Diagnostics;
using System.Text.Json;
using DistTree.Tests.Comparing;
using Markdig;
using Markdig.Extensions.Tables;
using Markdig.Syntax;

namespace DistTree.Tests.Cli.Commands;

/// <summary><c>disttree compare</c>, run in-process on files in a temporary folder (and a temporary git repository).</summary>
public sealed class CompareCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("disttree-compare-").FullName;

    public void Dispose()
    {
        foreach (var file in Directory.EnumerateFiles(_dir, "*", SearchOption.AllDirectories))
        {
            File.SetAttributes(file, FileAttributes.Normal); // git makes its objects read-only
        }

        Directory.Delete(_dir, recursive: true);
    }

    private string Write(string name, string text)
    {
        var path = Path.Combine(_dir, name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text);
        return path;
    }

    private static string LongLighting(string text) =>
        text.Replace("length: 18, size: 12 AWG", "length: 210, size: 12 AWG", StringComparison.Ordinal);

    private void Git(params string[] args)
    {
        var start = new ProcessStartInfo("git") { WorkingDirectory = _dir, RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (var a in new[] { "-c", "user.name=Test", "-c", "user.email=test@example.invalid", "-c", "commit.gpgsign=false" }.Concat(args))
        {
            start.ArgumentList.Add(a);
        }

        using var p = Process.Start(start)!;
        var error = p.StandardError.ReadToEndAsync();
        p.StandardOutput.ReadToEnd();
        p.WaitForExit();
        Assert.True(p.ExitCode == 0, $"git {string.Join(' ', args)} failed: {error.Result}");
    }

    [Fact]
    public void Compare_SubPanelAdded_PrintsChangesAndExitsZero()
    {
        var old = Write("old.yaml", ComparisonProjects.Shared());
        var @new = Write("new.yaml", ComparisonProjects.Shared(ComparisonProjects.SubPanel));

        var r = CliRunner.Run("compare", old, @new);

        Assert.Equal((0, ""), (r.ExitCode, r.Error));
        Assert.Contains("equipment 1 added, 0 removed, 0 changed; circuits 1 added", r.Out, StringComparison.Ordinal);
        Assert.Contains("+ SUB", r.Out, StringComparison.Ordinal);
        Assert.Contains("Affected end points", r.Out, StringComparison.Ordinal);
        Assert.Contains("Upstream runs", r.Out, StringComparison.Ordinal);
        Assert.Contains("Caution: ", r.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_NewFinding_ExitsOneAndListsIt()
    {
        var old = Write("old.yaml", ComparisonProjects.Shared());
        var @new = Write("new.yaml", LongLighting(ComparisonProjects.Shared()));

        var r = CliRunner.Run("compare", old, @new);

        // 210 m of 12 AWG also leaves too little fault current at its far end to trip the 20 A breaker at once
        // (about 120 V over 2 × 210 m at some 6.5 mΩ/m hot is below 50 A, against 10 × 20 A): fault_clearing.
        Assert.Equal(1, r.ExitCode);
        Assert.Contains("newly failing (branch_drop, fault_clearing, total_drop)", r.Out, StringComparison.Ordinal);
        Assert.Contains("New findings (3):", r.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_FindingResolved_ExitsZero()
    {
        var old = Write("old.yaml", LongLighting(ComparisonProjects.Shared()));
        var @new = Write("new.yaml", ComparisonProjects.Shared());

        var r = CliRunner.Run("compare", old, @new);

        Assert.Equal(0, r.ExitCode);
        Assert.Contains("Resolved findings (3):", r.Out, StringComparison.Ordinal); // branch_drop, total_drop, fault_clearing
    }

    [Fact]
    public void Compare_ReorderedFile_PrintsNoChange()
    {
        var r = CliRunner.Run("compare", Write("a.yaml", ComparisonProjects.Ordered), Write("b.yaml", ComparisonProjects.Reordered));

        Assert.Equal(0, r.ExitCode);
        Assert.Contains("No change:", r.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_JsonTwice_ByteIdenticalAndSnakeCase()
    {
        var old = Write("old.yaml", ComparisonProjects.Shared());
        var @new = Write("new.yaml", LongLighting(ComparisonProjects.Shared(ComparisonProjects.SubPanel)));
        var first = Path.Combine(_dir, "out", "first.json");
        var second = Path.Combine(_dir, "out", "second.json");

        Assert.Equal(1, CliRunner.Run("compare", old, @new, "--json", first).ExitCode);
        Assert.Equal(1, CliRunner.Run("compare", old, @new, "--json", second).ExitCode);

        var bytes = File.ReadAllBytes(first);
        Assert.Equal(bytes, File.ReadAllBytes(second));
        using var doc = JsonDocument.Parse(bytes);
        var root = doc.RootElement;
        Assert.Equal("disttree-comparison/1", root.GetProperty("format").GetString());
        Assert.Equal("LP1/2", root.GetProperty("end_points")[0].GetProperty("id").GetString());
        Assert.Equal("newly_failing", root.GetProperty("end_points")[0].GetProperty("status").GetString());
        Assert.Equal("SUB", root.GetProperty("equipment")[0].GetProperty("id").GetString());
        Assert.True(root.GetProperty("summary").GetProperty("has_new_findings").GetBoolean());
        var names = new List<string>();
        void Collect(JsonElement e)
        {
            if (e.ValueKind == JsonValueKind.Object)
            {
                foreach (var p in e.EnumerateObject())
                {
                    names.Add(p.Name);
                    Collect(p.Value);
                }
            }
            else if (e.ValueKind == JsonValueKind.Array)
            {
                foreach (var item in e.EnumerateArray())
                {
                    Collect(item);
                }
            }
        }

        Collect(root);
        Assert.All(names, n => Assert.Matches("^[a-z0-9_]+$", n));
    }

    [Fact]
    public void Compare_JsonToStdout_WritesOnlyTheDocument()
    {
        var old = Write("old.yaml", ComparisonProjects.Shared());
        var @new = Write("new.yaml", ComparisonProjects.Shared(ComparisonProjects.SubPanel));

        var r = CliRunner.Run("compare", old, @new, "--json", "-");

        using var doc = JsonDocument.Parse(r.Out);
        Assert.Equal(4, doc.RootElement.GetProperty("summary").GetProperty("end_points_affected").GetInt32());
        Assert.Equal("", r.Error);
    }

    // Rendered by a CommonMark parser with GitHub's pipe-table extension: the end points become a table whose
    // rows have as many cells as its header, and the caution is there.
    [Fact]
    public void Compare_Markdown_RendersTables()
    {
        var old = Write("old.yaml", ComparisonProjects.Shared());
        var @new = Write("new.yaml", LongLighting(ComparisonProjects.Shared(ComparisonProjects.SubPanel)));

        var r = CliRunner.Run("compare", old, @new, "--markdown", "-");

        Assert.Equal(1, r.ExitCode);
        var document = Markdown.Parse(r.Out, new MarkdownPipelineBuilder().UsePipeTables().Build());
        var tables = document.Descendants<Table>().ToArray();
        Assert.Equal(4, tables.Length); // elements, end points, upstream runs, fault currents (SUB added)
        var endPoints = tables[1];
        var header = (TableRow)endPoints[0];
        Assert.True(header.IsHeader);
        Assert.Equal(6, header.Count);
        Assert.Equal(5, endPoints.Count); // header + LP1/1, LP1/2, LP1/3, LP2/1
        Assert.All(endPoints.Cast<TableRow>(), row => Assert.Equal(6, row.Count));
        var html = Markdown.ToHtml(r.Out, new MarkdownPipelineBuilder().UsePipeTables().Build());
        Assert.Contains("<code>LP1/2</code>", html, StringComparison.Ordinal);
        Assert.Contains("Caution:", r.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_AgainstHead_ComparesTheCommittedVersion()
    {
        var file = Write(Path.Combine("designs", "site.yaml"), ComparisonProjects.Shared());
        Git("init", "--quiet");
        Git("add", ".");
        Git("commit", "--quiet", "-m", "first");
        File.WriteAllText(file, ComparisonProjects.Shared(ComparisonProjects.SubPanel));

        var r = CliRunner.Run("compare", file, "--against", "HEAD");

        Assert.Equal((0, ""), (r.ExitCode, r.Error));
        Assert.Contains("old  HEAD:designs/site.yaml", r.Out, StringComparison.Ordinal);
        Assert.Contains("+ SUB", r.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_AgainstHeadWithBadOldText_ErrorNamesTheRevision()
    {
        var file = Write("site.yaml", ComparisonProjects.Shared().Replace("kind: switchboard", "kind: swichboard", StringComparison.Ordinal));
        Git("init", "--quiet");
        Git("add", ".");
        Git("commit", "--quiet", "-m", "broken");
        File.WriteAllText(file, ComparisonProjects.Shared());

        var r = CliRunner.Run("compare", file, "--against", "HEAD");

        Assert.Equal(2, r.ExitCode);
        Assert.StartsWith("HEAD:site.yaml:", r.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_AgainstUnknownRevision_ExitsTwo()
    {
        var file = Write("site.yaml", ComparisonProjects.Shared());
        Git("init", "--quiet");
        Git("add", ".");
        Git("commit", "--quiet", "-m", "first");

        var r = CliRunner.Run("compare", file, "--against", "no-such-branch");

        Assert.Equal(2, r.ExitCode);
        Assert.Contains("unknown revision 'no-such-branch'", r.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_AgainstRevisionWithoutTheFile_ExitsTwo()
    {
        Write("other.yaml", ComparisonProjects.Shared());
        Git("init", "--quiet");
        Git("add", ".");
        Git("commit", "--quiet", "-m", "first");
        var file = Write("site.yaml", ComparisonProjects.Shared());

        var r = CliRunner.Run("compare", file, "--against", "HEAD");

        Assert.Equal(2, r.ExitCode);
        Assert.Contains("'site.yaml' did not exist at revision 'HEAD'", r.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_AgainstOutsideCheckout_ExitsTwo()
    {
        // The temporary folder must not be inside a repository; checked first.
        var file = Write("site.yaml", ComparisonProjects.Shared());
        var probe = new ProcessStartInfo("git", ["rev-parse", "--show-prefix"]) { WorkingDirectory = _dir, RedirectStandardOutput = true, RedirectStandardError = true };
        using (var p = Process.Start(probe)!)
        {
            p.StandardOutput.ReadToEnd();
            p.StandardError.ReadToEnd();
            p.WaitForExit();
            Assert.NotEqual(0, p.ExitCode);
        }

        var r = CliRunner.Run("compare", file, "--against", "HEAD");

        Assert.Equal(2, r.ExitCode);
        Assert.Contains("not in one", r.Error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("one")]
    [InlineData("three")]
    [InlineData("against-with-two")]
    [InlineData("both-stdout")]
    [InlineData("rows")]
    public void Compare_BadUsage_ExitsTwo(string which)
    {
        var a = Write("a.yaml", ComparisonProjects.Shared());
        var b = Write("b.yaml", ComparisonProjects.Shared());
        string[] args = which switch
        {
            "one" => ["compare", a],
            "three" => ["compare", a, b, b],
            "against-with-two" => ["compare", a, b, "--against", "HEAD"],
            "both-stdout" => ["compare", a, b, "--json", "-", "--markdown", "-"],
            _ => ["compare", a, b, "--rows", "0"],
        };

        var r = CliRunner.Run(args);

        Assert.Equal(2, r.ExitCode);
        Assert.Contains("error", r.Error, StringComparison.Ordinal);
        Assert.Equal("", r.Out);
    }

    [Fact]
    public void Compare_OutputOverInput_RefusedAndInputUnchanged()
    {
        var a = Write("a.yaml", ComparisonProjects.Shared());
        var b = Write("b.yaml", ComparisonProjects.Shared());

        var r = CliRunner.Run("compare", a, b, "--json", b);

        Assert.Equal(2, r.ExitCode);
        Assert.Equal(ComparisonProjects.Shared(), File.ReadAllText(b));
    }
}
