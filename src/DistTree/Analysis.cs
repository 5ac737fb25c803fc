using System.Globalization;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Solving;

namespace DistTree;

/// <summary>
/// The library's one way in: loads a project (<see cref="ProjectLoader"/>), builds its tree
/// (<see cref="NetworkBuilder"/>) and solves it (<see cref="DropSolver"/>). The command line, the comparison,
/// the upsizer's proof, the tests and the benchmarks all run the stages through it. It writes nothing: stages
/// are reported on <see cref="AnalysisOptions.Progress"/>, and warnings stay on <see cref="Project.Warnings"/>.
/// </summary>
public static class Analysis
{
    /// <summary>Loads the project file at <paramref name="path"/>, builds its tree and solves it.</summary>
    /// <exception cref="Diagnostics.ProjectException">The file is not a valid project, or the rules ask for a load flow that does not converge.</exception>
    /// <exception cref="IOException">The file cannot be read.</exception>
    public static AnalysisResult Run(string path, AnalysisOptions? options = null)
    {
        var project = ProjectLoader.Load(path);
        CollectAfterLoading();
        return Run(project, options);
    }

    /// <summary>
    /// As <see cref="Run(string, AnalysisOptions?)"/> on project text read as if from <paramref name="file"/> (the
    /// name diagnostics give); files it includes are read relative to <paramref name="file"/>.
    /// </summary>
    /// <exception cref="Diagnostics.ProjectException">The text is not a valid project, or the rules ask for a load flow that does not converge.</exception>
    public static AnalysisResult Parse(string text, string file, AnalysisOptions? options = null)
    {
        var project = ProjectLoader.Parse(text, file);
        CollectAfterLoading();
        return Run(project, options);
    }

    /// <summary>Builds the tree of a project already loaded (or made, as the upsizer's plan is) and solves it.</summary>
    /// <exception cref="Diagnostics.ProjectException">The rules ask for a load flow that does not converge.</exception>
    public static AnalysisResult Run(Project project, AnalysisOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(project);
        options ??= AnalysisOptions.Default;
        options.Progress?.Report(string.Create(CultureInfo.InvariantCulture, $"building the tree of {project.Equipment.Count:N0} equipment"));
        var network = NetworkBuilder.Build(project);
        options.Progress?.Report(string.Create(CultureInfo.InvariantCulture, $"solving {network.Nodes.Count:N0} nodes"));
        var solver = ReferenceEquals(options.Catalog, ConductorCatalog.Standard) ? DropSolver.Standard : new DropSolver(options.Catalog);
        return new AnalysisResult(project, network, solver.Solve(network));
    }

    // The file's parse tree is garbage now (about 200 MB at 100,000 end points) and little else lives: a collection
    // here is cheap, and spares the build, the solve and the writing one that would copy their results (analyze of
    // 100,000 end points: about 0.3 s faster and 100 MB lower peak; README, Performance). Younger generations only,
    // swept in place.
    private static void CollectAfterLoading() => GC.Collect(1, GCCollectionMode.Forced, blocking: true, compacting: false);
}
