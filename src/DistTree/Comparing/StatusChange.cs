namespace DistTree.Comparing;

/// <summary>How the findings on a run or end point changed between two revisions.</summary>
public enum StatusChange
{
    /// <summary>The same finding kinds (possibly none) before and after.</summary>
    None,

    /// <summary>Within every limit before; over at least one after.</summary>
    NewlyFailing,

    /// <summary>Over at least one limit before; within every limit after.</summary>
    NewlyPassing,

    /// <summary>Failing before and after, but with different finding kinds.</summary>
    FindingsChanged,
}
