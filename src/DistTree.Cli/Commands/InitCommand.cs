using System.CommandLine;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.ProjectFiles.Writing;
using DistTree.Vocabulary;

namespace DistTree.Cli.Commands;

/// <summary>
/// <c>disttree init [--code nec|…] [--units imperial|metric] [--system NAME] [--output PATH] [--force]</c>: writes a
/// commented starter project (default <c>project.yaml</c>) in the code's usual systems and units that validates and
/// analyzes within limits; an existing file is kept unless <c>--force</c> is given.
/// </summary>
internal static class InitCommand
{
    public static Command Create(CliContext context)
    {
        var code = new Option<string>("--code")
        {
            Description = $"The code whose rule set judges the design, and whose usual building the starter is: {string.Join(", ", Words.Code.Words)}.",
            DefaultValueFactory = _ => Words.Code.Of(ElectricalCode.Nec),
        };
        code.AcceptOnlyFromAmong([.. Words.Code.Words]);
        var units = new Option<string?>("--units") { Description = "Unit of bare lengths: imperial (ft) or metric (m). Default: the code's usual (under nec, metric for 400Y/230 and 230, else imperial)." };
        units.AcceptOnlyFromAmong([.. Words.Units.Words.Order(StringComparer.Ordinal)]);
        var system = new Option<string?>("--system")
        {
            Description = $"The service's system: {string.Join(", ", ElectricalSystem.Names)}. Default: the code's usual ({string.Join(", ", Enum.GetValues<ElectricalCode>().Select(c => $"{Words.Code.Of(c)} {StarterProject.DefaultSystem(c).Name}"))}).",
        };
        var output = new Option<string>("--output") { Description = "Where to write the project.", HelpName = "PATH", DefaultValueFactory = _ => "project.yaml" };
        var force = new Option<bool>("--force") { Description = "Replace the file at PATH if there is one." };
        var command = new Command("init", "Write a commented starter project to edit: a service, a switchboard, a panelboard and a few circuits.\n" +
            "Example: disttree init --units metric --system 400Y/230 --output clinic.yaml")
        {
            code, units, system, output, force,
        };
        command.SetAction(parsed =>
        {
            var rules = Words.Code.TryRead(parsed.GetValue(code)!, out var read) ? read : ElectricalCode.Nec;
            var found = parsed.GetValue(system) is { } name
                ? ElectricalSystem.Find(name) ?? throw new UsageException($"unknown system '{name}' for --system; expected one of {string.Join(", ", ElectricalSystem.Names)}")
                : StarterProject.DefaultSystem(rules);
            var unitSystem = parsed.GetValue(units) is { } word && Words.Units.TryRead(word, out var chosen) ? chosen : StarterProject.DefaultUnits(rules, found);
            var path = parsed.GetValue(output)!;
            var replace = parsed.GetValue(force);
            OptionChecks.Outputs(("--output", path));
            if (path != "-" && !replace && (File.Exists(path) || Directory.Exists(path)))
            {
                throw new UsageException($"'{path}' already exists; choose another --output, or give --force to replace it");
            }

            OutputFile.Write(context, path, StarterProject.Write(unitSystem, found, rules), replace, []);
            if (path != "-")
            {
                var shown = DisplayText.Escape(path);
                context.Out.WriteLine($"wrote {shown}: a starter project under {Codes.CodeRules.Describe(rules)} on {found.Name}, lengths in {(unitSystem == UnitSystem.Metric ? "metres" : "feet")}");
                context.Out.WriteLine($"next: edit it, then run 'disttree validate {shown}' and 'disttree analyze {shown}'");
            }

            return ExitCodes.Ok;
        });
        return command;
    }
}
