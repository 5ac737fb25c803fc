using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree.Cli;

/// <summary>The pipeline every analysing command runs: load, build, solve.</summary>
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
        Project project;
        Solution solution;
        using (var own = shared is null ? context.Status() : null)
        {
            var status = shared ?? own!;
            project = ProjectInput.Load(path);

            // The file's parse tree is garbage now (about 200 MB at 100,000 end points) and little else lives:
            // a collection here is cheap, and spares the build, the solve and the writing one that would copy
            // their results (analyze of 100,000 end points: about 0.3 s faster and 100 MB lower peak; README,
            // Performance). Younger generations only, swept in place.
            GC.Collect(1, GCCollectionMode.Forced, blocking: true, compacting: false);
            status.Report($"building the tree of {project.Equipment.Count:N0} equipment");
            var network = NetworkBuilder.Build(project);
            status.Report($"solving {network.Nodes.Count:N0} nodes");
            solution = DropSolver.Standard.Solve(network);
        }

        foreach (var warning in project.Warnings)
        {
            context.Error.WriteLine(warning.ToString());
        }

        return solution;
    }
}
