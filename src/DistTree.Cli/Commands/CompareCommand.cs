using System.CommandLine;
using DistTree.Comparing;
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
        var date = new Option<string?>("--date") { Description = "A date (any text) to show in the HTML report's header; without it the report carries no date.", HelpName = "TEXT" };
        var rows = new Option<int>("--rows") { Description = "How many end points and runs to list on the console and in Markdown.", DefaultValueFactory = _ => 20 };
        var command = new Command("compare", "Compare two revisions of a design: what changed, and what it does to every end point and run downstream.\n" +
            "Example: disttree compare projects/old.yaml projects/new.yaml\n" +
            "Example: disttree compare projects/quillfeather-medical.yaml --against HEAD --markdown -")
        {
            files, against, json, markdown, html, date, rows,
        };
        command.SetAction(parsed =>
        {
            var paths = parsed.GetValue(files)!;
            var revision = parsed.GetValue(against);
            var jsonPath = parsed.GetValue(json);
            var markdownPath = parsed.GetValue(markdown);
            var htmlPath = parsed.GetResult(html) is null ? null : parsed.GetValue(html) ?? DefaultHtmlPath(paths[^1]);
            var count = parsed.GetValue(rows);
            if (count < 1)
            {
                throw new UsageException("--rows takes a whole number of 1 or more");
            }

            if (new[] { jsonPath, markdownPath, htmlPath }.Count(p => p == "-") > 1)
            {
                throw new UsageException("only one of --json, --markdown and --html can write to standard output");
            }

            Solution before;
            Solution after;
            if (revision is not null)
            {
                if (paths.Length != 1)
                {
                    throw new UsageException("with --against, give one FILE: disttree compare FILE --against REV");
                }

                after = Pipeline.Solve(context, paths[0]);
                var (text, name) = GitRevision.Read(paths[0], revision);
                before = SolveText(context, text, name);
            }
            else
            {
                if (paths.Length != 2)
                {
                    throw new UsageException("give two files, OLD and NEW, or one FILE with --against REV");
                }

                before = Pipeline.Solve(context, paths[0]);
                after = Pipeline.Solve(context, paths[1]);
            }

            var comparison = RevisionComparer.Compare(before, after);
            if (jsonPath is not null)
            {
                OutputFile.Write(context, jsonPath, ComparisonJson.Write(comparison), paths);
            }

            if (markdownPath is not null)
            {
                OutputFile.Write(context, markdownPath, ComparisonMarkdown.Write(comparison, count), paths);
            }

            if (htmlPath is not null)
            {
                var options = new HtmlReportOptions { Comparison = comparison, Date = parsed.GetValue(date) };
                OutputFile.Write(context, htmlPath, HtmlReport.Render(after, options), paths);
            }

            if (jsonPath != "-" && markdownPath != "-" && htmlPath != "-")
            {
                ComparisonConsole.Write(context.Out, comparison, count);
            }

            return comparison.HasNewFindings ? ExitCodes.LimitExceeded : ExitCodes.Ok;
        });
        return command;
    }

    /// <summary><c>reports/NAME-compare.html</c> for the new project file <c>…/NAME.yaml</c>, relative to the working directory.</summary>
    internal static string DefaultHtmlPath(string newProjectPath) =>
        Path.Combine("reports", Path.GetFileNameWithoutExtension(newProjectPath) + "-compare.html");

    private static Solution SolveText(CliContext context, string text, string name)
    {
        var project = ProjectLoader.Parse(text, name);
        foreach (var warning in project.Warnings)
        {
            context.Error.WriteLine(warning.ToString());
        }

        return Analysis.Run(project).Solution;
    }
}
