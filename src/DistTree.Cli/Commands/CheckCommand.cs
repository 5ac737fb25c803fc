using System.CommandLine;
using DistTree.Reports;

namespace DistTree.Cli.Commands;

/// <summary><c>disttree check FILE [--sarif PATH|-]</c>: the same checks as analyze, terse, for CI; exit 0, 1 or 2.</summary>
internal static class CheckCommand
{
    public static Command Create(CliContext context)
    {
        var file = new Argument<string>("FILE") { Description = "The project file (YAML, format 1)." };
        var sarif = new Option<string?>("--sarif") { Description = FindingsOutput.SarifDescription, HelpName = "PATH" };
        var command = new Command("check", "Check every limit and print a verdict line and the findings (for CI).\n" +
            "Example: disttree check projects/quillfeather-medical.yaml --sarif reports/findings.sarif")
        {
            file, sarif,
        };
        command.SetAction(parsed =>
        {
            var path = parsed.GetValue(file)!;
            var sarifPath = parsed.GetValue(sarif);
            OptionChecks.Outputs(("--sarif", sarifPath));
            var solution = Pipeline.Solve(context, path);
            OutputTarget.CheckAll(solution.Project.Files, ("--sarif", sarifPath));
            FindingsOutput.WriteSarif(context, sarifPath, solution, path);
            if (sarifPath != "-")
            {
                ConsoleReport.WriteCheck(context.Out, solution);
            }

            return solution.HasFindings ? ExitCodes.LimitExceeded : ExitCodes.Ok;
        });
        return command;
    }
}
