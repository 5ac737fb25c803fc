using DistTree.Cli;

namespace DistTree.Tests.Cli;

/// <summary>Runs the <c>disttree</c> command in-process and returns what it wrote and its exit code.</summary>
internal static class CliRunner
{
    public static CliResult Run(params string[] args)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        var code = DisttreeApp.Run(args, stdout, stderr, showProgress: false, rethrowUnexpected: true);
        return new CliResult(code, stdout.ToString(), stderr.ToString());
    }
}

internal sealed record CliResult(int ExitCode, string Out, string Error);
