namespace DistTree.Comparing;

/// <summary>A piece of equipment or a circuit added, removed or changed.</summary>
/// <param name="Id">The equipment id, or the circuit's full id (<c>PANEL/ID</c>).</param>
/// <param name="Change">Added, removed or changed.</param>
/// <param name="Fields">
/// The fields that differ, in a fixed order; for an added element every field with a null <see cref="FieldChange.Before"/>,
/// for a removed one every field with a null <see cref="FieldChange.After"/>.
/// </param>
public sealed record ElementChange(string Id, ChangeKind Change, IReadOnlyList<FieldChange> Fields);
