using System.Diagnostics;

namespace DistTree.Tests.Cli;

/// <summary>Runs a program of the system (mkfifo, ln, git, kill) for a test's setup, and fails the test if it fails.</summary>
internal static class Tool
{
    public static string Run(string program, params string[] args) => RunIn(null, program, args);

    public static string RunIn(string? folder, string program, params string[] args)
    {
        var start = new ProcessStartInfo(program, args) { RedirectStandardOutput = true, RedirectStandardError = true };
        if (folder is not null)
        {
            start.WorkingDirectory = folder;
        }

        using var process = Process.Start(start)!;
        var error = process.StandardError.ReadToEndAsync();
        var output = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        Assert.True(process.ExitCode == 0, $"{program} {string.Join(' ', args)} failed: {error.Result}");
        return output;
    }
}
