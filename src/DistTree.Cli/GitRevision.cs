using System.ComponentModel;
using System.Diagnostics;
using System.Text;
using DistTree.Diagnostics;

namespace DistTree.Cli;

/// <summary>
/// Reads a file as it was at a git revision: <c>git show REV:path</c>, run in the file's directory, with the
/// path relative to the top of the repository (<c>git rev-parse --show-prefix</c>). git is started as a
/// process with an argument list (no shell); the repository is only read.
/// </summary>
internal static class GitRevision
{
    private static readonly UTF8Encoding StrictUtf8 = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);

    /// <summary>The text of <paramref name="file"/> at <paramref name="revision"/> and the name it goes by, <c>REV:path</c>.</summary>
    /// <exception cref="UsageException">Outside a git checkout, an unknown revision, the file absent at the revision, or git missing.</exception>
    /// <exception cref="ProjectException">The old file is not UTF-8 text.</exception>
    public static (string Text, string Name) Read(string file, string revision)
    {
        if (revision.Length == 0 || revision.StartsWith('-') || revision.Any(char.IsControl))
        {
            throw new UsageException($"'{revision}' is not a revision (a commit, branch or tag such as HEAD, main or v1.2)");
        }

        var full = Path.GetFullPath(file);
        var directory = Path.GetDirectoryName(full)!;
        var prefix = Run(directory, "rev-parse", "--show-prefix");
        if (prefix.ExitCode != 0)
        {
            throw new UsageException($"--against needs a git checkout, and '{file}' is not in one");
        }

        var path = Text(prefix.Output).Trim() + Path.GetFileName(full);
        if (Run(directory, "rev-parse", "--verify", "--quiet", "--end-of-options", revision + "^{commit}").ExitCode != 0)
        {
            throw new UsageException($"unknown revision '{revision}' in the repository of '{file}'");
        }

        var spec = $"{revision}:{path}";
        if (Run(directory, "cat-file", "-e", "--end-of-options", spec).ExitCode != 0)
        {
            throw new UsageException($"'{path}' did not exist at revision '{revision}'");
        }

        var shown = Run(directory, "show", "--end-of-options", spec);
        if (shown.ExitCode != 0)
        {
            throw new UsageException($"git could not show '{spec}': {Text(shown.Error).Trim()}");
        }

        string text;
        try
        {
            text = StrictUtf8.GetString(shown.Output);
        }
        catch (DecoderFallbackException)
        {
            throw ProjectException.At(new SourceLocation(spec, 1, 1), "the file is not UTF-8 text");
        }

        return (text.Length > 0 && text[0] == '\uFEFF' ? text[1..] : text, spec);
    }

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
