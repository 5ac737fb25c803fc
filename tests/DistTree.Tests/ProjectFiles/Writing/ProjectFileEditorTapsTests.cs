using System.Text;
using DistTree.Diagnostics;
using DistTree.ProjectFiles.Writing;
using DistTree.Sizing;
using DistTree.Solving;

namespace DistTree.Tests.ProjectFiles.Writing;

/// <summary>
/// The taps <c>upsize --apply</c> writes: each expected text is the input with exactly the tap's value replaced, or its
/// entry inserted, spelt out here in full, so every other byte (line endings, comments, a byte-order mark) is checked
/// to stay as it was. Lines break at LF, CR LF and CR (YAML 1.2, section 5.4).
/// </summary>
public sealed class ProjectFileEditorTapsTests
{
    private const string File = "p.yaml";

    // Line and column of the first occurrence of needle, counted as YAML 1.2 counts them.
    private static SourceLocation At(string text, string needle)
    {
        var index = text.IndexOf(needle, StringComparison.Ordinal);
        Assert.True(index >= 0, $"'{needle}' not in the text");
        var (line, start) = (1, 0);
        for (var i = 0; i < index; i++)
        {
            if (text[i] == '\r' && i + 1 < text.Length && text[i + 1] == '\n')
            {
                i++;
            }

            if (text[i] is '\n' or '\r')
            {
                (line, start) = (line + 1, i + 1);
            }
        }

        return new SourceLocation(File, line, index - start + 1);
    }

    // The tap of transformer T1, whose entry starts at needle (its first key in a block mapping, its '{' in a flow mapping).
    private static TapChange Tap(string text, string needle, double before, double after) => new()
    {
        TransformerId = "T1",
        TapPercentBefore = before,
        TapPercentAfter = after,
        RegulationPercentBefore = 3,
        RegulationPercentAfter = 0.5,
        CostAdded = 0,
        Location = At(text, needle),
    };

    private static string Apply(string text, params TapChange[] taps) => ProjectFileEditor.Apply(text, File, [], taps);

    private const string Block = """
        equipment:
          - id: T1   # the main transformer
            kind: transformer
            kva: 45
            x_r: 2
            feeder: { length: 50, size: 6 AWG }
          - id: P
            kind: panelboard

        """;

    [Fact]
    public void Apply_BlockMappingWithoutTheKey_LineAddedAtTheKeysIndentationAfterTheLastScalar()
    {
        var edited = Apply(Block, Tap(Block, "id: T1", 0, -2.5));
        Assert.Equal(Block.Replace("    x_r: 2\n", "    x_r: 2\n    tap_percent: -2.5\n", StringComparison.Ordinal), edited);
    }

    [Theory]
    [InlineData("0", "-2.5")]
    [InlineData("'0'", "'-2.5'")]
    [InlineData("\"0\"   # as delivered", "\"-2.5\"   # as delivered")]
    [InlineData("!!float 0", "!!float -2.5")]
    public void Apply_BlockMappingWithTheKey_ValueReplacedInItsOwnForm(string written, string expected)
    {
        var text = Block.Replace("    kva: 45\n", $"    tap_percent: {written}\n    kva: 45\n", StringComparison.Ordinal);
        var edited = Apply(text, Tap(text, "id: T1", 0, -2.5));
        Assert.Equal(Block.Replace("    kva: 45\n", $"    tap_percent: {expected}\n    kva: 45\n", StringComparison.Ordinal), edited);
    }

    [Fact]
    public void Apply_FlowMappingWithoutTheKey_EntryAddedAfterTheLastScalar()
    {
        var text = "equipment:\n  - { id: T1, kind: transformer, kva: 45, x_r: 2, feeder: { length: 50, size: 6 AWG } }   # T1\n";
        var edited = Apply(text, Tap(text, "{ id: T1", 0, -5));
        Assert.Equal("equipment:\n  - { id: T1, kind: transformer, kva: 45, x_r: 2, tap_percent: -5, feeder: { length: 50, size: 6 AWG } }   # T1\n", edited);
    }

    [Fact]
    public void Apply_FlowMappingWithTheKey_ValueReplaced()
    {
        var text = "equipment:\n  - { id: T1, kind: transformer, tap_percent: 2.5, kva: 45 }\n";
        var edited = Apply(text, Tap(text, "{ id: T1", 2.5, 0));
        Assert.Equal("equipment:\n  - { id: T1, kind: transformer, tap_percent: 0, kva: 45 }\n", edited);
    }

