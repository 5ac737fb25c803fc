using System.CommandLine;

namespace DistTree.Cli.Commands;

/// <summary>Every subcommand of <c>disttree</c>, in the order <c>--help</c> lists them.</summary>
internal static class CommandCatalog
{
    public static IEnumerable<Command> Create(CliContext context)
    {
        yield return InitCommand.Create(context);
        yield return ValidateCommand.Create(context);
        yield return AnalyzeCommand.Create(context);
        yield return CheckCommand.Create(context);
        yield return UpsizeCommand.Create(context);
        yield return CompareCommand.Create(context);
        yield return ConductorsCommand.Create(context);
        yield return GenerateCommand.Create(context);
    }
}
