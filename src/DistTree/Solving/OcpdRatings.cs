namespace DistTree.Solving;

/// <summary>
/// Standard ampere ratings of fuses and inverse-time circuit breakers, NEC 240.6(A) (memory; verify against
/// the edition in force), and the "next higher standard rating" permission of NEC 240.4(B) (devices of 800 A
/// or less).
/// </summary>
public static class OcpdRatings
{
    private static readonly double[] Standard =
    [
        15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450, 500,
        600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
    ];

    /// <summary>The standard ratings, ascending.</summary>
    public static IReadOnlyList<double> All => Standard;

    /// <summary>
    /// True when a device of <paramref name="ocpdA"/> may protect conductors of <paramref name="ampacityA"/>:
    /// the rating does not exceed the ampacity, or (800 A and less) it is the next standard rating above it.
    /// </summary>
    public static bool Permits(double ocpdA, double ampacityA)
    {
        if (ocpdA <= ampacityA + 1e-9)
        {
            return true;
        }

        if (ocpdA > 800)
        {
            return false;
        }

        // The next standard rating at or above the ampacity (none above the largest).
        foreach (var next in Standard)
        {
            if (next >= ampacityA - 1e-9)
            {
                return ocpdA <= next + 1e-9;
            }
        }

        return false;
    }
}
