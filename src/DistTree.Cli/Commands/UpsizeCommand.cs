using System.CommandLine;
using DistTree.Reports;
using DistTree.Sizing;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree upsize FILE [--json PATH|-] [--html [PATH]] [--schedules DIR] [--date TEXT] [--apply OUT.yaml|OUT/] [--max-sets N]</c>: the least-material set of
/// conductor upsizes that brings the tree within its limits, proved by re-solving; exit 0 when the plan
/// clears every finding, 1 when some limit no size can fix remains, 2 bad input.
/// </summary>
internal static class UpsizeCommand
{
    public static Command Create(CliContext context)
    {
        var file = new Argument<string>("FILE") { Description = "The project file (YAML, format 1)." };
        var json = new Option<string?>("--json") { Description = "Write the results document with its upsize_plan to PATH, or '-' for standard output.", HelpName = "PATH" };
        var html = new Option<string?>("--html")
        {
            Description = "Write the HTML review report of the project as it is, with the plan and what it leaves, to PATH (default reports/<project file name>-upsize.html).",
            HelpName = "PATH",
            Arity = ArgumentArity.ZeroOrOne,
        };
        var schedules = ScheduleOutput.Create();
        var date = new Option<string?>("--date") { Description = "A date (any text) to show in the HTML report's header; without it the report carries no date.", HelpName = "TEXT" };
        var apply = new Option<string?>("--apply") { Description = "Write a copy of the project with only the changed size (and sets) and tap_percent values edited, to OUT.yaml; or to a folder (OUT/), a copy of every file of the project, each edited where its sizes and taps are.", HelpName = "OUT.yaml|OUT/" };
        var maxSets = new Option<int?>("--max-sets") { Description = "Let feeders take up to N parallel sets, 1 to 40 (overrides sizing: max_sets).", HelpName = "N" };
        var command = new Command("upsize", "Find the least-material conductor upsizes that bring every run and end point within its limits.\n" +
            "Example: disttree upsize projects/quillfeather-medical.yaml --apply fixed.yaml")
        {
            file, json, html, schedules, date, apply, maxSets,
        };
        command.SetAction(parsed =>
        {
            var path = parsed.GetValue(file)!;
            var jsonPath = parsed.GetValue(json);
            var htmlPath = parsed.GetResult(html) is null ? null : parsed.GetValue(html) ?? DefaultHtmlPath(path);
            var applyPath = parsed.GetValue(apply);
            (string, string?)[] outputs = [("--json", jsonPath), ("--html", htmlPath)];
            OptionChecks.Outputs([.. outputs, ("--apply", applyPath)]);
            var schedulesFolder = parsed.GetValue(schedules);
            ScheduleOutput.CheckName(schedulesFolder);

            var before = WithMaxSets(Pipeline.Solve(context, path), parsed.GetValue(maxSets));
            var inputs = before.Project.Files;
            var schedulesPrepared = ScheduleOutput.Prepare(schedulesFolder, before);
            outputs = [.. outputs, .. schedulesPrepared.Targets];
            OutputTarget.CheckAll(inputs, outputs);
            var plan = Upsizer.Standard.Plan(before);

            // The copy is read, checked and edited before anything is written, so that a refusal writes nothing.
            var applied = applyPath is null ? null : AppliedProject.Prepare(before.Project, plan.Changes, applyPath, plan.TapChanges);
            if (applied is not null)
            {
                OutputTarget.CheckAll(inputs, [.. outputs, .. applied.Targets]);
            }

            if (jsonPath is not null)
            {
                OutputFile.Write(context, jsonPath, stream => JsonResults.Write(before, stream, w => PlanReport.WriteJson(w, plan)), inputs);
            }

            applied?.Write(context);
            if (htmlPath is not null)
            {
                var options = new HtmlReportOptions { Plan = plan, Date = parsed.GetValue(date) };
                OutputFile.Write(context, htmlPath, HtmlReport.Render(before, options), inputs);
            }

            ScheduleOutput.Write(context, schedulesPrepared, inputs);

            if (jsonPath != "-" && htmlPath != "-" && applyPath != "-")
            {
                PlanReport.WriteConsole(context.Out, plan);
            }

            return plan.After.HasFindings ? ExitCodes.LimitExceeded : ExitCodes.Ok;
        });
        return command;
    }

    /// <summary><c>reports/NAME-upsize.html</c> for the project file <c>…/NAME.yaml</c>, relative to the working directory.</summary>
    internal static string DefaultHtmlPath(string projectPath) =>
        Path.Combine("reports", Path.GetFileNameWithoutExtension(projectPath) + "-upsize.html");

    // The solution with --max-sets in place of the project's sizing: max_sets, when given.
    private static Solving.Solution WithMaxSets(Solving.Solution before, int? maxSets)
    {
        if (maxSets is not { } given)
        {
            return before;
        }

        var sets = (int)OptionChecks.InRange(given, ProjectFiles.ValueRanges.MaxSetsRange, "--max-sets");
        return before with { Project = before.Project with { Sizing = before.Project.Sizing with { MaxSets = sets } } };
    }
}
