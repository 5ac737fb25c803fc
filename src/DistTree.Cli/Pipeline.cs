using DistTree.Solving;

namespace DistTree.Cli;

/// <summary>What every analysing command runs: the library's <see cref="Analysis"/> on the file it names, its warnings on standard error.</summary>
internal static class Pipeline
{
    /// <summary>
    /// Loads <paramref name="path"/>, builds its tree and solves it; warnings go to standard error. On a terminal,
    /// work that takes more than a second shows its stage on a status line (<see cref="StatusLine"/>).
    /// </summary>
    public static Solution Solve(CliContext context, string path) => Solve(context, path, null);

    /// <summary>As <see cref="Solve(CliContext, string)"/>, reporting its stages on <paramref name="shared"/> (a command's own status line) when given.</summary>
    public static Solution Solve(CliContext context, string path, StatusLine? shared)
    {
        AnalysisResult result;
        using (var own = shared is null ? context.Status() : null)
        {
            var options = new AnalysisOptions { Progress = shared ?? own };
            result = ProjectInput.Read(path, file => Analysis.Run(file, options));
        }

        foreach (var warning in result.Project.Warnings)
        {
            context.Error.WriteLine(warning.ToString());
        }

        return result.Solution;
    }
}
