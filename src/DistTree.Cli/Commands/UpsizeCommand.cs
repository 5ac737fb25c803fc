using System.CommandLine;
using DistTree.Reports;
using DistTree.Sizing;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree upsize FILE [--json PATH|-] [--apply OUT.yaml] [--max-sets N]</c>: the least-material set of
/// conductor upsizes that brings the tree within its limits, proved by re-solving; exit 0 when the plan
/// clears every finding, 1 when some limit no size can fix remains, 2 bad input.
/// </summary>
internal static class UpsizeCommand
{
    public static Command Create(CliContext context)
    {
        var file = new Argument<string>("FILE") { Description = "The project file (YAML, format 1)." };
        var json = new Option<string?>("--json") { Description = "Write the results document with its upsize_plan to PATH, or '-' for standard output.", HelpName = "PATH" };
        var apply = new Option<string?>("--apply") { Description = "Write a copy of the project with only the changed size (and sets) values edited.", HelpName = "OUT.yaml" };
        var maxSets = new Option<int?>("--max-sets") { Description = "Let feeders take up to N parallel sets (overrides sizing: max_sets).", HelpName = "N" };
        var command = new Command("upsize", "Find the least-material conductor upsizes that bring every run and end point within its limits.\n" +
            "Example: disttree upsize projects/quillfeather-medical.yaml --apply fixed.yaml")
        {
            file, json, apply, maxSets,
        };
        command.SetAction(parsed =>
        {
            var path = parsed.GetValue(file)!;
            var before = Pipeline.Solve(context, path);
            if (parsed.GetValue(maxSets) is { } sets)
            {
                if (sets < 1)
                {
                    throw new UsageException("--max-sets takes a whole number of 1 or more");
                }

                var project = before.Project with { Sizing = before.Project.Sizing with { MaxSets = sets } };
                before = before with { Project = project };
            }

            var plan = Upsizer.Standard.Plan(before);
            var jsonPath = parsed.GetValue(json);
            if (jsonPath is not null)
            {
                OutputFile.Write(context, jsonPath, JsonResults.Write(before, w => PlanReport.WriteJson(w, plan)), path);
            }

            if (parsed.GetValue(apply) is { } output)
            {
                WriteApplied(context, path, output, plan);
            }

            if (jsonPath != "-")
            {
                PlanReport.WriteConsole(context.Out, plan);
            }

            return plan.After.HasFindings ? ExitCodes.LimitExceeded : ExitCodes.Ok;
        });
        return command;
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
        context.Error.WriteLine($"wrote {output}: {plan.Changes.Count} runs changed");
    }
}
