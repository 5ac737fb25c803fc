using DistTree.Solving;

namespace DistTree.Comparing;

/// <summary>Which revision a side of a comparison is, and its counts.</summary>
/// <param name="Name">The project's name.</param>
/// <param name="File">The file as given (for a git revision: <c>REV:path</c>).</param>
/// <param name="Sha256">Lower-case hex SHA-256 of the file's bytes.</param>
/// <param name="Summary">Its solution's counts and worst figure.</param>
/// <param name="Code">The code its checks assumed.</param>
public sealed record RevisionInfo(string Name, string File, string Sha256, SolutionSummary Summary, Model.ElectricalCode Code);
