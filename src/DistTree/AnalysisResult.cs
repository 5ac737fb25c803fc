using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;

namespace DistTree;

/// <summary>What <see cref="Analysis"/> gives: each stage's result, the project's warnings on <see cref="Project"/>.</summary>
/// <param name="Project">The loaded model (<see cref="Project.Warnings"/> holds what the loader warned of).</param>
/// <param name="Network">The tree built from it.</param>
/// <param name="Solution">The tree solved: every run, end point, panel and finding.</param>
public sealed record AnalysisResult(Project Project, DistributionNetwork Network, Solution Solution);
