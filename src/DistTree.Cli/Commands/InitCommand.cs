using System.CommandLine;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.ProjectFiles.Writing;
using DistTree.Vocabulary;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree init [--units imperial|metric] [--system NAME] [--output PATH] [--force]</c>: writes a commented
/// starter project (default <c>project.yaml</c>) that validates and analyzes within limits; an existing file
/// is kept unless <c>--force</c> is given.
/// </summary>
internal static class InitCommand
{
    public static Command Create(CliContext context)
    {
        var units = new Option<string?>("--units") { Description = "Unit of bare lengths: imperial (ft) or metric (m). Default: metric for 400Y/230 and 230, else imperial." };
        units.AcceptOnlyFromAmong([.. Words.Units.Words.Order(StringComparer.Ordinal)]);
        var system = new Option<string>("--system")
        {
            Description = $"The service's system: {string.Join(", ", ElectricalSystem.Names)}.",
            DefaultValueFactory = _ => "208Y/120",
        };
        var output = new Option<string>("--output") { Description = "Where to write the project.", HelpName = "PATH", DefaultValueFactory = _ => "project.yaml" };
        var force = new Option<bool>("--force") { Description = "Replace the file at PATH if there is one." };
        var command = new Command("init", "Write a commented starter project to edit: a service, a switchboard, a panelboard and a few circuits.\n" +
            "Example: disttree init --units metric --system 400Y/230 --output clinic.yaml")
        {
            units, system, output, force,
        };
        command.SetAction(parsed =>
        {
            var name = parsed.GetValue(system)!;
            var found = ElectricalSystem.Find(name)
                ?? throw new UsageException($"unknown system '{name}' for --system; expected one of {string.Join(", ", ElectricalSystem.Names)}");
            var unitSystem = parsed.GetValue(units) is { } word && Words.Units.TryRead(word, out var chosen) ? chosen : StarterProject.DefaultUnits(found);
            var path = parsed.GetValue(output)!;
            var replace = parsed.GetValue(force);
            OptionChecks.Outputs(("--output", path));
            if (path != "-" && !replace && (File.Exists(path) || Directory.Exists(path)))
            {
                throw new UsageException($"'{path}' already exists; choose another --output, or give --force to replace it");
            }

            OutputFile.Write(context, path, StarterProject.Write(unitSystem, found), replace, []);
            if (path != "-")
            {
                var shown = DisplayText.Escape(path);
                context.Out.WriteLine($"wrote {shown}: a starter project on {found.Name}, lengths in {(unitSystem == UnitSystem.Metric ? "metres" : "feet")}");
                context.Out.WriteLine($"next: edit it, then run 'disttree validate {shown}' and 'disttree analyze {shown}'");
            }

            return ExitCodes.Ok;
        });
        return command;
    }
}
