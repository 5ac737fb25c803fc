using System.Globalization;

namespace DistTree.Tests.Cli;

/// <summary>
/// Under a culture with decimal commas and point thousands (de-DE), parsing, JSON, SARIF and console output
/// are byte for byte what they are under the invariant culture. The test project runs with real cultures
/// (InvariantGlobalization false), so the culture set here does take effect.
/// </summary>
[Collection(WorkingDirectory.Name)]
public sealed class DisttreeAppCultureTests
{
    public static TheoryData<string> Commands() => new()
    {
        "analyze projects/quillfeather-medical.yaml",
        "analyze projects/riverside-clinic-metric.yaml --json -",
        "analyze projects/small-office.yaml --worst 3",
        "check projects/quillfeather-medical.yaml",
        "check projects/quillfeather-medical.yaml --sarif -",
        "validate projects/small-office.yaml",
        "conductors",
        "conductors --json --temperature 82.5 --frequency 50 --ambient 37.5",
        "init --output - --system 400Y/230",
        "validate CASES/bad/many-errors.yaml",
        "validate CASES/bad/number-too-large.yaml",
    };

    [Fact]
    public void GermanCulture_TakesEffectInThisTestProject()
    {
        var (value, list) = InCulture(new CultureInfo("de-DE", useUserOverride: false), () => (1234.5.ToString("N1", CultureInfo.CurrentCulture), CultureInfo.CurrentCulture.Name));

        Assert.Equal(("1.234,5", "de-DE"), (value, list));
    }

    [Theory]
    [MemberData(nameof(Commands))]
    public void Run_GermanCulture_SameBytesAsInvariant(string commandLine)
    {
        var args = commandLine.Replace("CASES", TestPaths.Cases, StringComparison.Ordinal).Split(' ');

        var invariant = InCulture(CultureInfo.InvariantCulture, () => RunInRepo(args));
        var german = InCulture(new CultureInfo("de-DE", useUserOverride: false), () => RunInRepo(args));

        Assert.Equal(invariant, german);
        Assert.True(invariant.Out.Length + invariant.Error.Length > 0);
    }

    [Fact]
    public void Parse_GermanCulture_ReadsDecimalPoints()
    {
        var text = DistTree.Tests.ProjectFiles.ProjectText.Minimal(feeder: "{ length: 12.5, size: 2 AWG }");

        var project = InCulture(new CultureInfo("de-DE", useUserOverride: false), () => DistTree.ProjectFiles.ProjectLoader.Parse(text, "t.yaml"));

        Assert.Equal(12.5, project.Equipment[0].Feeder!.LengthM);
    }

    [Fact]
    public void Parse_GermanCulture_LimitMessagesUseInvariantNumbers()
    {
        var text = DistTree.Tests.ProjectFiles.ProjectText.Minimal().Replace("name: Test", "name: " + new string('x', 70_000), StringComparison.Ordinal);

        var error = InCulture(
            new CultureInfo("de-DE", useUserOverride: false),
            () => Assert.Throws<DistTree.Diagnostics.ProjectException>(() => DistTree.ProjectFiles.ProjectLoader.Parse(text, "t.yaml")));

        Assert.Equal("a value of 70,000 characters; a value may have at most 65,536 (see docs/limits.md)", Assert.Single(error.Diagnostics).Message);
    }

    private static CliResult RunInRepo(string[] args)
    {
        CliResult? result = null;
        WorkingDirectory.In(TestPaths.RepoRoot, () => result = CliRunner.Run(args));
        return result!;
    }

    private static T InCulture<T>(CultureInfo culture, Func<T> work)
    {
        var (before, beforeUi) = (CultureInfo.CurrentCulture, CultureInfo.CurrentUICulture);
        CultureInfo.CurrentCulture = culture;
        CultureInfo.CurrentUICulture = culture;
        try
        {
            return work();
        }
        finally
        {
            CultureInfo.CurrentCulture = before;
            CultureInfo.CurrentUICulture = beforeUi;
        }
    }
}
