using System.CommandLine;
using DistTree.Comparing;
using DistTree.Model;
using DistTree.ProjectFiles;
using DistTree.Reports;
using DistTree.Solving;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree compare OLD NEW</c> or <c>disttree compare FILE --against REV</c>: what a change of design does
/// downstream, on the console, as JSON, as Markdown, or as the new revision's HTML report with a comparison section. Exit 1 when the new revision has a finding the old one did not, 0 otherwise, 2 for bad input.
/// </summary>
internal static class CompareCommand
{
    public static Command Create(CliContext context)
    {
        var files = new Argument<string[]>("FILES") { Description = "OLD.yaml NEW.yaml, or one FILE with --against.", Arity = new ArgumentArity(1, 2) };
        var against = new Option<string?>("--against") { Description = "Compare FILE with its own version at this git revision (a commit, branch or tag).", HelpName = "REV" };
        var json = new Option<string?>("--json") { Description = "Write the comparison document (disttree-comparison/1) to PATH, or '-' for standard output.", HelpName = "PATH" };
        var markdown = new Option<string?>("--markdown") { Description = "Write a Markdown summary with tables for a review comment to PATH, or '-' for standard output.", HelpName = "PATH" };
        var html = new Option<string?>("--html")
        {
            Description = "Write the new revision's HTML review report with a comparison section to PATH (default reports/<new file name>-compare.html).",
            HelpName = "PATH",
            Arity = ArgumentArity.ZeroOrOne,
        };
        var schedules = ScheduleOutput.Create();
        schedules.Description = "Write each panel's schedule of the new revision as a CSV file, DIR/<panel id>.csv (the folder is made if missing; see docs/schedules.md).";
        var date = new Option<string?>("--date") { Description = "A date (any text) to show in the HTML report's header; without it the report carries no date.", HelpName = "TEXT" };
        var rows = new Option<int>("--rows") { Description = "How many end points and runs to list on the console and in Markdown, 1 to 1,000.", DefaultValueFactory = _ => 20 };
        var command = new Command("compare", "Compare two revisions of a design: what changed, and what it does to every end point and run downstream.\n" +
            "Example: disttree compare projects/old.yaml projects/new.yaml\n" +
            "Example: disttree compare projects/quillfeather-medical.yaml --against HEAD --markdown -")
        {
            files, against, json, markdown, html, schedules, date, rows,
        };
        command.SetAction(parsed =>
        {
            var paths = parsed.GetValue(files)!;
            var revision = parsed.GetValue(against);
            var jsonPath = parsed.GetValue(json);
            var markdownPath = parsed.GetValue(markdown);
            var htmlPath = parsed.GetResult(html) is null ? null : parsed.GetValue(html) ?? DefaultHtmlPath(paths[^1]);
            var count = OptionChecks.Listed(parsed.GetValue(rows), "--rows");

            (string, string?)[] outputs = [("--json", jsonPath), ("--markdown", markdownPath), ("--html", htmlPath)];
            OptionChecks.Outputs(outputs);
            var schedulesFolder = parsed.GetValue(schedules);
            ScheduleOutput.CheckName(schedulesFolder);

            var (before, after) = SolveBoth(context, paths, revision);
            IReadOnlyList<SourceFile> inputs = [.. before.Project.Files, .. after.Project.Files];
            var schedulesPrepared = ScheduleOutput.Prepare(schedulesFolder, after);
            OutputTarget.CheckAll(inputs, [.. outputs, .. schedulesPrepared.Targets]);
            var comparison = RevisionComparer.Compare(before, after);
            ScheduleOutput.Write(context, schedulesPrepared, inputs);
            WriteOutputs(context, comparison, after, new Outputs(jsonPath, markdownPath, htmlPath, parsed.GetValue(date), count), inputs);
            return comparison.HasNewFindings ? ExitCodes.LimitExceeded : ExitCodes.Ok;
        });
        return command;
    }

    // The old and the new revision, solved: two files, or one file and its version at a git revision.
    private static (Solution Before, Solution After) SolveBoth(CliContext context, string[] paths, string? revision)
    {
        if (revision is not null)
        {
            if (paths.Length != 1)
            {
                throw new UsageException("with --against, give one FILE: disttree compare FILE --against REV");
            }

            var after = Pipeline.Solve(context, paths[0]);
            return (SolveAtRevision(context, paths[0], GitRevision.Open(paths[0], revision)), after);
        }

        if (paths.Length != 2)
        {
            throw new UsageException("give two files, OLD and NEW, or one FILE with --against REV");
        }

        var before = Pipeline.Solve(context, paths[0]);
        return (before, Pipeline.Solve(context, paths[1]));
    }

    // Every output asked for; the console's unless one of them is standard output.
    private static void WriteOutputs(CliContext context, Comparison comparison, Solution after, Outputs o, IReadOnlyList<SourceFile> paths)
    {
        if (o.Json is not null)
        {
            OutputFile.Write(context, o.Json, ComparisonJson.Write(comparison), paths);
        }

        if (o.Markdown is not null)
        {
            OutputFile.Write(context, o.Markdown, ComparisonMarkdown.Write(comparison, o.Rows), paths);
        }

        if (o.Html is not null)
        {
            var options = new HtmlReportOptions { Comparison = comparison, Date = o.Date };
            OutputFile.Write(context, o.Html, HtmlReport.Render(after, options), paths);
        }

        if (o.Json != "-" && o.Markdown != "-" && o.Html != "-")
        {
            ComparisonConsole.Write(context.Out, comparison, o.Rows);
        }
    }

    /// <summary><c>reports/NAME-compare.html</c> for the new project file <c>…/NAME.yaml</c>, relative to the working directory.</summary>
    internal static string DefaultHtmlPath(string newProjectPath) =>
        Path.Combine("reports", Path.GetFileNameWithoutExtension(newProjectPath) + "-compare.html");

    // The project as it was at a revision: the file and every file it includes, read from the revision.
    private static Solution SolveAtRevision(CliContext context, string path, GitRevision revision)
    {
        Project project;
        try
        {
            project = ProjectLoader.Load(path, revision);
        }
        catch (IOException e)
        {
            throw new UsageException($"cannot read '{revision.NameOf(Path.GetFullPath(path))}': {e.Message}");
        }

        foreach (var warning in project.Warnings)
        {
            context.Error.WriteLine(warning.ToString());
        }

        return Analysis.Run(project).Solution;
    }

    // Where each output goes (null: not asked for), the report's date and how many rows the console and Markdown list.
    private sealed record Outputs(string? Json, string? Markdown, string? Html, string? Date, int Rows);
}
