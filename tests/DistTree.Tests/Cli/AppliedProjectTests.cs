using System.Text;
using DistTree.Cli;
using DistTree.Sizing;

namespace DistTree.Tests.Cli;

/// <summary>
/// <c>upsize --apply</c>: each edit in the file that holds the size, on the bytes the plan was made on, in the form the
/// value is written in; every expected file here is the input with exactly the changed values replaced, compared byte
/// for byte.
/// </summary>
public sealed class AppliedProjectTests
{
    private static readonly byte[] Bom = [0xEF, 0xBB, 0xBF];

    // The campus example with one branch run in the main file and one in an included file made too long for their
    // sizes (the plan upsizes both: 8 to 6 AWG and 10 to 8 AWG); the included file written with CR LF and a byte-order mark.
    private static (string Main, string Included, byte[] MainBefore, byte[] IncludedBefore) LongCampus(TempFolder folder)
    {
        var main = OutputFileTests.CampusCopy(folder);
        TempFolder.OpenTerminals(main);
        var included = Path.Combine(folder.Path, "buildings", "north-hall.yaml");
        File.WriteAllText(main, File.ReadAllText(main).Replace("run: { length: 240, size: 8 AWG, raceway: pvc }", "run: { length: 1400, size: 8 AWG, raceway: pvc }", StringComparison.Ordinal));
        var text = File.ReadAllText(included).Replace("run: { length: 110, size: 10 AWG }", "run: { length: 700, size: 10 AWG }", StringComparison.Ordinal);
        File.WriteAllBytes(included, [.. Bom, .. Encoding.UTF8.GetBytes(text.ReplaceLineEndings("\r\n"))]);
        return (main, included, File.ReadAllBytes(main), File.ReadAllBytes(included));
    }

    private static byte[] Replaced(byte[] bytes, string old, string @new)
    {
        var text = Encoding.UTF8.GetString(bytes);
        Assert.Equal(1, text.Split(old).Length - 1);
        return Encoding.UTF8.GetBytes(text.Replace(old, @new, StringComparison.Ordinal));
    }

    [Fact]
    public void Upsize_ApplyToAFolder_EachEditInItsOwnFileAndEveryOtherByteKept()
    {
        using var folder = new TempFolder();
        var (main, included, mainBefore, includedBefore) = LongCampus(folder);
        var southLab = File.ReadAllBytes(Path.Combine(folder.Path, "buildings", "south-lab.yaml"));
        var output = Path.Combine(folder.Path, "fixed") + "/";

        var result = CliRunner.Run("upsize", main, "--apply", output);

        Assert.Equal(0, result.ExitCode);
        Assert.Equal($"wrote {output}: 2 runs changed in 2 of its 4 files\n", result.Error.ReplaceLineEndings("\n"));
        Assert.Equal(mainBefore, File.ReadAllBytes(main));
        Assert.Equal(includedBefore, File.ReadAllBytes(included));
        Assert.Equal(Replaced(mainBefore, "length: 1400, size: 8 AWG", "length: 1400, size: 4 AWG"), File.ReadAllBytes(Path.Combine(output, "campus.yaml")));
        var edited = File.ReadAllBytes(Path.Combine(output, "buildings", "north-hall.yaml"));
        Assert.Equal([.. Bom, .. Replaced(includedBefore[3..], "length: 700, size: 10 AWG", "length: 700, size: 8 AWG")], edited);
        Assert.Equal(southLab, File.ReadAllBytes(Path.Combine(output, "buildings", "south-lab.yaml")));
        Assert.Equal(0, CliRunner.Run("check", Path.Combine(output, "campus.yaml")).ExitCode);
    }

    [Fact]
    public void Upsize_ApplyToAFileWithAChangeInAnIncludedFile_RefusedAndNothingWritten()
    {
        using var folder = new TempFolder();
        var (main, _, _, _) = LongCampus(folder);
        var json = folder.File("plan.json");

        var result = CliRunner.Run("upsize", main, "--json", json, "--apply", folder.File("fixed.yaml"));

        Assert.Equal(2, result.ExitCode);
        Assert.StartsWith(
            $"disttree: error: the size of run 'NH-H1/1' is in the included file '{Path.Combine(folder.Path, "buildings", "north-hall.yaml")}'; for a project with included files give --apply a folder",
            result.Error,
            StringComparison.Ordinal);
        Assert.False(File.Exists(json));
        Assert.False(File.Exists(folder.File("fixed.yaml")));
    }

