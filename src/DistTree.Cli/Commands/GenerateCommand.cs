using System.CommandLine;
using DistTree.Generating;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree generate --end-points N [--depth D] [--seed S] [--output PATH|-]</c>: writes an invented, valid
/// campus project of N branch circuits (for benchmarks and trials) to standard output or PATH; exit 0, or 2
/// for a bad option.
/// </summary>
internal static class GenerateCommand
{
    public static Command Create(CliContext context)
    {
        var endPoints = new Option<int>("--end-points") { Description = "How many branch circuits (end points) to generate.", Required = true, HelpName = "N" };
        var depth = new Option<int>("--depth") { Description = "Levels of switchboards above the panels, main switchboard included.", DefaultValueFactory = _ => 3, HelpName = "D" };
        var seed = new Option<ulong>("--seed") { Description = "Any whole number; the same seed gives the same file.", DefaultValueFactory = _ => 1, HelpName = "S" };
        var output = new Option<string>("--output") { Description = "Write to PATH, or '-' for standard output (the default).", DefaultValueFactory = _ => "-", HelpName = "PATH" };
        var command = new Command("generate", "Write an invented, valid campus project (switchboards, transformers, panels, mixed loads) for trials and benchmarks.\n" +
            "Example: disttree generate --end-points 100000 --seed 7 --output reports/campus-100k.yaml")
        {
            endPoints, depth, seed, output,
        };
        command.SetAction(parsed =>
        {
            var count = parsed.GetValue(endPoints);
            var levels = parsed.GetValue(depth);
            if (count is < 1 or > ProjectGenerator.MaxEndPoints)
            {
                throw new UsageException($"--end-points takes a whole number from 1 to {ProjectGenerator.MaxEndPoints}");
            }

            if (levels is < 1 or > ProjectGenerator.MaxDepth)
            {
                throw new UsageException($"--depth takes a whole number from 1 to {ProjectGenerator.MaxDepth}");
            }

            var path = parsed.GetValue(output)!;
            OptionChecks.Outputs(("--output", path));
            string text;
            using (var status = context.Status())
            {
                text = ProjectGenerator.Generate(count, levels, parsed.GetValue(seed), status.Share("generating"));
                status.Report("writing");
                OutputFile.Write(context, path, text, []);
            }

            return ExitCodes.Ok;
        });
        return command;
    }
}
