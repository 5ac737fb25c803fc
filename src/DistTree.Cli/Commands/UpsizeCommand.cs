using System.CommandLine;
using DistTree.Diagnostics;
using DistTree.ProjectFiles.Writing;
using DistTree.Reports;
using DistTree.Sizing;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree upsize FILE [--json PATH|-] [--html [PATH]] [--date TEXT] [--apply OUT.yaml] [--max-sets N]</c>: the least-material set of
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
        var date = new Option<string?>("--date") { Description = "A date (any text) to show in the HTML report's header; without it the report carries no date.", HelpName = "TEXT" };
        var apply = new Option<string?>("--apply") { Description = "Write a copy of the project with only the changed size (and sets) values edited.", HelpName = "OUT.yaml" };
        var maxSets = new Option<int?>("--max-sets") { Description = "Let feeders take up to N parallel sets (overrides sizing: max_sets).", HelpName = "N" };
        var command = new Command("upsize", "Find the least-material conductor upsizes that bring every run and end point within its limits.\n" +
            "Example: disttree upsize projects/quillfeather-medical.yaml --apply fixed.yaml")
        {
            file, json, html, date, apply, maxSets,
        };
        command.SetAction(parsed =>
        {
            var path = parsed.GetValue(file)!;
            var jsonPath = parsed.GetValue(json);
            var htmlPath = parsed.GetResult(html) is null ? null : parsed.GetValue(html) ?? DefaultHtmlPath(path);
            OptionChecks.OneStandardOutput(("--json", jsonPath), ("--html", htmlPath));

            var before = WithMaxSets(Pipeline.Solve(context, path), parsed.GetValue(maxSets));
            var plan = Upsizer.Standard.Plan(before);
            if (jsonPath is not null)
            {
                OutputFile.Write(context, jsonPath, stream => JsonResults.Write(before, stream, w => PlanReport.WriteJson(w, plan)), path);
            }

            if (parsed.GetValue(apply) is { } output)
            {
                WriteApplied(context, path, output, plan);
            }

            if (htmlPath is not null)
            {
                var options = new HtmlReportOptions { Plan = plan, Date = parsed.GetValue(date) };
                OutputFile.Write(context, htmlPath, HtmlReport.Render(before, options), path);
            }

            if (jsonPath != "-" && htmlPath != "-")
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

        var sets = OptionChecks.Positive(given, "--max-sets");
        return before with { Project = before.Project with { Sizing = before.Project.Sizing with { MaxSets = sets } } };
    }

    private static void WriteApplied(CliContext context, string path, string output, UpsizePlan plan)
    {
        var elsewhere = plan.Changes.FirstOrDefault(c => c.SizeLocation.File != plan.Before.Project.File);
        if (elsewhere is not null)
        {
            throw new UsageException($"--apply edits one file; run {elsewhere.RunId} is in {elsewhere.SizeLocation.File}");
        }

        var text = File.ReadAllText(path);
        OutputFile.Write(context, output, ProjectFileEditor.Apply(text, plan.Changes), path);
        context.Error.WriteLine($"wrote {DisplayText.Escape(output)}: {plan.Changes.Count} runs changed");
    }
}
