using System.Security.Cryptography;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.ProjectFiles;
using DistTree.ProjectFiles.Writing;
using DistTree.Sizing;

namespace DistTree.Cli;

/// <summary>
/// What <c>upsize --apply</c> writes: a copy of the project with each change made in the file that holds the run's
/// size (a tap: the transformer's entry), and only there. To a file (<c>--apply fixed.yaml</c>): the project file, edited; a change in an included
/// file then needs a folder. To a folder (<c>--apply fixed/</c>, or a folder that exists): every file of the project
/// at its place relative to the project file, each edited where its sizes are. The edits are made to the very
/// bytes the plan was made on: each file is read again and must hold what was read at load time, or nothing is
/// written. Everything is checked and edited before the first file is written.
/// </summary>
internal sealed class AppliedProject
{
    private readonly List<(string Target, SourceFile Source, byte[] Bytes)> _files;
    private readonly IReadOnlyList<SourceFile> _inputs;

    private readonly int _editedFiles;

    private AppliedProject(string output, List<(string, SourceFile, byte[])> files, IReadOnlyList<SourceFile> inputs, int runs, int taps, int editedFiles)
    {
        Output = output;
        _files = files;
        _inputs = inputs;
        Runs = runs;
        Taps = taps;
        _editedFiles = editedFiles;
    }

    /// <summary>The --apply path as given.</summary>
    public string Output { get; }

    /// <summary>How many runs change.</summary>
    public int Runs { get; }

    /// <summary>How many transformers' taps are set.</summary>
    public int Taps { get; }

    /// <summary>Where each file goes, as (option, path) pairs for <see cref="OutputTarget.CheckAll"/>.</summary>
    public IEnumerable<(string Option, string? Path)> Targets => _files.Select(f => ("--apply", (string?)f.Target));

    /// <summary>Reads the project's files again, checks they are unchanged, and makes every edit; nothing is written yet.</summary>
    /// <exception cref="UsageException">A file changed since it was read; a change is in an included file and the output is not a folder.</exception>
    /// <exception cref="Diagnostics.ProjectException">A size or tap is written in a form that cannot be rewritten (located).</exception>
    public static AppliedProject Prepare(Project project, IReadOnlyList<UpsizeChange> changes, string output, IReadOnlyList<TapChange> taps)
    {
        var main = project.Files[0];
        var byFile = changes.GroupBy(c => c.SizeLocation.File).ToDictionary(g => g.Key, g => g.ToList(), StringComparer.Ordinal);
        var tapsByFile = taps.GroupBy(t => t.Location.File).ToDictionary(g => g.Key, g => g.ToList(), StringComparer.Ordinal);
        var toFolder = output != "-" && (Path.EndsInDirectorySeparator(output) || Directory.Exists(output));
        if (!toFolder && changes.FirstOrDefault(c => c.SizeLocation.File != main.Name) is { } elsewhere)
        {
            throw new UsageException(
                $"the size of run '{elsewhere.RunId}' is in the included file '{elsewhere.SizeLocation.File}'; for a project with included files give --apply a folder " +
                "(--apply fixed/): it writes a copy of every file of the project there, each edited where its sizes are");
        }

        if (!toFolder && taps.FirstOrDefault(t => t.Location.File != main.Name) is { } tapElsewhere)
        {
            throw new UsageException(
                $"transformer '{tapElsewhere.TransformerId}', whose tap the plan sets, is in the included file '{tapElsewhere.Location.File}'; for a project with included files give --apply a folder " +
                "(--apply fixed/): it writes a copy of every file of the project there, each edited where its sizes and taps are");
        }

        var files = new List<(string, SourceFile, byte[])>();
        foreach (var file in toFolder ? project.Files : [main])
        {
            var target = output;
            if (toFolder)
            {
                target = file.PathInProject is { } relative
                    ? Path.Combine(output, relative)
                    : throw new UsageException($"'{file.Name}' is included through a symbolic link from above the project's folder; --apply cannot copy the project to a folder");
            }

            var bytes = Unchanged(file);
            var edits = byFile.GetValueOrDefault(file.Name);
            var tapEdits = tapsByFile.GetValueOrDefault(file.Name);
            files.Add((target, file, edits is null && tapEdits is null ? bytes : ProjectFileEditor.Apply(bytes, file.Name, edits ?? [], tapEdits ?? [])));
        }

        var edited = byFile.Keys.Union(tapsByFile.Keys, StringComparer.Ordinal).Count();
        return new AppliedProject(output, files, project.Files, changes.Count, taps.Count, edited);
    }

    /// <summary>As the overload with taps, for a plan that sets none.</summary>
    public static AppliedProject Prepare(Project project, IReadOnlyList<UpsizeChange> changes, string output) => Prepare(project, changes, output, []);

    /// <summary>Writes every file, each checked once more to be unchanged just before; tells standard error what was written.</summary>
    public void Write(CliContext context)
    {
        foreach (var (_, source, _) in _files)
        {
            Unchanged(source);
        }

        foreach (var (target, _, bytes) in _files)
        {
            OutputFile.Write(context, target, stream => stream.Write(bytes), _inputs);
        }

        var files = _files.Count == 1 ? "" : $" in {_editedFiles} of its {_files.Count} files";
        var taps = Taps == 0 ? "" : $", {Taps} transformer tap{(Taps == 1 ? "" : "s")} set";
        context.Error.WriteLine($"wrote {DisplayText.Escape(Output)}: {Runs} runs changed{taps}{files}");
    }

    // The file's bytes now, when they are still the bytes read at load time.
    private static byte[] Unchanged(SourceFile file)
    {
        var changed = new UsageException($"'{file.Name}' changed since it was read; nothing written");
        var (kind, _) = FileIdentity.Of(file.FullPath);
        if (kind != FileKind.Regular)
        {
            throw kind == FileKind.Missing ? new UsageException($"'{file.Name}' is gone since it was read; nothing written") : changed;
        }

        try
        {
            using var stream = new FileStream(file.FullPath, FileMode.Open, FileAccess.Read, FileShare.ReadWrite, 1, FileOptions.SequentialScan);
            var bytes = new byte[file.Length + 1];
            var read = stream.ReadAtLeast(bytes, bytes.Length, throwOnEndOfStream: false);
            if (read != file.Length || Convert.ToHexStringLower(SHA256.HashData(bytes.AsSpan(0, read))) != file.Sha256)
            {
                throw changed;
            }

            return bytes[..read];
        }
        catch (Exception e) when (e is FileNotFoundException or DirectoryNotFoundException)
        {
            throw new UsageException($"'{file.Name}' is gone since it was read; nothing written");
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new UsageException($"cannot read '{file.Name}' again to edit it: {e.Message}; nothing written");
        }
    }
}
