namespace DistTree.Comparing;

/// <summary>One field of the project that differs between two revisions.</summary>
/// <param name="Field">The field, named as in the project file with its unit (<c>feeder.length_m</c>, <c>run.size</c>, <c>rules.total_limit_percent</c>).</param>
/// <param name="Before">The old value as text for the JSON (invariant culture, lengths in metres), or null when absent.</param>
/// <param name="After">The new value as text for the JSON, or null when absent.</param>
public sealed record FieldChange(string Field, string? Before, string? After)
{
    /// <summary>The field's name for people: <see cref="Field"/>, less the unit of a length, whose values carry it (<c>run.length</c>).</summary>
    public string Label { get; init; } = Field;

    /// <summary>
    /// The old value for people: a length in the newer revision's units with its unit (<c>80 ft</c>, <c>24.4 m</c>), a
    /// load with the unit it is stated in (<c>960 VA</c>); otherwise as <see cref="Before"/>. Null when absent.
    /// </summary>
    public string? BeforeText { get; init; } = Before;

    /// <summary>The new value for people, as <see cref="BeforeText"/>. Null when absent.</summary>
    public string? AfterText { get; init; } = After;
}
