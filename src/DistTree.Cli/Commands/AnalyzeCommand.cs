using System.CommandLine;
using DistTree.Reports;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree analyze FILE [--json PATH|-] [--html [PATH]] [--schedules DIR] [--date TEXT] [--sarif PATH|-] [--worst N]</c>: the
/// summary, the worst paths with each run's share of the drop, and every finding; optionally the results
/// document, the HTML review report, the panel schedules as CSV and a SARIF log; exit 0 within limits, 1 a limit exceeded, 2 bad input.
/// </summary>
internal static class AnalyzeCommand
{
    public static Command Create(CliContext context)
    {
        var file = new Argument<string>("FILE") { Description = "The project file (YAML, format 1)." };
        var json = new Option<string?>("--json") { Description = "Write the results document (disttree-results/1) to PATH, or '-' for standard output.", HelpName = "PATH" };
        var html = new Option<string?>("--html")
        {
            Description = "Write the HTML review report to PATH (default reports/<project file name>.html).",
            HelpName = "PATH",
            Arity = ArgumentArity.ZeroOrOne,
        };
        var schedules = ScheduleOutput.Create();
        var date = new Option<string?>("--date") { Description = "A date (any text) to show in the HTML report's header; without it the report carries no date.", HelpName = "TEXT" };
        var sarif = new Option<string?>("--sarif") { Description = FindingsOutput.SarifDescription, HelpName = "PATH" };
        var worst = new Option<int>("--worst") { Description = "How many worst paths to show (console and HTML), 1 to 1,000.", DefaultValueFactory = _ => 10 };
        var command = new Command("analyze", "Solve the voltage drop of every run and end point; print the worst paths and every finding.\n" +
            "Example: disttree analyze projects/quillfeather-medical.yaml --json reports/results.json --html")
        {
            file, json, html, schedules, date, sarif, worst,
        };
        command.SetAction(parsed =>
        {
            var path = parsed.GetValue(file)!;
            var count = OptionChecks.Listed(parsed.GetValue(worst), "--worst");

            var jsonPath = parsed.GetValue(json);
            var sarifPath = parsed.GetValue(sarif);
            var htmlPath = parsed.GetResult(html) is null ? null : parsed.GetValue(html) ?? DefaultHtmlPath(path);
            (string, string?)[] outputs = [("--json", jsonPath), ("--html", htmlPath), ("--sarif", sarifPath)];
            OptionChecks.Outputs(outputs);
            var schedulesFolder = parsed.GetValue(schedules);
            ScheduleOutput.CheckName(schedulesFolder);

            Solving.Solution solution;
            (IReadOnlyList<Reports.Schedules.ScheduleFile> Files, (string Option, string? Path)[] Targets) schedulesPrepared;
            using (var status = context.Status())
            {
                solution = Pipeline.Solve(context, path, status);
                schedulesPrepared = ScheduleOutput.Prepare(schedulesFolder, solution);
                OutputTarget.CheckAll(solution.Project.Files, [.. outputs, .. schedulesPrepared.Targets]);
                if (jsonPath is not null)
                {
                    status.Report($"writing the results of {solution.Runs.Count:N0} runs");
                    OutputFile.Write(context, jsonPath, stream => JsonResults.Write(solution, stream), solution.Project.Files);
                }
            }

            if (htmlPath is not null)
            {
                var options = new HtmlReportOptions { Worst = count, Date = parsed.GetValue(date) };
                OutputFile.Write(context, htmlPath, HtmlReport.Render(solution, options), solution.Project.Files);
            }

            ScheduleOutput.Write(context, schedulesPrepared, solution.Project.Files);
            FindingsOutput.WriteSarif(context, sarifPath, solution, path);
            if (jsonPath != "-" && htmlPath != "-" && sarifPath != "-")
            {
                ConsoleReport.WriteAnalysis(context.Out, solution, count);
            }

            return solution.HasFindings ? ExitCodes.LimitExceeded : ExitCodes.Ok;
        });
        return command;
    }

    /// <summary><c>reports/NAME.html</c> for the project file <c>…/NAME.yaml</c>, relative to the working directory.</summary>
    internal static string DefaultHtmlPath(string projectPath) =>
        Path.Combine("reports", Path.GetFileNameWithoutExtension(projectPath) + ".html");
}
