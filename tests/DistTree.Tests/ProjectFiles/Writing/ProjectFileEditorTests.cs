using System.Text;
using DistTree.Diagnostics;
using DistTree.ProjectFiles.Writing;
using DistTree.Sizing;
using DistTree.Solving;

namespace DistTree.Tests.ProjectFiles.Writing;

/// <summary>
/// The editor behind <c>upsize --apply</c>: each expected text is the input with exactly the edited value replaced
/// (and a sets line or entry added), built here by splicing at the value's index, so every other byte (line endings,
/// comments, NEL, a byte-order mark) is checked to stay as it was. Lines break at LF, CR LF and CR only (YAML 1.2,
/// section 5.4); NEL is a character of a line.
/// </summary>
public sealed class ProjectFileEditorTests
{
    private const string File = "p.yaml";

    // A change for the value that starts at the first occurrence of needle in text, its line and column counted as
    // YAML 1.2 counts them (columns in UTF-16 code units, as the loader reports them).
    private static UpsizeChange Change(string text, string needle, string before, string after, int setsBefore = 1, int setsAfter = 1)
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

        return new UpsizeChange
        {
            RunId = "X",
            Kind = RunResultKind.Feeder,
            SizeBefore = before,
            SizeAfter = after,
            SetsBefore = setsBefore,
            SetsAfter = setsAfter,
            DropPercentBefore = 4,
            DropPercentAfter = 2,
            CostAdded = 1,
            SizeLocation = new SourceLocation(File, line, index - start + 1),
        };
    }

    // text with old (at its first occurrence from needle's start) replaced by new.
    private static string Spliced(string text, string needle, string old, string @new)
    {
        var at = text.IndexOf(needle, StringComparison.Ordinal) + needle.IndexOf(old, StringComparison.Ordinal);
        return string.Concat(text.AsSpan(0, at), @new, text.AsSpan(at + old.Length));
    }

    [Fact]
    public void Apply_FlowMapping_EditsOnlyTheSize()
    {
        var text = "a: 1\nf:\n    feeder: { length: 40, size: 1 AWG, ocpd: 125 }   # primary\nb: 2\n";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "1 AWG", "1 AWG", "2/0 AWG")]);
        Assert.Equal("a: 1\nf:\n    feeder: { length: 40, size: 2/0 AWG, ocpd: 125 }   # primary\nb: 2\n", edited);
    }

    [Fact]
    public void Apply_FlowMappingWithSets_ReplacesOrAddsSets()
    {
        var text = "f: { size: 500 kcmil, sets: 1 }\n";
        Assert.Equal("f: { size: 600 kcmil, sets: 2 }\n", ProjectFileEditor.Apply(text, File, [Change(text, "500", "500 kcmil", "600 kcmil", 1, 2)]));
        text = "f: { size: 500 kcmil }\n";
        Assert.Equal("f: { size: 500 kcmil, sets: 3 }\n", ProjectFileEditor.Apply(text, File, [Change(text, "500", "500 kcmil", "500 kcmil", 1, 3)]));
    }

    [Fact]
    public void Apply_BlockMapping_KeepsCommentsAndAddsSetsBelow()
    {
        var text = "x:\n    feeder:\n      length: 40   # measured\n      size: \"1 AWG\"\n    demand_factor: 1\n";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "\"1 AWG\"", "1 AWG", "1/0 AWG", 1, 2)]);
        Assert.Equal("x:\n    feeder:\n      length: 40   # measured\n      size: \"1/0 AWG\"\n      sets: 2\n    demand_factor: 1\n", edited);
    }

    // A grounding conductor the plan names (the far-end repair) is written where the run states one, else added after the
    // size: in a flow mapping as an entry, in a block mapping as a line of its own below a sets line the change adds too.
    [Fact]
    public void Apply_GroundSizeAfter_ReplacedWhereWrittenElseAddedAfterTheSize()
    {
        var text = "f: { length: 220, size: 1/0 AWG, ocpd: 150 }\n";
        var change = Change(text, "1/0", "1/0 AWG", "1/0 AWG") with { GroundSizeAfter = "1 AWG" };
        Assert.Equal("f: { length: 220, size: 1/0 AWG, ground_size: 1 AWG, ocpd: 150 }\n", ProjectFileEditor.Apply(text, File, [change]));

        text = "f: { size: 1/0 AWG, ground_size: '6 AWG' }\n";
        change = Change(text, "1/0", "1/0 AWG", "2/0 AWG") with { GroundSizeAfter = "2/0 AWG" };
        Assert.Equal("f: { size: 2/0 AWG, ground_size: '2/0 AWG' }\n", ProjectFileEditor.Apply(text, File, [change]));

        text = "x:\r\n  feeder:\r\n    size: 250 kcmil # long\r\n    ocpd: 400\r\n";
        change = Change(text, "250", "250 kcmil", "250 kcmil", 1, 2) with { GroundSizeAfter = "1/0 AWG" };
        Assert.Equal("x:\r\n  feeder:\r\n    size: 250 kcmil # long\r\n    sets: 2\r\n    ground_size: 1/0 AWG\r\n    ocpd: 400\r\n", ProjectFileEditor.Apply(text, File, [change]));
    }

    [Fact]
    public void Apply_SequenceItemMapping_AddsSetsAtTheKeysColumn()
    {
        var text = "runs:\n  - size: 4 AWG  # first\n    length: 10\n";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "4 AWG", "4 AWG", "2 AWG", 1, 2)]);
        Assert.Equal("runs:\n  - size: 2 AWG  # first\n    sets: 2\n    length: 10\n", edited);
    }

    [Fact]
    public void Apply_SetsWrittenElsewhereInTheBlock_ReplacedWhereItIs()
    {
        var text = "f:\n  sets: 1 # one\n  size: 250 kcmil\n";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "250", "250 kcmil", "300 kcmil", 1, 2)]);
        Assert.Equal("f:\n  sets: 2 # one\n  size: 300 kcmil\n", edited);
    }

    [Theory]
    [InlineData("\r\n")]
    [InlineData("\r")]
    [InlineData("\n")]
    public void Apply_EachLineEnding_OnlyTheValueChangesAndAnAddedLineEndsAlike(string newline)
    {
        var text = string.Join(newline, "# head", "a:", "  f:", "    size: 6 AWG", "    length: 3", "b: 1", "");
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "6 AWG", "6 AWG", "4 AWG")]);
        Assert.Equal(Spliced(text, "6 AWG", "6", "4"), edited);

        var withSets = ProjectFileEditor.Apply(text, File, [Change(text, "6 AWG", "6 AWG", "4 AWG", 1, 2)]);
        Assert.Equal(Spliced(text, "6 AWG" + newline, "6 AWG" + newline, "4 AWG" + newline + "    sets: 2" + newline), withSets);
    }

    [Fact]
    public void Apply_OneCrLfLineInAnLfFile_KeepsEveryLineEndingAsItWas()
    {
        var text = "a:\n  f:\r\n    size: 6 AWG\r\n    length: 3\nb:\n  g: { size: 8 AWG }\n";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "6 AWG", "6 AWG", "4 AWG"), Change(text, "8 AWG", "8 AWG", "6 AWG")]);
        Assert.Equal(Spliced(Spliced(text, "6 AWG", "6", "4"), "8 AWG", "8", "6"), edited);
    }

    [Fact]
    public void Apply_NelInsideAValue_IsNotALineBreak()
    {
        // U+0085 (NEL) inside a name: YAML 1.2 reads it as a character, so the sizes on its line and below keep their places.
        var text = "a:\n  name: \"East\u0085wing\"\n  f: { name: \"x\u0085y\", size: 10 AWG }\n  g:\n    size: 12 AWG\n";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "10 AWG", "10 AWG", "8 AWG"), Change(text, "12 AWG", "12 AWG", "10 AWG")]);
        Assert.Equal(Spliced(Spliced(text, "10 AWG", "10", "8"), "12 AWG", "12", "10"), edited);
    }

    [Fact]
    public void Apply_CharacterOutsideTheBasicPlaneBeforeTheSize_ColumnsCountedAsTheLoaderCounts()
    {
        var text = "f: { name: \"\U0001F50C plug\", size: 10 AWG }\n";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "10 AWG", "10 AWG", "8 AWG")]);
        Assert.Equal(Spliced(text, "10 AWG", "10", "8"), edited);
    }

    [Theory]
    [InlineData("\"1\\x2F0 AWG\"", "\"2/0 AWG\"")]        // a double-quoted escape (YAML 1.2, 5.7): \x2F is '/'
    [InlineData("\"1\\/0 AWG\"", "\"2/0 AWG\"")]          // \/ is '/' too
    [InlineData("'1/0 AWG'", "'2/0 AWG'")]
    [InlineData("'1/0 AWG' # it''s", "'2/0 AWG' # it''s")]
    [InlineData("!!str 1/0 AWG", "!!str 2/0 AWG")]
    public void Apply_QuotedOrTaggedSize_RewrittenInItsOwnForm(string written, string expected)
    {
        var text = $"f:\n  size: {written}\n  length: 5\n";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, written, "1/0 AWG", "2/0 AWG")]);
        Assert.Equal($"f:\n  size: {expected}\n  length: 5\n", edited);
    }

    [Fact]
    public void Apply_SizeOnTheLineBelowItsKey_Edited()
    {
        var text = "f:\n  size:\n    1/0 AWG\n  length: 5\n";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "1/0 AWG", "1/0 AWG", "3/0 AWG", 1, 2)]);
        Assert.Equal("f:\n  size:\n    3/0 AWG\n  sets: 2\n  length: 5\n", edited);
    }

    [Fact]
    public void Apply_LastLineWithoutALineBreak_SetsAddedOnALineOfItsOwn()
    {
        var text = "f:\r\n  size: 2 AWG";
        var edited = ProjectFileEditor.Apply(text, File, [Change(text, "2 AWG", "2 AWG", "1 AWG", 1, 2)]);
        Assert.Equal("f:\r\n  size: 1 AWG\r\n  sets: 2", edited);
    }

    [Theory]
    [InlineData("f:\n  size: |\n    1/0 AWG\n", "|", "block scalar ('|')")]
    [InlineData("f:\n  size: >-\n    1/0 AWG\n", ">-", "block scalar ('>')")]
    [InlineData("f:\n  size: 1/0\n    AWG\n", "1/0", "over several lines")]
    [InlineData("f: { size: \"1/0\n    AWG\" }\n", "\"1/0", "over several lines")]
    public void Apply_SizeInAFormItCannotRewrite_LocatedErrorAndNothingEdited(string text, string needle, string form)
    {
        var change = Change(text, needle, "1/0 AWG", "2/0 AWG");

        var e = Assert.Throws<ProjectException>(() => ProjectFileEditor.Apply(text, File, [change]));

        var line = Assert.Single(e.Diagnostics).ToString();
        Assert.StartsWith($"p.yaml:{change.SizeLocation.Line}:{change.SizeLocation.Column}: error: the size of run 'X' is written ", line, StringComparison.Ordinal);
        Assert.Contains(form, line, StringComparison.Ordinal);
        Assert.EndsWith("write it on one line, as 'size: 1/0 AWG'; nothing written", line, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_ByteOrderMark_Kept()
    {
        var text = "f: { size: 6 AWG }\r\n";
        byte[] bytes = [0xEF, 0xBB, 0xBF, .. Encoding.UTF8.GetBytes(text)];

        var edited = ProjectFileEditor.Apply(bytes, File, [Change(text, "6 AWG", "6 AWG", "4 AWG")]);

        Assert.Equal([0xEF, 0xBB, 0xBF, .. Encoding.UTF8.GetBytes(Spliced(text, "6 AWG", "6", "4"))], edited);
    }

    [Fact]
    public void Apply_NotTheSizeThePlanSaw_LocatedError()
    {
        var text = "f: { size: 6 AWG }\n";
        var e = Assert.Throws<ProjectException>(() => ProjectFileEditor.Apply(text, File, [Change(text, "6 AWG", "4 AWG", "2 AWG")]));
        Assert.Equal("p.yaml:1:12: error: expected the size 4 AWG of run 'X' here, found '6 AWG'; nothing written", Assert.Single(e.Diagnostics).ToString());
    }

    [Fact]
    public void Apply_NoSizeAtTheLocation_LocatedError()
    {
        var text = "f: { size: 6 AWG, length: 40 }\n";
        var e = Assert.Throws<ProjectException>(() => ProjectFileEditor.Apply(text, File, [Change(text, "40", "6 AWG", "4 AWG")]));
        Assert.StartsWith("p.yaml:1:27: error: no size value of run 'X' here", Assert.Single(e.Diagnostics).ToString(), StringComparison.Ordinal);
    }
}
