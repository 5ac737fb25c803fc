namespace DistTree.Comparing;

/// <summary>
/// When two figures count as the same. Reordering a project file changes the order in which the solver sums
/// phasors, so figures can differ in their last bits; these tolerances are far below anything a report shows.
/// </summary>
public static class ComparisonTolerance
{
    /// <summary>A drop moved when it changed by more than this many percentage points (1e-9).</summary>
    public const double PercentPoints = 1e-9;

    /// <summary>Any other figure (amperes, metres, kVA, a demand factor) moved when it changed by more than this fraction of its size, or of 1 when smaller (1e-9).</summary>
    public const double Relative = 1e-9;

    /// <summary>True when <paramref name="before"/> and <paramref name="after"/> differ by more than <see cref="PercentPoints"/>.</summary>
    public static bool PercentMoved(double before, double after) => Math.Abs(after - before) > PercentPoints;

    /// <summary>True when the two differ by more than <see cref="Relative"/> of the larger magnitude (at least 1).</summary>
    public static bool Moved(double before, double after) =>
        Math.Abs(after - before) > Relative * Math.Max(1.0, Math.Max(Math.Abs(before), Math.Abs(after)));

    /// <summary>As <see cref="Moved(double, double)"/>, where a value appearing or disappearing is a move.</summary>
    public static bool Moved(double? before, double? after) => (before, after) switch
    {
        (null, null) => false,
        ({ } b, { } a) => Moved(b, a),
        _ => true,
    };
}
