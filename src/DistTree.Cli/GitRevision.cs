using System.ComponentModel;
using System.Diagnostics;
using System.Globalization;
using System.Text;
using DistTree.ProjectFiles;

namespace DistTree.Cli;

/// <summary>
/// A project's files as they were at a git revision: the project file and every file it includes, each read with
/// <c>git cat-file</c> from the revision's tree (never from the working tree), and named <c>REV:path</c> with the
/// path from the top of the repository. git is started as a process with an argument list (no shell), in the
/// project file's folder; the repository is only read. A symbolic link, a folder or a submodule at the revision is
/// not read as a file.
/// </summary>
internal sealed class GitRevision : IProjectFileSource
{
    private readonly string _folder;
    private readonly string _prefix;
    private readonly string _revision;

    private GitRevision(string folder, string prefix, string revision)
    {
        _folder = folder;
        _prefix = prefix;
        _revision = revision;
    }

    /// <summary>The revision <paramref name="revision"/> of the repository that holds <paramref name="file"/>, which must be in it.</summary>
    /// <exception cref="UsageException">Outside a git checkout, an unknown revision, the file absent at the revision, or git missing.</exception>
    public static GitRevision Open(string file, string revision)
    {
        if (revision.Length == 0 || revision.StartsWith('-') || revision.Any(char.IsControl))
        {
            throw new UsageException($"'{revision}' is not a revision (a commit, branch or tag such as HEAD, main or v1.2)");
        }

        var full = Path.GetFullPath(file);
        var folder = Path.GetDirectoryName(full)!;
        var prefix = Run(folder, "rev-parse", "--show-prefix");
        if (prefix.ExitCode != 0)
        {
            throw new UsageException($"--against needs a git checkout, and '{file}' is not in one");
        }

        if (Run(folder, "rev-parse", "--verify", "--quiet", "--end-of-options", revision + "^{commit}").ExitCode != 0)
        {
            throw new UsageException($"unknown revision '{revision}' in the repository of '{file}'");
        }

        var opened = new GitRevision(folder, Text(prefix.Output).Trim(), revision);
        var path = opened.PathOf(full);
        if (Run(folder, "cat-file", "-e", "--end-of-options", $"{revision}:{path}").ExitCode != 0)
        {
            throw new UsageException($"'{path}' did not exist at revision '{revision}'");
        }

        return opened;
    }

    /// <inheritdoc />
    public string NameOf(string fullPath) => $"{_revision}:{PathOf(fullPath)}";

    /// <inheritdoc />
    public byte[] Read(string fullPath)
    {
        var path = PathOf(fullPath);
        var listed = Run(_folder, "ls-tree", "-z", "--full-tree", "--end-of-options", _revision, "--", path);
        var entry = Text(listed.Output).TrimEnd('\0');
        if (listed.ExitCode != 0 || entry.Length == 0)
        {
            throw new FileNotFoundException($"no such file at revision '{_revision}'");
        }

        // "MODE TYPE OBJECT\tPATH": a regular file is 100644 or 100755.
        var fields = entry[..entry.IndexOf('\t', StringComparison.Ordinal)].Split(' ');
        if (fields[0] is not ("100644" or "100755"))
        {
            var what = fields[0] switch
            {
                "120000" => "a symbolic link",
                "040000" => "a folder",
                _ => "not a file",
            };
            throw new IOException($"it is {what} at revision '{_revision}'; a project file is read from a regular file");
        }

        var size = Run(_folder, "cat-file", "-s", fields[2]);
        if (long.TryParse(Text(size.Output).Trim(), NumberStyles.None, CultureInfo.InvariantCulture, out var bytes) && bytes > ProjectLimits.MaxFileBytes)
        {
            throw new IOException(string.Create(CultureInfo.InvariantCulture, $"it has {bytes:N0} bytes at revision '{_revision}'; a project file may have at most {ProjectLimits.MaxFileBytes:N0}"));
        }

        var shown = Run(_folder, "cat-file", "blob", fields[2]);
        return shown.ExitCode == 0 ? shown.Output : throw new IOException($"git could not read it: {Text(shown.Error).Trim()}");
    }

    // The path from the top of the repository of a file in or below the project file's folder, with forward slashes.
    private string PathOf(string fullPath) =>
        _prefix + Path.GetRelativePath(_folder, fullPath).Replace(Path.DirectorySeparatorChar, '/');

    private static string Text(byte[] bytes) => Encoding.UTF8.GetString(bytes);

    private static (int ExitCode, byte[] Output, byte[] Error) Run(string directory, params string[] arguments)
    {
        var start = new ProcessStartInfo("git")
        {
            WorkingDirectory = directory,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
        };
        foreach (var argument in arguments)
        {
            start.ArgumentList.Add(argument);
        }

        start.Environment["GIT_TERMINAL_PROMPT"] = "0";
        try
        {
            using var process = Process.Start(start) ?? throw new UsageException("--against needs git, and it could not be started");
            process.StandardInput.Close();
            using var output = new MemoryStream();
            using var error = new MemoryStream();
            var copyError = process.StandardError.BaseStream.CopyToAsync(error);
            process.StandardOutput.BaseStream.CopyTo(output);
            copyError.GetAwaiter().GetResult();
            process.WaitForExit();
            return (process.ExitCode, output.ToArray(), error.ToArray());
        }
        catch (Win32Exception e)
        {
            throw new UsageException($"--against needs git on the PATH: {e.Message}");
        }
    }
}