    // A size after the tap on the same line, and a line added above a size: both located in the text as read.
    [Fact]
    public void Apply_TapAndSizeInOneEntry_BothEditedWhereTheyWereRead()
    {
        var text = "equipment:\n  - { id: T1, tap_percent: 0, kva: 45, feeder: { size: 6 AWG } }\n  - id: T2\n    kva: 45\n    feeder: { size: 8 AWG }\n";
        var size = new UpsizeChange
        {
            RunId = "T1",
            Kind = RunResultKind.Feeder,
            SizeBefore = "6 AWG",
            SizeAfter = "4 AWG",
            SetsBefore = 1,
            SetsAfter = 1,
            DropPercentBefore = 4,
            DropPercentAfter = 2,
            CostAdded = 1,
            SizeLocation = At(text, "6 AWG"),
        };
        var below = size with { RunId = "T2", SizeBefore = "8 AWG", SizeAfter = "6 AWG", SizeLocation = At(text, "8 AWG") };
        var tap2 = Tap(text, "id: T2", 0, -2.5) with { TransformerId = "T2" };
        var edited = ProjectFileEditor.Apply(text, File, [size, below], [Tap(text, "{ id: T1", 0, -2.5), tap2]);
        Assert.Equal("equipment:\n  - { id: T1, tap_percent: -2.5, kva: 45, feeder: { size: 4 AWG } }\n  - id: T2\n    kva: 45\n    tap_percent: -2.5\n    feeder: { size: 6 AWG }\n", edited);
    }

    [Theory]
    [InlineData("\r\n")]
    [InlineData("\r")]
    [InlineData("\n")]
    public void Apply_EachLineEnding_AddedLineEndsAsItsNeighbour(string newline)
    {
        var text = Block.ReplaceLineEndings(newline);
        var edited = Apply(text, Tap(text, "id: T1", 0, -2.5));
        Assert.Equal(Block.Replace("    x_r: 2\n", "    x_r: 2\n    tap_percent: -2.5\n", StringComparison.Ordinal).ReplaceLineEndings(newline), edited);
    }

    [Fact]
    public void Apply_OneCrLfLineInAnLfFile_AddedLineTakesThatLinesEnding()
    {
        var text = "e:\n  - id: T1\n    x_r: 2\r\n    feeder: { size: 6 AWG }\n";
        Assert.Equal("e:\n  - id: T1\n    x_r: 2\r\n    tap_percent: -2.5\r\n    feeder: { size: 6 AWG }\n", Apply(text, Tap(text, "id: T1", 0, -2.5)));
    }

    [Fact]
    public void Apply_LastLineWithoutALineBreak_TapAddedOnALineOfItsOwn()
    {
        var text = "e:\r\n  - id: T1\r\n    x_r: 2";
        Assert.Equal("e:\r\n  - id: T1\r\n    x_r: 2\r\n    tap_percent: -5", Apply(text, Tap(text, "id: T1", 0, -5)));
    }

    [Fact]
    public void Apply_ByteOrderMark_Kept()
    {
        var text = "e:\n  - { id: T1, x_r: 2 }\n";
        byte[] bytes = [0xEF, 0xBB, 0xBF, .. Encoding.UTF8.GetBytes(text)];
        var edited = ProjectFileEditor.Apply(bytes, File, [], [Tap(text, "{ id: T1", 0, -2.5)]);
        Assert.Equal([0xEF, 0xBB, 0xBF, .. Encoding.UTF8.GetBytes("e:\n  - { id: T1, x_r: 2, tap_percent: -2.5 }\n")], edited);
    }

    [Fact]
    public void Apply_NotTheTapThePlanSaw_LocatedError()
    {
        var text = "e:\n  - { id: T1, tap_percent: 2.5 }\n";
        var e = Assert.Throws<ProjectException>(() => Apply(text, Tap(text, "{ id: T1", 0, -2.5)));
        Assert.Equal("p.yaml:2:28: error: expected the tap_percent of transformer 'T1', 0, here, found '2.5'; nothing written", Assert.Single(e.Diagnostics).ToString());
    }

    [Fact]
    public void Apply_NoEntryOfTheTransformerAtTheLocation_LocatedError()
    {
        var text = "e:\n  - { id: T2, x_r: 2 }\n";
        var e = Assert.Throws<ProjectException>(() => Apply(text, Tap(text, "{ id: T2", 0, -2.5)));
        Assert.Equal("p.yaml:2:5: error: no equipment entry of transformer 'T1' here; nothing written", Assert.Single(e.Diagnostics).ToString());
    }

    [Fact]
    public void Apply_TapWrittenOverSeveralLines_LocatedErrorAsForASize()
    {
        var text = "e:\n  - id: T1\n    tap_percent: |\n      0\n";
        var e = Assert.Throws<ProjectException>(() => Apply(text, Tap(text, "id: T1", 0, -2.5)));
        Assert.Contains("the tap_percent of transformer 'T1' is written as a block scalar ('|')", Assert.Single(e.Diagnostics).ToString(), StringComparison.Ordinal);
    }
}
