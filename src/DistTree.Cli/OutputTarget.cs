using DistTree.Model;
using DistTree.ProjectFiles;

namespace DistTree.Cli;

/// <summary>
/// Whether a command may write an output at a path: the path is not empty, names no file the command read (the
/// project file or any file it includes, by the file's identity, so a hard link, a symbolic link or a path through a
/// linked folder is caught too), and names nothing but a regular file or a new name (never a folder, a pipe, a device
/// or a socket). Each refusal is a usage error (exit 2).
/// </summary>
internal static class OutputTarget
{
    /// <summary>
    /// Checks every output (option name, path or null) before anything is written: each on its own, and no two naming
    /// the same file.
    /// </summary>
    /// <exception cref="UsageException">An output may not be written.</exception>
    public static void CheckAll(IReadOnlyList<SourceFile> inputs, params (string Option, string? Path)[] outputs)
    {
        var seen = new List<(string Option, string Target, FileIdentity? Identity)>();
        foreach (var (option, path) in outputs)
        {
            if (path is null or "-")
            {
                continue;
            }

            var full = Check(path, inputs, option);
            var identity = FileIdentity.Of(full).Identity;
            if (seen.Find(s => s.Target == full || (identity is not null && s.Identity == identity)) is { Option: { } other })
            {
                throw new UsageException($"{other} and {option} name the same file, '{path}'; give each output a file of its own");
            }

            seen.Add((option, full, identity));
        }
    }

    /// <summary>
    /// The full path to write for <paramref name="path"/>: the path itself, or the regular file it leads to through
    /// symbolic links (which stay as they are).
    /// </summary>
    /// <param name="path">The output path as given.</param>
    /// <param name="inputs">The files the command read.</param>
    /// <param name="option">The option that names it, for the message about an empty path.</param>
    /// <exception cref="UsageException">The output may not be written there.</exception>
    public static string Check(string path, IReadOnlyList<SourceFile> inputs, string option = "an output")
    {
        if (path.Length == 0)
        {
            throw new UsageException($"{option} was given an empty path; give a file name, or '-' for standard output");
        }

        // The path as .NET writes it: '.' and '..' worked out on the text (not through the links on the way).
        var full = Path.GetFullPath(path);
        var (kind, identity) = FileIdentity.Of(full);
        var link = new FileInfo(full).LinkTarget is not null;
        switch (kind)
        {
            case FileKind.Missing when link:
                throw new UsageException($"'{path}' is a symbolic link to nothing; DistTree writes a regular file, or a new one");
            case FileKind.Missing:
                return full;
            case FileKind.Folder:
                throw new UsageException($"'{path}' is a folder; give the output a file name");
            case FileKind.Pipe:
            case FileKind.Device:
            case FileKind.Socket:
                throw new UsageException($"'{path}' is {Described(kind)}, not a regular file; DistTree replaces only regular files (give '-' to write to standard output)");
            case FileKind.Regular:
            case FileKind.Unknown: // not examined (no permission on the way, say): the write will tell; inputs checked by path
                break;
        }

        if (IsInput(full, identity, inputs))
        {
            throw new UsageException($"'{path}' is an input file; DistTree never overwrites its input");
        }

        if (!link || kind == FileKind.Unknown)
        {
            return full;
        }

        if (ThroughOpenFiles(full))
        {
            throw new UsageException($"'{path}' names a file the process has open (its standard output, say), not a file to replace; give '-' to write to standard output");
        }

        // Written in place of the file the links lead to, so the links stay; a link the system resolves its own way
        // (/dev/stdout, /proc/self/fd/1) must lead to the very file it opens.
        var target = new FileInfo(full).ResolveLinkTarget(returnFinalTarget: true)?.FullName;
        if (target is null || FileIdentity.Of(target) is not { Kind: FileKind.Regular } found || found.Identity != identity)
        {
            throw new UsageException($"'{path}' is a symbolic link that DistTree cannot follow to a regular file; give the file's own path");
        }

        return target;
    }

    private static string Described(FileKind kind) => kind switch
    {
        FileKind.Pipe => "a pipe (FIFO)",
        FileKind.Device => "a device",
        FileKind.Socket => "a socket",
        FileKind.Missing or FileKind.Regular or FileKind.Folder or FileKind.Unknown => "not a regular file",
    };

    // The same file as one read: by identity where the system gives both, else by the path with every link followed.
    private static bool IsInput(string path, FileIdentity? identity, IReadOnlyList<SourceFile> inputs)
    {
        var full = Resolved(path);
        return inputs.Any(i => identity is not null && i.Identity is not null
            ? i.Identity == identity
            : string.Equals(Resolved(i.FullPath), full, StringComparison.Ordinal));
    }

    // True when a link on the way is one of the system's names for a process's open files (/proc/self/fd/1,
    // /dev/fd/1): what it leads to is whatever the process has open there, not a file to replace.
    private static bool ThroughOpenFiles(string path)
    {
        var current = path;
        for (var step = 0; step < 40 && new FileInfo(current).LinkTarget is { } target; step++)
        {
            current = Path.GetFullPath(target, Path.GetDirectoryName(current)!);
            if (current.StartsWith("/proc/", StringComparison.Ordinal) || current.StartsWith("/dev/fd/", StringComparison.Ordinal))
            {
                return true;
            }
        }

        return false;
    }

    private static string Resolved(string path)
    {
        var full = Path.GetFullPath(path);
        try
        {
            return new FileInfo(full).ResolveLinkTarget(returnFinalTarget: true)?.FullName ?? full;
        }
        catch (IOException)
        {
            return full;
        }
    }
}
