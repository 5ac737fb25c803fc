using System.Text;
using DistTree.Diagnostics;
using DistTree.ProjectFiles;
using Xunit.Abstractions;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// Hostile input (docs/limits.md): each gives a located error or a bounded result, never another exception,
/// a stack overflow or a hang. Every case runs on a 1 MiB stack with a 30 s guard (<see cref="Bounded"/>),
/// and states the memory it may allocate.
/// </summary>
public sealed class ProjectLoaderHostileInputTests(ITestOutputHelper output)
{
    private const long MiB = 1024 * 1024;

    [Fact]
    public void Parse_AliasExpansionBomb_RefusedAtEachAliasWithoutExpanding()
    {
        // The classic expansion bomb: nine levels, each nine aliases of the one above (9^9 leaves if expanded).
        var text = new StringBuilder("disttree: 1\nl0: &l0 [lol, lol, lol, lol, lol, lol, lol, lol, lol]\n");
        for (var level = 1; level <= 9; level++)
        {
            var above = string.Join(", ", Enumerable.Repeat($"*l{level - 1}", 9));
            text.Append(System.Globalization.CultureInfo.InvariantCulture, $"l{level}: &l{level} [{above}]\n");
        }

        var error = Refused(text.ToString(), maxMiB: 16);

        var aliases = error.Diagnostics.Where(d => d.Message.StartsWith("aliases ('*l", StringComparison.Ordinal)).ToArray();
        Assert.Equal(81, aliases.Length);
        Assert.Equal(new SourceLocation("bomb.yaml", 3, 10), aliases[0].Location);
        Assert.Equal("aliases ('*l0') are not supported; write the value out (each run's size is edited in place)", aliases[0].Message);
    }

    [Fact]
    public void Parse_MillionAliases_ReportsTheFirst200AndCountsTheRest()
    {
        var text = "disttree: 1\nsize: &s 12 AWG\nmany: [" + string.Join(",", Enumerable.Repeat("*s", 1_000_000)) + "]\n";

        var error = Refused(text, maxMiB: 1024);

        Assert.Equal(ProjectLimits.MaxDiagnostics + 1, error.Diagnostics.Count);
        Assert.Equal("999,805 more errors from here on not shown (the first 200 of 1,000,005 are)", error.Diagnostics[^1].Message);
        Assert.Equal(3, error.Diagnostics[^1].Location.Line);
    }

    [Fact]
    public void Parse_TenMegabyteScalar_LocatedErrorNamingTheLimit()
    {
        var text = ProjectText.Minimal().Replace("name: Test", "name: " + new string('x', 10_000_000), StringComparison.Ordinal);

        var error = Refused(text, maxMiB: 512);

        var diagnostic = Assert.Single(error.Diagnostics);
        Assert.Equal(new SourceLocation("bomb.yaml", 3, 9), diagnostic.Location);
        Assert.Equal("a value of 10,000,000 characters; a value may have at most 65,536 (see docs/limits.md)", diagnostic.Message);
    }

    [Fact]
    public void Parse_ScalarAtTheLimit_Accepted()
    {
        var name = new string('x', ProjectLimits.MaxScalarLength);
        var text = ProjectText.Minimal().Replace("name: Test", "name: " + name, StringComparison.Ordinal);

        var result = Bounded.Run(() => ProjectLoader.Parse(text, "long.yaml"));

        Assert.Null(result.Thrown);
        Assert.Equal(name, result.Value!.Name);
    }

    [Fact]
    public void Parse_SequenceOfAMillionItems_BoundedErrorsInBoundedMemory()
    {
        var text = new StringBuilder("disttree: 1\nproject: { name: Big }\nservice: { id: SVC, system: 208Y/120 }\nequipment:\n");
        for (var i = 0; i < 1_000_000; i++)
        {
            text.Append("  - 1\n");
        }

        var error = Refused(text.ToString(), maxMiB: 2048);

        Assert.Equal(ProjectLimits.MaxDiagnostics + 1, error.Diagnostics.Count);
        Assert.Equal(new SourceLocation("bomb.yaml", 5, 5), error.Diagnostics[0].Location);
        Assert.StartsWith("999,800 more errors from here on not shown", error.Diagnostics[^1].Message, StringComparison.Ordinal);
        Assert.Equal(205, error.Diagnostics[^1].Location.Line);
    }

    [Theory]
    [InlineData('[')]
    [InlineData('{')]
    public void Parse_HundredThousandNestedFlowCollections_StopsAtTheDepthLimit(char open)
    {
        // YamlDotNet's scanner spends time in proportion to the depth on every token: unbounded, this input
        // takes it about a minute; the limit stops it at the 65th level.
        var text = "disttree: " + new string(open, 100_000);

        var error = Refused(text, maxMiB: 16);

        var diagnostic = Assert.Single(error.Diagnostics);
        Assert.Equal(new SourceLocation("bomb.yaml", 1, 11 + ProjectLimits.MaxDepth - 1), diagnostic.Location);
        Assert.Equal("the YAML nests deeper than 64 levels here; a project needs at most 6 (see docs/limits.md)", diagnostic.Message);
    }

