namespace DistTree.Comparing;

/// <summary>What happened to a piece of equipment or a circuit between two revisions.</summary>
public enum ChangeKind
{
    /// <summary>Only in the new revision.</summary>
    Added,

    /// <summary>Only in the old revision.</summary>
    Removed,

    /// <summary>In both, with at least one field different.</summary>
    Changed,
}
