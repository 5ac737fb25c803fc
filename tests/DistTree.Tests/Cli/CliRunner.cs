using DistTree.Cli;

namespace DistTree.Tests.Cli;

/// <summary>Runs the <c>disttree</c> command in-process and returns what it wrote and its exit code.</summary>
internal static class CliRunner
{
    /// <summary>Runs <paramref name="args"/>; an unexpected exception is thrown on, with its stack trace (a test fails on it).</summary>
    public static CliResult Run(params string[] args) => Run(args, rethrowUnexpected: true);

    /// <summary>
    /// Runs <paramref name="args"/> as a user's command line runs: an unexpected exception becomes the
    /// <c>internal error:</c> line and exit code 3, as a user would see it.
    /// </summary>
    public static CliResult RunAsUser(params string[] args) => Run(args, rethrowUnexpected: false);

    private static CliResult Run(string[] args, bool rethrowUnexpected)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        var code = DisttreeApp.Run(args, stdout, stderr, showProgress: false, rethrowUnexpected);
        return new CliResult(code, stdout.ToString(), stderr.ToString());
    }
}

internal sealed record CliResult(int ExitCode, string Out, string Error);
