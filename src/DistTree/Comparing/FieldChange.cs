namespace DistTree.Comparing;

/// <summary>One field of the project that differs between two revisions.</summary>
/// <param name="Field">The field, named as in the project file with its unit (<c>feeder.length_m</c>, <c>run.size</c>, <c>rules.total_limit_percent</c>).</param>
/// <param name="Before">The old value as text (invariant culture, lengths in metres), or null when absent.</param>
/// <param name="After">The new value as text, or null when absent.</param>
public sealed record FieldChange(string Field, string? Before, string? After);
