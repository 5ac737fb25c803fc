using System.CommandLine;
using DistTree.Network;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree validate FILE</c>: loads the project, checks it and builds its tree; prints
/// <c>ok: N equipment, M circuits</c> (warnings on standard error) and exits 0, or prints every
/// error on standard error and exits 2.
/// </summary>
internal static class ValidateCommand
{
    public static Command Create(CliContext context)
    {
        var file = new Argument<string>("FILE") { Description = "The project file (YAML, format 1)." };
        var command = new Command("validate", "Check a project file and report every error with its line and column.\n" +
            "Example: disttree validate projects/small-office.yaml");
        command.Arguments.Add(file);
        command.SetAction(parsed =>
        {
            var project = ProjectInput.Load(parsed.GetValue(file)!);
            NetworkBuilder.Build(project);
            foreach (var warning in project.Warnings)
            {
                context.Error.WriteLine(warning.ToString());
            }

            var circuits = project.Equipment.Sum(e => e.Circuits.Count);
            context.Out.WriteLine($"ok: {project.Equipment.Count} equipment, {circuits} circuits");
            return ExitCodes.Ok;
        });
        return command;
    }
}
