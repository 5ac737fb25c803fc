using System.CommandLine;
using DistTree.Cli.Commands;
using DistTree.Diagnostics;

namespace DistTree.Cli;

/// <summary>
/// Builds the command tree and runs it. The one top-level catch turns user errors into messages and exit code 2,
/// and any other exception (a defect) into one <c>internal error:</c> line and exit code 3; no stack trace reaches
/// a user. Every message shows the values it repeats (a path, an option's value, a project's text) with their
/// control characters escaped (<see cref="DisplayText"/>).
/// </summary>
public static class DisttreeApp
{
    /// <summary>Runs <paramref name="args"/> writing to the given writers; returns the exit code.</summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr) => Run(args, stdout, stderr, showProgress: false);

    /// <summary>
    /// Runs <paramref name="args"/>; with <paramref name="showProgress"/> (standard error is a terminal) long work
    /// shows a status line on <paramref name="stderr"/>.
    /// </summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr, bool showProgress) =>
        Run(args, stdout, stderr, showProgress, rethrowUnexpected: false);

    /// <summary>
    /// As <see cref="Run(string[], TextWriter, TextWriter, bool)"/>; with <paramref name="rethrowUnexpected"/> (tests
    /// and the benchmarks) an exception that is not a user error is thrown on, with its stack trace, instead of
    /// becoming the <c>internal error:</c> line and <see cref="ExitCodes.InternalError"/>. User errors give exit
    /// code 2 either way.
    /// </summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr, bool showProgress, bool rethrowUnexpected)
    {
        ArgumentNullException.ThrowIfNull(stderr);
        try
        {
            return RunCommand(args, stdout, stderr, showProgress);
        }
        catch (Exception e) when (!rethrowUnexpected)
        {
            stderr.WriteLine(InternalError.Line(e));
            return ExitCodes.InternalError;
        }
    }

    private static int RunCommand(string[] args, TextWriter stdout, TextWriter stderr, bool showProgress)
    {
        var context = new CliContext(stdout, stderr) { ShowProgress = showProgress };
        var root = new RootCommand(
            "DistTree: voltage drop, ampacity and upsizing for the distribution tree of a building. " +
            "A design aid: the code in force and the authority having jurisdiction decide; a qualified person reviews the design.");
        foreach (var command in CommandCatalog.Create(context))
        {
            root.Subcommands.Add(command);
        }

        foreach (var version in root.Options.OfType<VersionOption>())
        {
            version.Action = new PrintVersion();
        }

        var parsed = root.Parse(args);
        if (parsed.Errors.Count > 0)
        {
            foreach (var error in parsed.Errors)
            {
                stderr.WriteLine($"disttree: error: {DisplayText.Escape(error.Message)}");
            }

            stderr.WriteLine("Run 'disttree --help' for usage.");
            return ExitCodes.BadInput;
        }

        try
        {
            return parsed.Invoke(new InvocationConfiguration { Output = stdout, Error = stderr, EnableDefaultExceptionHandler = false });
        }
        catch (ProjectException e)
        {
            foreach (var diagnostic in e.Diagnostics)
            {
                stderr.WriteLine(diagnostic.ToString());
            }

            return ExitCodes.BadInput;
        }
        catch (UsageException e)
        {
            stderr.WriteLine($"disttree: error: {DisplayText.Escape(e.Message)}");
            return ExitCodes.BadInput;
        }
    }
}