    // The demo project rewritten in the forms a file may take: CR LF, CR alone, or LF with one CR LF line; a
    // byte-order mark; NEL (U+0085) in comments, once before and once on an edited line; the sizes that change written
    // double-quoted with an escape, single-quoted, and after a tag.
    [Theory]
    [InlineData("crlf")]
    [InlineData("cr")]
    [InlineData("one crlf line")]
    public void Upsize_ApplyToAFileInEveryForm_OnlyTheChangedValuesDiffer(string endings)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("quillfeather-medical.yaml");
        TempFolder.OpenTerminals(input);
        var text = File.ReadAllText(input);
        string[] forms =
        [
            "feeder: { length: 750, size: \"8\\x20AWG\", ground_size: '10 AWG', ocpd: 50, raceway: pvc }    # long\u0085on purpose",
            "run: { length: 180, size: '12 AWG' }    # long on purpose",
            "run: { length: 85, size: !!str 8 AWG, raceway: pvc }",
        ];
        text = "# NEL\u0085here\n" + text
            .Replace("feeder: { length: 750, size: 8 AWG, ground_size: 10 AWG, ocpd: 50, raceway: pvc }    # long on purpose", forms[0], StringComparison.Ordinal)
            .Replace("run: { length: 180, size: 12 AWG }    # long on purpose", forms[1], StringComparison.Ordinal)
            .Replace("run: { length: 85, size: 8 AWG, raceway: pvc }", forms[2], StringComparison.Ordinal);
        text = endings switch
        {
            // Not ReplaceLineEndings: it takes NEL for a line ending too.
            "crlf" => text.Replace("\n", "\r\n", StringComparison.Ordinal),
            "cr" => text.Replace("\n", "\r", StringComparison.Ordinal),
            _ => text.Replace(forms[1] + "\n", forms[1] + "\r\n", StringComparison.Ordinal),
        };
        byte[] before = [.. Bom, .. Encoding.UTF8.GetBytes(text)];
        File.WriteAllBytes(input, before);
        var output = folder.File("fixed.yaml");

        var result = CliRunner.Run("upsize", input, "--apply", output);

        Assert.True(result.ExitCode == 0, result.Error);
        var expected = text
            .Replace(forms[0], forms[0].Replace("\"8\\x20AWG\"", "\"2 AWG\"", StringComparison.Ordinal).Replace("'10 AWG'", "'4 AWG'", StringComparison.Ordinal), StringComparison.Ordinal)
            .Replace(forms[1], forms[1].Replace("'12 AWG'", "'6 AWG'", StringComparison.Ordinal), StringComparison.Ordinal)
            .Replace("run: { length: 250, size: 8 AWG, raceway: pvc }", "run: { length: 250, size: 4 AWG, raceway: pvc }", StringComparison.Ordinal)

