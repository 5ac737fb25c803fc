using DistTree.Cli;
using DistTree.Cli.Commands;

namespace DistTree.Tests.Cli.Commands;

/// <summary>Every subcommand's help carries a worked example.</summary>
public sealed class CommandCatalogTests
{
    private static readonly CliContext Quiet = new(TextWriter.Null, TextWriter.Null);

    public static TheoryData<string> CommandNames()
    {
        var data = new TheoryData<string>();
        foreach (var command in CommandCatalog.Create(Quiet))
        {
            data.Add(command.Name);
        }

        return data;
    }

    [Fact]
    public void Create_EveryCommand_DescriptionHasAnExampleOfItself()
    {
        var commands = CommandCatalog.Create(Quiet).ToArray();

        Assert.NotEmpty(commands);
        Assert.All(commands, c => Assert.Contains($"Example: disttree {c.Name}", c.Description, StringComparison.Ordinal));
    }

    [Theory]
    [MemberData(nameof(CommandNames))]
    public void Help_EveryCommand_PrintsItsExample(string name)
    {
        var result = CliRunner.Run(name, "--help");

        Assert.Equal(0, result.ExitCode);
        Assert.Contains($"Example: disttree {name}", result.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Help_Init_ListsItsOptions()
    {
        var help = CliRunner.Run("init", "--help").Out;

        Assert.All(["--units", "--system", "--output", "--force"], o => Assert.Contains(o, help, StringComparison.Ordinal));
    }

    [Fact]
    public void Version_Flag_PrintsThePackageVersion()
    {
        var result = CliRunner.Run("--version");

        Assert.Equal((0, "0.1.0\n", ""), (result.ExitCode, result.Out.ReplaceLineEndings("\n"), result.Error));
    }

    [Fact]
    public void Create_Commands_HaveUniqueNames()
    {
        var names = CommandCatalog.Create(Quiet).Select(c => c.Name).ToArray();

        Assert.Equal(names.Distinct(StringComparer.Ordinal).Count(), names.Length);
        Assert.All(names, n => Assert.Matches("^[a-z]+$", n));
    }
}
