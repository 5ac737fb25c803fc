using System.CommandLine;
using DistTree.Reports;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree analyze FILE [--json PATH|-] [--sarif PATH|-] [--worst N]</c>: the summary, the worst paths with each run's
/// share of the drop, and every finding; exit 0 within limits, 1 a limit exceeded, 2 bad input.
/// </summary>
internal static class AnalyzeCommand
{
    public static Command Create(CliContext context)
    {
        var file = new Argument<string>("FILE") { Description = "The project file (YAML, format 1)." };
        var json = new Option<string?>("--json") { Description = "Write the results document (disttree-results/1) to PATH, or '-' for standard output.", HelpName = "PATH" };
        var sarif = new Option<string?>("--sarif") { Description = FindingsOutput.SarifDescription, HelpName = "PATH" };
        var worst = new Option<int>("--worst") { Description = "How many worst paths to show.", DefaultValueFactory = _ => 10 };
        var command = new Command("analyze", "Solve the voltage drop of every run and end point; print the worst paths and every finding.\n" +
            "Example: disttree analyze projects/quillfeather-medical.yaml --json reports/results.json")
        {
            file, json, sarif, worst,
        };
        command.SetAction(parsed =>
        {
            var path = parsed.GetValue(file)!;
            var count = parsed.GetValue(worst);
            if (count < 1)
            {
                throw new UsageException("--worst takes a whole number of 1 or more");
            }

            var jsonPath = parsed.GetValue(json);
            var sarifPath = parsed.GetValue(sarif);
            if (jsonPath == "-" && sarifPath == "-")
            {
                throw new UsageException("--json - and --sarif - cannot both write to standard output");
            }

            var solution = Pipeline.Solve(context, path);
            if (jsonPath is not null)
            {
                OutputFile.Write(context, jsonPath, JsonResults.Write(solution), path);
            }

            FindingsOutput.WriteSarif(context, sarifPath, solution, path);
            if (jsonPath != "-" && sarifPath != "-")
            {
                ConsoleReport.WriteAnalysis(context.Out, solution, count);
            }

            return solution.HasFindings ? ExitCodes.LimitExceeded : ExitCodes.Ok;
        });
        return command;
    }
}