            // The far ends too small to trip their devices (issue 23): a branch circuit raised a size; a feeder's grounding
            // conductor alone raised (written where none was), cheaper than its lines a size up.
            .Replace("run: { length: 600, size: 10 AWG, raceway: pvc }", "run: { length: 600, size: 8 AWG, raceway: pvc }", StringComparison.Ordinal)
            .Replace("feeder: { length: 110, size: 3 AWG, ocpd: 100 }", "feeder: { length: 110, size: 3 AWG, ground_size: 6 AWG, ocpd: 100 }", StringComparison.Ordinal);
        Assert.Equal([.. Bom, .. Encoding.UTF8.GetBytes(expected)], File.ReadAllBytes(output));
        Assert.Equal(before, File.ReadAllBytes(input));
        Assert.Equal(0, CliRunner.Run("check", output).ExitCode);
    }

    [Fact]
    public void Upsize_ApplyWithASizeAsABlockScalar_LocatedErrorAndNothingWritten()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("quillfeather-medical.yaml");
        var text = File.ReadAllText(input).Replace(
            "        run: { length: 180, size: 12 AWG }    # long on purpose\n",
            "        run:\n          length: 180\n          size: |-\n            12 AWG\n",
            StringComparison.Ordinal);
        File.WriteAllText(input, text);
        var line = text[..text.IndexOf("size: |-", StringComparison.Ordinal)].Split('\n').Length;
        var json = folder.File("plan.json");

        var result = CliRunner.Run("upsize", input, "--json", json, "--apply", folder.File("fixed.yaml"));

        Assert.Equal(2, result.ExitCode);
        Assert.StartsWith($"{input}:{line}:17: error: the size of run 'LP4/32' is written as a block scalar ('|'); --apply cannot rewrite it in that form", result.Error, StringComparison.Ordinal);
        Assert.False(File.Exists(json));
        Assert.Single(Directory.GetFileSystemEntries(folder.Path));
    }

    [Theory]
    [InlineData("changed")]
    [InlineData("deleted")]
    [InlineData("replaced by a folder")]
    public void Prepare_FileChangedOrGoneSinceItWasRead_RefusedAndNothingWritten(string what)
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("quillfeather-medical.yaml");
        var solution = Analysis.Run(input).Solution;
        var plan = Upsizer.Standard.Plan(solution);
        switch (what)
        {
            case "changed":
                File.AppendAllText(input, "# a comment added by an editor\n");
                break;
            case "deleted":
                File.Delete(input);
                break;
            default:
                File.Delete(input);
                Directory.CreateDirectory(input);
                break;
        }

        var e = Assert.Throws<UsageException>(() => AppliedProject.Prepare(solution.Project, plan.Changes, folder.File("fixed.yaml")));

        var expected = what == "deleted" ? "is gone since it was read" : "changed since it was read";
        Assert.Equal($"'{input}' {expected}; nothing written", e.Message);
        Assert.False(File.Exists(folder.File("fixed.yaml")));
    }

    // A tap follows the sizes' rule: in an included file it needs a folder, and there only that file's tap line is added.
    [Fact]
    public void Upsize_ApplyATapInAnIncludedFile_ToAFileRefusedToAFolderWritten()
    {
        using var folder = new TempFolder();
        var main = folder.File("main.yaml");
        var included = folder.File("t.yaml");
        var transformer = Sizing.UpsizerRemedyTests.Transformer();
        var equipment = transformer[transformer.IndexOf("equipment:", StringComparison.Ordinal)..];
        File.WriteAllText(main, "disttree: 1\nproject: { name: Tap, units: imperial }\nservice: { id: SVC, system: 480Y/277 }\ninclude: [t.yaml]\n");
        File.WriteAllText(included, equipment.ReplaceLineEndings("\r\n"));

        var refused = CliRunner.Run("upsize", main, "--apply", folder.File("fixed.yaml"));
        Assert.Equal(2, refused.ExitCode);
        Assert.Contains($"transformer 'T1', whose tap the plan sets, is in the included file '{included}'; for a project with included files give --apply a folder", refused.Error, StringComparison.Ordinal);
        Assert.False(File.Exists(folder.File("fixed.yaml")));

        var output = Path.Combine(folder.Path, "fixed") + "/";
        var result = CliRunner.Run("upsize", main, "--apply", output);
        Assert.Equal(0, result.ExitCode);
        Assert.Equal($"wrote {output}: 0 runs changed, 1 transformer tap set in 1 of its 2 files\n", result.Error.ReplaceLineEndings("\n"));
        Assert.Equal(File.ReadAllBytes(main), File.ReadAllBytes(Path.Combine(output, "main.yaml")));
        var x = equipment.IndexOf("x_r: 2\n", StringComparison.Ordinal) + "x_r: 2\n".Length;
        Assert.Equal(equipment.Insert(x, "    tap_percent: -2.5\n").ReplaceLineEndings("\r\n"), File.ReadAllText(Path.Combine(output, "t.yaml")));
        Assert.Equal(0, CliRunner.Run("check", Path.Combine(output, "main.yaml")).ExitCode);
    }

    [Fact]
    public void Write_FileChangedAfterThePreparation_RefusedBeforeAnyFileIsWritten()
    {
        using var folder = new TempFolder();
        var input = folder.CopyProject("quillfeather-medical.yaml");
        var solution = Analysis.Run(input).Solution;
        var applied = AppliedProject.Prepare(solution.Project, Upsizer.Standard.Plan(solution).Changes, folder.File("fixed.yaml"));
        File.WriteAllText(input, File.ReadAllText(input).Replace("size: 8 AWG", "size: 6 AWG", StringComparison.Ordinal));

        var e = Assert.Throws<UsageException>(() => applied.Write(new CliContext(TextWriter.Null, TextWriter.Null)));

        Assert.Equal($"'{input}' changed since it was read; nothing written", e.Message);
        Assert.False(File.Exists(folder.File("fixed.yaml")));
    }
}
