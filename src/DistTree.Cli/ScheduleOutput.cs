using DistTree.Model;
using DistTree.ProjectFiles;
using DistTree.Reports.Schedules;
using DistTree.Solving;

namespace DistTree.Cli;

/// <summary>
/// The <c>--schedules DIR</c> output of the commands that write the HTML report: each panel's schedule as a CSV file,
/// <c>DIR/&lt;panel id&gt;.csv</c> (<see cref="ScheduleCsv"/>), each written through <see cref="OutputFile"/> and checked
/// with the command's other outputs first, so that none is an input and no two name the same file.
/// </summary>
internal static class ScheduleOutput
{
    /// <summary>The option's name.</summary>
    public const string Name = "--schedules";

    /// <summary>The option, the same on every command that has it.</summary>
    public static System.CommandLine.Option<string?> Create() => new(Name)
    {
        Description = "Write each panel's schedule as a CSV file, DIR/<panel id>.csv (the folder is made if missing; see docs/schedules.md).",
        HelpName = "DIR",
    };

    /// <summary>Checks the folder's name before any work: not empty, not standard output, no NUL character.</summary>
    /// <exception cref="UsageException">The folder cannot be one.</exception>
    public static void CheckName(string? folder)
    {
        switch (folder)
        {
            case null:
                return;
            case "":
                throw new UsageException($"{Name} was given an empty path; give a folder");
            case "-":
                throw new UsageException($"{Name} writes a file per panel into a folder, not to standard output; give a folder");
            case var f when f.Contains('\0', StringComparison.Ordinal):
                throw new UsageException($"{Name} was given a path with a NUL character, which no file name can hold");
        }
    }

    /// <summary>
    /// The schedules of <paramref name="solution"/> and the path of each in <paramref name="folder"/> (option name and
    /// path, for <see cref="OutputTarget.CheckAll"/>); none when <paramref name="folder"/> is null.
    /// </summary>
    /// <exception cref="UsageException">Something other than a folder stands at <paramref name="folder"/>.</exception>
    public static (IReadOnlyList<ScheduleFile> Files, (string Option, string? Path)[] Targets) Prepare(string? folder, Solution solution)
    {
        if (folder is null)
        {
            return ([], []);
        }

        if (FileIdentity.Of(Path.GetFullPath(folder)).Kind is not (FileKind.Missing or FileKind.Folder or FileKind.Unknown))
        {
            throw new UsageException($"'{folder}' is not a folder; {Name} writes a file per panel into a folder");
        }

        var files = ScheduleCsv.Write(solution);
        return (files, files.Select(f => (Name, (string?)Path.Combine(folder, f.FileName))).ToArray());
    }

    /// <summary>Writes the files <see cref="Prepare"/> gave, to the paths it gave.</summary>
    public static void Write(CliContext context, (IReadOnlyList<ScheduleFile> Files, (string Option, string? Path)[] Targets) prepared, IReadOnlyList<SourceFile> inputs)
    {
        for (var k = 0; k < prepared.Files.Count; k++)
        {
            OutputFile.Write(context, prepared.Targets[k].Path!, prepared.Files[k].Content, inputs);
        }
    }
}
