using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Cli;

/// <summary>The pipeline every analysing command runs: load, build, solve.</summary>
internal static class Pipeline
{
    /// <summary>Loads <paramref name="path"/>, builds its tree and solves it; warnings go to standard error.</summary>
    public static Solution Solve(CliContext context, string path)
    {
        var project = ProjectInput.Load(path);
        foreach (var warning in project.Warnings)
        {
            context.Error.WriteLine(warning.ToString());
        }

        return DropSolver.Standard.Solve(NetworkBuilder.Build(project));
    }
}
