namespace DistTree.Comparing;

/// <summary>A figure in the old and the new revision, in the unit its owner's name states.</summary>
/// <param name="Before">The old revision's figure.</param>
/// <param name="After">The new revision's figure.</param>
public readonly record struct Delta(double Before, double After)
{
    /// <summary>After minus before (for percentages: percentage points).</summary>
    public double Change => After - Before;
}
