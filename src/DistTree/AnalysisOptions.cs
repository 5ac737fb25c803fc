using DistTree.Conductors;

namespace DistTree;

/// <summary>How <see cref="Analysis"/> runs: the conductor data it solves with, and where it reports its stages.</summary>
public sealed record AnalysisOptions
{
    /// <summary>The embedded catalogue, no progress reports.</summary>
    public static AnalysisOptions Default { get; } = new();

    /// <summary>
    /// The conductor data the solve takes its figures from; the embedded catalogue unless set. A project that brings its
    /// own (<c>rules: conductor_catalog:</c>, <see cref="Model.Rules.ConductorCatalog"/>) is solved with that one instead.
    /// </summary>
    public ConductorCatalog Catalog { get; init; } = ConductorCatalog.Standard;

    /// <summary>
    /// Told, in a few words, each stage as it starts (building the tree, solving), for a status display; null
    /// (the default) for none. The analysis writes nothing of its own.
    /// </summary>
    public IProgress<string>? Progress { get; init; }
}
