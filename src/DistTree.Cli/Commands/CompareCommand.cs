using System.CommandLine;
using DistTree.Comparing;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Reports;
using DistTree.Solving;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree compare OLD NEW</c> or <c>disttree compare FILE --against REV</c>: what a change of design does
/// downstream. Exit 1 when the new revision has a finding the old one did not, 0 otherwise, 2 for bad input.
/// </summary>
internal static class CompareCommand
{
    public static Command Create(CliContext context)
    {
        var files = new Argument<string[]>("FILES") { Description = "OLD.yaml NEW.yaml, or one FILE with --against.", Arity = new ArgumentArity(1, 2) };
        var against = new Option<string?>("--against") { Description = "Compare FILE with its own version at this git revision (a commit, branch or tag).", HelpName = "REV" };
        var json = new Option<string?>("--json") { Description = "Write the comparison document (disttree-comparison/1) to PATH, or '-' for standard output.", HelpName = "PATH" };
        var markdown = new Option<string?>("--markdown") { Description = "Write a Markdown summary with tables for a review comment to PATH, or '-' for standard output.", HelpName = "PATH" };
        var rows = new Option<int>("--rows") { Description = "How many end points and runs to list on the console and in Markdown.", DefaultValueFactory = _ => 20 };
        var command = new Command("compare", "Compare two revisions of a design: what changed, and what it does to every end point and run downstream.\n" +
            "Example: disttree compare projects/old.yaml projects/new.yaml\n" +
            "Example: disttree compare projects/quillfeather-medical.yaml --against HEAD --markdown -")
        {
            files, against, json, markdown, rows,
        };
        command.SetAction(parsed =>
        {
            var paths = parsed.GetValue(files)!;
            var revision = parsed.GetValue(against);
            var jsonPath = parsed.GetValue(json);
            var markdownPath = parsed.GetValue(markdown);
            var count = parsed.GetValue(rows);
            if (count < 1)
            {
                throw new UsageException("--rows takes a whole number of 1 or more");
            }

            if (jsonPath == "-" && markdownPath == "-")
            {
                throw new UsageException("--json - and --markdown - cannot both write to standard output");
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

            if (jsonPath != "-" && markdownPath != "-")
            {
                ComparisonConsole.Write(context.Out, comparison, count);
            }

            return comparison.HasNewFindings ? ExitCodes.LimitExceeded : ExitCodes.Ok;
        });
        return command;
    }

    private static Solution SolveText(CliContext context, string text, string name)
    {
        var project = ProjectLoader.Parse(text, name);
        foreach (var warning in project.Warnings)
        {
            context.Error.WriteLine(warning.ToString());
        }

        return DropSolver.Standard.Solve(NetworkBuilder.Build(project));
    }
}