    [Fact]
    public void Parse_HundredThousandNestedBlockSequences_StopsAtTheDepthLimit()
    {
        var text = new StringBuilder("disttree: 1\nequipment:\n");
        for (var depth = 0; depth < 100_000; depth++)
        {
            text.Append("- ");
        }

        text.Append("x\n");

        var error = Refused(text.ToString(), maxMiB: 64);

        var diagnostic = Assert.Single(error.Diagnostics);
        Assert.StartsWith("the YAML nests deeper than 64 levels here", diagnostic.Message, StringComparison.Ordinal);
        Assert.Equal(3, diagnostic.Location.Line);
    }

    [Fact]
    public void Parse_NestingAtTheLimit_ReadsOnToTheProjectErrors()
    {
        // 63 flow levels under the top mapping: 64 in all, the most allowed; the reader then reports the wrong type.
        var text = "disttree: " + new string('[', ProjectLimits.MaxDepth - 1) + new string(']', ProjectLimits.MaxDepth - 1) + "\n";

        var error = Refused(text, maxMiB: 16);

        Assert.DoesNotContain(error.Diagnostics, d => d.Message.Contains("nests deeper", StringComparison.Ordinal));
        Assert.Contains(error.Diagnostics, d => d.Location == new SourceLocation("bomb.yaml", 1, 11));
    }

    [Fact]
    public void Load_InvalidUtf8_LocatedAtTheFirstBadByte()
    {
        // Line 3, after "  name: Caf" (11 characters), at offset 12 + 9 + 11: 0xE9 is Latin-1 'é', not UTF-8.
        var bytes = Encoding.ASCII.GetBytes("disttree: 1\nproject:\n  name: Caf").Concat(new byte[] { 0xE9, (byte)'\n' }).ToArray();

        var error = LoadRefused(bytes, maxMiB: 16);

        var diagnostic = Assert.Single(error.Diagnostics);
        Assert.Equal((3, 12), (diagnostic.Location.Line, diagnostic.Location.Column));
        Assert.Equal("the file is not UTF-8 text: the byte 0xE9 at offset 32 does not decode; save the file as UTF-8", diagnostic.Message);
    }

    [Fact]
    public void Load_InvalidUtf8AfterMultibyteCharacters_ColumnCountsCharacters()
    {
        // "  name: Ωμ" is 10 characters in 12 bytes; the bad byte 0xFF is the 11th character of line 2.
        var bytes = Encoding.UTF8.GetBytes("disttree: 1\n  name: Ωμ").Concat(new byte[] { 0xFF }).ToArray();

        var diagnostic = Assert.Single(LoadRefused(bytes, maxMiB: 16).Diagnostics);

        Assert.Equal((2, 11), (diagnostic.Location.Line, diagnostic.Location.Column));
    }

    [Fact]
    public void Load_Utf16File_SaysItLooksLikeUtf16()
    {
        var bytes = Encoding.Unicode.GetPreamble().Concat(Encoding.Unicode.GetBytes("disttree: 1\n")).ToArray();

        var diagnostic = Assert.Single(LoadRefused(bytes, maxMiB: 16).Diagnostics);

        Assert.Equal((1, 1), (diagnostic.Location.Line, diagnostic.Location.Column));
        Assert.StartsWith("the file is not UTF-8 text (it looks like UTF-16): the byte 0xFF at offset 0", diagnostic.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Load_FileOverTheSizeLimit_RefusedBeforeItIsRead()
    {
        var path = Path.Combine(Path.GetTempPath(), $"disttree-huge-{Guid.NewGuid():N}.yaml");
        try
        {
            using (var stream = File.Create(path))
            {
                stream.SetLength(ProjectLimits.MaxFileBytes + 1); // sparse: no 64 MiB written
            }

            var result = Bounded.Run(() => ProjectLoader.Load(path));

            var error = Assert.IsType<ProjectException>(result.Thrown);
            var diagnostic = Assert.Single(error.Diagnostics);
            Assert.Equal(new SourceLocation(path, 1, 1), diagnostic.Location);
            Assert.Equal("the file has 67,108,865 bytes; a project file may have at most 67,108,864 (64 MiB, see docs/limits.md)", diagnostic.Message);
            Assert.True(result.AllocatedBytes < MiB, $"allocated {result.AllocatedBytes} bytes: the file was read");
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Parse_TextOverTheSizeLimit_Refused()
    {
        var text = new string(' ', (int)ProjectLimits.MaxFileBytes + 1);

        var diagnostic = Assert.Single(Refused(text, maxMiB: 4).Diagnostics);

        Assert.StartsWith("the file has 67,108,865 characters; a project file may have at most 67,108,864", diagnostic.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("  name: Test", "\tname: Test", 3, 1)]
    [InlineData("  units: metric", "  \tunits: metric", 4, 3)]
    public void Parse_TabIndentation_LocatedAtTheTab(string line, string tabbed, int expectedLine, int expectedColumn)
    {
        var text = ProjectText.Minimal().Replace(line, tabbed, StringComparison.Ordinal);

        var diagnostic = Assert.Single(Refused(text, maxMiB: 16).Diagnostics);

        Assert.Equal(new SourceLocation("bomb.yaml", expectedLine, expectedColumn), diagnostic.Location);
        Assert.Equal("a tab in the indentation; YAML indents with spaces only", diagnostic.Message);
    }

    [Fact]
    public void Parse_TabAfterAColon_IsOrdinarySpace()
    {
        // YAML 1.2 allows tabs as separation inside a line, only not as indentation.
        var text = ProjectText.Minimal().Replace("  name: Test", "  name:\tTest", StringComparison.Ordinal);

        var result = Bounded.Run(() => ProjectLoader.Parse(text, "tab.yaml"));

        Assert.Null(result.Thrown);
        Assert.Equal("Test", result.Value!.Name);
    }

    [Fact]
    public void Parse_DuplicateTopLevelKey_LocatedAtTheSecond()
    {
        var text = ProjectText.Minimal() + "disttree: 1\n";

        var diagnostic = Assert.Single(Refused(text, maxMiB: 16).Diagnostics);

        Assert.Equal(new SourceLocation("bomb.yaml", 19, 1), diagnostic.Location);
        Assert.Equal("duplicate key 'disttree' in the project file (first given at line 1)", diagnostic.Message);
    }

    [Theory]
    [InlineData("1e309", "'length' of the feeder of 'LP1' must be a finite number; found '1e309'")]
    [InlineData("-1e309", "'length' of the feeder of 'LP1' must be a finite number; found '-1e309'")]
    [InlineData(".nan", "'length' of the feeder of 'LP1' must be a finite number; found '.nan'")]
    [InlineData(".NaN", "'length' of the feeder of 'LP1' must be a finite number; found '.NaN'")]
    [InlineData(".inf", "'length' of the feeder of 'LP1' must be a finite number; found '.inf'")]
    [InlineData("-.Inf", "'length' of the feeder of 'LP1' must be a finite number; found '-.Inf'")]
    public void Parse_NonFiniteNumber_LocatedError(string value, string message)
    {
        var text = ProjectText.Minimal(feeder: $"{{ length: {value}, size: 2 AWG }}");

        var diagnostic = Assert.Single(Refused(text, maxMiB: 16).Diagnostics);

        Assert.Equal(new SourceLocation("bomb.yaml", 12, 23), diagnostic.Location);
        Assert.Equal(message, diagnostic.Message);
    }

    [Theory]
    [InlineData("\\U80000000")]
    [InlineData("\\UFFFFFFFF")]
    [InlineData("\\uDC00")]
    [InlineData("\\U7FFFFFFF")]
    public void Parse_EscapeNotAUnicodeCharacter_LocatedError(string escape)
    {
        var text = ProjectText.Minimal().Replace("name: Test", "name: \"Test " + escape + "\"", StringComparison.Ordinal);

        var diagnostic = Assert.Single(Refused(text, maxMiB: 16).Diagnostics);

        Assert.Equal(new SourceLocation("bomb.yaml", 3, 9), diagnostic.Location);
        Assert.StartsWith("invalid YAML: while scanning a quoted scalar, found invalid Unicode", diagnostic.Message, StringComparison.Ordinal);
    }

    private ProjectException Refused(string text, long maxMiB)
    {
        var result = Bounded.Run(() => ProjectLoader.Parse(text, "bomb.yaml"));
        output.WriteLine($"{text.Length:N0} characters: {result.Elapsed.TotalSeconds:0.0} s, {result.AllocatedMiB} MiB allocated (bound {maxMiB} MiB)");

        var error = Assert.IsType<ProjectException>(result.Thrown);
        Assert.All(error.Diagnostics, d => Assert.True(d.Location.Line >= 1 && d.Location.Column >= 1, d.ToString()));
        Assert.True(result.AllocatedMiB <= maxMiB, $"allocated {result.AllocatedMiB} MiB; the bound is {maxMiB} MiB");
        return error;
    }

    private ProjectException LoadRefused(byte[] bytes, long maxMiB)
    {
        var path = Path.Combine(Path.GetTempPath(), $"disttree-bytes-{Guid.NewGuid():N}.yaml");
        File.WriteAllBytes(path, bytes);
        try
        {
            var result = Bounded.Run(() => ProjectLoader.Load(path));
            var error = Assert.IsType<ProjectException>(result.Thrown);
            Assert.All(error.Diagnostics, d => Assert.Equal(path, d.Location.File));
            Assert.True(result.AllocatedMiB <= maxMiB, $"allocated {result.AllocatedMiB} MiB; the bound is {maxMiB} MiB");
            Assert.Equal(bytes, File.ReadAllBytes(path));
            return error;
        }
        finally
        {
            File.Delete(path);
        }
    }
}
